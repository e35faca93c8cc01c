/**
 * Slow, obviously correct references for the spectrum kernels, used only in
 * tests/spectrum/kernels.test.ts. Each is written from the definition, with
 * plain loops and no shared code with src/spectrum.
 */
import { Matrix, pseudoInverse } from 'ml-matrix';

/**
 * Uniform resampling by definition: for each grid value, scan every data
 * point; mean of the kept points within ±step/2 when no masked point is
 * there; else linear interpolation between the nearest kept points on
 * either side when the points adjacent to the grid value are kept; else NaN.
 */
export function referenceResample(x: number[], y: number[], kept: boolean[], grid: number[]): number[] {
  const step = grid[1]! - grid[0]!;
  return grid.map((g) => {
    const inBin = x.map((_, i) => i).filter((i) => x[i]! >= g - step / 2 && x[i]! < g + step / 2);
    if (inBin.length > 0) {
      if (inBin.some((i) => !kept[i])) return Number.NaN;
      return inBin.reduce((s, i) => s + y[i]!, 0) / inBin.length;
    }
    let left = -1;
    let right = -1;
    for (let i = 0; i < x.length; i++) {
      if (x[i]! < g) left = i;
      if (x[i]! >= g && right < 0) right = i;
    }
    if (left < 0 || right < 0 || !kept[left] || !kept[right]) return Number.NaN;
    const t = (g - x[left]!) / (x[right]! - x[left]!);
    return y[left]! * (1 - t) + y[right]! * t;
  });
}

/** Lower convex envelope at each x: the lowest chord between points on either side (O(n³)). */
export function referenceLowerHull(x: number[], y: number[]): number[] {
  return x.map((xi, i) => {
    let best = y[i]!;
    for (let a = 0; a <= i; a++) {
      for (let b = i; b < x.length; b++) {
        if (a === b) continue;
        const t = (xi - x[a]!) / (x[b]! - x[a]!);
        best = Math.min(best, y[a]! * (1 - t) + y[b]! * t);
      }
    }
    return best;
  });
}

/**
 * Noise of a Savitzky–Golay second derivative by definition: the
 * least-squares polynomial (degree 3) coefficients over the window from the
 * pseudo-inverse of the Vandermonde matrix; the second derivative at the
 * centre is 2·a2 / h², so its noise is σ · 2 · ‖row 2 of pinv‖ / h².
 */
export function referenceSgSecondDerivativeNoise(windowSize: number, step: number, sigma: number): number {
  const m = (windowSize - 1) / 2;
  const rows: number[][] = [];
  for (let k = -m; k <= m; k++) rows.push([1, k, k * k, k * k * k]);
  const pinv = pseudoInverse(new Matrix(rows));
  let s = 0;
  for (let j = 0; j < windowSize; j++) s += pinv.get(2, j) ** 2;
  return (2 * sigma * Math.sqrt(s)) / (step * step);
}

/** ∂model/∂p by central differences, for a model given as a function of the parameter vector. */
export function referenceJacobian(model: (p: number[]) => number[], p: number[], relativeStep = 1e-6): number[][] {
  const base = model(p);
  const columns = p.map((v, j) => {
    const h = relativeStep * Math.max(Math.abs(v), 1);
    const plus = model(p.map((w, k) => (k === j ? w + h : w)));
    const minus = model(p.map((w, k) => (k === j ? w - h : w)));
    return plus.map((f, i) => (f - minus[i]!) / (2 * h));
  });
  return base.map((_, i) => columns.map((c) => c[i]!));
}
