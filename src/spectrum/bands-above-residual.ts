/**
 * Narrow bands must stand out of what the fit leaves around them. The
 * noise model reads the noise from second differences of neighbouring
 * points, which smoothing by the instrument hides (a 5-point moving average
 * leaves them a third of the noise), so a smoothed noise bump a few points
 * wide can pass for a narrow band against that estimate. The residual of
 * the fit beside the band (data less model, between one and four FWHM from
 * its centre) holds the noise as it is, smoothed or not: a narrow band
 * (FWHM under 2 × narrowFwhm, the rule of the band fit's prune) lower than
 * NARROW_SIGNIFICANCE times that residual's rms is noise and is dropped.
 * Broad bands are left to the band fit's own criteria.
 */
import type { GaussianParameters } from './xy-refine-bands.js';

/** Heights a narrow band must reach, in residual rms (the band fit's 5σ rule for narrow bands). */
export const NARROW_SIGNIFICANCE = 5;

/** Fewest residual points beside a band for the test; with fewer the band stays. */
const MIN_POINTS = 8;

/**
 * Indices of the bands to keep. `x` ascending (cm-1), `residual` the
 * data less the full model at each x.
 */
export function bandsAboveResidual(bands: readonly GaussianParameters[], x: Float64Array, residual: Float64Array, narrowFwhm: number): number[] {
  const kept: number[] = [];
  bands.forEach((b, k) => {
    if (b.fwhm >= 2 * narrowFwhm) {
      kept.push(k);
      return;
    }
    let sum = 0;
    let count = 0;
    for (let i = 0; i < x.length; i++) {
      const d = Math.abs((x[i] as number) - b.position);
      if (d < b.fwhm || d > 4 * b.fwhm) continue;
      sum += (residual[i] as number) ** 2;
      count++;
    }
    if (count < MIN_POINTS || b.height >= NARROW_SIGNIFICANCE * Math.sqrt(sum / count)) kept.push(k);
  });
  return kept;
}
