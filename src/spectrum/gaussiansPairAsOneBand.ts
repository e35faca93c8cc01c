/**
 * Is a pair of fitted Gaussians one skewed band? Measured d–d bands are
 * log-normal-like: a steeper low-energy side and a longer high-energy tail
 * (skewness ρ, the ratio of the high-energy to the low-energy half width,
 * 1.05–1.3 at room temperature: common practice; shape of D. B. Siano and
 * D. E. Metzler, J. Chem. Phys. 51 (1969) 1856). A sum of Gaussians
 * describes such a band as a main band and a weaker component on its
 * high-energy side. The pair is one band when its sum has one maximum and
 * is one log-normal band of skewness at most MAX_SKEW: the least-squares
 * log-normal (started from the one through the sum's maximum and
 * half-height points) departs from the sum by no more than twice the
 * band-shape error (rms over the sum's upper part, above a tenth of its
 * peak, relative to the peak). Used by gaussiansGroupMultiplets, the one
 * rule that joins fitted components into reported bands.
 */
import { leastSquares } from '../numeric/least-squares.js';
import { gaussianValue } from './gaussian.js';
import type { GaussianParameters } from './xyRefineBands.js';

/** Largest skewness of a single band (common practice: measured d–d bands 1.05–1.3; a margin for noise). */
export const MAX_SKEW = 1.35;

/**
 * The log-normal may depart from the sum by this
 * many shape errors (rms): the shape error is a one-σ allowance per point,
 * and the two Gaussians themselves carry it (a 2σ criterion).
 */
const TOLERANCE_FACTOR = 2;

/** Points of the fine grid the sum is examined on. */
const FINE_POINTS = 200;

/** Peak-normalised log-normal band (Siano & Metzler 1969) with maximum `maximum`, FWHM `fwhm`, skewness `skew` (> 1). */
function logNormal(nu: number, maximum: number, fwhm: number, skew: number): number {
  if (Math.abs(skew - 1) < 1e-6) return Math.exp(-4 * Math.LN2 * ((nu - maximum) / fwhm) ** 2);
  const argument = 1 + ((nu - maximum) * (skew * skew - 1)) / (skew * fwhm);
  if (argument <= 0) return 0;
  const l = Math.log(argument) / Math.log(skew);
  return Math.exp(-Math.LN2 * l * l);
}

/**
 * The single-band description of the sum of `a` and `b` (a below b), or
 * null when the sum is no single band of skewness ≤ MAX_SKEW within
 * `shapeError` (see the header).
 */
export function pairAsOneBand(a: GaussianParameters, b: GaussianParameters, shapeError: number): { maximum: number; fwhm: number; skew: number } | null {
  const from = a.position - 2 * a.fwhm;
  const to = b.position + 2 * b.fwhm;
  const step = (to - from) / (FINE_POINTS - 1);
  const x = Float64Array.from({ length: FINE_POINTS }, (_, i) => from + i * step);
  const y = Float64Array.from(x, (v) => gaussianValue(v, a.position, a.height, a.fwhm) + gaussianValue(v, b.position, b.height, b.fwhm));
  let top = 0;
  for (let i = 1; i < y.length; i++) if ((y[i] as number) > (y[top] as number)) top = i;
  const peak = y[top] as number;
  // One maximum only: the sum falls monotonically on either side of its top.
  for (let i = 1; i <= top; i++) if ((y[i] as number) < (y[i - 1] as number) - 1e-12 * peak) return null;
  for (let i = top + 1; i < y.length; i++) if ((y[i] as number) > (y[i - 1] as number) + 1e-12 * peak) return null;
  const crossing = (i: number, j: number): number => {
    const yi = y[i] as number;
    const yj = y[j] as number;
    return (x[i] as number) + ((peak / 2 - yi) / (yj - yi)) * ((x[j] as number) - (x[i] as number));
  };
  let lo = top;
  while (lo > 0 && (y[lo] as number) > peak / 2) lo--;
  let hi = top;
  while (hi < y.length - 1 && (y[hi] as number) > peak / 2) hi++;
  if ((y[lo] as number) > peak / 2 || (y[hi] as number) > peak / 2) return null;
  const maximum = x[top] as number;
  const low = crossing(lo, lo + 1);
  const high = crossing(hi - 1, hi);
  const skew = (high - maximum) / (maximum - low);
  // The three-point skewness may exceed the limit a little where the best log-normal does not.
  if (!(skew >= 1 && skew <= 1.2 * MAX_SKEW)) return null;
  // The best log-normal (maximum, FWHM, skewness ≤ MAX_SKEW, height) over the sum's upper part, from the three-point one.
  const keep: number[] = [];
  for (let i = 0; i < x.length; i++) if ((y[i] as number) >= 0.1 * peak) keep.push(i);
  const residuals = (q: Float64Array, out: Float64Array): void => {
    keep.forEach((i, k) => {
      out[k] = ((y[i] as number) - (q[3] as number) * logNormal(x[i] as number, q[0] as number, q[1] as number, q[2] as number)) / peak;
    });
  };
  const fwhm0 = high - low;
  const start = Float64Array.of(maximum, fwhm0, Math.min(skew, MAX_SKEW), peak);
  const fit = leastSquares(residuals, start, keep.length, {
    lower: Float64Array.of(low, 0.5 * fwhm0, 1, 0.5 * peak), upper: Float64Array.of(high, 2 * fwhm0, MAX_SKEW, 2 * peak), maxIterations: 50,
  });
  const rms = Math.sqrt((2 * fit.cost) / keep.length);
  return fit.success && rms <= TOLERANCE_FACTOR * shapeError ? { maximum: fit.params[0] as number, fwhm: fit.params[1] as number, skew: fit.params[2] as number } : null;
}
