/**
 * Parameter covariance from a least-squares Jacobian.
 *
 * For weighted residuals r_i = (calc_i − obs_i)/σ_i the covariance of the
 * parameters is scale·(JᵀJ)⁻¹, with J the Jacobian of the weighted residuals
 * (row-major m×p). `scale` is 1 when the σ_i are absolute band uncertainties,
 * or the residual variance s² = Σr²/(m − p) when the residuals are unweighted.
 * (JᵀJ)⁻¹ is formed from the singular value decomposition of J, so a
 * parameter the data do not determine shows up as rank deficiency (undefined)
 * rather than as a huge number.
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix';

export interface CovarianceOptions {
  /** Multiplies (JᵀJ)⁻¹. Default 1. */
  scale?: number;
  /** Singular values below rcond·s_max count as zero. Default 1e-10. */
  rcond?: number;
}

/** p×p row-major covariance, or undefined when J is rank deficient. */
export function jacobianCovariance(
  jacobian: Float64Array,
  m: number,
  p: number,
  { scale = 1, rcond = 1e-10 }: CovarianceOptions = {},
): Float64Array | undefined {
  if (m < p) return undefined;
  const rows: number[][] = [];
  for (let i = 0; i < m; i++) rows.push(Array.from(jacobian.subarray(i * p, (i + 1) * p)));
  const svd = new SingularValueDecomposition(new Matrix(rows), { autoTranspose: true });
  const s = svd.diagonal;
  const sMax = Math.max(...s);
  if (!(sMax > 0) || s.some((v) => v <= rcond * sMax)) return undefined;
  const v = svd.rightSingularVectors;
  const cov = new Float64Array(p * p);
  for (let j = 0; j < p; j++) {
    for (let k = 0; k < p; k++) {
      let sum = 0;
      for (let l = 0; l < p; l++) sum += (v.get(j, l) * v.get(k, l)) / (s[l]! * s[l]!);
      cov[j * p + k] = scale * sum;
    }
  }
  return cov;
}

/** Standard deviations √diag(cov). */
export function covarianceStandardErrors(cov: Float64Array, p: number): Float64Array {
  return Float64Array.from({ length: p }, (_, j) => Math.sqrt(Math.max(cov[j * p + j]!, 0)));
}

/** Correlation matrix cov_jk/(σ_j σ_k); NaN where a σ is zero. */
export function covarianceCorrelation(cov: Float64Array, p: number): Float64Array {
  const sd = covarianceStandardErrors(cov, p);
  return Float64Array.from({ length: p * p }, (_, index) => {
    const j = Math.floor(index / p);
    const k = index % p;
    return cov[index]! / (sd[j]! * sd[k]!);
  });
}
