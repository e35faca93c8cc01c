/**
 * Parameter standard deviations of a fitted model Σ Gaussians + polynomial
 * from the analytic Jacobian at the solution: cov = s² (JᵀJ)⁻¹ with
 * s² = RSS / (n − p). Parameter order: for each component position,
 * height, fwhm; then the polynomial coefficients.
 */
import { inverse, Matrix } from 'ml-matrix';
import { FOUR_LN2 } from './gaussian.js';
import type { GaussianParameters } from './xyRefineBands.js';
import { type PolynomialScale, xPolynomialValues } from './xyPolynomial.js';

export interface ModelCovarianceResult {
  residualRms: number;
  /** Standard deviation per parameter; NaN when JᵀJ is singular. */
  sd: Float64Array;
}

/** Writes row i of the Jacobian of the model into `row`, returns the model value. */
export function modelJacobianRow(
  xi: number, components: GaussianParameters[], polynomialLength: number, scale: PolynomialScale, row: Float64Array,
): number {
  let value = 0;
  for (let k = 0; k < components.length; k++) {
    const { position, height, fwhm } = components[k] as GaussianParameters;
    const d = xi - position;
    if (Math.abs(d) > 4 * fwhm) {
      // exp(−4 ln2 · 16) ≈ 1e-19: the band does not reach here.
      row[3 * k] = 0;
      row[3 * k + 1] = 0;
      row[3 * k + 2] = 0;
      continue;
    }
    const e = Math.exp((-FOUR_LN2 * d * d) / (fwhm * fwhm));
    value += height * e;
    row[3 * k] = (height * e * 2 * FOUR_LN2 * d) / (fwhm * fwhm);
    row[3 * k + 1] = e;
    row[3 * k + 2] = (height * e * 2 * FOUR_LN2 * d * d) / (fwhm * fwhm * fwhm);
  }
  const t = (xi - scale.centre) / scale.halfWidth;
  let p = 1;
  for (let j = 0; j < polynomialLength; j++) {
    row[3 * components.length + j] = p;
    p *= t;
  }
  return value;
}

export function xyModelCovariance(
  x: Float64Array, y: Float64Array, components: GaussianParameters[], coefficients: Float64Array, scale: PolynomialScale,
): ModelCovarianceResult {
  const n = x.length;
  const p = 3 * components.length + coefficients.length;
  const jtj = new Matrix(p, p);
  const row = new Float64Array(p);
  const baseline = xPolynomialValues(x, coefficients, scale);
  let rss = 0;
  for (let i = 0; i < n; i++) {
    const value = modelJacobianRow(x[i] as number, components, coefficients.length, scale, row) + (baseline[i] as number);
    const r = (y[i] as number) - value;
    rss += r * r;
    for (let a = 0; a < p; a++) {
      const ra = row[a] as number;
      if (ra === 0) continue;
      for (let b = a; b < p; b++) jtj.set(a, b, jtj.get(a, b) + ra * (row[b] as number));
    }
  }
  for (let a = 0; a < p; a++) for (let b = 0; b < a; b++) jtj.set(a, b, jtj.get(b, a));
  const s2 = n > p ? rss / (n - p) : Number.NaN;
  const sd = new Float64Array(p).fill(Number.NaN);
  try {
    const cov = inverse(jtj);
    for (let a = 0; a < p; a++) {
      const v = cov.get(a, a) * s2;
      sd[a] = v >= 0 && Number.isFinite(v) ? Math.sqrt(v) : Number.NaN;
    }
  } catch {
    // singular: leave NaN, the caller falls back to an estimate from noise and width
  }
  return { residualRms: Math.sqrt(rss / Math.max(n, 1)), sd };
}
