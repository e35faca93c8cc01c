/**
 * Fitting 10Dq, Racah B and C to observed d–d band maxima: automatic
 * assignment, spin-state logic, uncertainties. See fit-ligand-field.ts for the
 * method and likelihood.ts for the one score that chooses between
 * assignments (penalties.ts computes its named terms).
 */
export { fitLigandField, fitBands, unexplainedThreshold } from './fit-ligand-field.js';
export { parseBandList, normalizeBands, BAND_FLAGS, type BandFlag, type BandInput, type ObservedBand } from './bands.js';
export { leastSquares, type LeastSquaresOptions, type LeastSquaresResult } from './least-squares.js';
export { jacobianCovariance } from './covariance.js';
export { ligandFieldStabilisation, spinOnlyMoment, strongFieldConfiguration, type Lfse } from './lfse.js';
export { DEFAULT_C_OVER_B } from './settings.js';
export { defaultBandSigma } from './observations.js';
export { PENALTY, LIMITS } from './penalties.js';
export { LIKELIHOOD, probabilitiesOf } from './likelihood.js';
export { leastSquaresNormal, LEAST_SQUARES_MESSAGES } from './least-squares.js';
export type * from './types.js';
