/**
 * Savitzky–Golay smoothing or derivative of a uniformly spaced series, with
 * the cached weights of savitzky-golay-weights.ts. Same result as
 * ml-savitzky-golay-generalized's `sgg(y, step, options)` (the same sums in
 * the same order): the first and last m points use the window's end rows,
 * the others its centre row. The derivative is per unit of x (divided by
 * step^derivative).
 */
import { savitzkyGolayWeights } from './savitzky-golay-weights.js';

export interface SavitzkyGolayOptions {
  /** Odd, at least 5, at most y.length. @default 9 */
  windowSize?: number;
  /** Order of the local polynomial. @default 3 */
  polynomial?: number;
  /** 0 smooths, 1 and 2 differentiate. @default 0 */
  derivative?: number;
}

/** Filtered y (a new array, length y.length); x step `step` (> 0). */
export function xSavitzkyGolay(y: ArrayLike<number>, step: number, options: SavitzkyGolayOptions = {}): Float64Array {
  const { windowSize = 9, polynomial = 3, derivative = 0 } = options;
  const np = y.length;
  if (!Number.isInteger(windowSize) || windowSize % 2 === 0 || windowSize < 5 || windowSize > np) {
    throw new RangeError(`Savitzky–Golay window must be an odd whole number from 5 to ${np}, got ${windowSize}`);
  }
  const weights = savitzkyGolayWeights(windowSize, polynomial, derivative);
  const half = Math.floor(windowSize / 2);
  const hs = step ** derivative;
  const out = new Float64Array(np);
  for (let i = 0; i < half; i++) {
    const wg1 = weights[half - i - 1] as Float64Array;
    const wg2 = weights[half + i + 1] as Float64Array;
    let d1 = 0;
    let d2 = 0;
    for (let l = 0; l < windowSize; l++) {
      d1 += (wg1[l] as number) * (y[l] as number);
      d2 += (wg2[l] as number) * (y[np - windowSize + l] as number);
    }
    out[half - i - 1] = d1 / hs;
    out[np - half + i] = d2 / hs;
  }
  const wg = weights[half] as Float64Array;
  for (let i = windowSize; i <= np; i++) {
    let d = 0;
    for (let l = 0; l < windowSize; l++) d += (wg[l] as number) * (y[l + i - windowSize] as number);
    out[i - half - 1] = d / hs;
  }
  return out;
}
