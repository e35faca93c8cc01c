import { excitationSign } from './determinants.js';
import { symmetricEigen } from './eigen-symmetric.js';

/**
 * Highest-weight subspaces: the states of a block (fixed M_S, and M_L or
 * M_L mod 4) that raising operators annihilate. In the block M_S = S the
 * kernel of S+ holds exactly the spin-S states (an S′ > S multiplet has a
 * component there too, but S+ does not kill it), so the eigenvalues of H on
 * that kernel are the spectrum of block M_S = S less that of M_S = S + 1,
 * the spin-S levels, without the subtraction. Adding L+ (free ion) leaves
 * one state per (2S+1)L term.
 */

/** A one-body operator Σ coef·a†p a_q as a list of (p, q, coef) over spin-orbital bits. */
export type OneBodyTerms = ReadonlyArray<readonly [number, number, number]>;

/** S+ = Σ_m a†(m, up) a(m, down). */
export const SPIN_RAISING: OneBodyTerms = [0, 1, 2, 3, 4].map((i) => [i, i + 5, 1] as const);

/** L+ = Σ_m √(l(l+1) − m(m+1)) a†(m+1) a(m), both spins, l = 2, Condon–Shortley phase. */
export const ORBITAL_RAISING: OneBodyTerms = [0, 1, 2, 3].flatMap((i) => {
  const m = i - 2;
  const coef = Math.sqrt(6 - m * (m + 1));
  return [[i + 1, i, coef] as const, [i + 6, i + 5, coef] as const];
});

/** Rows × cols matrix <row| Σ coef a†p a_q |col> between two lists of determinant masks. */
export function oneBodyTransitionMatrix(rowMasks: readonly number[], colMasks: readonly number[], terms: OneBodyTerms): Float64Array {
  const rows = new Map(rowMasks.map((mask, i) => [mask, i]));
  const out = new Float64Array(rowMasks.length * colMasks.length);
  colMasks.forEach((ket, col) => {
    for (const [p, q, coef] of terms) {
      const sign = excitationSign(ket, p, q);
      if (sign === 0) continue;
      const row = rows.get((ket & ~(1 << q)) | (1 << p));
      if (row !== undefined) out[row * colMasks.length + col] = out[row * colMasks.length + col]! + sign * coef;
    }
  });
  return out;
}

/** AᵀA for a rows × cols matrix A (row-major): cols × cols. */
export function gramMatrix(a: Float64Array, rows: number, cols: number): Float64Array {
  const out = new Float64Array(cols * cols);
  for (let r = 0; r < rows; r++)
    for (let i = 0; i < cols; i++) {
      const ai = a[r * cols + i]!;
      if (ai === 0) continue;
      for (let j = 0; j < cols; j++) out[i * cols + j] = out[i * cols + j]! + ai * a[r * cols + j]!;
    }
  return out;
}

/**
 * Orthonormal basis (n × m, column-major in the sense: element [i·m + j] is
 * component i of basis vector j) of the null space of a positive
 * semi-definite n×n matrix whose nonzero eigenvalues are ≥ 1 (true for
 * S−S+ and L−L+, whose eigenvalues are integers).
 */
export function nullSpaceBasis(q: Float64Array, n: number): { basis: Float64Array; dimension: number } {
  const { values, vectors } = symmetricEigen(q, n);
  const keep: number[] = [];
  for (let j = 0; j < n; j++) if (values[j]! < 0.5) keep.push(j);
  const m = keep.length;
  const basis = new Float64Array(n * m);
  keep.forEach((j, c) => {
    for (let i = 0; i < n; i++) basis[i * m + c] = vectors[i * n + j]!;
  });
  return { basis, dimension: m };
}

/** Uᵀ A U for an n×n A and an n×m U: m×m. */
export function projectMatrix(a: Float64Array, u: Float64Array, n: number, m: number): Float64Array {
  const au = new Float64Array(n * m);
  for (let i = 0; i < n; i++)
    for (let k = 0; k < n; k++) {
      const aik = a[i * n + k]!;
      if (aik === 0) continue;
      for (let j = 0; j < m; j++) au[i * m + j] = au[i * m + j]! + aik * u[k * m + j]!;
    }
  const out = new Float64Array(m * m);
  for (let i = 0; i < n; i++)
    for (let r = 0; r < m; r++) {
      const uir = u[i * m + r]!;
      if (uir === 0) continue;
      for (let c = 0; c < m; c++) out[r * m + c] = out[r * m + c]! + uir * au[i * m + c]!;
    }
  // Symmetrise away round-off so the eigen-solver sees an exactly symmetric matrix.
  for (let r = 0; r < m; r++)
    for (let c = r + 1; c < m; c++) {
      const mean = 0.5 * (out[r * m + c]! + out[c * m + r]!);
      out[r * m + c] = mean;
      out[c * m + r] = mean;
    }
  return out;
}
