import { condonShortleyCk } from '../../src/ligand-field/gaunt.js';
import type { FieldParameters, Geometry } from '../../src/ligand-field/types.js';
import { jacobiEigen } from './jacobi-eigen.js';

/**
 * The slow, obviously correct reference: one dense C(10, n) × C(10, n)
 * Hamiltonian built by applying second-quantised operators to every
 * determinant, written without the engine's blocks, Slater–Condon rules or
 * sign helpers, and diagonalised by plain Jacobi; the spin of each
 * eigenvector from <S²>.
 *
 * Spin-orbital p in 0..9: m_l = p % 5 − 2, spin up for p < 5 (the engine's
 * convention, though nothing here depends on it matching).
 * H = Σ h_pq a†p a_q + ½ Σ <pq|rs> a†p a†q a_s a_r.
 */

const ml = (p: number): number => (p % 5) - 2;
const up = (p: number): boolean => p < 5;

/** a_q then sign, or null. */
export function annihilate(state: { mask: number; sign: number } | null, q: number): { mask: number; sign: number } | null {
  if (!state || !(state.mask & (1 << q))) return null;
  let below = 0;
  for (let i = 0; i < q; i++) if (state.mask & (1 << i)) below++;
  return { mask: state.mask & ~(1 << q), sign: below % 2 ? -state.sign : state.sign };
}

/** a†_p then sign, or null. */
export function create(state: { mask: number; sign: number } | null, p: number): { mask: number; sign: number } | null {
  if (!state || state.mask & (1 << p)) return null;
  let below = 0;
  for (let i = 0; i < p; i++) if (state.mask & (1 << i)) below++;
  return { mask: state.mask | (1 << p), sign: below % 2 ? -state.sign : state.sign };
}

/** The one-electron cubic field per unit Dq, typed in from its definition (octahedral sign). */
function fieldElement(m1: number, m2: number): number {
  if (m1 === m2) return { [-2]: 1, [-1]: -4, [0]: 6, [1]: -4, [2]: 1 }[m1]!;
  if (Math.abs(m1 - m2) === 4) return 5;
  return 0;
}

/** Spatial <m1 m2|1/r12|m3 m4> with F0 dropped, F2 = 49B + 7C, F4 = 63C/5. */
function coulomb(m1: number, m2: number, m3: number, m4: number, b: number, c: number): number {
  if (m1 + m2 !== m3 + m4) return 0;
  const f2 = 49 * b + 7 * c;
  const f4 = (63 * c) / 5;
  return (
    condonShortleyCk(2, 2, m1, 2, m3) * condonShortleyCk(2, 2, m4, 2, m2) * f2 +
    condonShortleyCk(4, 2, m1, 2, m3) * condonShortleyCk(4, 2, m4, 2, m2) * f4
  );
}

export function allDeterminants(n: number): number[] {
  const out: number[] = [];
  for (let mask = 0; mask < 1024; mask++) {
    let count = 0;
    for (let i = 0; i < 10; i++) if (mask & (1 << i)) count++;
    if (count === n) out.push(mask);
  }
  return out;
}

/** The dense Hamiltonian over all C(10, n) determinants (number[][]). */
export function denseHamiltonian(n: number, geometry: Geometry, { dq, b, c }: FieldParameters): number[][] {
  const fieldSign = geometry === 'octahedral' ? 1 : -1;
  const oneBody = Array.from({ length: 10 }, (_, p) =>
    Array.from({ length: 10 }, (_, q) => (up(p) === up(q) ? fieldSign * dq * fieldElement(ml(p), ml(q)) : 0)),
  );
  return denseOneAndTwoBody(n, oneBody, b, c);
}

/**
 * H = Σ h_pq a†p a_q + ½ Σ <pq|rs> a†p a†q a_s a_r over all C(10, n)
 * determinants, for a one-electron matrix h over the ten spin-orbitals
 * (real, cm-1) and the Coulomb repulsion at Racah B and C: the one loop both
 * slow references (cubic here, any field with ζ in dense-field-hamiltonian.ts)
 * build their matrices with.
 */
