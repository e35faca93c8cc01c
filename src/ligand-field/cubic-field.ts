import { cubicOrbitalField, realFieldInMlBasis } from './orbital-field.js';
import type { Geometry } from './types.js';

/**
 * The cubic crystal-field operator of one d electron, per unit Dq, in the
 * |m_l = −2..2> basis (index m_l + 2), Condon–Shortley phases, fourfold axes
 * along x, y, z:
 *   octahedral: <±2|V|±2> = 1, <±1|V|±1> = −4, <0|V|0> = 6, <2|V|−2> = <−2|V|2> = 5;
 * eigenvalues +6 (e_g: d_z², d_x²−y²) twice and −4 (t2g: d_xy, d_xz, d_yz)
 * three times, so 10Dq = E(e_g) − E(t2g).
 * Tetrahedral: the same operator with the opposite sign (e = −6Dq, t2 = +4Dq,
 * 10Dq = E(t2) − E(e)), Dq being the tetrahedral field's own Dq.
 *
 * Returns a 5×5 row-major Float64Array: realFieldInMlBasis of the cubic
 * OrbitalField at Dq = 1. Other one-electron terms (the tetragonal Ds, Dt)
 * are further operators of the same shape, each with its own parameter: the
 * many-electron Hamiltonian is Σ parameter × operator.
 */
export function cubicFieldOrbitalMatrix(geometry: Geometry): Float64Array {
  // The engine's field operator comes from the one-electron field matrix
  // (orbital-field.ts), the single place a field is defined; the table above
  // is what it gives, and tests/ligand-field/orbital-field.test.ts holds it to that.
  return realFieldInMlBasis(cubicOrbitalField(1, geometry));
}
