import { cubicBlockEigenvalues } from './block-spectra.js';
import { cubicBlocks, type CubicBlocks } from './blocks.js';
import { spinStateChoice } from './spin-state.js';
import type { Geometry } from './types.js';
import { validateD, validateFinite, validateGeometry } from './validate.js';

/** 2S of the ground level: the spin block with the lowest eigenvalue (the higher spin on an exact tie). */
export function groundTwoSpin(blocks: CubicBlocks, coefficients: readonly number[], tol: number): number {
  const values = cubicBlockEigenvalues(blocks, coefficients);
  const lowest = values.map((row) => Math.min(...row.map((v) => (v.length ? v[0]! : Infinity))));
  const minimum = Math.min(...lowest);
  let twoS = blocks.twoSValues[0]!;
  lowest.forEach((value, s) => {
    if (value <= minimum + tol) twoS = blocks.twoSValues[s]!;
  });
  return twoS;
}

/** Options of crossoverDqOverB. */
export interface CrossoverOptions {
  /** Search Dq/B from 0 up to this. Default 10. */
  maxDqOverB?: number;
}

/**
 * The Dq/B at which the ground-level spin of d^n first changes (high-spin to
 * low-spin) at the given C/B, or undefined when it does not change below
 * maxDqOverB (always so when spinStateChoice is false). Found by a scan in
 * steps of 0.02 and bisection to 1e-10.
 */
export function crossoverDqOverB(d: number, geometry: Geometry, cOverB: number, options: CrossoverOptions = {}): number | undefined {
  const { maxDqOverB = 10 } = options;
  validateD(d);
  validateGeometry(geometry);
  validateFinite(cOverB, 'cOverB', { min: 0, unit: '' });
  validateFinite(maxDqOverB, 'maxDqOverB', { min: 0, exclusiveMin: true, unit: '' });
  if (!spinStateChoice(d, geometry)) return undefined;
  const blocks = cubicBlocks(d, geometry);
  const spinAt = (x: number): number => groundTwoSpin(blocks, [x, 1, cOverB], 1e-9 * (10 * x + 20 + 10 * cOverB));
  const start = spinAt(0);
  const step = 0.02;
  let lo = 0;
  for (let hi = step; hi <= maxDqOverB + 1e-12; hi += step) {
    if (spinAt(hi) !== start) {
      while (hi - lo > 1e-10) {
        const mid = (lo + hi) / 2;
        if (spinAt(mid) === start) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    }
    lo = hi;
  }
  return undefined;
}
