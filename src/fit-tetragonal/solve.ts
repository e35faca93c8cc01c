import { Matrix, SingularValueDecomposition } from 'ml-matrix';

/**
 * Levenberg–Marquardt for a few parameters, rank-deficiency tolerant: each
 * step is the minimum-norm least-squares solution (ml-matrix SVD) of the
 * damped, column-scaled system, so parameters the data do not fix stay where
 * they started instead of running off. Kept here rather than reusing
 * src/fit/least-squares.ts, which another piece of work is rewriting, and
 * because the tetragonal fit needs the SVD (rank, null space) anyway.
 */
export interface SolveResult {
  x: Float64Array;
  residuals: Float64Array;
  jacobian: Matrix;
  chi2: number;
  iterations: number;
  converged: boolean;
}

/** Weighted residuals (model − observed)/σ at x. */
export type Residuals = (x: Float64Array) => Float64Array;

/** Central-difference Jacobian with per-parameter steps. */
export function jacobianAt(f: Residuals, x: Float64Array, steps: Float64Array): Matrix {
  const r0 = f(x);
  const J = new Matrix(r0.length, x.length);
  for (let j = 0; j < x.length; j++) {
    const plus = Float64Array.from(x);
    const minus = Float64Array.from(x);
    plus[j] = plus[j]! + steps[j]!;
    minus[j] = minus[j]! - steps[j]!;
    const rp = f(plus);
    const rm = f(minus);
    for (let i = 0; i < r0.length; i++) J.set(i, j, (rp[i]! - rm[i]!) / (2 * steps[j]!));
  }
  return J;
}

const sumSquares = (r: Float64Array): number => r.reduce((s, v) => s + v * v, 0);

export function levenbergMarquardt(f: Residuals, start: Float64Array, steps: Float64Array, maxIterations = 100): SolveResult {
  let x = Float64Array.from(start);
  let r = f(x);
  let chi2 = sumSquares(r);
  let lambda = 1e-3;
  let converged = false;
  let iterations = 0;
  let J = jacobianAt(f, x, steps);
  for (; iterations < maxIterations; iterations++) {
    const n = x.length;
    const m = r.length;
    // Column scales: steps make the columns comparable (cm-1 per step).
    const scaled = new Matrix(m + n, n);
    const rhs = new Matrix(m + n, 1);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < n; j++) scaled.set(i, j, J.get(i, j) * steps[j]!);
      rhs.set(i, 0, -r[i]!);
    }
    for (let j = 0; j < n; j++) {
      let norm = 0;
      for (let i = 0; i < m; i++) norm += (J.get(i, j) * steps[j]!) ** 2;
      scaled.set(m + j, j, Math.sqrt(lambda * norm));
    }
    const svd = new SingularValueDecomposition(scaled, { autoTranspose: true });
    const delta = svd.solve(rhs);
    const trial = Float64Array.from(x, (v, j) => v + delta.get(j, 0) * steps[j]!);
    const rTrial = f(trial);
    const chi2Trial = sumSquares(rTrial);
    if (chi2Trial <= chi2) {
      const improvement = chi2 - chi2Trial;
      x = trial;
      r = rTrial;
      chi2 = chi2Trial;
      lambda = Math.max(lambda / 10, 1e-12);
      J = jacobianAt(f, x, steps);
      if (improvement <= 1e-12 * (1 + chi2)) {
        converged = true;
        break;
      }
    } else {
      lambda *= 10;
      if (lambda > 1e12) {
        converged = true;
        break;
      }
    }
  }
  return { x, residuals: r, jacobian: J, chi2, iterations, converged };
}
