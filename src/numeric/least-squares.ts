/**
 * The one nonlinear least-squares solver of fieldgap: bounded
 * Levenberg–Marquardt over Float64Array, used by the band fit of a spectrum
 * (src/spectrum/levenberg-marquardt.ts, an adapter) and by the ligand-field
 * fit (src/fit/least-squares.ts re-exports it).
 *
 * Minimises S(θ) = Σ r_i(θ)² within lower ≤ θ ≤ upper. Two ways in:
 * - `leastSquares(residualsAt, x0, m, options)`: residuals r (length m) and a
 *   row-major Jacobian jacobian[i·p + j] = ∂r_i/∂θ_j (analytic or forward
 *   differences). The result follows scipy.optimize.least_squares: params,
 *   cost = ½·S, residuals, Jacobian, a status code with its message from
 *   LEAST_SQUARES_MESSAGES, success, evaluations.
 * - `leastSquaresNormal(problem, x0, options)`: a problem that forms its own
 *   normal equations A = JᵀJ and g = −Jᵀr (the descent direction of ½S),
 *   so a sparse model can skip zero products and trial steps cost one sum of
 *   squares.
 *
 * Method: Marquardt's damping (A + λ·diag A)δ = g, λ updated by Nielsen's
 * rule from the gain ratio; bounds by projecting each trial onto the box,
 * with the parameters that the gradient pushes against a bound frozen for the
 * step (a simple active set). Non-finite residuals are never a result: at the
 * start, in the Jacobian, or at every trial of one iteration they end the fit
 * with status −3 and success false; a single non-finite trial is rejected
 * like a step that raised the cost.
 */
import { invalidArgument } from '../errors.js';

/** Fills `out` (length m) with the residuals at `params`. */
export type ResidualFunction = (params: Float64Array, out: Float64Array) => void;

/**
 * Fills `out` (m×p, row-major) with ∂r/∂θ at `params`, given the residuals
 * there. Returns the number of residual evaluations it spent (0 if analytic).
 */
export type JacobianFunction = (params: Float64Array, residuals: Float64Array, out: Float64Array) => number;

/** A problem given by its normal equations. */
export interface NormalEquationsProblem {
  /** Fills a = JᵀJ (p×p, row-major) and g = −Jᵀr at params; returns S = Σr² (non-finite when r is). */
  normal: (params: Float64Array, a: Float64Array, g: Float64Array) => number;
  /** S = Σr² alone, for trial steps. */
  cost: (params: Float64Array) => number;
  /** Residual evaluations spent so far, if the problem counts them itself. Default: calls of normal and cost. */
  evaluations?: () => number;
}

export interface LeastSquaresOptions {
  /** Stop (status 2) when a step lowers S by at most max(ftol·S, absoluteTolerance). Default 1e-10. */
  ftol?: number;
  /** Absolute floor of the ftol test, in units of S. Default 0. */
  absoluteTolerance?: number;
  /** Stop (status 3) when the step is below xtol·(‖θ‖ + xtol). Default 1e-10. */
  xtol?: number;
  /**
   * Stop (status 1) when the largest cosine between r and a column of J is
   * below gtol (MINPACK's scale-free test; a zero residual satisfies it). Default 1e-10.
   */
  gtol?: number;
  /** Stop (status 5) when ½S is at most atol: exact to rounding. Default 0 (off). */
  atol?: number;
  /** Maximum number of residual evaluations (status 0 beyond). Default 100·(p + 1). */
  maxEvaluations?: number;
  /** Maximum number of accepted steps (status 0 beyond). Default: unlimited. */
  maxIterations?: number;
  /** Starting damping λ, relative to diag(JᵀJ). Default 1e-3. */
  initialDamping?: number;
  /** Lower bound per parameter. Default: none. */
  lower?: Float64Array;
  /** Upper bound per parameter. Default: none. */
  upper?: Float64Array;
  /** Analytic or custom Jacobian (residual form only). Default: forward differences with step √ε·max(|θ_j|, 1). */
  jacobian?: JacobianFunction;
}

/**
 * scipy.optimize.least_squares status codes 0–4, and ours: 5 (the atol
 * test), 6 (no step lowers the cost: a minimum to rounding), −3 (non-finite
 * residuals or Jacobian).
 */
export type LeastSquaresStatus = -3 | 0 | 1 | 2 | 3 | 4 | 5 | 6;

