/**
 * Slater determinants of a d^n shell as 10-bit masks.
 *
 * Bit order: bit i (0 ≤ i < 5) is the spin-up (alpha) orbital with
 * m_l = i − 2; bit 5 + i is the spin-down (beta) orbital with m_l = i − 2.
 * So bit 0 = |−2 α>, bit 4 = |+2 α>, bit 5 = |−2 β>, bit 9 = |+2 β>.
 * Example: 0b0000010001 (bits 0 and 4) is |−2α, +2α>, M_L = 0, M_S = 1.
 *
 * Sign convention: the mask with occupied bits p1 < p2 < … < pn stands for
 * a†(p1) a†(p2) … a†(pn) |vacuum>, the leftmost creation operator carrying
 * the lowest bit. Moving an operator past k occupied orbitals gives (−1)^k,
 * so a†(p) a(q) on a mask has the sign (−1)^(occupied bits strictly between
 * p and q), counted after q is emptied (see excitationSign).
 */

/** Number of spin-orbitals of a d shell. */
export const SPIN_ORBITALS = 10;

/** m_l of a spin-orbital bit. */
export function bitMl(bit: number): number {
  return (bit % 5) - 2;
}

/** Index 0..4 of the spatial orbital (m_l + 2) of a spin-orbital bit. */
export function bitOrbital(bit: number): number {
  return bit % 5;
}

/** True for the spin-up half (bits 0..4). */
export function bitIsAlpha(bit: number): boolean {
  return bit < 5;
}

/** Number of set bits of a mask. */
export function maskPopcount(mask: number): number {
  let m = mask;
  let count = 0;
  while (m) {
    m &= m - 1;
    count++;
  }
  return count;
}

/** 2·M_S of a determinant: (alpha count − beta count). */
export function maskTwoMs(mask: number): number {
  return maskPopcount(mask & 0b11111) - maskPopcount(mask >> 5);
}

/** M_L of a determinant: the sum of m_l over occupied spin-orbitals. */
export function maskMl(mask: number): number {
  let ml = 0;
  for (let bit = 0; bit < SPIN_ORBITALS; bit++) if (mask & (1 << bit)) ml += bitMl(bit);
  return ml;
}

/** The C4 (about z) label k = M_L mod 4, in 0..3. */
export function maskC4Label(mask: number): number {
  return ((maskMl(mask) % 4) + 4) % 4;
}

/** All C(10, n) determinant masks with n electrons, ascending. */
export function dShellMasks(n: number): number[] {
  const masks: number[] = [];
  for (let mask = 0; mask < 1 << SPIN_ORBITALS; mask++) if (maskPopcount(mask) === n) masks.push(mask);
  return masks;
}

/** Occupied bits of a mask, ascending. */
export function maskBits(mask: number): number[] {
  const bits: number[] = [];
  for (let bit = 0; bit < SPIN_ORBITALS; bit++) if (mask & (1 << bit)) bits.push(bit);
  return bits;
}

/** (−1)^(number of occupied bits of mask strictly below bit). */
export function signBelow(mask: number, bit: number): number {
  return maskPopcount(mask & ((1 << bit) - 1)) % 2 === 0 ? 1 : -1;
}

/**
 * Sign of a†(p) a(q) acting on mask (q occupied; p empty after q is removed,
 * or p = q). Returns 0 when the operator gives zero.
 */
export function excitationSign(mask: number, p: number, q: number): number {
  if (!(mask & (1 << q))) return 0;
  const removed = mask & ~(1 << q);
  if (removed & (1 << p)) return 0;
  return signBelow(mask, q) * signBelow(removed, p);
}
