/**
 * Refinement of a grid solution with the full engine: Levenberg–Marquardt on
 * (Dq, B) or (Dq, B, C), residual i = (calc_i − obs_i)/σ_i, calc_i the energy
 * of the assigned level above the assumed ground level.
 *
 * Jacobian: one forward difference in Dq (and one in C when C is a
 * parameter); ∂/∂B then follows from Euler's relation for functions
 * homogeneous of degree 1, E = Dq·∂E/∂Dq + B·∂E/∂B + C·∂E/∂C, so a Jacobian
 * costs one or two engine calls instead of two or three.
 *
 * With the Trees correction (trees-correction.ts) α is a fixed engine
 * parameter (`alpha`) or one more fitted one (`alphaFree`, the last θ, one
 * more forward difference); H stays linear in (Dq, B, C, α), so Euler's
 * relation still gives ∂/∂B, less α·∂E/∂α.
 */
import { assignedIdentitiesOf } from './assigned-level-energies.js';
import { assignedEnergiesAt, levelsAt as computeLevels } from './engine.js';
import type { FieldParameters, Geometry, LevelsResult } from '../ligand-field/types.js';
import { leastSquares, type LeastSquaresResult } from './least-squares.js';
import { levelIdentityKey } from './scan.js';
import type { CMode } from './types.js';
import { float64Of } from './float64-of.js';

export interface RefineProblem {
  d: number;
  geometry: Geometry;
  mode: CMode;
  /** C/B in ratio mode. */
  cOverB: number;
  /** C in fixed mode, cm-1. */
  cFixed: number;
  /** Key ("4A2g#0") of the assumed ground level. */
  groundKey: string;
  /** Key of the level each observation is assigned to. */
  levelKeys: string[];
  observed: Float64Array;
  /** Divides each residual (1 for an unweighted fit). */
  sigma: Float64Array;
  /** Bounds on B, cm-1, where the β prior is negligible beyond (likelihood.ts). Default: B ≥ 1. */
  bRange?: [number, number];
  /** The Trees α, cm-1: fixed at this value, or the start when alphaFree. Default 0 (none). */
  alpha?: number;
  /** α is fitted (the last parameter). Default false. */
  alphaFree?: boolean;
}

export interface Refined {
  params: FieldParameters;
  calculated: Float64Array;
  levels: LevelsResult;
  lsq: LeastSquaresResult;
  /** Whether the assumed ground level is the ground level at the result. */
  selfConsistent: boolean;
}

/** (θ) → field parameters for the mode. */
export function parametersOf(problem: RefineProblem, theta: Float64Array): FieldParameters {
  const params = cubicParametersOf(problem, theta);
  if (problem.alphaFree) params.alpha = theta[theta.length - 1]!;
  else if (problem.alpha !== undefined && problem.alpha !== 0) params.alpha = problem.alpha;
  return params;
}

function cubicParametersOf(problem: RefineProblem, theta: Float64Array): FieldParameters {
  const dq = theta[0]!;
  const b = theta[1]!;
  if (problem.mode === 'ratio') return { dq, b, c: problem.cOverB * b };
  if (problem.mode === 'fixed') return { dq, b, c: problem.cFixed };
  return { dq, b, c: theta[2]! };
}

/** θ for the mode from field parameters. */
export function thetaOf(problem: RefineProblem, params: FieldParameters): Float64Array {
  const cubic = problem.mode === 'free' ? [params.dq, params.b, params.c] : [params.dq, params.b];
  return Float64Array.from(problem.alphaFree ? [...cubic, params.alpha ?? problem.alpha ?? 0] : cubic);
}

/** Number of fitted parameters: Dq, B, C when free, α when free. */
export function parameterCount(problem: Pick<RefineProblem, 'mode' | 'alphaFree'>): number {
  return (problem.mode === 'free' ? 3 : 2) + (problem.alphaFree ? 1 : 0);
}

/** Energies of the assigned levels above the assumed ground level; NaN where a key is missing. */
export function assignedEnergies(levels: LevelsResult, groundKey: string, keys: string[], out: Float64Array): void {
  const byKey = new Map(levels.levels.map((l) => [levelIdentityKey(l), l.energy]));
  const zero = byKey.get(groundKey) ?? Number.NaN;
  keys.forEach((key, i) => (out[i] = (byKey.get(key) ?? Number.NaN) - zero));
}

/** |α| bound of a fitted Trees α, cm-1. */
export const ALPHA_BOUND = 500;

