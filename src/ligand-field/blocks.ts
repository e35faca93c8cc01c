import { dShellMasks, maskC4Label, maskMl, maskTwoMs } from './determinants.js';
import { cubicFieldOrbitalMatrix } from './cubic-field.js';
import { dShellRepulsionIntegrals } from './repulsion.js';
import { oneBodyBlockMatrix, twoBodyBlockMatrix } from './slater-condon.js';
import {
  gramMatrix, nullSpaceBasis, oneBodyTransitionMatrix, ORBITAL_RAISING, projectMatrix, SPIN_RAISING,
} from './spin-projection.js';
import type { Geometry } from './types.js';
import { CHANNELS } from './cubic-group.js';
import { symmetricEigen } from './eigen-symmetric.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from './rotations.js';

/**
 * The symmetry blocks of the d^n Hamiltonian and their precomputed operator
 * matrices. H = Dq·H_cf + B·H_B + C·H_C is linear in its parameters, so each
 * block stores one matrix per parameter and an evaluation only forms the sum
 * and diagonalises. (A tetragonal Ds, Dt or a spin–orbit term would be one
 * more operator per block, with spin–orbit also mixing the spin blocks.)
 *
 * Cubic blocks: spin S and k = M_L mod 4, the C4(z) label (the cubic field
 * couples m_l with m_l ± 4 only; repulsion conserves M_L). Each block is the
 * spin-S subspace (kernel of S+, see spin-projection.ts) of the determinants
 * with M_S = S and M_L ≡ k (mod 4); k = 0 and k = 2 are split further by
 * their parity under C2 about x (see CHANNELS in cubic-group.ts), which
 * commutes with H and roughly halves the work of diagonalising them. Free-ion blocks: one per (S, L) present,
 * the subspace of M_S = S, M_L = L killed by S+ and L+: one dimension per term.
 */
export interface OperatorBlock {
  /** 2S. */
  twoS: number;
  /** k = M_L mod 4 (cubic) or L (free ion). */
  label: number;
  /** Determinants spanning the block (M_S = S), ascending. */
  masks: number[];
  /** Dimension of the projected block. */
  size: number;
  /** masks.length × size orthonormal columns (element [i·size + j]) expressing the block basis in determinants. */
  basis: Float64Array;
  /** Projected operator matrices (size × size), in parameter order: cubic [dq, b, c], free ion [b, c]. */
  operators: Float64Array[];
}

export interface CubicBlocks {
  n: number;
  geometry: Geometry;
  /** 2S values present, ascending. */
  twoSValues: number[];
  /** blocks[spinIndex][channel], channels k0+, k0−, k1, k2+, k2− (CHANNELS). */
  blocks: OperatorBlock[][];
  /** The k = 3 block of each spin: the mirror of k = 1, used only for characters. */
  mirrors: OperatorBlock[];
}

function spinValues(n: number): number[] {
  const top = Math.min(n, 10 - n);
  const values: number[] = [];
  for (let twoS = top % 2; twoS <= top; twoS += 2) values.push(twoS);
  return values;
}

/** The highest-weight subspace of a list of determinants: killed by S+ (and L+ when withL). */
function projectedBlock(
  all: readonly number[],
  masks: number[],
  twoS: number,
  label: number,
  raisedMl: number | undefined,
  build: (masks: number[]) => Float64Array[],
): OperatorBlock {
  const n = masks.length;
  const upper = all.filter((m) => maskTwoMs(m) === twoS + 2 && (raisedMl === undefined ? maskC4Label(m) === label : maskMl(m) === raisedMl - 1));
  const gram = gramMatrix(oneBodyTransitionMatrix(upper, masks, SPIN_RAISING), upper.length, n);
  if (raisedMl !== undefined) {
    const upperL = all.filter((m) => maskTwoMs(m) === twoS && maskMl(m) === raisedMl);
    const gramL = gramMatrix(oneBodyTransitionMatrix(upperL, masks, ORBITAL_RAISING), upperL.length, n);
    for (let i = 0; i < gram.length; i++) gram[i] = gram[i]! + gramL[i]!;
  }
  const { basis, dimension } = nullSpaceBasis(gram, n);
  const operators = build(masks).map((op) => projectMatrix(op, basis, n, dimension));
  return { twoS, label, masks, size: dimension, basis, operators };
}

