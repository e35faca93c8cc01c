/**
 * A band whose maximum lies at or below the low-energy (red) end of the
 * measured range: the data are highest at the first point and fall away
 * from it, like the flank of the broad [Cu(H2O)6]2+ band in a spectrum that
 * stops at 780 nm. Band finding by curvature cannot see such a band (it has
 * no maximum inside the range), so it is proposed here and the fit, free to
 * move its centre beyond the end, says where the maximum is.
 *
 * Conditions (all in noise deviations σ of the fit): the first point rises
 * more than `significance` σ above the lowest point of the range; no point
 * within `look` of the end lies more than 2 σ above the first; the data fall
 * by more than `significance` σ within that stretch; over twice that stretch the data are concave (a
 * quadratic through them sags more than 3 σ below its chord, where a
 * sloping baseline is straight and a tail from the UV convex), or, convex,
 * fall within `look` more than twice as far as a baseline straight in
 * wavelength falling from the first point to the lowest over the whole
 * range would (a band's flank is convex beyond its inflection point, half
 * a FWHM from its centre, and falls steeply there: the 3T2g band of
 * [Ni(H2O)6]2+ near 1 150 nm in a spectrum that stops at 1 100 nm). The start: height
 * y[0] − min y, FWHM twice the distance to where the data have fallen half
 * way (clamped to [narrow, limit]), centre a tenth of that FWHM beyond the
 * end.
 */
import type { GaussianParameters } from './xy-refine-bands.js';

export interface LowEndCandidateOptions {
  /** σ of each point. */
  noise: Float64Array;
  /** Stretch (cm-1) from the end over which the data must fall. @default 1500 */
  look?: number;
  /** @default 10 */
  significance?: number;
  /** Narrowest and broadest FWHM of the start, cm-1. @default [1000, 10000] */
  fwhmLimits?: [number, number];
}

export function xyLowEndBandCandidate(x: Float64Array, y: Float64Array, options: LowEndCandidateOptions): GaussianParameters | null {
  const { noise, look = 1500, significance = 10, fwhmLimits = [1000, 10000] } = options;
  const n = x.length;
  if (n < 10) return null;
  const x0 = x[0] as number;
  const y0 = y[0] as number;
  let min = Number.POSITIVE_INFINITY;
  for (const v of y) if (v < min) min = v;
  const sigma = noise[0] as number;
  if (!(y0 - min > significance * sigma)) return null;
  let lowest = y0;
  for (let i = 1; i < n && (x[i] as number) - x0 <= look; i++) {
    const v = y[i] as number;
    if (v > y0 + 2 * sigma) return null;
    lowest = Math.min(lowest, v);
  }
  if (!(y0 - lowest > significance * sigma)) return null;
  // A band's top is concave, its flank near the half-height point straight. A convex end is a band's flank only
  // when it falls steeply: more than twice as far within `look` as a baseline straight in nm (convex in cm-1) that
  // falls from the first point to the lowest over the whole range.
  const sag = endSag(x, y, 2 * look);
  if (!(sag >= -3 * sigma || y0 - lowest > 2 * straightInNmFall(x0, x0 + look, x[n - 1] as number) * (y0 - min))) return null;
  const half = min + 0.5 * (y0 - min);
  let k = 1;
  while (k < n - 1 && (y[k] as number) > half) k++;
  const fwhm = Math.min(Math.max(2 * ((x[k] as number) - x0), fwhmLimits[0]), fwhmLimits[1]);
  return { position: x0 - 0.1 * fwhm, height: y0 - min, fwhm };
}

/**
 * The fraction of its whole fall that a baseline straight in wavelength
 * (λ = 10⁷/ν̃), falling from the red end `from` to the blue end `to`, makes
 * between `from` and `at` (cm-1, from < at ≤ to).
 */
function straightInNmFall(from: number, at: number, to: number): number {
  return (1 / from - 1 / Math.min(at, to)) / (1 / from - 1 / to);
}

/**
 * How far the chord over [x0, x0 + length] lies below the least-squares
 * quadratic through the points there, at the middle: −c (L/2)² for the
 * quadratic a + b t + c t²; positive when the data are concave.
 */
