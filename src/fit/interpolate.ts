/**
 * Energies between the scan's grid points, and the refinement of a grid
 * solution on them without calling the engine.
 *
 * The reduced transition energy ε(x) = e_k(x) − e_ground(x) (units of B,
 * x = Dq/B) is interpolated by cubic Hermite segments whose node slopes
 * come from the three-point formula for unequal steps. On the default grid
 * the error over the lowest twelve levels is ~1e-7 B typically and ~5e-5 B
 * at worst (0.04 cm-1 at B = 800; tests/fit/interpolate.test.ts checks it
 * against the engine); higher levels near sharp avoided crossings can be off
 * by ~1e-3 B. Good enough to rank runners-up; the winner is recomputed with
 * the engine. With C/B fixed the best B at each x has the closed
 * form of profile.ts, so the fit of an assignment is a one-dimensional
 * minimisation of the profile S(x), done by golden-section search between
 * the grid neighbours of the grid optimum.
 */
import { bestScale } from './profile.js';
import type { LevelScan } from './scan.js';

function nodeValue(scan: LevelScan, j: number, level: number, ground: number): number {
  const n = scan.ids.length;
  return scan.energies[j * n + level]! - scan.energies[j * n + ground]!;
}

function nodeSlope(scan: LevelScan, j: number, level: number, ground: number): number {
  const x = scan.x;
  const last = x.length - 1;
  if (j === 0 || j === last) {
    const a = j === 0 ? 0 : last - 1;
    return (nodeValue(scan, a + 1, level, ground) - nodeValue(scan, a, level, ground)) / (x[a + 1]! - x[a]!);
  }
  const h0 = x[j]! - x[j - 1]!;
  const h1 = x[j + 1]! - x[j]!;
  const f0 = nodeValue(scan, j - 1, level, ground);
  const f1 = nodeValue(scan, j, level, ground);
  const f2 = nodeValue(scan, j + 1, level, ground);
  return (h0 * h0 * f2 - h1 * h1 * f0 + (h1 * h1 - h0 * h0) * f1) / (h0 * h1 * (h0 + h1));
}

/** Index j with x[j] ≤ x ≤ x[j+1] (clamped to the grid). */
function segmentOf(grid: Float64Array, x: number): number {
  let lo = 0;
  let hi = grid.length - 1;
  if (x <= grid[0]!) return 0;
  if (x >= grid[hi]!) return hi - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (grid[mid]! <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** ε(x) of `level` above `ground`, in units of B, interpolated. */
export function scanEnergyAt(scan: LevelScan, level: number, ground: number, x: number): number {
  const j = segmentOf(scan.x, x);
  const x0 = scan.x[j]!;
  const h = scan.x[j + 1]! - x0;
  const t = (x - x0) / h;
  const f0 = nodeValue(scan, j, level, ground);
  const f1 = nodeValue(scan, j + 1, level, ground);
  const d0 = nodeSlope(scan, j, level, ground) * h;
  const d1 = nodeSlope(scan, j + 1, level, ground) * h;
  const t2 = t * t;
  const t3 = t2 * t;
  return (2 * t3 - 3 * t2 + 1) * f0 + (t3 - 2 * t2 + t) * d0 + (-2 * t3 + 3 * t2) * f1 + (t3 - t2) * d1;
}

export interface ScanRefined {
  x: number;
  b: number;
  ssr: number;
}

/**
 * Minimises the profile S(x) = min_B Σ w (o − B ε(x))² for the levels of an
 * assignment over [lo, hi] (Dq/B), by golden-section search to 1e-10.
 */
export function refineProfileOnScan(
  scan: LevelScan,
  ground: number,
  levels: ArrayLike<number>,
  o: Float64Array,
  w: Float64Array,
  lo: number,
  hi: number,
): ScanRefined {
  const e = new Float64Array(o.length);
  const profile = (x: number) => {
    for (let i = 0; i < o.length; i++) e[i] = scanEnergyAt(scan, levels[i]!, ground, x);
    const fit = bestScale(o, e, w);
    return fit.b > 0 ? fit : { b: fit.b, ssr: Infinity };
  };
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let bnd = hi;
  let c = bnd - g * (bnd - a);
  let d = a + g * (bnd - a);
  let fc = profile(c).ssr;
  let fd = profile(d).ssr;
  while (bnd - a > 1e-10 * Math.max(1, Math.abs(a))) {
    if (fc < fd) {
      bnd = d;
      d = c;
      fd = fc;
      c = bnd - g * (bnd - a);
      fc = profile(c).ssr;
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (bnd - a);
      fd = profile(d).ssr;
    }
  }
  const x = (a + bnd) / 2;
  const fit = profile(x);
  return { x, b: fit.b, ssr: fit.ssr };
}
