/**
 * A bounded Levenberg–Marquardt least-squares solver with an analytic
 * Jacobian (Marquardt's diagonal scaling; bounds by projection onto the
 * box). Small and dense: n residuals × p parameters with p up to a few
 * dozen, as in a band fit.
 */

export interface LevenbergMarquardtOptions {
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

/**
 * Solves m · s = rhs in place for a symmetric positive definite p × p
 * matrix (row major) by Cholesky; `m` is overwritten with its factor.
 * Returns false when m is not positive definite.
 */
export function choleskySolveInPlace(m: Float64Array, rhs: Float64Array, p: number, out: Float64Array): boolean {
  for (let j = 0; j < p; j++) {
    let d = m[j * p + j] as number;
    for (let k = 0; k < j; k++) d -= (m[j * p + k] as number) ** 2;
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    m[j * p + j] = l;
    for (let i = j + 1; i < p; i++) {
      let v = m[i * p + j] as number;
      for (let k = 0; k < j; k++) v -= (m[i * p + k] as number) * (m[j * p + k] as number);
      m[i * p + j] = v / l;
    }
  }
  for (let i = 0; i < p; i++) {
    let v = rhs[i] as number;
    for (let k = 0; k < i; k++) v -= (m[i * p + k] as number) * (out[k] as number);
    out[i] = v / (m[i * p + i] as number);
  }
  for (let i = p - 1; i >= 0; i--) {
    let v = out[i] as number;
    for (let k = i + 1; k < p; k++) v -= (m[k * p + i] as number) * (out[k] as number);
    out[i] = v / (m[i * p + i] as number);
  }
  return true;
}

/** A least-squares problem given by its normal equations (see xyBandModelNormal). */
export interface NormalEquationsProblem {
  /** Fills a = JᵀJ (p × p, row major) and g = Jᵀr at params; returns the sum of squares. */
  normal: (params: Float64Array, a: Float64Array, g: Float64Array) => number;
  /** The sum of squares alone (cheaper: no Jacobian), for trial steps. */
  cost: (params: Float64Array) => number;
}

/**
 * Bounded Levenberg–Marquardt on a problem that
 * forms its own normal equations (so a sparse model can skip the zero
 * products) and evaluates rejected trial steps by their cost only.
 * Converged: the decrease of the cost in one step fell below
 * max(tolerance × cost, absoluteTolerance) (@default 0; with a χ² cost,
 * 0.01 is far below what changes any conclusion), or no step lowers it.
 */
export function levenbergMarquardtNormal(
  problem: NormalEquationsProblem, options: LevenbergMarquardtOptions & { absoluteTolerance?: number },
): LevenbergMarquardtResult {
  const { initial, lower, upper, maxIterations = 100, tolerance = 1e-9, absoluteTolerance = 0 } = options;
  let lambda = options.damping ?? 1e-3;
  const p = initial.length;
  const params = Float64Array.from(initial, (v, j) => Math.min(Math.max(v, lower[j] as number), upper[j] as number));
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  const m = new Float64Array(p * p);
  const rhs = new Float64Array(p);
  const step = new Float64Array(p);
  const trial = new Float64Array(p);
  let cost = problem.normal(params, a, g);
  let iterations = 0;
  let converged = false;
  while (iterations < maxIterations && !converged) {
    iterations++;
    let improved = false;
    for (let attempt = 0; attempt < 12 && !improved; attempt++) {
      m.fill(0);
      for (let j = 0; j < p; j++) {
        const v = params[j] as number;
        // Parameters held at a bound by the gradient are frozen for this step (a simple active set).
        const frozen = (v <= (lower[j] as number) && (g[j] as number) < 0) || (v >= (upper[j] as number) && (g[j] as number) > 0);
        if (frozen) {
          m[j * p + j] = 1;
          rhs[j] = 0;
          continue;
        }
        for (let k = 0; k < p; k++) {
          const u = params[k] as number;
          const frozenK = (u <= (lower[k] as number) && (g[k] as number) < 0) || (u >= (upper[k] as number) && (g[k] as number) > 0);
          if (!frozenK) m[j * p + k] = a[j * p + k] as number;
        }
        const d = a[j * p + j] as number;
        m[j * p + j] = d + lambda * (d > 0 ? d : 1e-12);
        rhs[j] = g[j] as number;
      }
      if (!choleskySolveInPlace(m, rhs, p, step)) {
        lambda *= 10;
        continue;
      }
      for (let j = 0; j < p; j++) trial[j] = Math.min(Math.max((params[j] as number) + (step[j] as number), lower[j] as number), upper[j] as number);
      const trialCost = problem.cost(trial);
      if (Number.isFinite(trialCost) && trialCost < cost) {
        const decrease = cost - trialCost;
        params.set(trial);
        cost = problem.normal(params, a, g);
        lambda = Math.max(lambda / 3, 1e-12);
        improved = true;
        if (decrease < Math.max(tolerance * cost, absoluteTolerance)) converged = true;
      } else lambda *= 4;
    }
    if (!improved) converged = true;
  }
  return { parameters: params, cost, iterations, converged };
}