export const LEAST_SQUARES_MESSAGES: Readonly<Record<LeastSquaresStatus, string>> = {
  [-3]: 'the residuals or the Jacobian are not finite numbers',
  0: 'the maximum number of residual evaluations was exceeded',
  1: 'the gradient norm fell below gtol',
  2: 'the relative reduction of the cost fell below ftol',
  3: 'the step size fell below xtol',
  4: 'both the ftol and the xtol conditions were satisfied',
  5: 'the cost fell below atol (exact to rounding)',
  6: 'no step lowers the cost (a minimum to rounding)',
};

/** Success per status: a result at a minimum; not for 0 (budget spent) nor −3 (non-finite). */
export function leastSquaresSuccess(status: LeastSquaresStatus): boolean {
  return status > 0;
}

interface CoreResult {
  params: Float64Array;
  /** S = Σr² at params. */
  sumSquares: number;
  status: LeastSquaresStatus;
  evaluations: number;
  iterations: number;
}

export interface NormalLeastSquaresResult {
  params: Float64Array;
  /** ½·Σr² at params. */
  cost: number;
  status: LeastSquaresStatus;
  message: string;
  success: boolean;
  evaluations: number;
  iterations: number;
}

export interface LeastSquaresResult extends NormalLeastSquaresResult {
  residuals: Float64Array;
  /** m×p, row-major, at `params`. */
  jacobian: Float64Array;
  jacobianEvaluations: number;
}

/** Consecutive rejected trials after which no step lowers the cost (status 6). */
const MAX_REJECTED = 30;

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

/**
 * Solves m·s = rhs for a symmetric positive definite p×p matrix (row-major)
 * by Cholesky; `m` is overwritten with its factor. False when m is not
 * positive definite.
 */
export function choleskySolveInPlace(m: Float64Array, rhs: Float64Array, p: number, out: Float64Array): boolean {
  for (let j = 0; j < p; j++) {
    let d = m[j * p + j]!;
    for (let k = 0; k < j; k++) d -= m[j * p + k]! ** 2;
    if (!(d > 0)) return false;
    const l = Math.sqrt(d);
    m[j * p + j] = l;
    for (let i = j + 1; i < p; i++) {
      let v = m[i * p + j]!;
      for (let k = 0; k < j; k++) v -= m[i * p + k]! * m[j * p + k]!;
      m[i * p + j] = v / l;
    }
  }
  for (let i = 0; i < p; i++) {
    let v = rhs[i]!;
    for (let k = 0; k < i; k++) v -= m[i * p + k]! * out[k]!;
    out[i] = v / m[i * p + i]!;
  }
  for (let i = p - 1; i >= 0; i--) {
    let v = out[i]!;
    for (let k = i + 1; k < p; k++) v -= m[k * p + i]! * out[k]!;
    out[i] = v / m[i * p + i]!;
  }
  return true;
}

function checkInputs(x0: Float64Array, options: LeastSquaresOptions): void {
  if (x0.length === 0) throw invalidArgument('x0', 'least squares needs at least one parameter');
  if (!x0.every(Number.isFinite)) throw invalidArgument('x0', 'every starting parameter must be a finite number');
  for (const key of ['ftol', 'xtol', 'gtol', 'atol', 'initialDamping', 'absoluteTolerance'] as const) {
    const value = options[key];
    if (value !== undefined && !(value >= 0 && Number.isFinite(value))) {
      throw invalidArgument(key, `${key} must be a finite number ≥ 0, got ${value}`);
    }
  }
  for (const key of ['lower', 'upper'] as const) {
    const bound = options[key];
    if (bound && bound.length !== x0.length) throw invalidArgument(key, `${key} has ${bound.length} bounds for ${x0.length} parameters`);
  }
  if (options.lower && options.upper && options.lower.some((v, j) => v > options.upper![j]!)) {
    throw invalidArgument('lower', 'every lower bound must be at most its upper bound');
  }
  for (const key of ['maxEvaluations', 'maxIterations'] as const) {
    const value = options[key];
    if (value !== undefined && !(value >= 1)) throw invalidArgument(key, `${key} must be at least 1, got ${value}`);
  }
}

/** True when every entry is finite. */
function allFinite(values: Float64Array): boolean {
  for (let i = 0; i < values.length; i++) if (!Number.isFinite(values[i]!)) return false;
  return true;
}

