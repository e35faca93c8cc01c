import { condonShortleyCk } from './gaunt.js';

/**
 * Two-electron repulsion integrals of a d shell, split by Racah parameter.
 *
 * <a b | 1/r12 | c d> (electron 1 in a → c, electron 2 in b → d; a..d are
 * spatial orbitals m_l + 2 in 0..4) is
 *   δ(m_a + m_b, m_c + m_d) Σ_k c^k(2 m_a, 2 m_c) c^k(2 m_d, 2 m_b) F^k,  k = 0, 2, 4.
 * F^0 is dropped: it shifts every level of a d^n configuration by the same
 * amount, and fieldgap measures energies from the ground level. With
 * F^2 = 49B + 7C and F^4 = 63C/5 (Racah; in Condon–Shortley reduced form
 * F2 = F^2/49, F4 = F^4/441) each integral is coefB·B + coefC·C.
 *
 * Index of <a b|c d> in the returned arrays: ((a·5 + b)·5 + c)·5 + d.
 */
export interface RepulsionIntegrals {
  /** Coefficient of Racah B, per integral (625 entries). */
  coefB: Float64Array;
  /** Coefficient of Racah C, per integral (625 entries). */
  coefC: Float64Array;
}

/** Flat index of <a b|c d>. */
export function integralIndex(a: number, b: number, c: number, d: number): number {
  return ((a * 5 + b) * 5 + c) * 5 + d;
}

let cached: RepulsionIntegrals | undefined;

/** The d-shell repulsion integrals in units of B and C (computed once). */
export function dShellRepulsionIntegrals(): RepulsionIntegrals {
  if (cached) return cached;
  const coefB = new Float64Array(625);
  const coefC = new Float64Array(625);
  for (let a = 0; a < 5; a++)
    for (let b = 0; b < 5; b++)
      for (let c = 0; c < 5; c++)
        for (let d = 0; d < 5; d++) {
          if (a + b !== c + d) continue;
          const [ma, mb, mc, md] = [a - 2, b - 2, c - 2, d - 2];
          const k2 = condonShortleyCk(2, 2, ma, 2, mc) * condonShortleyCk(2, 2, md, 2, mb);
          const k4 = condonShortleyCk(4, 2, ma, 2, mc) * condonShortleyCk(4, 2, md, 2, mb);
          const index = integralIndex(a, b, c, d);
          coefB[index] = 49 * k2;
          coefC[index] = 7 * k2 + (63 / 5) * k4;
        }
  cached = { coefB, coefC };
  return cached;
}
