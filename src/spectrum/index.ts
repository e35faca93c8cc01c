/**
 * fieldgap's spectrum stage: read instrument exports (delimited text,
 * JCAMP-DX), convert units, mask, fit baseline and bands, classify them.
 * Everything here is pure; file access lives in src/cli/ and server/.
 */
export type * from './types.js';
export { parseSpectrumText, type ParseSpectrumOptions } from './parse-spectrum-text.js';
export { CM1_PER_EV, X_UNITS, parseXUnitOption, valueToWavenumber, wavenumberToValue, xUnitFromName } from './units.js';
export { xToWavenumber } from './x-to-wavenumber.js';
export { yToAbsorbance } from './y-to-absorbance.js';
export { absorbanceToEpsilon, epsilonToAbsorbance, yAbsorbanceToEpsilon } from './y-absorbance-to-epsilon.js';
export {
  OSCILLATOR_STRENGTH_FACTOR, bandOscillatorStrength, gaussianArea, integratedEpsilonToOscillatorStrength,
} from './band-oscillator-strength.js';
export { synthesizeSpectrum, type SynthesizeOptions, type SyntheticBand, type SyntheticSpectrum } from './synthesize.js';
export { formatDelimited, type FormatDelimitedOptions } from './format/format-delimited.js';
export { formatJcamp, type FormatJcampOptions } from './format/format-jcamp.js';
export { mulberry32, gaussianDeviates } from './random.js';
export { processSpectrum, type ProcessSpectrumOptions } from './process-spectrum.js';
export { bandsClassify, bandKindFromEpsilon, defaultThresholds, type ClassificationThresholds } from './band-classify.js';
export { xUnitFromLabel, yUnitFromLabel } from './unit-labels.js';
export { gaussianValue, xAddGaussian } from './gaussian.js';
export { xNoiseFromSecondDifferences, xNoiseLocal } from './x-noise.js';
export { xChooseGridStep, xUniformGrid, xyResampleUniform, xyResampleUniformWithCounts } from './xy-resample.js';
export { maskAroundStep, xyMaskedRegions, xyMaskPoints, type MaskOptions } from './xy-mask.js';
export { xyCorrectDetectorSteps, xyFindDetectorSteps, type DetectorStep, type FindDetectorStepsOptions } from './xy-detector-steps.js';
export { xyLowerHull } from './xy-lower-hull.js';
export { xPolynomialScale, xPolynomialValues, xyPolynomialFit, type PolynomialScale } from './xy-polynomial.js';
export { xyFindBandCandidates, type BandCandidate, type FindBandCandidatesOptions } from './xy-find-band-candidates.js';
export { xyRefineBands, type GaussianParameters, type RefineBandsOptions, type RefineBandsResult } from './xy-refine-bands.js';
