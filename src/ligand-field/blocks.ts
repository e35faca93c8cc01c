import { dShellMasks, maskC4Label, maskMl, maskTwoMs } from './determinants.js';
import { cubicFieldOrbitalMatrix } from './cubic-field.js';
import { dShellRepulsionIntegrals } from './repulsion.js';
import { oneBodyBlockMatrix, twoBodyBlockMatrix } from './slater-condon.js';
import type { Geometry } from './types.js';

/**
 * The symmetry blocks of the d^n Hamiltonian and their precomputed operator
 * matrices. H = Dq·H_cf + B·H_B + C·H_C is linear in its parameters, so each
 * block stores one matrix per parameter and an evaluation only forms the sum.
 *
 * Cubic blocks: (2M_S, k) with k = M_L mod 4, the C4(z) label: the cubic
 * field couples m_l with m_l ± 4 only and repulsion conserves M_L. Only
 * M_S ≥ 0 is kept (M_S and −M_S have the same spectrum). Free-ion blocks:
 * (2M_S, M_L) with both ≥ 0, for the terms at Dq = 0.
 */
export interface OperatorBlock {
  /** 2·M_S of every determinant of the block. */
  twoMs: number;
  /** k = M_L mod 4 (cubic blocks) or M_L (free-ion blocks). */
  label: number;
  /** Determinant masks, ascending. */
  masks: number[];
  size: number;
  /** Operator matrices (row-major size×size), one per parameter, same order as the parameter vector. */
  operators: Float64Array[];
}

/** Parameter order of cubic operator lists: [dq, b, c]. Free-ion lists: [b, c]. */
export const CUBIC_PARAMETERS = ['dq', 'b', 'c'] as const;

export interface CubicBlocks {
  n: number;
  geometry: Geometry;
  /** 2M_S values present (≥ 0), ascending. */
  twoMsValues: number[];
  /** blocks[twoMsIndex][k], k = 0..3. */
  blocks: OperatorBlock[][];
  /** All masks of each 2M_S (all k), ascending: the space rotations act on. */
  spinMasks: number[][];
}

function buildBlock(masks: number[], twoMs: number, label: number, oneBody: Float64Array[], twoBody: Float64Array[]): OperatorBlock {
  const operators = [
    ...oneBody.map((h) => oneBodyBlockMatrix(masks, h)),
    ...twoBody.map((g) => twoBodyBlockMatrix(masks, g)),
  ];
  return { twoMs, label, masks, size: masks.length, operators };
}

function nonNegativeTwoMs(n: number): number[] {
  const top = Math.min(n, 10 - n);
  const values: number[] = [];
  for (let twoMs = top % 2; twoMs <= top; twoMs += 2) values.push(twoMs);
  return values;
}

const cubicCache = new Map<string, CubicBlocks>();

/** The cubic blocks of d^n in a geometry, built once and cached. n in 1..9. */
export function cubicBlocks(n: number, geometry: Geometry): CubicBlocks {
  const key = `${n}:${geometry}`;
  const hit = cubicCache.get(key);
  if (hit) return hit;
  const { coefB, coefC } = dShellRepulsionIntegrals();
  const field = cubicFieldOrbitalMatrix(geometry);
  const all = dShellMasks(n);
  const twoMsValues = nonNegativeTwoMs(n);
  const spinMasks = twoMsValues.map((twoMs) => all.filter((m) => maskTwoMs(m) === twoMs));
  const blocks = twoMsValues.map((twoMs, s) =>
    [0, 1, 2, 3].map((k) =>
      buildBlock(spinMasks[s]!.filter((m) => maskC4Label(m) === k), twoMs, k, [field], [coefB, coefC]),
    ),
  );
  const result: CubicBlocks = { n, geometry, twoMsValues, blocks, spinMasks };
  cubicCache.set(key, result);
  return result;
}

export interface FreeIonBlocks {
  n: number;
  twoMsValues: number[];
  /** Largest M_L present. */
  maxMl: number;
  /** blocks[twoMsIndex][M_L], M_L = 0..maxMl (possibly empty blocks). */
  blocks: OperatorBlock[][];
}

const freeIonCache = new Map<number, FreeIonBlocks>();

/** The (2M_S, M_L) repulsion blocks of d^n at Dq = 0, cached. n in 1..9. */
export function freeIonBlocks(n: number): FreeIonBlocks {
  const hit = freeIonCache.get(n);
  if (hit) return hit;
  const { coefB, coefC } = dShellRepulsionIntegrals();
  const all = dShellMasks(n);
  const twoMsValues = nonNegativeTwoMs(n);
  const maxMl = Math.max(...all.map(maskMl));
  const blocks = twoMsValues.map((twoMs) =>
    Array.from({ length: maxMl + 1 }, (_, ml) =>
      buildBlock(all.filter((m) => maskTwoMs(m) === twoMs && maskMl(m) === ml), twoMs, ml, [], [coefB, coefC]),
    ),
  );
  const result: FreeIonBlocks = { n, twoMsValues, maxMl, blocks };
  freeIonCache.set(n, result);
  return result;
}
