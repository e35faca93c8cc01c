/**
 * Levenberg–Marquardt nonlinear least squares over Float64Array.
 *
 * Minimises cost(θ) = ½·Σ r_i(θ)² for m residuals and p parameters. The
 * Jacobian is row-major: jacobian[i·p + j] = ∂r_i/∂θ_j. The damping is
 * Marquardt's (λ·diag(JᵀJ)), updated by Nielsen's rule from the gain ratio.
 * Lower bounds, when given, are enforced by projecting each trial step onto
 * them (the fit's Dq ≥ 0 and B > 0 need nothing more elaborate).
 *
 * The result follows scipy.optimize.least_squares: parameters, cost,
 * residuals, Jacobian, a status code with a message from a fixed table,
 * `success`, and the number of residual evaluations (finite-difference
 * Jacobian evaluations included).
 */
import { CholeskyDecomposition, Matrix } from 'ml-matrix';
import { invalidArgument } from '../errors.js';

/** Fills `out` (length m) with the residuals at `params`. */
export type ResidualFunction = (params: Float64Array, out: Float64Array) => void;

/**
 * Fills `out` (m×p, row-major) with ∂r/∂θ at `params`, given the residuals
 * there. Returns the number of residual evaluations it spent (0 if analytic).
 */
export type JacobianFunction = (params: Float64Array, residuals: Float64Array, out: Float64Array) => number;

export interface LeastSquaresOptions {
  /** Stop when both the actual and the predicted relative reduction of the cost are below ftol. Default 1e-10. */
  ftol?: number;
  /** Stop when the step is below xtol·(‖θ‖ + xtol). Default 1e-10. */
  xtol?: number;
  /**
   * Stop when the largest cosine between r and a column of J is below gtol
   * (MINPACK's scale-free test; a zero residual satisfies it). Default 1e-10.
   */
  gtol?: number;
  /**
   * Stop when the cost itself is at most atol: an exact fit down to rounding,
   * where the relative tests would only chase noise. Default 0 (off).
   */
  atol?: number;
  /** Maximum number of residual evaluations. Default 100·(p + 1). */
  maxEvaluations?: number;
  /** Starting damping relative to max diag(JᵀJ). Default 1e-3. */
  initialDamping?: number;
  /** Lower bound per parameter (projected). Default: none. */
  lower?: Float64Array;
  /** Analytic or custom Jacobian. Default: forward differences with step √ε·max(|θ_j|, 1). */
  jacobian?: JacobianFunction;
}

/** scipy.optimize.least_squares status codes, and 5 for the atol test (not in scipy). */
export type LeastSquaresStatus = 0 | 1 | 2 | 3 | 4 | 5;

export const LEAST_SQUARES_MESSAGES: Readonly<Record<LeastSquaresStatus, string>> = {
  0: 'the maximum number of residual evaluations was exceeded',
  1: 'the gradient norm fell below gtol',
  2: 'the relative reduction of the cost fell below ftol',
  3: 'the step size fell below xtol',
  4: 'both the ftol and the xtol conditions were satisfied',
  5: 'the cost fell below atol (exact to rounding)',
};

export interface LeastSquaresResult {
  params: Float64Array;
  /** ½·Σ r². */
  cost: number;
  residuals: Float64Array;
  /** m×p, row-major, at `params`. */
  jacobian: Float64Array;
  status: LeastSquaresStatus;
  message: string;
  success: boolean;
  /** Residual evaluations, including those spent on finite differences. */
  evaluations: number;
  jacobianEvaluations: number;
  iterations: number;
}

/** Forward-difference Jacobian; spends p residual evaluations. */
export function forwardDifferenceJacobian(residualsAt: ResidualFunction, m: number): JacobianFunction {
  const shifted = new Float64Array(m);
  return (params, residuals, out) => {
    const p = params.length;
    const trial = Float64Array.from(params);
    for (let j = 0; j < p; j++) {
      const h = Math.sqrt(Number.EPSILON) * Math.max(Math.abs(params[j]!), 1);
      trial[j] = params[j]! + h;
      residualsAt(trial, shifted);
      for (let i = 0; i < m; i++) out[i * p + j] = (shifted[i]! - residuals[i]!) / h;
      trial[j] = params[j]!;
    }
    return p;
  };
}

function halfSumOfSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
  return 0.5 * s;
}

/** JᵀJ (p×p) and Jᵀr (p) of a row-major m×p Jacobian. */
function normalEquations(jac: Float64Array, r: Float64Array, m: number, p: number) {
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < p; j++) {
      const jij = jac[i * p + j]!;
      g[j] = g[j]! + jij * r[i]!;
      for (let k = 0; k <= j; k++) a[j * p + k] = a[j * p + k]! + jij * jac[i * p + k]!;
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) a[k * p + j] = a[j * p + k]!;
  return { a, g };
}

/** max_j |(Jᵀr)_j| / (‖r‖·‖J_j‖): 0 at a stationary point or a zero residual. */
function gradientCosine(jac: Float64Array, r: Float64Array, g: Float64Array, m: number, p: number): number {
  const rNorm = Math.sqrt(2 * halfSumOfSquares(r));
  if (rNorm === 0) return 0;
  let worst = 0;
  for (let j = 0; j < p; j++) {
    let column = 0;
    for (let i = 0; i < m; i++) column += jac[i * p + j]! ** 2;
    if (column > 0) worst = Math.max(worst, Math.abs(g[j]!) / (rNorm * Math.sqrt(column)));
  }
  return worst;
}

