/**
 * Test helper: synthetic spectra from known bands (invented test cases, not
 * check values from the outside world), turned into Spectrum objects.
 */
import type { Spectrum, SynthesizeOptions } from '../../src/spectrum/index.js';
import { synthesizeSpectrum } from '../../src/spectrum/index.js';

export function syntheticSpectrum(options: SynthesizeOptions): Spectrum {
  const s = synthesizeSpectrum(options);
  return { x: s.wavelength, y: s.absorbance, xUnit: 'nm', yUnit: 'absorbance', name: 'synthetic', column: 1, metadata: {} };
}

/** Tolerances (fractions) used by the recovery tests, documented in one place. */
export const TOLERANCE = {
  /** Position error of an isolated band, as a fraction of its FWHM. */
  isolatedPosition: 0.05,
  /** Position error of a shoulder, as a fraction of its FWHM. */
  shoulderPosition: 0.1,
  /** Relative error of height and FWHM, isolated bands. */
  isolatedShape: 0.08,
  /** Relative error of height and FWHM, shoulders and narrow bands. */
  shoulderShape: 0.25,
};