export function refineSolution(problem: RefineProblem, start: FieldParameters, maxEvaluations = 40): Refined {
  const m = problem.observed.length;
  const calc = new Float64Array(m);
  const shifted = new Float64Array(m);
  const energiesAt = (params: FieldParameters, out: Float64Array): LevelsResult => {
    const levels = computeLevels(problem.d, problem.geometry, params);
    assignedEnergies(levels, problem.groundKey, problem.levelKeys, out);
    return levels;
  };
  // Inside the iterations only the assigned energies are read: the fast path, same numbers (assigned-level-energies.ts).
  const identities = assignedIdentitiesOf(problem.groundKey, problem.levelKeys, problem.geometry);
  const energiesOnlyAt = (params: FieldParameters, out: Float64Array): void =>
    assignedEnergiesAt(problem.d, problem.geometry, params, problem.groundKey, problem.levelKeys, identities, out);
  const residuals = (theta: Float64Array, out: Float64Array) => {
    energiesOnlyAt(parametersOf(problem, theta), calc);
    for (let i = 0; i < m; i++) out[i] = (calc[i]! - problem.observed[i]!) / problem.sigma[i]!;
  };
  const p = parameterCount(problem);
  const jacobian = (theta: Float64Array, r: Float64Array, out: Float64Array): number => {
    const params = parametersOf(problem, theta);
    const { dq, b, c } = params;
    const alpha = params.alpha ?? 0;
    // calc from the residuals (exact: r was computed at theta).
    for (let i = 0; i < m; i++) calc[i] = r[i]! * problem.sigma[i]! + problem.observed[i]!;
    const hDq = 1e-6 * Math.max(dq, 0.1 * b, 1);
    energiesOnlyAt({ ...params, dq: dq + hDq }, shifted);
    const dDq = float64Of(shifted, (v, i) => (v - calc[i]!) / hDq);
    let dC: Float64Array | undefined;
    let dAlpha: Float64Array | undefined;
    let calls = 1;
    if (problem.mode !== 'ratio') {
      const hC = 1e-6 * Math.max(c, b, 1);
      energiesOnlyAt({ ...params, c: c + hC }, shifted);
      dC = float64Of(shifted, (v, i) => (v - calc[i]!) / hC);
      calls++;
    }
    if (problem.alphaFree) {
      const hAlpha = 1e-6 * Math.max(Math.abs(alpha), 0.1 * b, 1);
      energiesOnlyAt({ ...params, alpha: alpha + hAlpha }, shifted);
      dAlpha = float64Of(shifted, (v, i) => (v - calc[i]!) / hAlpha);
      calls++;
    }
    for (let i = 0; i < m; i++) {
      // Ratio mode: total dE/dB along C = rB is (E − Dq·E_Dq − α·E_α)/B; otherwise the partial (E − Dq·E_Dq − C·E_C − α·E_α)/B.
      const dB = (calc[i]! - dq * dDq[i]! - (dC ? c * dC[i]! : 0) - (dAlpha ? alpha * dAlpha[i]! : 0)) / b;
      const s = problem.sigma[i]!;
      out[i * p] = dDq[i]! / s;
      out[i * p + 1] = dB / s;
      if (dC) out[i * p + 2] = dC[i]! / s;
      if (dAlpha) out[i * p + p - 1] = dAlpha[i]! / s;
    }
    return calls;
  };
  const [bLow, bHigh] = problem.bRange ?? [1, Infinity];
  const cubicLower = problem.mode === 'free' ? [0, bLow, 0] : [0, bLow];
  const cubicUpper = problem.mode === 'free' ? [Infinity, bHigh, Infinity] : [Infinity, bHigh];
  // α: the first-row values lie near 60–80 cm-1 (trees-correction.ts); ±500 only keeps a runaway fit finite.
  const lower = Float64Array.from(problem.alphaFree ? [...cubicLower, -ALPHA_BOUND] : cubicLower);
  const upper = Float64Array.from(problem.alphaFree ? [...cubicUpper, ALPHA_BOUND] : cubicUpper);
  // Exact to 1e-6 cm-1 per band is exact: below that only rounding is left to chase.
  let atol = 0;
  for (let i = 0; i < m; i++) atol += 0.5 * (1e-6 / problem.sigma[i]!) ** 2;
  const lsq = leastSquares(residuals, thetaOf(problem, start), m, { jacobian, lower, upper, maxEvaluations, atol });
  const params = parametersOf(problem, lsq.params);
  const levels = energiesAt(params, calc);
  const selfConsistent = levelIdentityKey(levels.levels[0]!) === problem.groundKey || levels.levels.some(
    (l) => l.energy === 0 && levelIdentityKey(l) === problem.groundKey,
  );
  return { params, calculated: Float64Array.from(calc), levels, lsq, selfConsistent };
}
