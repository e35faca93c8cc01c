/**
 * A bounded Levenberg–Marquardt least-squares solver with an analytic
 * Jacobian (Marquardt's diagonal scaling; bounds by projection onto the
 * box). Small and dense: n residuals × p parameters with p up to a few
 * dozen, as in a band fit.
 */
import { Matrix, solve } from 'ml-matrix';

/**
 * Fills `residuals` (length n: data − model) and `jacobian` (n × p, row
 * major: ∂model_i/∂p_j) for parameters `p`.
 */
export type ResidualsAndJacobian = (p: Float64Array, residuals: Float64Array, jacobian: Float64Array) => void;

export interface LevenbergMarquardtOptions {
  /** Number of residuals. */
  n: number;
  initial: Float64Array;
  lower: Float64Array;
  upper: Float64Array;
  /** @default 100 */
  maxIterations?: number;
  /** Stop when the relative decrease of the cost is below this. @default 1e-9 */
  tolerance?: number;
  /** Initial damping. @default 1e-3 */
  damping?: number;
}

export interface LevenbergMarquardtResult {
  parameters: Float64Array;
  /** Sum of squared residuals at the solution. */
  cost: number;
  iterations: number;
  /** True when the cost stopped decreasing before maxIterations. */
  converged: boolean;
}

function sumOfSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += (r[i] as number) * (r[i] as number);
  return s;
}

export function levenbergMarquardt(evaluate: ResidualsAndJacobian, options: LevenbergMarquardtOptions): LevenbergMarquardtResult {
  const { n, initial, lower, upper, maxIterations = 100, tolerance = 1e-9 } = options;
  let lambda = options.damping ?? 1e-3;
  const p = initial.length;
  let params = Float64Array.from(initial, (v, j) => Math.min(Math.max(v, lower[j] as number), upper[j] as number));
  const r = new Float64Array(n);
  const jac = new Float64Array(n * p);
  const trialR = new Float64Array(n);
  const trialJ = new Float64Array(n * p);
  evaluate(params, r, jac);
  let cost = sumOfSquares(r);
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  let iterations = 0;
  let converged = false;
  const normal = (): void => {
    a.fill(0);
    g.fill(0);
    for (let i = 0; i < n; i++) {
      const ri = r[i] as number;
      const off = i * p;
      for (let j = 0; j < p; j++) {
        const jj = jac[off + j] as number;
        if (jj === 0) continue;
        g[j] = (g[j] as number) + jj * ri;
        for (let k = j; k < p; k++) a[j * p + k] = (a[j * p + k] as number) + jj * (jac[off + k] as number);
      }
    }
    for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) a[j * p + k] = a[k * p + j] as number;
  };
  normal();
  while (iterations < maxIterations) {
    iterations++;
    let improved = false;
    for (let attempt = 0; attempt < 12 && !improved; attempt++) {
      // Parameters held at a bound by the gradient are frozen for this step (a simple active set).
      const frozen = Array.from(params, (v, j) => (v <= (lower[j] as number) && (g[j] as number) < 0) || (v >= (upper[j] as number) && (g[j] as number) > 0));
      const m = new Matrix(p, p);
      const rhs = new Float64Array(p);
      for (let j = 0; j < p; j++) {
        if (frozen[j]) {
          m.set(j, j, 1);
          continue;
        }
        for (let k = 0; k < p; k++) if (!frozen[k]) m.set(j, k, a[j * p + k] as number);
        const d = a[j * p + j] as number;
        m.set(j, j, d + lambda * (d > 0 ? d : 1e-12));
        rhs[j] = g[j] as number;
      }
      let step: Float64Array;
      try {
        step = Float64Array.from(solve(m, Matrix.columnVector(Array.from(rhs))).getColumn(0));
      } catch {
        lambda *= 10;
        continue;
      }
      const trial = Float64Array.from(params, (v, j) => Math.min(Math.max(v + (step[j] as number), lower[j] as number), upper[j] as number));
      evaluate(trial, trialR, trialJ);
      const trialCost = sumOfSquares(trialR);
      if (Number.isFinite(trialCost) && trialCost < cost) {
        const decrease = (cost - trialCost) / Math.max(cost, 1e-300);
        params = trial;
        r.set(trialR);
        jac.set(trialJ);
        cost = trialCost;
        lambda = Math.max(lambda / 3, 1e-12);
        improved = true;
        normal();
        if (decrease < tolerance) converged = true;
      } else lambda *= 4;
    }
    if (!improved) converged = true;
    if (converged) break;
  }
  return { parameters: params, cost, iterations, converged };
}