/** Solves (A + λ·D)δ = −g with D = max(diag A, tiny); undefined if not positive definite. */
function dampedStep(a: Float64Array, g: Float64Array, p: number, lambda: number): Float64Array | undefined {
  const rows: number[][] = [];
  let maxDiag = 0;
  for (let j = 0; j < p; j++) maxDiag = Math.max(maxDiag, a[j * p + j]!);
  for (let j = 0; j < p; j++) {
    const row: number[] = [];
    for (let k = 0; k < p; k++) row.push(a[j * p + k]!);
    row[j] = row[j]! + lambda * Math.max(a[j * p + j]!, 1e-12 * maxDiag, 1e-300);
    rows.push(row);
  }
  const chol = new CholeskyDecomposition(new Matrix(rows));
  if (!chol.isPositiveDefinite()) return undefined;
  const rhs = Matrix.columnVector(Array.from(g, (v) => -v));
  const step = chol.solve(rhs).getColumn(0);
  return step.every(Number.isFinite) ? Float64Array.from(step) : undefined;
}

function checkInputs(x0: Float64Array, m: number, options: LeastSquaresOptions): void {
  if (x0.length === 0) throw invalidArgument('x0', 'least squares needs at least one parameter');
  if (!x0.every(Number.isFinite)) throw invalidArgument('x0', 'every starting parameter must be a finite number');
  if (!Number.isInteger(m) || m < 1) throw invalidArgument('m', `the number of residuals must be a positive whole number, got ${m}`);
  for (const key of ['ftol', 'xtol', 'gtol', 'atol', 'initialDamping'] as const) {
    const value = options[key];
    if (value !== undefined && !(value >= 0 && Number.isFinite(value))) {
      throw invalidArgument(key, `${key} must be a finite number ≥ 0, got ${value}`);
    }
  }
  if (options.lower && options.lower.length !== x0.length) {
    throw invalidArgument('lower', `lower has ${options.lower.length} bounds for ${x0.length} parameters`);
  }
  if (options.maxEvaluations !== undefined && !(options.maxEvaluations >= 1)) {
    throw invalidArgument('maxEvaluations', `maxEvaluations must be at least 1, got ${options.maxEvaluations}`);
  }
}

/**
 * Minimises ½‖r(θ)‖² from x0. `m` is the number of residuals. Arguments are
 * checked before iterating (FieldgapError naming the argument).
 */
export function leastSquares(
  residualsAt: ResidualFunction,
  x0: Float64Array,
  m: number,
  options: LeastSquaresOptions = {},
): LeastSquaresResult {
  checkInputs(x0, m, options);
  const p = x0.length;
  const {
    ftol = 1e-10,
    xtol = 1e-10,
    gtol = 1e-10,
    atol = 0,
    maxEvaluations = 100 * (p + 1),
    initialDamping = 1e-3,
    lower,
    jacobian = forwardDifferenceJacobian(residualsAt, m),
  } = options;
  const project = (x: Float64Array) => {
    if (lower) for (let j = 0; j < p; j++) if (x[j]! < lower[j]!) x[j] = lower[j]!;
    return x;
  };

  let x = project(Float64Array.from(x0));
  let r = new Float64Array(m);
  residualsAt(x, r);
  let evaluations = 1;
  let cost = halfSumOfSquares(r);
  let jac = new Float64Array(m * p);
  evaluations += jacobian(x, r, jac);
  let jacobianEvaluations = 1;
  let { a, g } = normalEquations(jac, r, m, p);
  let lambda = initialDamping;
  let nu = 2;
  let iterations = 0;
  let status: LeastSquaresStatus = 0;
  const trialR = new Float64Array(m);

  while (evaluations < maxEvaluations) {
    if (cost <= atol) { status = 5; break; }
    if (gradientCosine(jac, r, g, m, p) <= gtol) { status = 1; break; }
    iterations++;
    const step = dampedStep(a, g, p, lambda);
    if (!step) { lambda *= nu; nu *= 2; continue; }
    const trial = project(Float64Array.from(x, (v, j) => v + step[j]!));
    let stepNorm = 0;
    let xNorm = 0;
    for (let j = 0; j < p; j++) {
      stepNorm += (trial[j]! - x[j]!) ** 2;
      xNorm += x[j]! ** 2;
    }
    stepNorm = Math.sqrt(stepNorm);
    xNorm = Math.sqrt(xNorm);
    residualsAt(trial, trialR);
    evaluations++;
    const trialCost = halfSumOfSquares(trialR);
    // Predicted reduction of the quadratic model, −(gᵀδ + ½δᵀAδ).
    let predicted = 0;
    for (let j = 0; j < p; j++) {
      let ad = 0;
      for (let k = 0; k < p; k++) ad += a[j * p + k]! * step[k]!;
      predicted -= g[j]! * step[j]! + 0.5 * step[j]! * ad;
    }
    const actual = cost - trialCost;
    const smallStep = stepNorm <= xtol * (xNorm + xtol);
    if (Number.isFinite(trialCost) && actual > 0) {
      const rho = predicted > 0 ? actual / predicted : 0;
      const smallReduction = actual <= ftol * cost && predicted <= ftol * cost;
      x = trial;
      r = Float64Array.from(trialR);
      cost = trialCost;
      jac = new Float64Array(m * p);
      evaluations += jacobian(x, r, jac);
      jacobianEvaluations++;
      ({ a, g } = normalEquations(jac, r, m, p));
      lambda *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      if (smallReduction && smallStep) { status = 4; break; }
      if (smallReduction) { status = 2; break; }
      if (smallStep) { status = 3; break; }
    } else {
      if (smallStep) { status = 3; break; }
      lambda *= nu;
      nu *= 2;
    }
  }
  return {
    params: x,
    cost,
    residuals: r,
    jacobian: jac,
    status,
    message: LEAST_SQUARES_MESSAGES[status],
    success: status > 0,
    evaluations,
    jacobianEvaluations,
    iterations,
  };
}
