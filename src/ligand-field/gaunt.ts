import { wigner3j } from './wigner3j.js';

/**
 * The Condon–Shortley coefficient c^k(l m, l' m') = (4π/(2k+1))^½ ∫ Y*_lm Y_k,m−m' Y_l'm' dΩ,
 * written with 3j symbols:
 *   c^k(l m, l' m') = (−1)^m √((2l+1)(2l'+1)) (l k l'; 0 0 0) (l k l'; −m m−m' m').
 * Spherical harmonics carry the Condon–Shortley phase. Symmetry:
 * c^k(l' m', l m) = (−1)^(m−m') c^k(l m, l' m').
 */
export function condonShortleyCk(k: number, l: number, m: number, lPrime: number, mPrime: number): number {
  const phase = Math.abs(m) % 2 === 0 ? 1 : -1;
  return (
    phase *
    Math.sqrt((2 * l + 1) * (2 * lPrime + 1)) *
    wigner3j(l, k, lPrime, 0, 0, 0) *
    wigner3j(l, k, lPrime, -m, m - mPrime, mPrime)
  );
}
