import { bitOrbital } from './determinants.js';

/**
 * Rotations acting on d orbitals and on d^n determinants, used for the
 * characters of O.
 *
 * Orbital functions: ψ_m(r) = rᵀ Q_m r with the traceless symmetric (complex)
 * 3×3 matrices Q_{±2} = ½(x ± iy)², Q_{±1} = ∓ z(x ± iy), Q_0 = (2z² − x² − y²)/√6,
 * each of unit Frobenius norm, proportional to r²Y_2^m with the Condon–Shortley
 * phase (the convention of cubic-field.ts). A rotation acts on functions as
 * (O_R ψ)(r) = ψ(R⁻¹ r) = rᵀ (R Q Rᵀ) r, so O_R ψ_m = Σ_m' ψ_m' D_m'm with
 * D_m'm = Σ_ij conj(Q_m')_ij (R Q_m Rᵀ)_ij (Frobenius product: for harmonic
 * quadratics it is proportional to the overlap on the sphere).
 */
export interface ComplexMatrix {
  n: number;
  re: Float64Array;
  im: Float64Array;
}

/** Q_m for m = −2..2 (index m + 2): [re, im] 3×3 row-major. */
function orbitalQuadrics(): Array<[Float64Array, Float64Array]> {
  const q = (re: number[], im: number[]): [Float64Array, Float64Array] => [Float64Array.from(re), Float64Array.from(im)];
  const s6 = 1 / Math.sqrt(6);
  // (x + iy)² = x² − y² + 2i xy; z(x + iy) = xz + i yz (symmetric halves off the diagonal).
  return [
    q([0.5, 0, 0, 0, -0.5, 0, 0, 0, 0], [0, -0.5, 0, -0.5, 0, 0, 0, 0, 0]), // m = −2: ½(x − iy)²
    q([0, 0, 0.5, 0, 0, 0, 0.5, 0, 0], [0, 0, 0, 0, 0, -0.5, 0, -0.5, 0]), // m = −1: +z(x − iy)
    q([-s6, 0, 0, 0, -s6, 0, 0, 0, 2 * s6], [0, 0, 0, 0, 0, 0, 0, 0, 0]), // m = 0
    q([0, 0, -0.5, 0, 0, 0, -0.5, 0, 0], [0, 0, 0, 0, 0, -0.5, 0, -0.5, 0]), // m = +1: −z(x + iy)
    q([0.5, 0, 0, 0, -0.5, 0, 0, 0, 0], [0, 0.5, 0, 0.5, 0, 0, 0, 0, 0]), // m = +2: ½(x + iy)²
  ];
}

/** R M Rᵀ for a real 3×3 R and a real 3×3 M. */
function conjugateBy(r: readonly number[], m: Float64Array): Float64Array {
  const out = new Float64Array(9);
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++) {
      let sum = 0;
      for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) sum += r[i * 3 + a]! * m[a * 3 + b]! * r[j * 3 + b]!;
      out[i * 3 + j] = sum;
    }
  return out;
}

/** D^(2)(R) in the |m_l = −2..2> basis for a proper rotation R (3×3 row-major). */
export function dOrbitalRotation(rotation: readonly number[]): ComplexMatrix {
  const quadrics = orbitalQuadrics();
  const re = new Float64Array(25);
  const im = new Float64Array(25);
  for (let m = 0; m < 5; m++) {
    const [qr, qi] = quadrics[m]!;
    const rotRe = conjugateBy(rotation, qr);
    const rotIm = conjugateBy(rotation, qi);
    for (let mp = 0; mp < 5; mp++) {
      const [pr, pi] = quadrics[mp]!;
      let sumRe = 0;
      let sumIm = 0;
      // conj(p)·rot = (pr − i pi)(rotRe + i rotIm)
      for (let t = 0; t < 9; t++) {
        sumRe += pr[t]! * rotRe[t]! + pi[t]! * rotIm[t]!;
        sumIm += pr[t]! * rotIm[t]! - pi[t]! * rotRe[t]!;
      }
      re[mp * 5 + m] = sumRe;
      im[mp * 5 + m] = sumIm;
    }
  }
  return { n: 5, re, im };
}

