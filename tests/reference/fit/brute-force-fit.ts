/**
 * Slow, obviously correct reference for one assignment's least-squares fit:
 * minimise S(Dq, B) = Σ w_i (E_i(Dq, B, r·B) − o_i)² with the engine called
 * at every trial point (no homogeneity trick, no closed-form B, no scan):
 * a dense 2-D grid over Dq and B, then a compass search (try ± step in each
 * coordinate, halve the step when nothing improves) from the best point.
 */
import { computeLevels } from '../../../src/ligand-field/index.js';
import type { Geometry } from '../../../src/ligand-field/types.js';

export interface BruteForceProblem {
  d: number;
  geometry: Geometry;
  cOverB: number;
  /** "4A2g#0": multiplicity, irrep, rank. */
  groundKey: string;
  levelKeys: string[];
  observed: number[];
  weights: number[];
}

function key(l: { multiplicity: number; irrep: string; rank: number }): string {
  return `${l.multiplicity}${l.irrep}#${l.rank}`;
}

export function sumOfSquares(problem: BruteForceProblem, dq: number, b: number): number {
  const levels = computeLevels(problem.d, problem.geometry, { dq, b, c: problem.cOverB * b }).levels;
  const energy = new Map(levels.map((l) => [key(l), l.energy]));
  const zero = energy.get(problem.groundKey)!;
  let s = 0;
  problem.levelKeys.forEach((k, i) => {
    s += problem.weights[i]! * (energy.get(k)! - zero - problem.observed[i]!) ** 2;
  });
  return s;
}

export function bruteForceFit(
  problem: BruteForceProblem,
  { dqRange = [100, 4000], bRange = [200, 1500], steps = 60 } = {},
): { dq: number; b: number; ssr: number } {
  let best = { dq: 0, b: 0, ssr: Infinity };
  for (let i = 0; i <= steps; i++) {
    for (let j = 0; j <= steps; j++) {
      const dq = dqRange[0]! + ((dqRange[1]! - dqRange[0]!) * i) / steps;
      const b = bRange[0]! + ((bRange[1]! - bRange[0]!) * j) / steps;
      const ssr = sumOfSquares(problem, dq, b);
      if (ssr < best.ssr) best = { dq, b, ssr };
    }
  }
  let stepDq = (dqRange[1]! - dqRange[0]!) / steps;
  let stepB = (bRange[1]! - bRange[0]!) / steps;
  while (stepDq > 1e-5 || stepB > 1e-5) {
    let improved = false;
    for (const [ddq, db] of [[stepDq, 0], [-stepDq, 0], [0, stepB], [0, -stepB]] as const) {
      const dq = best.dq + ddq;
      const b = best.b + db;
      if (dq < 0 || b <= 0) continue;
      const ssr = sumOfSquares(problem, dq, b);
      if (ssr < best.ssr) {
        best = { dq, b, ssr };
        improved = true;
      }
    }
    if (!improved) {
      stepDq /= 2;
      stepB /= 2;
    }
  }
  return best;
}
