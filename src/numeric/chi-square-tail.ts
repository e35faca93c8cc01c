/**
 * The upper tail of the χ² distribution, P(X ≥ x) for X ~ χ²(k), k a positive
 * integer: the p-value of a goodness-of-fit χ².
 *
 * Closed forms for integer k (Abramowitz & Stegun, Handbook of Mathematical
 * Functions (1964), 26.4.4 and 26.4.5):
 * - k even: Q = e^{−x/2} Σ_{i=0}^{k/2−1} (x/2)^i / i!
 * - k odd:  Q = erfc(√(x/2)) + e^{−x/2} Σ_{i=1}^{(k−1)/2} (x/2)^{i−½} / Γ(i + ½)
 *
 * Why not a library: the fit's degrees of freedom are small integers, for
 * which these sums are exact; the one chi-square package in the registry
 * list (@stdlib/stats-base-dists-chisquare-cdf) pulls native-addon loaders
 * into the page's bundle. erfc is the project's one (src/predict/normal.ts,
 * Numerical Recipes' erfcc, fractional error below 1.2e-7): ample for a
 * p-value. tests/numeric checks the tail against a slow quadrature.
 */
import { erfc } from '../predict/normal.js';

/** erfc(z): the project's one error function (src/predict/normal.ts). */
export const erfcOf = erfc;

/** P(χ²_k ≥ x); 1 for x ≤ 0. k must be a positive integer. */
export function chiSquareTail(x: number, k: number): number {
  if (!(Number.isInteger(k) && k >= 1)) throw new RangeError(`degrees of freedom must be a positive integer, got ${k}`);
  if (Number.isNaN(x)) return Number.NaN;
  if (x <= 0) return 1;
  if (x === Infinity) return 0;
  const h = x / 2;
  const e = Math.exp(-h);
  if (k % 2 === 0) {
    let term = 1;
    let sum = 1;
    for (let i = 1; i < k / 2; i++) {
      term *= h / i;
      sum += term;
    }
    return Math.min(1, e * sum);
  }
  // term_i = h^{i−½}/Γ(i+½): term_1 = √h / Γ(3/2) = 2√(h/π), term_{i+1} = term_i · h/(i + ½).
  let sum = 0;
  let term = 2 * Math.sqrt(h / Math.PI);
  for (let i = 1; i <= (k - 1) / 2; i++) {
    sum += term;
    term *= h / (i + 0.5);
  }
  return Math.min(1, erfcOf(Math.sqrt(h)) + e * sum);
}