/** Proper rotations of O used for characters (3×3 row-major, acting on column vectors). */
export const ROTATIONS = {
  /** C3 about [111]: x → y → z → x. */
  c3: [0, 0, 1, 1, 0, 0, 0, 1, 0],
  /** C2' about [110]. */
  c2prime: [0, 1, 0, 1, 0, 0, 0, 0, -1],
  /** C4 about z (counter-clockwise). */
  c4: [0, -1, 0, 1, 0, 0, 0, 0, 1],
  /** C2 about z. */
  c2: [-1, 0, 0, 0, -1, 0, 0, 0, 1],
  /** C2 about x (same class as C2 about z): the parity that splits blocks k = 0 and 2. */
  c2x: [1, 0, 0, 0, -1, 0, 0, 0, -1],
} as const;

/** Determinant of a small complex matrix (row-major), by Gaussian elimination with partial pivoting. */
export function complexDeterminant(n: number, reIn: Float64Array, imIn: Float64Array): [number, number] {
  const re = Float64Array.from(reIn);
  const im = Float64Array.from(imIn);
  let detRe = 1;
  let detIm = 0;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    let best = -1;
    for (let row = col; row < n; row++) {
      const size = Math.hypot(re[row * n + col]!, im[row * n + col]!);
      if (size > best) [best, pivot] = [size, row];
    }
    if (best === 0) return [0, 0];
    if (pivot !== col) {
      for (let j = 0; j < n; j++) {
        [re[col * n + j], re[pivot * n + j]] = [re[pivot * n + j]!, re[col * n + j]!];
        [im[col * n + j], im[pivot * n + j]] = [im[pivot * n + j]!, im[col * n + j]!];
      }
      detRe = -detRe;
      detIm = -detIm;
    }
    const pr = re[col * n + col]!;
    const pi = im[col * n + col]!;
    [detRe, detIm] = [detRe * pr - detIm * pi, detRe * pi + detIm * pr];
    const norm = pr * pr + pi * pi;
    for (let row = col + 1; row < n; row++) {
      const ar = re[row * n + col]!;
      const ai = im[row * n + col]!;
      const fr = (ar * pr + ai * pi) / norm; // factor = a / pivot
      const fi = (ai * pr - ar * pi) / norm;
      for (let j = col; j < n; j++) {
        const br = re[col * n + j]!;
        const bi = im[col * n + j]!;
        re[row * n + j] = re[row * n + j]! - (fr * br - fi * bi);
        im[row * n + j] = im[row * n + j]! - (fr * bi + fi * br);
      }
    }
  }
  return [detRe, detIm];
}

/** Spatial orbital indices (m_l + 2) of the bits of one spin half of a mask, ascending. */
function halfOrbitals(mask: number, alpha: boolean): number[] {
  const out: number[] = [];
  for (let i = 0; i < 5; i++) if (mask & (1 << (alpha ? i : i + 5))) out.push(bitOrbital(alpha ? i : i + 5));
  return out;
}

function minorDeterminant(d: ComplexMatrix, rows: number[], cols: number[]): [number, number] {
  const k = rows.length;
  if (k === 0) return [1, 0];
  const re = new Float64Array(k * k);
  const im = new Float64Array(k * k);
  rows.forEach((r, i) =>
    cols.forEach((c, j) => {
      re[i * k + j] = d.re[r * 5 + c]!;
      im[i * k + j] = d.im[r * 5 + c]!;
    }),
  );
  return complexDeterminant(k, re, im);
}

/**
 * <bra| O_R |ket> for determinants of one M_S (masks as in determinants.ts):
 * the rotated determinant is Π_i (Σ_q D_{q p_i} a†_q)|0>, so the element is
 * the minor det D[bra orbitals, ket orbitals], and spin-orbital D is block
 * diagonal (alpha, beta), giving det(D_αα minor)·det(D_ββ minor).
 */
export function determinantRotation(masks: readonly number[], d: ComplexMatrix): ComplexMatrix {
  const n = masks.length;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  const alpha = masks.map((m) => halfOrbitals(m, true));
  const beta = masks.map((m) => halfOrbitals(m, false));
  for (let row = 0; row < n; row++)
    for (let col = 0; col < n; col++) {
      if (alpha[row]!.length !== alpha[col]!.length) continue;
      const [ar, ai] = minorDeterminant(d, alpha[row]!, alpha[col]!);
      const [br, bi] = minorDeterminant(d, beta[row]!, beta[col]!);
      re[row * n + col] = ar * br - ai * bi;
      im[row * n + col] = ar * bi + ai * br;
    }
  return { n, re, im };
}