export function denseOneAndTwoBody(n: number, oneBody: readonly (readonly number[])[], b: number, c: number): number[][] {
  const dets = allDeterminants(n);
  const index = new Map(dets.map((m, i) => [m, i]));
  const size = dets.length;
  const h = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  dets.forEach((ket, col) => {
    const start = { mask: ket, sign: 1 };
    for (let p = 0; p < 10; p++)
      for (let q = 0; q < 10; q++) {
        const value = oneBody[p]![q]!;
        if (value === 0) continue;
        const out = create(annihilate(start, q), p);
        if (out) h[index.get(out.mask)!]![col]! += out.sign * value;
      }
    for (let r = 0; r < 10; r++)
      for (let s = 0; s < 10; s++) {
        const after = annihilate(annihilate(start, r), s);
        if (!after) continue;
        for (let p = 0; p < 10; p++)
          for (let q = 0; q < 10; q++) {
            if (up(p) !== up(r) || up(q) !== up(s)) continue;
            const value = 0.5 * coulomb(ml(p), ml(q), ml(r), ml(s), b, c);
            if (value === 0) continue;
            const out = create(create(after, q), p);
            if (out) h[index.get(out.mask)!]![col]! += out.sign * value;
          }
      }
  });
  return h;
}

/** S² over all determinants: S−S+ + Sz² + Sz with S+ = Σ_m a†(m up) a(m down). */
export function denseSpinSquared(n: number): number[][] {
  const dets = allDeterminants(n);
  const index = new Map(dets.map((m, i) => [m, i]));
  const size = dets.length;
  const raise = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  dets.forEach((ket, col) => {
    for (let m = 0; m < 5; m++) {
      const out = create(annihilate({ mask: ket, sign: 1 }, m + 5), m);
      if (out) raise[index.get(out.mask)!]![col]! += out.sign;
    }
  });
  const s2 = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  for (let i = 0; i < size; i++)
    for (let j = 0; j < size; j++) {
      let sum = 0;
      for (let k = 0; k < size; k++) sum += raise[k]![i]! * raise[k]![j]!;
      s2[i]![j] = sum;
    }
  dets.forEach((mask, i) => {
    let twoSz = 0;
    for (let p = 0; p < 10; p++) if (mask & (1 << p)) twoSz += up(p) ? 1 : -1;
    s2[i]![i]! += (twoSz / 2) ** 2 + twoSz / 2;
  });
  return s2;
}

export interface ReferenceState {
  /** cm-1 above the lowest eigenvalue. */
  energy: number;
  /** 2S from <S²>. */
  twoS: number;
}

/** Every eigenstate (C(10, n) of them) with its spin, ascending energy; also the absolute ground energy and trace. */
export function referenceSpectrum(n: number, geometry: Geometry, params: FieldParameters): {
  states: ReferenceState[];
  groundEnergy: number;
  trace: number;
} {
  const h = denseHamiltonian(n, geometry, params);
  const s2 = denseSpinSquared(n);
  const { values, vectors } = jacobiEigen(h);
  const size = values.length;
  const ground = Math.min(...values);
  const states = values.map((value, j) => {
    let expectation = 0;
    for (let a = 0; a < size; a++) {
      let row = 0;
      for (let b = 0; b < size; b++) row += s2[a]![b]! * vectors[b]![j]!;
      expectation += vectors[a]![j]! * row;
    }
    const twoS = Math.sqrt(1 + 4 * expectation) - 1;
    if (Math.abs(twoS - Math.round(twoS)) > 1e-6) throw new Error(`reference: eigenvector ${j} has no definite spin`);
    return { energy: value - ground, twoS: Math.abs(Math.round(twoS)) };
  });
  states.sort((x, y) => x.energy - y.energy);
  return { states, groundEnergy: ground, trace: h.reduce((sum, row, i) => sum + row[i]!, 0) };
}
