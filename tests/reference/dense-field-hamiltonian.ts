import { denseOneAndTwoBody } from './dense-hamiltonian.js';
import { jacobiEigen } from './jacobi-eigen.js';

/**
 * The slow, obviously correct reference for the tetragonal field and
 * spin–orbit coupling: the full C(10, n) determinant Hamiltonian built from
 * second-quantised operators, diagonalised by plain Jacobi.
 *
 * Written without the engine's operator matrices: the one-electron field is
 * typed in as the five real-orbital energies of the convention
 *   z² = 6Dq − 2Ds − 6Dt, x²−y² = 6Dq + 2Ds − Dt, xy = −4Dq + 2Ds − Dt,
 *   xz = yz = −4Dq − Ds + 4Dt   (octahedral; the tetrahedral field is
 *   e = −6Dq, t2 = +4Dq, with Ds = Dt = 0)
 * and turned into the complex m_l basis with the real-orbital definitions
 * (Condon–Shortley): z² = Y0, xz = (Y−1 − Y1)/√2, yz = i(Y−1 + Y1)/√2,
 * x²−y² = (Y2 + Y−2)/√2, xy = −i(Y2 − Y−2)/√2. Spin–orbit is ζ(lx sx +
 * ly sy + lz sz) from the angular-momentum matrices (ħ = 1), complex
 * arithmetic throughout; the result must come out real (checked).
 */

type C = [number, number];
const cadd = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
const cmul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const conj = (a: C): C => [a[0], -a[1]];

const R = Math.SQRT1_2;
/** Real orbitals (z², xz, yz, x²−y², xy) as coefficient vectors over m = −2..2 (index m + 2). */
const REAL_ORBITALS: C[][] = [
  [[0, 0], [0, 0], [1, 0], [0, 0], [0, 0]],
  [[0, 0], [R, 0], [0, 0], [-R, 0], [0, 0]],
  [[0, 0], [0, R], [0, 0], [0, R], [0, 0]],
  [[R, 0], [0, 0], [0, 0], [0, 0], [R, 0]],
  [[0, R], [0, 0], [0, 0], [0, 0], [0, -R]],
];

export interface ReferenceFieldParameters {
  dq: number;
  ds: number;
  dt: number;
  b: number;
  c: number;
  zeta: number;
}

/** Spatial one-electron matrix <m|V|m'> = Σ_real E_r <m|r><r|m'>. */
function spatialField(geometry: 'octahedral' | 'tetrahedral', { dq, ds, dt }: ReferenceFieldParameters): C[][] {
  const energies =
    geometry === 'octahedral'
      ? [6 * dq - 2 * ds - 6 * dt, -4 * dq - ds + 4 * dt, -4 * dq - ds + 4 * dt, 6 * dq + 2 * ds - dt, -4 * dq + 2 * ds - dt]
      : [-6 * dq, 4 * dq, 4 * dq, -6 * dq, 4 * dq];
  const v: C[][] = Array.from({ length: 5 }, () => Array.from({ length: 5 }, (): C => [0, 0]));
  REAL_ORBITALS.forEach((orbital, r) => {
    for (let a = 0; a < 5; a++)
      for (let b = 0; b < 5; b++) v[a]![b] = cadd(v[a]![b]!, cmul([energies[r]!, 0], cmul(orbital[a]!, conj(orbital[b]!))));
  });
  return v;
}

/** l·s on spin-orbitals (p < 5: m = p − 2, spin up; else m = p − 7, spin down). */
function spinOrbit(): C[][] {
  const lz = (m: number): number => m;
  const lPlus = (m: number): number => Math.sqrt(6 - m * (m + 1)); // <m+1|l+|m>
  const out: C[][] = Array.from({ length: 10 }, () => Array.from({ length: 10 }, (): C => [0, 0]));
  const spin = (p: number): number => (p < 5 ? 0.5 : -0.5);
  const m = (p: number): number => (p % 5) - 2;
  for (let p = 0; p < 10; p++)
    for (let q = 0; q < 10; q++) {
      // lx = (l+ + l−)/2, ly = (l+ − l−)/(2i); same for s. Matrix elements <p|·|q>.
      const lp = m(p) === m(q) + 1 ? lPlus(m(q)) : 0;
      const lm = m(p) === m(q) - 1 ? lPlus(m(p)) : 0;
      const sp = spin(p) === spin(q) + 1 ? 1 : 0;
      const sm = spin(p) === spin(q) - 1 ? 1 : 0;
      const lSame = m(p) === m(q);
      const sSame = spin(p) === spin(q);
      const lx: C = [(lp + lm) / 2, 0];
      const ly: C = [0, -(lp - lm) / 2];
      const lzv: C = [lSame ? lz(m(q)) : 0, 0];
      // The spin factors vanish unless the spins relate as the operator needs; lx etc. vanish likewise for m.
      const sx: C = [(sp + sm) / 2, 0];
      const sy: C = [0, -(sp - sm) / 2];
      const szv: C = [sSame ? spin(q) : 0, 0];
      // <p|l_i s_i|q> = <m_p|l_i|m_q><σ_p|s_i|σ_q>: lx, ly, lzv are the orbital factors, sx, sy, szv the spin ones.
      let sum: C = [0, 0];
      sum = cadd(sum, cmul(lx, sx));
      sum = cadd(sum, cmul(ly, sy));
      sum = cadd(sum, cmul(lzv, szv));
      out[p]![q] = sum;
    }
  return out;
}

/** The dense Hamiltonian (real; throws if an imaginary part survives). */
export function denseFieldHamiltonian(n: number, geometry: 'octahedral' | 'tetrahedral', params: ReferenceFieldParameters): number[][] {
  const field = spatialField(geometry, params);
  const so = spinOrbit();
  const oneBody: number[][] = Array.from({ length: 10 }, () => new Array<number>(10).fill(0));
  for (let p = 0; p < 10; p++)
    for (let q = 0; q < 10; q++) {
      let value: C = [params.zeta * so[p]![q]![0], params.zeta * so[p]![q]![1]];
      if ((p < 5) === (q < 5)) value = cadd(value, field[p % 5]![q % 5]!);
      if (Math.abs(value[1]) > 1e-12) throw new Error('reference: complex one-electron element');
      oneBody[p]![q] = value[0];
    }
  return denseOneAndTwoBody(n, oneBody, params.b, params.c);
}

/** All C(10, n) eigenvalues, ascending, from the lowest. */
export function referenceFieldEnergies(n: number, geometry: 'octahedral' | 'tetrahedral', params: ReferenceFieldParameters): number[] {
  const { values } = jacobiEigen(denseFieldHamiltonian(n, geometry, params));
  values.sort((x, y) => x - y);
  return values.map((v) => v - values[0]!);
}
