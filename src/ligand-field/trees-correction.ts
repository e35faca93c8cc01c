import { irrepBlocks, type IrrepBlocks } from './irrep-blocks.js';
import { termEnergiesUnitBInto, termEntries, termOrder } from './free-ion-terms.js';
import { parentTableOf, type ParentTable } from './labels.js';
import { LruCache } from './lru-cache.js';
import { oneBodyBlockMatrix, twoBodyBlockMatrix } from './slater-condon.js';
import { projectMatrix } from './spin-projection.js';
import type { Geometry } from './types.js';
import { validateFinite } from './validate.js';

/**
 * The Trees correction α·L(L+1) (Trees, Phys. Rev. 83 (1951) 756; Racah,
 * Phys. Rev. 85 (1952) 381): the configuration interaction of 3d^n with
 * distant configurations, to first order, adds α·L² to the Hamiltonian, so a
 * free-ion term (2S+1)L rises by exactly α·L(L+1) (α in cm-1, of the order
 * of 60–80 cm-1 for the first-row divalent ions).
 *
 * L² is one-body plus two-body: L² = Σ_i l_i² + 2 Σ_{i<j} l_i·l_j, with
 * l_i² = l(l+1) = 6 for a d electron and
 *   l_1·l_2 = l_z1 l_z2 + ½(l_+1 l_−2 + l_−1 l_+2).
 * The two-body part is given here as spatial integrals in the convention of
 * repulsion.ts (<a b|g|c d>, electron 1 a ← c, electron 2 b ← d, index
 * ((a·5 + b)·5 + c)·5 + d, orbitals m_l + 2), so the Slater–Condon rules of
 * slater-condon.ts build it like the repulsion. The one-body part (6n) is a
 * constant of d^n: it is kept so that the operator is L² itself (6S at 0).
 *
 * The engine takes α as a fourth operator on the irrep blocks of
 * irrep-blocks.ts (H = Dq·V + B·H_B + C·H_C + α·L²), built once per d and
 * geometry on the same spin-S basis; α = 0 never reaches these blocks
 * (levels.ts uses the three-operator blocks then), so results without α are
 * unchanged to the bit.
 */

/** <m + 1| l_+ |m> of a d orbital (l = 2): √(6 − m(m + 1)). */
function raising(m: number): number {
  return Math.sqrt(6 - m * (m + 1));
}

/** <a|l_z|c>, <a|l_+|c>, <a|l_−|c> for orbitals a, c (m_l + 2). */
function lComponents(a: number, c: number): [number, number, number] {
  const ma = a - 2;
  const mc = c - 2;
  const z = a === c ? ma : 0;
  const plus = ma === mc + 1 ? raising(mc) : 0;
  const minus = ma === mc - 1 ? raising(ma) : 0;
  return [z, plus, minus];
}

let cachedTwoBody: Float64Array | undefined;

/** The spatial integrals of 2·l_1·l_2 (625 entries, repulsion.ts's index): the two-body part of L². */
export function orbitalAngularTwoBodyIntegrals(): Float64Array {
  if (cachedTwoBody) return cachedTwoBody;
  const g = new Float64Array(625);
  for (let a = 0; a < 5; a++)
    for (let b = 0; b < 5; b++)
      for (let c = 0; c < 5; c++)
        for (let d = 0; d < 5; d++) {
          const [z1, p1, m1] = lComponents(a, c);
          const [z2, p2, m2] = lComponents(b, d);
          g[((a * 5 + b) * 5 + c) * 5 + d] = 2 * (z1 * z2 + 0.5 * (p1 * m2 + m1 * p2));
        }
  cachedTwoBody = g;
  return g;
}

/** l² = 6 on every d orbital: the one-body part of L² (5×5, row-major). */
const ONE_BODY_L_SQUARED = Float64Array.from({ length: 25 }, (_, i) => (i % 6 === 0 ? 6 : 0));

/** L² between the determinants of a block (dense, row-major, slater-condon.ts's convention). */
export function orbitalAngularSquaredMatrix(masks: readonly number[]): Float64Array {
  const one = oneBodyBlockMatrix(masks, ONE_BODY_L_SQUARED);
  const two = twoBodyBlockMatrix(masks, orbitalAngularTwoBodyIntegrals());
  for (let i = 0; i < one.length; i++) one[i] = one[i]! + two[i]!;
  return one;
}

const blockCache: Array<IrrepBlocks | undefined> = [];

/**
 * The (S, Γ) blocks of irrep-blocks.ts with L² appended: operators
 * [dq, b, c, alpha]. Built once per (d, geometry). n in 1..9.
 */
export function treesIrrepBlocks(n: number, geometry: Geometry): IrrepBlocks {
  const index = 2 * n + (geometry === 'octahedral' ? 0 : 1);
  const hit = blockCache[index];
  if (hit) return hit;
  const plain = irrepBlocks(n, geometry);
  const blocks = plain.blocks.map((row) =>
    row.map((block) => {
      if (block.size === 0) return { ...block, operators: [...block.operators, new Float64Array(0)] };
      const l2 = projectMatrix(orbitalAngularSquaredMatrix(block.masks), block.basis, block.masks.length, block.size);
      return { ...block, operators: [...block.operators, l2] };
    }),
  );
  const result: IrrepBlocks = { n, geometry, twoSValues: plain.twoSValues, blocks };
  blockCache[index] = result;
  return result;
}

const tableCache = new LruCache<string, ParentTable>(64);
const energyScratch = new Float64Array(64);

/**
 * The parent table of d^n with the Trees term: the free-ion terms in the
 * order of their energies B·E(C/B) + α·L(L+1). Exact: L² is L(L+1) on each
 * term and commutes with the repulsion, so α only shifts each term.
 */
export function treesParentTable(n: number, b: number, c: number, alpha: number): ParentTable {
  const entries = termEntries(n);
  const energies = termEnergiesUnitBInto(n, c / b, energyScratch);
  const shifted = new Float64Array(entries.length);
  entries.forEach((entry, i) => (shifted[i] = b * energies[i]! + alpha * entry.L * (entry.L + 1)));
  const order = termOrder(entries, shifted);
  const key = `${n}:${String.fromCharCode(...order)}`;
  let table = tableCache.get(key);
  if (!table) {
    table = parentTableOf(order.map((i) => entries[i]!));
    tableCache.set(key, table);
  }
  return table;
}

/** The Trees α of engine parameters: absent means 0; otherwise finite (any sign; cm-1). */
export function treesAlphaOf(params: { alpha?: number }): number {
  if (params.alpha === undefined) return 0;
  validateFinite(params.alpha, 'alpha');
  return params.alpha;
}