/** The Levenberg–Marquardt iteration on normal equations; see the file comment. */
function minimise(problem: NormalEquationsProblem, x0: Float64Array, options: LeastSquaresOptions): CoreResult {
  const p = x0.length;
  const {
    ftol = 1e-10, xtol = 1e-10, gtol = 1e-10, atol = 0, absoluteTolerance = 0,
    maxEvaluations = 100 * (p + 1), maxIterations = Infinity, initialDamping = 1e-3,
  } = options;
  const lower = options.lower ?? new Float64Array(p).fill(-Infinity);
  const upper = options.upper ?? new Float64Array(p).fill(Infinity);
  let calls = 0;
  const evaluations = problem.evaluations ?? (() => calls);
  const x = Float64Array.from(x0, (v, j) => Math.min(Math.max(v, lower[j]!), upper[j]!));
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  const m = new Float64Array(p * p);
  const rhs = new Float64Array(p);
  const step = new Float64Array(p);
  const trial = new Float64Array(p);
  const free = new Uint8Array(p);
  calls++;
  let s = problem.normal(x, a, g);
  const done = (status: LeastSquaresStatus): CoreResult => ({ params: x, sumSquares: s, status, evaluations: evaluations(), iterations });
  let iterations = 0;
  if (!Number.isFinite(s) || !allFinite(a) || !allFinite(g)) return done(-3);
  let lambda = initialDamping;
  let nu = 2;
  let rejected = 0;
  let nonFinite = 0;
  // Rejected finite trials that moved θ measurably: evidence of a finite neighbourhood to stop in.
  let finiteMoves = 0;
  /** After rejected trials: non-finite residuals all around (−3), or the given status. */
  const stuck = (status: LeastSquaresStatus) => done(nonFinite > 0 && finiteMoves === 0 ? -3 : status);
  for (;;) {
    if (0.5 * s <= atol) return done(5);
    // Free parameters: those not pushed against a bound by the descent direction.
    for (let j = 0; j < p; j++) free[j] = (x[j]! <= lower[j]! && g[j]! < 0) || (x[j]! >= upper[j]! && g[j]! > 0) ? 0 : 1;
    // MINPACK's gradient test over the free parameters: |(Jᵀr)_j| / (‖r‖·‖J_j‖).
    let cosine = 0;
    for (let j = 0; j < p; j++) {
      const d = a[j * p + j]!;
      if (free[j] && d > 0 && s > 0) cosine = Math.max(cosine, Math.abs(g[j]!) / Math.sqrt(s * d));
    }
    if (cosine <= gtol) return done(1);
    if (evaluations() >= maxEvaluations || iterations >= maxIterations) return done(0);
    let maxDiag = 0;
    for (let j = 0; j < p; j++) maxDiag = Math.max(maxDiag, a[j * p + j]!);
    m.fill(0);
    for (let j = 0; j < p; j++) {
      if (!free[j]) {
        m[j * p + j] = 1;
        rhs[j] = 0;
        continue;
      }
      for (let k = 0; k < p; k++) if (free[k]) m[j * p + k] = a[j * p + k]!;
      const d = a[j * p + j]!;
      m[j * p + j] = d + lambda * Math.max(d, 1e-12 * maxDiag, 1e-300);
      rhs[j] = g[j]!;
    }
    if (!choleskySolveInPlace(m, rhs, p, step) || !allFinite(step)) {
      lambda *= nu;
      nu *= 2;
      if (++rejected >= MAX_REJECTED) return stuck(6);
      continue;
    }
    let stepNorm = 0;
    let xNorm = 0;
    for (let j = 0; j < p; j++) {
      trial[j] = Math.min(Math.max(x[j]! + step[j]!, lower[j]!), upper[j]!);
      stepNorm += (trial[j]! - x[j]!) ** 2;
      xNorm += x[j]! ** 2;
    }
    const smallStep = Math.sqrt(stepNorm) <= xtol * (Math.sqrt(xNorm) + xtol);
    calls++;
    const trialS = problem.cost(trial);
    // Predicted reduction of S by the quadratic model: 2·(gᵀδ − ½δᵀAδ) over the projected step.
    let predicted = 0;
    for (let j = 0; j < p; j++) {
      const dj = trial[j]! - x[j]!;
      let ad = 0;
      for (let k = 0; k < p; k++) ad += a[j * p + k]! * (trial[k]! - x[k]!);
      predicted += 2 * g[j]! * dj - dj * ad;
    }
    const actual = s - trialS;
    if (!Number.isFinite(trialS)) nonFinite++;
    if (Number.isFinite(trialS) && actual > 0) {
      iterations++;
      rejected = 0;
      nonFinite = 0;
      finiteMoves = 0;
      const rho = predicted > 0 ? actual / predicted : 0;
      const before = s;
      x.set(trial);
      calls++;
      s = problem.normal(x, a, g);
      if (!Number.isFinite(s) || !allFinite(a) || !allFinite(g)) return done(-3);
      lambda *= Math.max(1 / 3, 1 - (2 * rho - 1) ** 3);
      nu = 2;
      const smallReduction = actual <= Math.max(ftol * before, absoluteTolerance);
      if (smallReduction && smallStep) return done(4);
      if (smallReduction) return done(2);
      if (smallStep) return done(3);
    } else {
      if (Number.isFinite(trialS) && !smallStep) finiteMoves++;
      if (smallStep) return stuck(3);
      lambda *= nu;
      nu *= 2;
      if (++rejected >= MAX_REJECTED) return stuck(6);
      if (evaluations() >= maxEvaluations) return stuck(0);
    }
  }
}

