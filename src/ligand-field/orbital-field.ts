import { invalidArgument } from '../errors.js';
import type { Geometry } from './types.js';

/**
 * The one-electron field of a d shell as one matrix: the single input of the
 * field part of the many-electron engine, whatever model made it.
 *
 * An OrbitalField is a real symmetric 5×5 matrix (row-major Float64Array,
 * cm-1) over the real d orbitals in the order of REAL_D_ORBITALS:
 *   0 z², 1 xz, 2 yz, 3 x²−y², 4 xy,
 * with the Condon–Shortley relation to |m_l> (realOrbitalInMl below).
 * Its trace is free (a ligand-position model shifts all five orbitals; only
 * differences reach the spectrum, and fieldgap measures from the ground).
 *
 * Producers: cubicOrbitalField (Dq, Oh or Td), tetragonalOrbitalField
 * (Dq, Ds, Dt in the convention of tetragonal-field.ts), and
 * angular-overlap.ts (e_σ, e_π per ligand from ligand directions). The block
 * engine (blocks.ts, tetragonal-blocks.ts, double-group-blocks.ts) takes its
 * per-parameter operators from the first two through fieldInMlBasis; a field
 * of lower symmetry goes to the general engine of general-field-levels.ts.
 */
export type OrbitalField = Float64Array;

export const REAL_D_ORBITALS = ['z2', 'xz', 'yz', 'x2-y2', 'xy'] as const;

/** A complex 5×5 matrix as two real row-major parts. */
export interface ComplexMatrix5 {
  re: Float64Array;
  im: Float64Array;
}

const H = Math.SQRT1_2;

/**
 * Columns: each real orbital as a combination of |m_l = −2..2> (row index
 * m_l + 2), Condon–Shortley phases (Y_l,−m = (−1)^m Y_lm*):
 *   z² = |0>;  xz = (|−1> − |1>)/√2;  yz = i(|−1> + |1>)/√2;
 *   x²−y² = (|−2> + |2>)/√2;  xy = i(|−2> − |2>)/√2.
 */
export function realOrbitalInMl(): ComplexMatrix5 {
  const re = new Float64Array(25);
  const im = new Float64Array(25);
  const put = (ml: number, real: number, valueRe: number, valueIm: number): void => {
    re[(ml + 2) * 5 + real] = valueRe;
    im[(ml + 2) * 5 + real] = valueIm;
  };
  put(0, 0, 1, 0);
  put(-1, 1, H, 0);
  put(1, 1, -H, 0);
  put(-1, 2, 0, H);
  put(1, 2, 0, H);
  put(-2, 3, H, 0);
  put(2, 3, H, 0);
  put(-2, 4, 0, H);
  put(2, 4, 0, -H);
  return { re, im };
}

/**
 * U·F·U† for F real symmetric and U = realOrbitalInMl(): the field in the
 * |m_l> basis (Hermitian). Each element is Σ_kl U[i][k]·F[k][l]·U*[j][l];
 * the entries of U are 1 or ±1/√2 (times 1 or i), so each product of two is
 * formed as ±1, ±1/√2 or ±½ exactly, and a field with dyadic entries (the
 * cubic and tetragonal ones) comes out exact, with no round-off from √2·√2.
 */
export function fieldInMlBasis(field: OrbitalField): ComplexMatrix5 {
  const { re: ur, im: ui } = realOrbitalInMl();
  // Entry (m, k) of U as (unit phase, power of 1/√2): |U| is 1 (z² on m = 0) or 1/√2.
  const phaseRe = new Float64Array(25);
  const phaseIm = new Float64Array(25);
  const halfPower = new Int8Array(25);
  for (let i = 0; i < 25; i++) {
    if (ur[i] === 0 && ui[i] === 0) continue;
    const root = Math.abs(ur[i]!) === 1 || Math.abs(ui[i]!) === 1 ? 0 : 1;
    halfPower[i] = root;
    phaseRe[i] = Math.sign(ur[i]!);
    phaseIm[i] = Math.sign(ui[i]!);
  }
  const magnitude = [1, Math.SQRT1_2, 0.5];
  const re = new Float64Array(25);
  const im = new Float64Array(25);
  for (let i = 0; i < 5; i++)
    for (let j = 0; j < 5; j++) {
      let r = 0;
      let m = 0;
      for (let k = 0; k < 5; k++) {
        const a = i * 5 + k;
        if (phaseRe[a] === 0 && phaseIm[a] === 0) continue;
        for (let l = 0; l < 5; l++) {
          const b = j * 5 + l;
          const f = field[k * 5 + l]!;
          if (f === 0 || (phaseRe[b] === 0 && phaseIm[b] === 0)) continue;
          // U[i][k]·conj(U[j][l]) = (pr + i·pi)(qr − i·qi)·magnitude.
          const scale = f * magnitude[halfPower[a]! + halfPower[b]!]!;
          r += scale * (phaseRe[a]! * phaseRe[b]! + phaseIm[a]! * phaseIm[b]!);
          m += scale * (phaseIm[a]! * phaseRe[b]! - phaseRe[a]! * phaseIm[b]!);
        }
      }
      re[i * 5 + j] = r;
      im[i * 5 + j] = m;
    }
  return { re, im };
}

/**
 * The field in the |m_l> basis when it is real there (every field whose
 * symmetry group holds C2 about x, as the cubic and tetragonal ones: then
 * the block engine, which is real, applies). Refuses a field with an
 * imaginary part above 1e-12 of its largest element, naming the element.
 */
export function realFieldInMlBasis(field: OrbitalField): Float64Array {
  const { re, im } = fieldInMlBasis(field);
  const scale = Math.max(1, ...Array.from(field, Math.abs));
  for (let i = 0; i < 25; i++) {
    if (Math.abs(im[i]!) > 1e-12 * scale) {
      throw invalidArgument('field', `the field has an imaginary |m_l> element (${Math.floor(i / 5) - 2}, ${(i % 5) - 2}): the symmetry-blocked engine needs a field real in |m_l>; use the general engine`);
    }
    im[i] = 0;
  }
  return re;
}

function diagonal(values: readonly number[]): OrbitalField {
  const f = new Float64Array(25);
  values.forEach((v, i) => (f[i * 6] = v));
  return f;
}

/**
 * The cubic field at Dq (cm-1): octahedral e_g (z², x²−y²) at +6Dq and t2g
 * (xz, yz, xy) at −4Dq; tetrahedral the same with the opposite sign (e at
 * −6Dq, t2 at +4Dq, Dq the tetrahedral field's own). Barycentred.
 */
export function cubicOrbitalField(dq: number, geometry: Geometry): OrbitalField {
  const s = geometry === 'octahedral' ? dq : -dq;
  return diagonal([6 * s, -4 * s, -4 * s, 6 * s, -4 * s]);
}

/**
 * The tetragonal (D4h, z the fourfold axis) field at Dq, Ds, Dt (cm-1) in
 * the convention of tetragonal-field.ts: a1g(z²) = 6Dq − 2Ds − 6Dt,
 * eg(xz, yz) = −4Dq − Ds + 4Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt,
 * b2g(xy) = −4Dq + 2Ds − Dt. Barycentred.
 */
export function tetragonalOrbitalField(dq: number, ds: number, dt: number): OrbitalField {
  const eg = -4 * dq - ds + 4 * dt;
  return diagonal([6 * dq - 2 * ds - 6 * dt, eg, eg, 6 * dq + 2 * ds - dt, -4 * dq + 2 * ds - dt]);
}
