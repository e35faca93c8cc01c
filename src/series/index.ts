/**
 * Series of complexes of one metal ion: spectrochemical and nephelauxetic
 * ranking, Jørgensen factors fitted from one's own analyses, the rule of
 * average environment, and predictions from a formula alone. Energies in cm-1.
 */
export { rankByTenDq, rankByNephelauxetic, valuesOverlap, type RankOptions } from './rank.js';
export { fitLigandFactors, combine, type FitFactorsOptions, type FactorFit, type LigandFactor } from './factors.js';
export { averageEnvironmentFactor, averageEnvironmentTenDq, type FactorShare } from './average-environment.js';
export { predictComplex, type Estimate, type PredictOptions, type PredictedLigand, type Prediction } from './predict.js';
export { validateSeriesAnalyses, canonicalLigand } from './validate.js';
export type * from './types.js';
