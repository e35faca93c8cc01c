import { excitationSign, maskPopcount, SPIN_ORBITALS } from './determinants.js';

/**
 * Spin–orbit coupling Σ_i ζ l_i·s_i of a d shell, and other one-electron
 * operators that act on spin, between determinants (bit order and signs as in
 * determinants.ts).
 *
 * Real form. In the Condon–Shortley |m_l, m_s> basis,
 *   l·s = l_z s_z + ½(l+ s− + l− s+)
 * has only real matrix elements: <m, α|l·s|m, α> = m/2, <m, β|l·s|m, β> = −m/2,
 * <m+1, β|l·s|m, α> = ½·√(l(l+1) − m(m+1)) (l = 2). The cubic and
 * tetragonal fields are real in this basis too, so the whole d^n Hamiltonian
 * with spin–orbit coupling is a real symmetric matrix over the determinants:
 * no complex Hermitian problem (and no 2N real embedding) is needed.
 * M_J = M_L + M_S is changed by the cubic field in steps of 4 only, so the
 * matrix falls into blocks of 2M_J mod 8 (see double-group-blocks.ts).
 */

/** l·s per unit ζ on the 10 spin-orbitals (bit order of determinants.ts), row-major 10×10. */
export function spinOrbitSpinOrbitalMatrix(): Float64Array {
  const h = new Float64Array(SPIN_ORBITALS * SPIN_ORBITALS);
  for (let i = 0; i < 5; i++) {
    const m = i - 2;
    h[i * 10 + i] = m / 2; // alpha
    h[(i + 5) * 10 + (i + 5)] = -m / 2; // beta
    if (m < 2) {
      // <m+1, β| l·s |m, α> and its transpose
      const value = 0.5 * Math.sqrt(6 - m * (m + 1));
      const alpha = i;
      const beta = i + 1 + 5;
      h[beta * 10 + alpha] = value;
      h[alpha * 10 + beta] = value;
    }
  }
  return h;
}

/** Spatial 5×5 operator (index m_l + 2) as a 10×10 spin-orbital operator, the same on both spins. */
export function spinFreeSpinOrbitalMatrix(h5: Float64Array): Float64Array {
  const h = new Float64Array(100);
  for (let i = 0; i < 5; i++)
    for (let j = 0; j < 5; j++) {
      const value = h5[i * 5 + j]!;
      h[i * 10 + j] = value;
      h[(i + 5) * 10 + (j + 5)] = value;
    }
  return h;
}

function lowestBit(mask: number): number {
  return 31 - Math.clz32(mask & -mask);
}

/**
 * A one-electron operator h on spin-orbitals (10×10, row-major, real) between
 * determinants: diagonal Σ h_pp over occupied p; one spin-orbital q → p:
 * sign(a†p a_q)·h_pq; zero otherwise. rows and cols may be different lists.
 * Returns rows.length × cols.length, row-major.
 */
export function spinOrbitalOneBodyMatrix(rows: readonly number[], cols: readonly number[], h: Float64Array): Float64Array {
  const out = new Float64Array(rows.length * cols.length);
  for (let r = 0; r < rows.length; r++) {
    const bra = rows[r]!;
    for (let c = 0; c < cols.length; c++) {
      const ket = cols[c]!;
      const diff = bra ^ ket;
      if (diff === 0) {
        let sum = 0;
        for (let bit = 0; bit < SPIN_ORBITALS; bit++) if (ket & (1 << bit)) sum += h[bit * 11]!;
        out[r * cols.length + c] = sum;
      } else if (maskPopcount(diff) === 2) {
        const p = lowestBit(diff & bra);
        const q = lowestBit(diff & ket);
        out[r * cols.length + c] = excitationSign(ket, p, q) * h[p * 10 + q]!;
      }
    }
  }
  return out;
}

/**
 * C2 about x on determinants, spin included, for an even number of electrons
 * (where it is a real signed permutation). One electron: the d orbitals go
 * m → −m with no phase (Y_2m(C2x⁻¹ r) = Y_2,−m(r), Condon–Shortley), and the
 * spin by e^(−iπ s_x) = −iσ_x: α → −iβ, β → −iα. The product of the n
 * factors −i is (−1)^(n/2); the reordering of creation operators gives the
 * rest of the sign. Returns masks.length² row-major; masks must be closed
 * under the map (a set with M_J ↔ −M_J).
 */
export function c2xWithSpinMatrix(masks: readonly number[]): Float64Array {
  const n = masks.length;
  const index = new Map(masks.map((m, i) => [m, i]));
  const out = new Float64Array(n * n);
  for (let col = 0; col < n; col++) {
    const mask = masks[col]!;
    const electrons = maskPopcount(mask);
    if (electrons % 2 !== 0) throw new RangeError('c2xWithSpinMatrix: odd electron count');
    // Apply the image creation operators left to right: a†(f(p1)) a†(f(p2)) … |0>.
    const images: number[] = [];
    for (let bit = 0; bit < SPIN_ORBITALS; bit++) {
      if (!(mask & (1 << bit))) continue;
      const orbital = bit % 5;
      const alpha = bit < 5;
      images.push((4 - orbital) + (alpha ? 5 : 0));
    }
    // Sign of sorting images ascending (each transposition of two creators gives −1).
    let inversions = 0;
    let target = 0;
    for (let i = 0; i < images.length; i++) {
      target |= 1 << images[i]!;
      for (let j = i + 1; j < images.length; j++) if (images[i]! > images[j]!) inversions++;
    }
    const sign = (inversions % 2 === 0 ? 1 : -1) * ((electrons / 2) % 2 === 0 ? 1 : -1);
    const row = index.get(target);
    if (row === undefined) throw new RangeError('c2xWithSpinMatrix: mask set not closed under C2(x)');
    out[row * n + col] = sign;
  }
  return out;
}
