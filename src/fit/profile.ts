/**
 * The least-squares profile of one assignment along the scan.
 *
 * At a grid point the calculated band i is B·e_i (e_i in units of B, from
 * the scan), so for fixed x = Dq/B the best B has the closed form
 *   B = Σ w_i o_i e_i / Σ w_i e_i²,
 * and the weighted sum of squares is Σ w_i (o_i − B e_i)². Minimising that
 * over the grid points where the assignment holds gives the global optimum
 * at this C/B to within the grid step, with no local minima to fall into.
 */
import type { AssignmentTable, Branch } from './enumerate.js';
import type { LevelScan } from './scan.js';

export interface ScaleFit {
  /** Best B, cm-1 (≤ 0 when the energies cannot scale to the bands). */
  b: number;
  /** Σ w (o − B e)². */
  ssr: number;
}

/** Closed-form best scale B for observed o and reduced energies e with weights w. */
export function bestScale(o: Float64Array, e: Float64Array, w: Float64Array): ScaleFit {
  let num = 0;
  let den = 0;
  for (let i = 0; i < o.length; i++) {
    num += w[i]! * o[i]! * e[i]!;
    den += w[i]! * e[i]! * e[i]!;
  }
  const b = den > 0 ? num / den : 0;
  let ssr = 0;
  for (let i = 0; i < o.length; i++) ssr += w[i]! * (o[i]! - b * e[i]!) ** 2;
  return { b, ssr };
}

export interface GridSolution {
  /** Row of the assignment table. */
  assignment: number;
  /** Grid index. */
  point: number;
  /** Dq/B at that point. */
  x: number;
  b: number;
  ssr: number;
}

/**
 * The grid optimum of assignment `a` of `table` for observations `o`
 * (ordered like the table's columns) with weights `w`; undefined when no
 * point gives a positive B. With stride s > 1 every s-th point is tried and
 * then every point between the coarse neighbours of the best: the optimum of
 * a profile with one minimum per s points, at about 1/s of the cost.
 * With `prior` (a deviance of B and Dq in the units of the weighted sum of
 * squares, likelihood.ts) the point minimising ssr + prior is chosen: where
 * two roots fit the bands equally (two bands, two parameters), the plausible
 * one; `ssr` is still the sum of squares alone.
 */
export function gridOptimum(
  scan: LevelScan,
  branch: Branch,
  table: AssignmentTable,
  a: number,
  o: Float64Array,
  w: Float64Array,
  work: Float64Array = new Float64Array(o.length),
  stride = 1,
  prior?: (b: number, dq: number) => number,
): GridSolution | undefined {
  const n = scan.ids.length;
  const width = table.width;
  const energies = scan.energies;
  const levels = table.levels;
  const row = a * width;
  // One pass per point: with num = Σ w o e and den = Σ w e², the best B is num/den and
  // Σ w (o − B e)² = Σ w o² − num²/den (bestScale, expanded; clamped at 0 against rounding).
  let soo = 0;
  for (let i = 0; i < width; i++) {
    work[i] = w[i]! * o[i]!;
    soo += work[i]! * o[i]!;
  }
  let bestSsr = Infinity;
  let bestObjective = Infinity;
  let bestPoint = -1;
  let bestAt = -1;
  let bestB = 0;
  const start = table.pointStart[a]!;
  const end = table.pointStart[a + 1]!;
  // Pass 0 visits every stride-th point; pass 1 (stride > 1) every point between the coarse neighbours of the best.
  for (let pass = 0; pass < (stride > 1 ? 2 : 1); pass++) {
    const from = pass === 0 ? start : Math.max(start, bestAt - stride + 1);
    const to = pass === 0 ? end : Math.min(end, bestAt + stride);
    const step = pass === 0 ? stride : 1;
    if (pass === 1 && bestAt < 0) break;
    for (let p = from; p < to; p += step) {
      const j = table.points[p]!;
      const base = j * n;
      const zero = energies[base + branch.ground]!;
      let num = 0;
      let den = 0;
      for (let i = 0; i < width; i++) {
        const e = energies[base + levels[row + i]!]! - zero;
        num += work[i]! * e;
        den += w[i]! * e * e;
      }
      if (!(den > 0) || !(num > 0)) continue;
      const ssr = Math.max(0, soo - (num * num) / den);
      const objective = prior ? ssr + prior(num / den, scan.x[j]! * (num / den)) : ssr;
      if (objective < bestObjective) {
        bestObjective = objective;
        bestSsr = ssr;
        bestPoint = j;
        bestAt = p;
        bestB = num / den;
      }
    }
  }
  if (bestPoint < 0) return undefined;
  return { assignment: a, point: bestPoint, x: scan.x[bestPoint]!, b: bestB, ssr: bestSsr };
}