/**
 * Minimises Σr² of a problem given by its normal equations (g = −Jᵀr), from
 * x0 within the bounds. Arguments are checked before iterating.
 */
export function leastSquaresNormal(
  problem: NormalEquationsProblem,
  x0: Float64Array,
  options: Omit<LeastSquaresOptions, 'jacobian'> = {},
): NormalLeastSquaresResult {
  checkInputs(x0, options);
  const core = minimise(problem, x0, options);
  return {
    params: core.params, cost: 0.5 * core.sumSquares, status: core.status, message: LEAST_SQUARES_MESSAGES[core.status],
    success: leastSquaresSuccess(core.status), evaluations: core.evaluations, iterations: core.iterations,
  };
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
  if (!Number.isInteger(m) || m < 1) throw invalidArgument('m', `the number of residuals must be a positive whole number, got ${m}`);
  checkInputs(x0, options);
  const p = x0.length;
  const jacobianAt = options.jacobian ?? forwardDifferenceJacobian(residualsAt, m);
  let evaluations = 0;
  let jacobianEvaluations = 0;
  const residuals = new Float64Array(m);
  const jacobian = new Float64Array(m * p);
  // The last trial's residuals: the accepted trial's normal equations reuse them (no second evaluation).
  const trialParams = new Float64Array(p).fill(Number.NaN);
  const trialResiduals = new Float64Array(m);
  const sumSquares = (r: Float64Array) => {
    let s = 0;
    for (let i = 0; i < m; i++) s += r[i]! * r[i]!;
    return s;
  };
  const problem: NormalEquationsProblem = {
    cost: (params) => {
      residualsAt(params, trialResiduals);
      evaluations++;
      trialParams.set(params);
      return sumSquares(trialResiduals);
    },
    normal: (params, a, g) => {
      if (params.every((v, j) => v === trialParams[j])) residuals.set(trialResiduals);
      else {
        residualsAt(params, residuals);
        evaluations++;
      }
      const s = sumSquares(residuals);
      if (!Number.isFinite(s)) return s;
      evaluations += jacobianAt(params, residuals, jacobian);
      jacobianEvaluations++;
      a.fill(0);
      g.fill(0);
      for (let i = 0; i < m; i++) {
        for (let j = 0; j < p; j++) {
          const jij = jacobian[i * p + j]!;
          g[j] = g[j]! - jij * residuals[i]!;
          for (let k = 0; k <= j; k++) a[j * p + k] = a[j * p + k]! + jij * jacobian[i * p + k]!;
        }
      }
      for (let j = 0; j < p; j++) for (let k = 0; k < j; k++) a[k * p + j] = a[j * p + k]!;
      return s;
    },
    evaluations: () => evaluations,
  };
  const core = minimise(problem, x0, options);
  return {
    params: core.params, cost: 0.5 * core.sumSquares, residuals, jacobian, status: core.status,
    message: LEAST_SQUARES_MESSAGES[core.status], success: leastSquaresSuccess(core.status),
    evaluations: core.evaluations, jacobianEvaluations, iterations: core.iterations,
  };
}
