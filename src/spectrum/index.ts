/**
 * fieldgap's spectrum stage: read instrument exports (delimited text,
 * JCAMP-DX), convert units, mask, fit baseline and bands, classify them.
 * Everything here is pure; file access lives in src/cli/ and server/.
 */
export type * from './types.js';
export { parseSpectrumText, type ParseSpectrumOptions } from './parseSpectrumText.js';
export { CM1_PER_EV, X_UNITS, parseXUnitOption, valueToWavenumber, wavenumberToValue, xUnitFromName } from './units.js';
export { xToWavenumber } from './xToWavenumber.js';
export { yToAbsorbance } from './yToAbsorbance.js';
export { absorbanceToEpsilon, epsilonToAbsorbance, yAbsorbanceToEpsilon } from './yAbsorbanceToEpsilon.js';
export {
  OSCILLATOR_STRENGTH_FACTOR, bandOscillatorStrength, gaussianArea, integratedEpsilonToOscillatorStrength,
} from './bandOscillatorStrength.js';
export { synthesizeSpectrum, type SynthesizeOptions, type SyntheticBand, type SyntheticSpectrum } from './synthesize.js';
export { formatDelimited, type FormatDelimitedOptions } from './format/formatDelimited.js';
export { formatJcamp, type FormatJcampOptions } from './format/formatJcamp.js';
export { mulberry32, gaussianDeviates } from './random.js';
export { processSpectrum, type ProcessSpectrumOptions } from './processSpectrum.js';
export { bandsClassify, bandKindFromEpsilon, defaultThresholds, type ClassificationThresholds } from './bandClassify.js';
export { xUnitFromLabel, yUnitFromLabel } from './unitLabels.js';
export { gaussianValue, xAddGaussian } from './gaussian.js';
export { xNoiseFromSecondDifferences, xNoiseLocal } from './xNoise.js';
export { xChooseGridStep, xUniformGrid, xyResampleUniform, xyResampleUniformWithCounts } from './xyResample.js';
export { maskAroundStep, xyMaskedRegions, xyMaskPoints, type MaskOptions } from './xyMask.js';
export { xyCorrectDetectorSteps, xyFindDetectorSteps, type DetectorStep, type FindDetectorStepsOptions } from './xyDetectorSteps.js';
export { xyLowerHull } from './xyLowerHull.js';
export { xPolynomialScale, xPolynomialValues, xyPolynomialFit, type PolynomialScale } from './xyPolynomial.js';
export { xyFindBandCandidates, type BandCandidate, type FindBandCandidatesOptions } from './xyFindBandCandidates.js';
export { xyRefineBands, type GaussianParameters, type RefineBandsOptions, type RefineBandsResult } from './xyRefineBands.js';
