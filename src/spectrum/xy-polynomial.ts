/**
 * Low-order polynomial baselines in a scaled variable t = (x − centre) /
 * halfWidth ∈ [−1, 1], so the normal equations stay well conditioned for
 * wavenumbers of order 10^4.
 */
import { Matrix, QrDecomposition } from 'ml-matrix';

export interface PolynomialScale {
  centre: number;
  halfWidth: number;
}

/** The scale mapping [min, max] of x onto [−1, 1]. */
export function xPolynomialScale(x: Float64Array): PolynomialScale {
  const min = x[0] as number;
  const max = x[x.length - 1] as number;
  return { centre: (min + max) / 2, halfWidth: Math.max((max - min) / 2, 1e-12) };
}

/** Σ c_k t^k at each x. */
export function xPolynomialValues(x: Float64Array, coefficients: Float64Array, scale: PolynomialScale): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) {
    const t = ((x[i] as number) - scale.centre) / scale.halfWidth;
    let v = 0;
    for (let k = coefficients.length - 1; k >= 0; k--) v = v * t + (coefficients[k] as number);
    out[i] = v;
  }
  return out;
}

/** Least-squares coefficients c_0..c_order of y ≈ Σ c_k t^k (QR, so no normal equations). */
export function xyPolynomialFit(x: Float64Array, y: Float64Array, order: number, scale: PolynomialScale): Float64Array {
  const n = x.length;
  const a = new Matrix(n, order + 1);
  const b = new Matrix(n, 1);
  for (let i = 0; i < n; i++) {
    const t = ((x[i] as number) - scale.centre) / scale.halfWidth;
    let p = 1;
    for (let k = 0; k <= order; k++) {
      a.set(i, k, p);
      p *= t;
    }
    b.set(i, 0, y[i] as number);
  }
  const solution = new QrDecomposition(a).solve(b);
  return Float64Array.from(solution.getColumn(0));
}
