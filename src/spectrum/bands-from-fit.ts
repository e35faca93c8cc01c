/**
 * Turning fitted Gaussians into reported bands: position (the measured
 * maximum when the caller found one, else the Gaussian centre), wavelength,
 * ε, area, oscillator strength, position uncertainty, the shoulder flag,
 * kind.
 */
import { bandOscillatorStrength, gaussianArea } from './band-oscillator-strength.js';
import { bandsClassify, type ClassificationThresholds } from './band-classify.js';
import type { BandMaximum } from './xy-band-maximum.js';
import { gaussianValue } from './gaussian.js';
import type { Band, BandWindow } from './types.js';
import type { GaussianParameters } from './xy-refine-bands.js';

export interface BandsFromFitOptions {
  /** Factor turning signal height into ε (1 / (c·l), or 1 for ε input); null when ε is unknown. */
  epsilonPerSignal: number | null;
  /** Position standard deviations from the fit (NaN where unknown). */
  positionSd: Float64Array;
  noise: number;
  gridStep: number;
  thresholds: ClassificationThresholds;
  /** Range of the data used [min, max], cm-1: the measured range less masked end stretches (for each band's window). */
  range: [number, number];
  /** Baseline slope (signal per cm-1) near each band, for the shoulder test. */
  baselineAt: (x: number) => number;
  /**
   * Each band's reported position where it is not the Gaussian's centre
   * (cm-1, with a σ added to the position's: its maximum as measured,
   * xyBandMaximum, or an unresolved multiplet's centroid), or null; used
   * only for a band inside the range that is not a shoulder.
   * @default the Gaussian centres
   */
  maxima?: ReadonlyArray<BandMaximum | null>;
}

/**
 * A band is a shoulder when the fitted spectrum (bands and baseline) has
 * no local maximum within ±FWHM/4 of its centre.
 */
function isShoulder(band: GaussianParameters, all: GaussianParameters[], baselineAt: (x: number) => number): boolean {
  const value = (x: number): number => all.reduce((s, b) => s + gaussianValue(x, b.position, b.height, b.fwhm), baselineAt(x));
  const h = band.fwhm / 80;
  let previous = value(band.position - 20 * h - h);
  let current = value(band.position - 20 * h);
  for (let k = -19; k <= 21; k++) {
    const next = value(band.position + k * h);
    if (current > previous && current >= next) return false;
    previous = current;
    current = next;
  }
  return true;
}

/**
 * Where a band's centre lies in the measured range: outside it ('beyond'),
 * or inside but within half its FWHM of an end ('near').
 */
export function bandWindow(band: GaussianParameters, range: [number, number]): BandWindow {
  const [low, high] = range;
  if (band.position < low) return 'beyond-red-end';
  if (band.position > high) return 'beyond-blue-end';
  if (band.position < low + 0.5 * band.fwhm) return 'near-red-end';
  if (band.position > high - 0.5 * band.fwhm) return 'near-blue-end';
  return 'inside';
}

/**
 * Model error of a centre the data do not bracket, as a fraction of the
 * FWHM, added in quadrature to the fit's σ: the fit extrapolates a Gaussian
 * from one flank, and real flanks are not Gaussian (on the asymmetric test
 * bands of tests/spectrum/realistic.ts the maximum moves by up to a tenth of
 * the width).
 */
const EXTRAPOLATION: Record<BandWindow, number> = {
  inside: 0, 'near-red-end': 0.03, 'near-blue-end': 0.03, 'beyond-red-end': 0.1, 'beyond-blue-end': 0.1,
};

export function bandsFromFit(bands: GaussianParameters[], options: BandsFromFitOptions): { bands: Band[]; relative: boolean } {
  const { epsilonPerSignal, positionSd, noise, gridStep, thresholds, baselineAt, range, maxima } = options;
  const epsilons = bands.map((b) => (epsilonPerSignal === null ? null : b.height * epsilonPerSignal));
  const { kinds, relative } = bandsClassify(
    bands.map((b, k) => ({ position: b.position, fwhm: b.fwhm, height: b.height, epsilon: epsilons[k] ?? null })),
    thresholds,
  );
  const out = bands.map((b, k): Band => {
    const epsilon = epsilons[k] ?? null;
    const window = bandWindow(b, range);
    const sd = positionSd[k] as number;
    // Fallback when the covariance is singular: FWHM · (σ / height) / √(points within the FWHM).
    const fallback = (b.fwhm * noise) / Math.max(b.height, 1e-300) / Math.sqrt(Math.max(b.fwhm / gridStep, 1));
    const shoulder = isShoulder(b, bands, baselineAt);
    // A band with a maximum of its own inside the range is reported at that maximum (an asymmetric band's centre is not its maximum).
    const maximum = shoulder || window.startsWith('beyond') ? null : (maxima?.[k] ?? null);
    const position = maximum?.position ?? b.position;
    return {
      position,
      wavelength: 1e7 / position,
      height: b.height,
      epsilon,
      fwhm: b.fwhm,
      area: gaussianArea(b.height, b.fwhm),
      oscillatorStrength: epsilon === null ? null : bandOscillatorStrength(epsilon, b.fwhm),
      kind: kinds[k] ?? 'd-d',
      positionUncertainty: Math.hypot(Number.isFinite(sd) ? sd : fallback, maximum?.sd ?? 0, EXTRAPOLATION[window] * b.fwhm),
      shoulder,
      window,
      maximumInWindow: window === 'inside' || window.startsWith('near'),
    };
  });
  return { bands: out, relative };
}
