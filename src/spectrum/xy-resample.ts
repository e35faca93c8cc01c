/**
 * Resampling onto a uniform wavenumber grid. Absorbance is a per-sample
 * quantity, so it is resampled as is (no Jacobian: unlike a spectral
 * density, A does not change when the axis changes from nm to cm-1).
 */
import { median } from '../numeric/median.js';

/**
 * Grid step, cm-1: the median spacing of the data (so the grid keeps the
 * resolution the data have where most points are), but no finer than
 * range / (maxPoints − 1), which bounds the cost of the band fit.
 */
export function xChooseGridStep(x: Float64Array, maxPoints = 600): number {
  const n = x.length;
  const gaps = new Float64Array(n - 1);
  for (let i = 0; i < n - 1; i++) gaps[i] = Math.abs((x[i + 1] as number) - (x[i] as number));
  const range = Math.abs((x[n - 1] as number) - (x[0] as number));
  return Math.max(median(gaps), range / (maxPoints - 1));
}

/** Uniform grid from `from` to (at most) `to` with spacing `step`. */
export function xUniformGrid(from: number, to: number, step: number): Float64Array {
  const n = Math.floor((to - from) / step + 1e-9) + 1;
  const grid = new Float64Array(n);
  for (let i = 0; i < n; i++) grid[i] = from + i * step;
  return grid;
}

/**
 * y on the uniform `grid` from data (x ascending): the mean of the kept
 * points within ±step/2 of a grid point when there are any (averaging where
 * the data are denser than the grid, so noise is not aliased), else linear
 * interpolation between the two kept neighbours. NaN where a grid point
 * falls in a masked stretch (a neighbour is masked) or outside the data.
 */
export function xyResampleUniform(x: Float64Array, y: Float64Array, kept: Uint8Array, grid: Float64Array): Float64Array {
  return xyResampleUniformWithCounts(x, y, kept, grid).y;
}

export interface ResampleOptions {
  /**
   * Move each bin mean from the mean x of its points to the grid value along
   * the slope through the kept points just outside the bin. @default false
   */
  slopeCorrected?: boolean;
}

/**
 * As xyResampleUniform, also returning how many data points each grid
 * value averages (0 where interpolated or NaN), from which the noise of
 * each grid value follows: σ / √count, or about σ where interpolated.
 */
export function xyResampleUniformWithCounts(
  x: Float64Array, y: Float64Array, kept: Uint8Array, grid: Float64Array, options: ResampleOptions = {},
): { y: Float64Array; counts: Uint16Array } {
  const { slopeCorrected = false } = options;
  const n = x.length;
  const out = new Float64Array(grid.length).fill(Number.NaN);
  const counts = new Uint16Array(grid.length);
  if (grid.length === 0 || n === 0) return { y: out, counts };
  const step = grid.length > 1 ? (grid[1] as number) - (grid[0] as number) : 1;
  let lo = 0;
  for (let g = 0; g < grid.length; g++) {
    const xg = grid[g] as number;
    const left = xg - step / 2;
    const right = xg + step / 2;
    while (lo < n && (x[lo] as number) < left) lo++;
    let sum = 0;
    let sumX = 0;
    let count = 0;
    let masked = false;
    let k = lo;
    for (; k < n && (x[k] as number) < right; k++) {
      if (kept[k] === 1) {
        sum += y[k] as number;
        sumX += x[k] as number;
        count++;
      } else masked = true;
    }
    if (count > 0 && !masked) {
      out[g] = sum / count;
      // The bin mean belongs to the mean x of its points, not to xg: on a steep flank that offset is a bias of many noise deviations.
      const before = lo - 1;
      if (slopeCorrected && before >= 0 && k < n && kept[before] === 1 && kept[k] === 1) {
        const slope = ((y[k] as number) - (y[before] as number)) / ((x[k] as number) - (x[before] as number));
        out[g] = (out[g] as number) + slope * (xg - sumX / count);
      }
      counts[g] = Math.min(count, 65535);
      continue;
    }
    if (masked) continue;
    // No point in the bin: interpolate between the neighbours around xg.
    let j = lo;
    while (j < n && (x[j] as number) < xg) j++;
    if (j === 0 || j === n) continue;
    if (kept[j - 1] !== 1 || kept[j] !== 1) continue;
    const x0 = x[j - 1] as number;
    const x1 = x[j] as number;
    const t = (xg - x0) / (x1 - x0);
    out[g] = (y[j - 1] as number) * (1 - t) + (y[j] as number) * t;
  }
  return { y: out, counts };
}
