/**
 * Refinement of a grid solution with the full engine: Levenberg–Marquardt on
 * (Dq, B) or (Dq, B, C), residual i = (calc_i − obs_i)/σ_i, calc_i the energy
 * of the assigned level above the assumed ground level.
 *
 * Jacobian: one forward difference in Dq (and one in C when C is a
 * parameter); ∂/∂B then follows from Euler's relation for functions
 * homogeneous of degree 1, E = Dq·∂E/∂Dq + B·∂E/∂B + C·∂E/∂C, so a Jacobian
 * costs one or two engine calls instead of two or three.
 */
import { levelsAt as computeLevels } from './engine.js';
import type { FieldParameters, Geometry, LevelsResult } from '../ligand-field/types.js';
import { leastSquares, type LeastSquaresResult } from './least-squares.js';
import { levelIdentityKey } from './scan.js';
import type { CMode } from './types.js';

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
  const dq = theta[0]!;
  const b = theta[1]!;
  if (problem.mode === 'ratio') return { dq, b, c: problem.cOverB * b };
  if (problem.mode === 'fixed') return { dq, b, c: problem.cFixed };
  return { dq, b, c: theta[2]! };
}

/** θ for the mode from field parameters. */
export function thetaOf(problem: RefineProblem, params: FieldParameters): Float64Array {
  return problem.mode === 'free' ? Float64Array.of(params.dq, params.b, params.c) : Float64Array.of(params.dq, params.b);
}

/** Energies of the assigned levels above the assumed ground level; NaN where a key is missing. */
export function assignedEnergies(levels: LevelsResult, groundKey: string, keys: string[], out: Float64Array): void {
  const byKey = new Map(levels.levels.map((l) => [levelIdentityKey(l), l.energy]));
  const zero = byKey.get(groundKey) ?? Number.NaN;
  keys.forEach((key, i) => (out[i] = (byKey.get(key) ?? Number.NaN) - zero));
}

export function refineSolution(problem: RefineProblem, start: FieldParameters, maxEvaluations = 40): Refined {
  const m = problem.observed.length;
  const calc = new Float64Array(m);
  const shifted = new Float64Array(m);
  const energiesAt = (params: FieldParameters, out: Float64Array): LevelsResult => {
    const levels = computeLevels(problem.d, problem.geometry, params);
    assignedEnergies(levels, problem.groundKey, problem.levelKeys, out);
    return levels;
  };
  const residuals = (theta: Float64Array, out: Float64Array) => {
    energiesAt(parametersOf(problem, theta), calc);
    for (let i = 0; i < m; i++) out[i] = (calc[i]! - problem.observed[i]!) / problem.sigma[i]!;
  };
  const p = problem.mode === 'free' ? 3 : 2;
  const jacobian = (theta: Float64Array, r: Float64Array, out: Float64Array): number => {
    const params = parametersOf(problem, theta);
    const { dq, b, c } = params;
    // calc from the residuals (exact: r was computed at theta).
    for (let i = 0; i < m; i++) calc[i] = r[i]! * problem.sigma[i]! + problem.observed[i]!;
    const hDq = 1e-6 * Math.max(dq, 0.1 * b, 1);
    energiesAt({ dq: dq + hDq, b, c }, shifted);
    const dDq = Float64Array.from(shifted, (v, i) => (v - calc[i]!) / hDq);
    let dC: Float64Array | undefined;
    let calls = 1;
    if (problem.mode !== 'ratio') {
      const hC = 1e-6 * Math.max(c, b, 1);
      energiesAt({ dq, b, c: c + hC }, shifted);
      dC = Float64Array.from(shifted, (v, i) => (v - calc[i]!) / hC);
      calls++;
    }
    for (let i = 0; i < m; i++) {
      // Ratio mode: total dE/dB along C = rB is (E − Dq·E_Dq)/B; otherwise the partial (E − Dq·E_Dq − C·E_C)/B.
      const dB = (calc[i]! - dq * dDq[i]! - (dC ? c * dC[i]! : 0)) / b;
      const s = problem.sigma[i]!;
      out[i * p] = dDq[i]! / s;
      out[i * p + 1] = dB / s;
      if (p === 3) out[i * p + 2] = dC![i]! / s;
    }
    return calls;
  };
  const [bLow, bHigh] = problem.bRange ?? [1, Infinity];
  const lower = p === 3 ? Float64Array.of(0, bLow, 0) : Float64Array.of(0, bLow);
  const upper = p === 3 ? Float64Array.of(Infinity, bHigh, Infinity) : Float64Array.of(Infinity, bHigh);
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
