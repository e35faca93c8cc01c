/**
 * Turning fitted Gaussians into reported bands: wavelength, ε, area,
 * oscillator strength, position uncertainty, the shoulder flag, kind.
 */
import { bandOscillatorStrength, gaussianArea } from './bandOscillatorStrength.js';
import { bandsClassify, type ClassificationThresholds } from './bandClassify.js';
import { gaussianValue } from './gaussian.js';
import type { Band } from './types.js';
import type { GaussianParameters } from './xyRefineBands.js';

export interface BandsFromFitOptions {
  /** Factor turning signal height into ε (1 / (c·l), or 1 for ε input); null when ε is unknown. */
  epsilonPerSignal: number | null;
  /** Position standard deviations from the fit (NaN where unknown). */
  positionSd: Float64Array;
  noise: number;
  gridStep: number;
  thresholds: ClassificationThresholds;
  /** Baseline slope (signal per cm-1) near each band, for the shoulder test. */
  baselineAt: (x: number) => number;
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

export function bandsFromFit(bands: GaussianParameters[], options: BandsFromFitOptions): { bands: Band[]; relative: boolean } {
  const { epsilonPerSignal, positionSd, noise, gridStep, thresholds, baselineAt } = options;
  const epsilons = bands.map((b) => (epsilonPerSignal === null ? null : b.height * epsilonPerSignal));
  const { kinds, relative } = bandsClassify(
    bands.map((b, k) => ({ position: b.position, fwhm: b.fwhm, height: b.height, epsilon: epsilons[k] ?? null })),
    thresholds,
  );
  const out = bands.map((b, k): Band => {
    const epsilon = epsilons[k] ?? null;
    const sd = positionSd[k] as number;
    // Fallback when the covariance is singular: FWHM · (σ / height) / √(points within the FWHM).
    const fallback = (b.fwhm * noise) / Math.max(b.height, 1e-300) / Math.sqrt(Math.max(b.fwhm / gridStep, 1));
    return {
      position: b.position,
      wavelength: 1e7 / b.position,
      height: b.height,
      epsilon,
      fwhm: b.fwhm,
      area: gaussianArea(b.height, b.fwhm),
      oscillatorStrength: epsilon === null ? null : bandOscillatorStrength(epsilon, b.fwhm),
      kind: kinds[k] ?? 'd-d',
      positionUncertainty: Number.isFinite(sd) ? sd : fallback,
      shoulder: isShoulder(b, bands, baselineAt),
    };
  });
  return { bands: out, relative };
}
