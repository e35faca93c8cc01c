/**
 * The band fit's bounded Levenberg–Marquardt: a thin adapter over the one
 * least-squares solver of fieldgap (src/numeric/least-squares.ts), keeping
 * the options and result this module has always had. Small and dense: n
 * residuals × p parameters with p up to a few dozen, as in a band fit.
 */
import {
  choleskySolveInPlace, leastSquaresNormal, type LeastSquaresStatus, type NormalEquationsProblem,
} from '../numeric/least-squares.js';

export { choleskySolveInPlace, type NormalEquationsProblem };

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
  /** True when the solver stopped at a minimum (its `success`): false when the budget ran out or the residuals were not finite. */
  converged: boolean;
  /** The solver's status code and message (LEAST_SQUARES_MESSAGES). */
  status: LeastSquaresStatus;
  message: string;
}

/**
 * Bounded Levenberg–Marquardt on a problem that forms its own normal
 * equations (g = Jᵀ(y − model), so a sparse model can skip the zero
 * products) and evaluates trial steps by their cost only. Converged: the
 * decrease of the cost in one step fell below max(tolerance × cost,
 * absoluteTolerance) (@default 0; with a χ² cost, 0.01 is far below what
 * changes any conclusion), or no step lowers it.
 */
export function levenbergMarquardtNormal(
  problem: NormalEquationsProblem, options: LevenbergMarquardtOptions & { absoluteTolerance?: number },
): LevenbergMarquardtResult {
  const { initial, lower, upper, maxIterations = 100, tolerance = 1e-9, absoluteTolerance = 0 } = options;
  const result = leastSquaresNormal(problem, initial, {
    lower, upper, maxIterations, ftol: tolerance, absoluteTolerance,
    // Every accepted step may take a few rejected trials: the iteration cap is the budget that matters here.
    maxEvaluations: 40 * (maxIterations + 1),
    ...(options.damping !== undefined ? { initialDamping: options.damping } : {}),
  });
  return {
    parameters: result.params, cost: 2 * result.cost, iterations: result.iterations,
    converged: result.success, status: result.status, message: result.message,
  };
}
