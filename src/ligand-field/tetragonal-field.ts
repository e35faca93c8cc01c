import { realFieldInMlBasis, tetragonalOrbitalField } from './orbital-field.js';

/**
 * The tetragonal (D4h) one-electron field of a d shell, per unit Ds and per
 * unit Dt, in the |m_l = −2..2> basis (index m_l + 2), Condon–Shortley
 * phases, z the fourfold axis.
 *
 * Convention (fieldgap's, fixed): with the cubic field of cubic-field.ts the
 * one-electron energies are
 *   a1g (z²)      =  6Dq − 2Ds − 6Dt
 *   b1g (x²−y²)   =  6Dq + 2Ds −  Dt
 *   b2g (xy)      = −4Dq + 2Ds −  Dt
 *   eg  (xz, yz)  = −4Dq −  Ds + 4Dt
 * so positive Ds and Dt describe an octahedron elongated along z, and square
 * planar is the limit of large positive Ds and Dt. Both operators are
 * diagonal in m_l (they are the Y20 and Y40 parts of the field: d_z² is
 * m_l = 0, d_xz and d_yz are m_l = ±1, d_x²−y² and d_xy are m_l = ±2), and
 * traceless, so the centre of gravity of the five orbitals stays at zero:
 *   Ds: m_l = 0 → −2, ±1 → −1, ±2 → +2;
 *   Dt: m_l = 0 → −6, ±1 → +4, ±2 → −1.
 * The operators are made from the one-electron field matrix of
 * orbital-field.ts (tetragonalOrbitalField), the single definition of the
 * field; a field from ligand positions (angular-overlap.ts) is another
 * producer of that matrix.
 */

/** Ds operator per unit Ds: 5×5 row-major Float64Array (a new copy each call), from the tetragonal OrbitalField. */
export function dsOrbitalMatrix(): Float64Array {
  return realFieldInMlBasis(tetragonalOrbitalField(0, 1, 0));
}

/** Dt operator per unit Dt: 5×5 row-major Float64Array (a new copy each call), from the tetragonal OrbitalField. */
export function dtOrbitalMatrix(): Float64Array {
  return realFieldInMlBasis(tetragonalOrbitalField(0, 0, 1));
}

/** One-electron energies (cm-1) of the D4h orbitals in the convention above. */
export function tetragonalOrbitalEnergies(dq: number, ds: number, dt: number): { a1g: number; b1g: number; b2g: number; eg: number } {
  return {
    a1g: 6 * dq - 2 * ds - 6 * dt,
    b1g: 6 * dq + 2 * ds - dt,
    b2g: -4 * dq + 2 * ds - dt,
    eg: -4 * dq - ds + 4 * dt,
  };
}
