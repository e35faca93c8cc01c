/**
 * Series of complexes of one metal ion: spectrochemical and nephelauxetic
 * ranking, Jørgensen factors fitted from one's own analyses, the rule of
 * average environment, and predictions from a formula alone. Energies in cm-1.
 */
export { rankByTenDq, rankByNephelauxetic, valuesOverlap, type RankOptions } from './rank.js';
export { fitLigandFactors, combine, type FitFactorsOptions, type FactorFit, type LigandFactor } from './factors.js';
export { averageEnvironmentFactor, averageEnvironmentTenDq, type FactorShare } from './average-environment.js';
export {
  predictComplex, type Estimate, type PredictOptions, type PredictedLigand, type Prediction,
  type OwnFactor, type PredictGeometry, type SpinDecision, type UsedFactor, type Rule,
} from './predict.js';
export { ownFactorsFromFit } from './predict-library.js';
export { validateSeriesAnalyses, canonicalLigand } from './validate.js';
export type * from './types.js';
