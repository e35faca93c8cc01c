import { allDeterminants, annihilate, create } from './dense-hamiltonian.js';

/**
 * The slow reference for the Trees operator: L² over all C(10, n)
 * determinants as L−L+ + Lz² + Lz (the textbook identity), with
 * L+ = Σ_{m,σ} √(l(l+1) − m(m+1)) a†(m+1, σ) a(m, σ) and Lz = Σ m·n(m, σ),
 * applied with the second-quantised helpers of dense-hamiltonian.ts (its
 * spin-orbital convention: m_l = p % 5 − 2, spin up for p < 5). Nothing here
 * shares code with src/ligand-field/trees-correction.ts, which builds L²
 * from one- and two-electron integrals instead.
 */
export function denseOrbitalAngularSquared(n: number): number[][] {
  const dets = allDeterminants(n);
  const index = new Map(dets.map((m, i) => [m, i]));
  const size = dets.length;
  const raise = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  const lz = new Array<number>(size).fill(0);
  dets.forEach((ket, col) => {
    for (let p = 0; p < 10; p++) if (ket & (1 << p)) lz[col] = lz[col]! + (p % 5) - 2;
    for (let p = 0; p < 10; p++) {
      const m = (p % 5) - 2;
      if (m === 2) continue;
      const out = create(annihilate({ mask: ket, sign: 1 }, p), p + 1);
      if (out) raise[index.get(out.mask)!]![col]! += out.sign * Math.sqrt(6 - m * (m + 1));
    }
  });
  // L−L+ = (L+)ᵀ L+ (L+ is real).
  const l2 = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  for (let i = 0; i < size; i++)
    for (let j = 0; j < size; j++) {
      let sum = 0;
      for (let k = 0; k < size; k++) sum += raise[k]![i]! * raise[k]![j]!;
      l2[i]![j] = sum;
    }
  for (let i = 0; i < size; i++) l2[i]![i]! += lz[i]! ** 2 + lz[i]!;
  return l2;
}
