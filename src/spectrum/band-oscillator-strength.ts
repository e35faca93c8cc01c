/**
 * Oscillator strength of an absorption band from its integrated molar
 * absorptivity: f = 4.32 × 10⁻⁹ ∫ε dν̃, ε in L mol-1 cm-1 and ν̃ in cm-1
 * (the usual constant, e.g. Lever, Inorganic Electronic Spectroscopy, 1984).
 */
export const OSCILLATOR_STRENGTH_FACTOR = 4.32e-9;

/** √(π / (4 ln 2)): area of a unit-height Gaussian per unit FWHM. */
export const GAUSSIAN_AREA_PER_FWHM = Math.sqrt(Math.PI / (4 * Math.LN2));

/** Area of a Gaussian band of `height` and `fwhm` (same x unit as fwhm). */
export function gaussianArea(height: number, fwhm: number): number {
  return height * fwhm * GAUSSIAN_AREA_PER_FWHM;
}

/** f from the integrated absorptivity ∫ε dν̃ (L mol-1 cm-2). */
export function integratedEpsilonToOscillatorStrength(integratedEpsilon: number): number {
  return OSCILLATOR_STRENGTH_FACTOR * integratedEpsilon;
}

/** f of a Gaussian band given ε at its maximum and its FWHM in cm-1. */
export function bandOscillatorStrength(epsilonMax: number, fwhm: number): number {
  return integratedEpsilonToOscillatorStrength(gaussianArea(epsilonMax, fwhm));
}
