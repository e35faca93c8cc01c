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
 * Returns a 5×5 row-major Float64Array. Other one-electron terms (a tetragonal
 * Ds, Dt, say) would be further operators of the same shape, each with its
 * own parameter: the many-electron Hamiltonian is Σ parameter × operator.
 */
export function cubicFieldOrbitalMatrix(geometry: Geometry): Float64Array {
  const sign = geometry === 'octahedral' ? 1 : -1;
  const v = new Float64Array(25);
  const set = (mRow: number, mCol: number, value: number): void => {
    v[(mRow + 2) * 5 + (mCol + 2)] = sign * value;
  };
  set(2, 2, 1);
  set(-2, -2, 1);
  set(1, 1, -4);
  set(-1, -1, -4);
  set(0, 0, 6);
  set(2, -2, 5);
  set(-2, 2, 5);
  return v;
}