/**
 * The part of a block on which a symmetry operator (given on the block, a
 * real symmetric matrix that commutes with H) has the eigenvalues that keep
 * accepts: diagonalise the operator and project onto those eigenvectors.
 */
export function blockPart(block: OperatorBlock, operator: Float64Array, keep: (eigenvalue: number) => boolean): OperatorBlock {
  const n = block.size;
  const { values, vectors } = symmetricEigen(operator, n);
  const kept: number[] = [];
  for (let j = 0; j < n; j++) if (keep(values[j]!)) kept.push(j);
  const m = kept.length;
  const w = new Float64Array(n * m);
  kept.forEach((j, c) => {
    for (let i = 0; i < n; i++) w[i * m + c] = vectors[i * n + j]!;
  });
  const rows = block.masks.length;
  const basis = new Float64Array(rows * m);
  for (let i = 0; i < rows; i++)
    for (let a = 0; a < n; a++) {
      const u = block.basis[i * n + a]!;
      if (u === 0) continue;
      for (let c = 0; c < m; c++) basis[i * m + c] = basis[i * m + c]! + u * w[a * m + c]!;
    }
  const operators = block.operators.map((op) => projectMatrix(op, w, n, m));
  return { twoS: block.twoS, label: block.label, masks: block.masks, size: m, basis, operators };
}

/** The part of a block with C2(x) parity +1 or −1 (C2(x) is a real involution on the block). */
function parityPart(block: OperatorBlock, parity: number, c2x: Float64Array): OperatorBlock {
  return blockPart(block, c2x, (value) => Math.sign(value) === parity);
}

/** C2(x) on the projected block (its real part: C2(x) is a real signed permutation of determinants). */
function projectedC2x(block: OperatorBlock): Float64Array {
  const full = determinantRotation(block.masks, dOrbitalRotation(ROTATIONS.c2x)).re;
  return projectMatrix(full, block.basis, block.masks.length, block.size);
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
  const twoSValues = spinValues(n);
  const build = (masks: number[]): Float64Array[] => [
    oneBodyBlockMatrix(masks, field), twoBodyBlockMatrix(masks, coefB), twoBodyBlockMatrix(masks, coefC),
  ];
  const byK = twoSValues.map((twoS) =>
    [0, 1, 2, 3].map((k) =>
      projectedBlock(all, all.filter((m) => maskTwoMs(m) === twoS && maskC4Label(m) === k), twoS, k, undefined, build),
    ),
  );
  const blocks = byK.map((row) => {
    const parity = [row[0]!, row[2]!].map((block) => projectedC2x(block));
    return CHANNELS.map(({ k, parity: p }) => (k === 1 ? row[1]! : parityPart(row[k]!, p, parity[k / 2]!)));
  });
  const result: CubicBlocks = { n, geometry, twoSValues, blocks, mirrors: byK.map((row) => row[3]!) };
  cubicCache.set(key, result);
  return result;
}

const freeIonCache = new Map<number, OperatorBlock[]>();

/** The (S, L) term blocks of d^n at Dq = 0 (only those with terms), cached. n in 1..9. */
export function freeIonBlocks(n: number): OperatorBlock[] {
  const hit = freeIonCache.get(n);
  if (hit) return hit;
  const { coefB, coefC } = dShellRepulsionIntegrals();
  const all = dShellMasks(n);
  const maxMl = Math.max(...all.map(maskMl));
  const build = (masks: number[]): Float64Array[] => [twoBodyBlockMatrix(masks, coefB), twoBodyBlockMatrix(masks, coefC)];
  const blocks: OperatorBlock[] = [];
  for (const twoS of spinValues(n))
    for (let L = 0; L <= maxMl; L++) {
      const masks = all.filter((m) => maskTwoMs(m) === twoS && maskMl(m) === L);
      if (masks.length === 0) continue;
      const block = projectedBlock(all, masks, twoS, L, L + 1, build);
      if (block.size > 0) blocks.push(block);
    }
  freeIonCache.set(n, blocks);
  return blocks;
}
