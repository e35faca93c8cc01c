import { bitIsAlpha, bitOrbital, excitationSign, maskPopcount, signBelow, SPIN_ORBITALS } from './determinants.js';
import { integralIndex } from './repulsion.js';

/**
 * Dense many-electron matrices of spin-free operators between the
 * determinants of one block, by the Slater–Condon rules. Determinants and
 * signs as in determinants.ts. Matrices are row-major n×n Float64Array with
 * element [row·n + col] = <masks[row]| O |masks[col]>.
 */

/** Lowest set bit index of a nonzero mask. */
function lowestBit(mask: number): number {
  return 31 - Math.clz32(mask & -mask);
}

/**
 * The n×n row-major matrix of element(operator, bra, ket) over every pair
 * of the block's determinants: the one loop both Slater–Condon rules below
 * share. The callback costs speed only where no one waits for it: these
 * matrices are built once per block and cached (blocks.ts and its kin),
 * never per evaluation. Measured against the two loops written out
 * (interleaved, CPU time, a shared machine): building the one-body and both
 * two-body matrices over all 252 d5 determinants in a warm process took
 * 6.8 ms against 5.9 ms (median of 40); the first calls of a fresh process,
 * where the caches are filled (all d^n, both cubic geometries, and the
 * field levels with spin–orbit), medians of 363 ms (loops) and 364 ms
 * (helper) over 8 runs each, single runs 332–432 ms; bench/ligand-field.ts
 * (evaluations, diagrams, spin–orbit energies), run twice each, unchanged.
 */
function blockMatrixOf(
  masks: readonly number[], operator: Float64Array, element: (operator: Float64Array, bra: number, ket: number) => number,
): Float64Array {
  const n = masks.length;
  const out = new Float64Array(n * n);
  for (let row = 0; row < n; row++) {
    const bra = masks[row]!;
    for (let col = 0; col < n; col++) out[row * n + col] = element(operator, bra, masks[col]!);
  }
  return out;
}

/**
 * A one-electron spin-free operator h (5×5 spatial, row-major, index m_l + 2)
 * between determinants: diagonal Σ h_ii over occupied spin-orbitals; single
 * excitation q → p (same spin) sign·h_pq; zero otherwise.
 */
export function oneBodyBlockMatrix(masks: readonly number[], h: Float64Array): Float64Array {
  return blockMatrixOf(masks, h, oneBodyElement);
}

/** <bra| h |ket> for a one-electron operator h (oneBodyBlockMatrix's rule). */
function oneBodyElement(h: Float64Array, bra: number, ket: number): number {
  const diff = bra ^ ket;
  if (diff === 0) {
    let sum = 0;
    for (let bit = 0; bit < SPIN_ORBITALS; bit++) if (ket & (1 << bit)) sum += h[bitOrbital(bit) * 5 + bitOrbital(bit)]!;
    return sum;
  }
  if (maskPopcount(diff) !== 2) return 0;
  const p = lowestBit(diff & bra);
  const q = lowestBit(diff & ket);
  if (bitIsAlpha(p) !== bitIsAlpha(q)) return 0;
  return excitationSign(ket, p, q) * h[bitOrbital(p) * 5 + bitOrbital(q)]!;
}

/** Antisymmetrised spin-orbital integral <pq||rs> from spatial integrals g. */
function antisymmetrised(g: Float64Array, p: number, q: number, r: number, s: number): number {
  const [sp, sq, sr, ss] = [bitIsAlpha(p), bitIsAlpha(q), bitIsAlpha(r), bitIsAlpha(s)];
  const [op, oq, or, os] = [bitOrbital(p), bitOrbital(q), bitOrbital(r), bitOrbital(s)];
  const direct = sp === sr && sq === ss ? g[integralIndex(op, oq, or, os)]! : 0;
  const exchange = sp === ss && sq === sr ? g[integralIndex(op, oq, os, or)]! : 0;
  return direct - exchange;
}

/**
 * A two-electron spin-free operator with spatial integrals g (625 entries,
 * see repulsion.ts) between determinants:
 *   same determinant: Σ_{i<j} <ij||ij>;
 *   one spin-orbital q → p: sign(a†p a_q) Σ_{j≠q} <pj||qj>;
 *   two, q1 < q2 → p1 < p2: sign(a†p1 a†p2 a_q2 a_q1) <p1p2||q1q2>.
 */
export function twoBodyBlockMatrix(masks: readonly number[], g: Float64Array): Float64Array {
  return blockMatrixOf(masks, g, twoBodyElement);
}

/** <bra| g |ket> for a two-electron operator g (twoBodyBlockMatrix's rule). */
function twoBodyElement(g: Float64Array, bra: number, ket: number): number {
  const diff = bra ^ ket;
  const changed = maskPopcount(diff);
  if (changed === 0) {
    let value = 0;
    for (let i = 0; i < SPIN_ORBITALS; i++) {
      if (!(ket & (1 << i))) continue;
      for (let j = i + 1; j < SPIN_ORBITALS; j++) if (ket & (1 << j)) value += antisymmetrised(g, i, j, i, j);
    }
    return value;
  }
  if (changed === 2) {
    const p = lowestBit(diff & bra);
    const q = lowestBit(diff & ket);
    let sum = 0;
    for (let j = 0; j < SPIN_ORBITALS; j++) if (j !== q && ket & (1 << j)) sum += antisymmetrised(g, p, j, q, j);
    return excitationSign(ket, p, q) * sum;
  }
  if (changed !== 4) return 0;
  const created = diff & bra;
  const removed = diff & ket;
  const p1 = lowestBit(created);
  const p2 = lowestBit(created & ~(1 << p1));
  const q1 = lowestBit(removed);
  const q2 = lowestBit(removed & ~(1 << q1));
  let state = ket;
  let sign = signBelow(state, q1);
  state &= ~(1 << q1);
  sign *= signBelow(state, q2);
  state &= ~(1 << q2);
  sign *= signBelow(state, p2);
  state |= 1 << p2;
  sign *= signBelow(state, p1);
  return sign * antisymmetrised(g, p1, p2, q1, q2);
}