function endSag(x: Float64Array, y: Float64Array, length: number): number {
  const x0 = x[0] as number;
  let m = 0;
  while (m < x.length && (x[m] as number) - x0 <= length) m++;
  if (m < 5) return 0;
  const span = (x[m - 1] as number) - x0;
  // Normal equations of the quadratic in t = (x − x0) / span, by Cramer's rule on the 3 × 3 system.
  const s = new Float64Array(5);
  const r = new Float64Array(3);
  for (let i = 0; i < m; i++) {
    const t = ((x[i] as number) - x0) / span;
    let p = 1;
    for (let k = 0; k < 5; k++) {
      s[k] = (s[k] as number) + p;
      if (k < 3) r[k] = (r[k] as number) + p * (y[i] as number);
      p *= t;
    }
  }
  const a = [[s[0], s[1], s[2]], [s[1], s[2], s[3]], [s[2], s[3], s[4]]] as number[][];
  const det = (q: number[][]) => q[0]![0]! * (q[1]![1]! * q[2]![2]! - q[1]![2]! * q[2]![1]!) - q[0]![1]! * (q[1]![0]! * q[2]![2]! - q[1]![2]! * q[2]![0]!) + q[0]![2]! * (q[1]![0]! * q[2]![1]! - q[1]![1]! * q[2]![0]!);
  const d = det(a);
  if (d === 0) return 0;
  const withC = a.map((row, i) => [row[0]!, row[1]!, r[i] as number]);
  const c = det(withC) / d;
  return -c * 0.25;
}

/**
 * A band whose maximum lies inside the range but close to its high-energy
 * (blue) end, like the 3T1g(P) band of [Ni(H2O)6]2+ at 395 nm in a spectrum
 * that starts at 380 nm: a smoothing second derivative loses it at the
 * boundary, and an absorption edge must not take its place. Proposed when
 * the highest point within `look` of the top lies inside that stretch, the
 * data fall from it to the top of the range by more than `significance` σ,
 * and rise to it from the lowest point before it by as much. The start: the
 * maximum's position and height above that lowest point, FWHM twice the
 * distance to where the data are half way down on the low-energy side.
 */
export function xyHighEndBandCandidate(x: Float64Array, y: Float64Array, options: LowEndCandidateOptions): GaussianParameters | null {
  const { noise, look = 3000, significance = 10, fwhmLimits = [1000, 10000] } = options;
  const n = x.length;
  if (n < 10) return null;
  const top = x[n - 1] as number;
  let m = n - 1;
  for (let i = n - 1; i >= 0 && top - (x[i] as number) <= look; i--) if ((y[i] as number) > (y[m] as number)) m = i;
  const sigma = noise[m] as number;
  const peak = y[m] as number;
  if (m >= n - 2 || !(peak - (y[n - 1] as number) > significance * sigma)) return null;
  let low = m;
  for (let i = m; i >= 0 && (x[m] as number) - (x[i] as number) <= 2 * look; i--) if ((y[i] as number) < (y[low] as number)) low = i;
  const rise = peak - (y[low] as number);
  if (!(rise > significance * sigma)) return null;
  let k = m;
  while (k > low && (y[k] as number) > (y[low] as number) + 0.5 * rise) k--;
  const fwhm = Math.min(Math.max(2 * ((x[m] as number) - (x[k] as number)), fwhmLimits[0]), fwhmLimits[1]);
  return { position: x[m] as number, height: rise, fwhm };
}

/**
 * The mirror of xyHighEndBandCandidate at the low-energy (red) end: a
 * maximum inside the range but within `look` of its first point, which a
 * smoothing second derivative loses at the boundary (the Jahn–Teller band
 * of Cu(II) peaking just inside 780 nm).
 */
export function xyNearLowEndBandCandidate(x: Float64Array, y: Float64Array, options: LowEndCandidateOptions): GaussianParameters | null {
  const n = x.length;
  const mx = Float64Array.from({ length: n }, (_, i) => -(x[n - 1 - i] as number));
  const my = Float64Array.from({ length: n }, (_, i) => y[n - 1 - i] as number);
  const noise = Float64Array.from({ length: n }, (_, i) => options.noise[n - 1 - i] as number);
  const found = xyHighEndBandCandidate(mx, my, { ...options, noise });
  return found === null ? null : { ...found, position: -found.position };
}
