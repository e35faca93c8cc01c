/**
 * Dense real-symmetric eigenproblems on row-major Float64Array: Householder
 * reduction to tridiagonal form, then the implicit QL algorithm with Wilkinson
 * shifts (the classic EISPACK tred2/tql2 scheme, written afresh here).
 *
 * Only the lower triangle of the input is read. Eigenvalues come out
 * ascending; eigenvectors are the columns of `vectors` (element [i·n + j] is
 * component i of eigenvector j), orthonormal.
 *
 * The matrix is scaled by a power of two (exact) so that its largest entry
 * lies in [0.5, 1) before the iteration, so entries near the ends of the
 * double range (1e-150, 1e300) neither underflow nor overflow in the
 * rotations. A non-finite entry is refused; an iteration that does not
 * converge (it should not happen for finite input) raises
 * EigenConvergenceError, a FieldgapError, never a bare Error.
 */
import { FieldgapError } from '../errors.js';

const EPSILON = 2 ** -52;
const MAX_SWEEPS = 60;
/** Largest |log2| of a matrix's largest entry that is left unscaled (see scaleLowerTriangle). */
const SAFE_EXPONENT = 128;

/** The QL iteration did not converge: a numerical failure (code "internal"), with the matrix order for the log. */
export class EigenConvergenceError extends FieldgapError {
  readonly order: number;
  constructor(order: number) {
    super('internal', `symmetric eigensolver: the QL iteration did not converge within ${MAX_SWEEPS} sweeps for a matrix of order ${order}`);
    this.order = order;
  }
}

function refuseEntry(v: number, i: number, j: number): never {
  throw new FieldgapError('invalid-argument', `symmetric eigensolver: matrix entry (${i}, ${j}) is ${v}; the parameters are out of range`);
}

/**
 * Multiplies the lower triangle of a by the power of two that brings its
 * largest magnitude into [0.5, 1), and returns that factor (1 for a zero
 * matrix). Refuses a NaN or infinite entry, naming where it is.
 */
function scaleLowerTriangle(a: Float64Array, n: number): number {
  let largest = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const m = Math.abs(a[i * n + j]!);
      // One comparison per entry: NaN fails every comparison and Infinity passes this one, so both reach the check.
      if (!(m <= largest)) {
        if (!(m < Infinity)) refuseEntry(a[i * n + j]!, i, j);
        largest = m;
      }
    }
  }
  if (largest === 0) return 1;
  // 2^-floor(log2(largest)+1), computed in two steps so that neither factor overflows.
  const exponent = Math.floor(Math.log2(largest)) + 1;
  const half = Math.trunc(exponent / 2);
  // Within 2^±SAFE_EXPONENT nothing in the reduction or the QL iteration under- or overflows, and every
  // step is exact under a power-of-two scaling (the square roots are of squares or of scale-free sums),
  // so scaling there would change no bit of the result: only its cost. (Tested in eigen-symmetric-range.test.ts.)
  if (Math.abs(exponent) <= SAFE_EXPONENT) return 1;
  const factor = 2 ** -half * 2 ** -(exponent - half);
  if (factor === 1) return 1;
  for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) a[i * n + j]! *= factor;
  return factor;
}

/** Scratch arrays reused between calls of the same size, so hot loops do not allocate. */
export interface EigenWorkspace {
  offDiagonal: Float64Array;
}

export function createEigenWorkspace(n: number): EigenWorkspace {
  return { offDiagonal: new Float64Array(Math.max(n, 1)) };
}

/**
 * Householder tridiagonalisation of a (destroyed). Leaves the diagonal in d,
 * the sub-diagonal in e[1..n−1], and, when accumulate is set, the orthogonal
 * transformation Q (A = Q T Qᵀ) in a.
 */
function tridiagonalise(a: Float64Array, n: number, d: Float64Array, e: Float64Array, accumulate: boolean): void {
  for (let i = n - 1; i > 0; i--) {
    const l = i - 1;
    const rowI = i * n;
    let h = 0;
    if (l > 0) {
      let scale = 0;
      for (let k = 0; k <= l; k++) scale += Math.abs(a[rowI + k]!);
      if (scale === 0) {
        e[i] = a[rowI + l]!;
      } else {
        for (let k = 0; k <= l; k++) {
          const v = a[rowI + k]! / scale;
          a[rowI + k] = v;
          h += v * v;
        }
        let f = a[rowI + l]!;
        let g = f >= 0 ? -Math.sqrt(h) : Math.sqrt(h);
        e[i] = scale * g;
        h -= f * g;
        a[rowI + l] = f - g;
        f = 0;
        for (let j = 0; j <= l; j++) {
          const rowJ = j * n;
          if (accumulate) a[rowJ + i] = a[rowI + j]! / h;
          g = 0;
          for (let k = 0; k <= j; k++) g += a[rowJ + k]! * a[rowI + k]!;
          for (let k = j + 1; k <= l; k++) g += a[k * n + j]! * a[rowI + k]!;
          e[j] = g / h;
          f += e[j]! * a[rowI + j]!;
        }
        const hh = f / (h + h);
        for (let j = 0; j <= l; j++) {
          const rowJ = j * n;
          const fj = a[rowI + j]!;
          const gj = e[j]! - hh * fj;
          e[j] = gj;
          for (let k = 0; k <= j; k++) a[rowJ + k] = a[rowJ + k]! - (fj * e[k]! + gj * a[rowI + k]!);
        }
      }
    } else {
      e[i] = a[rowI + l]!;
    }
    d[i] = h;
  }
  d[0] = 0;
  e[0] = 0;
  for (let i = 0; i < n; i++) {
    const rowI = i * n;
    if (accumulate) {
      if (d[i] !== 0) {
        for (let j = 0; j < i; j++) {
          let g = 0;
          for (let k = 0; k < i; k++) g += a[rowI + k]! * a[k * n + j]!;
          for (let k = 0; k < i; k++) a[k * n + j] = a[k * n + j]! - g * a[k * n + i]!;
        }
      }
      d[i] = a[rowI + i]!;
      a[rowI + i] = 1;
      for (let j = 0; j < i; j++) {
        a[j * n + i] = 0;
        a[rowI + j] = 0;
      }
    } else {
      d[i] = a[rowI + i]!;
    }
  }
}

/**
 * Implicit QL on the tridiagonal (d, e from tridiagonalise). Overwrites d with
 * the eigenvalues (unsorted); rotates the columns of z when given.
 */
function tridiagonalQl(d: Float64Array, e: Float64Array, n: number, z: Float64Array | undefined): void {
  for (let i = 1; i < n; i++) e[i - 1] = e[i]!;
  if (n > 0) e[n - 1] = 0;
  for (let l = 0; l < n; l++) {
    let sweeps = 0;
    for (;;) {
      let m = l;
      for (; m < n - 1; m++) {
        const dd = Math.abs(d[m]!) + Math.abs(d[m + 1]!);
        if (Math.abs(e[m]!) <= EPSILON * dd) break;
      }
      if (m === l) break;
      if (++sweeps > MAX_SWEEPS) throw new EigenConvergenceError(n);
      let g = (d[l + 1]! - d[l]!) / (2 * e[l]!);
      let r = Math.sqrt(g * g + 1);
      g = d[m]! - d[l]! + e[l]! / (g + (g >= 0 ? r : -r));
      let s = 1;
      let c = 1;
      let p = 0;
      let underflow = false;
      for (let i = m - 1; i >= l; i--) {
        const f = s * e[i]!;
        const b = c * e[i]!;
        r = Math.sqrt(f * f + g * g);
        e[i + 1] = r;
        if (r === 0) {
          d[i + 1] = d[i + 1]! - p;
          e[m] = 0;
          underflow = true;
          break;
        }
        s = f / r;
        c = g / r;
        g = d[i + 1]! - p;
        r = (d[i]! - g) * s + 2 * c * b;
        p = s * r;
        d[i + 1] = g + p;
        g = c * r - b;
        if (z) {
          for (let k = 0; k < n; k++) {
            const row = k * n;
            const zf = z[row + i + 1]!;
            z[row + i + 1] = s * z[row + i]! + c * zf;
            z[row + i] = c * z[row + i]! - s * zf;
          }
        }
      }
      if (underflow) continue;
      d[l] = d[l]! - p;
      e[l] = g;
      e[m] = 0;
    }
  }
}

/**
 * Eigenvalues only of the tridiagonal (d, e from tridiagonalise), by the
 * root-free rational QL iteration of Pal, Walker and Kahan (as in EISPACK's
 * tqlrat, written afresh): it works on the squared off-diagonal and needs no
 * square root per rotation, about a third faster than tridiagonalQl without
 * vectors on the ligand-field blocks. Overwrites d with the eigenvalues,
 * ascending (each is put in place as it converges); destroys e. The
 * convergence test is relative to the largest |d_l| + |e_l| met so far (ε²
 * on the squares).
 */
function tridiagonalEigenvaluesRootFree(d: Float64Array, e: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) e[i - 1] = e[i]! * e[i]!;
  e[n - 1] = 0;
  let shift = 0;
  let norm = 0;
  let tiny = 0;
  let tinySquared = 0;
  for (let l = 0; l < n; l++) {
    const size = Math.abs(d[l]!) + Math.sqrt(e[l]!);
    if (size > norm) {
      norm = size;
      tiny = EPSILON * norm;
      tinySquared = tiny * tiny;
    }
    let m = l;
    while (e[m]! > tinySquared) m++; // e[n − 1] is 0: the scan stops by m = n − 1.
    let sweeps = 0;
    while (m > l) {
      if (++sweeps > MAX_SWEEPS) throw new EigenConvergenceError(n);
      // Shift from the leading 2×2, subtracted from the whole remaining diagonal.
      const offDiagonal = Math.sqrt(e[l]!);
      const first = d[l]!;
      const p0 = (d[l + 1]! - first) / (2 * offDiagonal);
      // hypot(p0, 1) without Math.hypot, slow in V8; beyond 1e150 the 1 is lost anyway and p0² would overflow.
      const r0 = Math.abs(p0) < 1e150 ? Math.sqrt(p0 * p0 + 1) : Math.abs(p0);
      d[l] = offDiagonal / (p0 + (p0 >= 0 ? r0 : -r0));
      const h0 = first - d[l]!;
      for (let i = l + 1; i < n; i++) d[i] = d[i]! - h0;
      shift += h0;
      // The rational QL sweep from m up to l.
      let g = d[m]!;
      if (g === 0) g = tiny;
      let h = g;
      let s = 0;
      for (let i = m - 1; i >= l; i--) {
        const p = g * h;
        const r = p + e[i]!;
        e[i + 1] = s * r;
        s = e[i]! / r;
        d[i + 1] = h + s * (h + d[i]!);
        g = d[i]! - e[i]! / g;
        if (g === 0) g = tiny;
        h = (g * p) / r;
      }
      e[l] = s * g;
      d[l] = h;
      // Converged when the new off-diagonal is negligible (the test guards against underflow).
      if (h === 0 || Math.abs(e[l]!) <= Math.abs(tinySquared / h)) break;
      e[l] = h * e[l]!;
      if (e[l] === 0) break;
    }
    // Insert the converged eigenvalue among those found so far, ascending.
    const value = d[l]! + shift;
    let i = l;
    for (; i > 0 && value < d[i - 1]!; i--) d[i] = d[i - 1]!;
    d[i] = value;
  }
}

/**
 * Eigenvalues of the symmetric n×n matrix a, ascending, into values[0..n−1].
 * Destroys a. The fast path: no eigenvectors are accumulated, and the QL
 * iteration is the root-free one (tridiagonalEigenvaluesRootFree); the
 * eigenvalues of symmetricEigen (tridiagonalQl) are its reference in the tests.
 */
export function symmetricEigenvaluesInPlace(
  a: Float64Array,
  n: number,
  values: Float64Array,
  workspace: EigenWorkspace = createEigenWorkspace(n),
): void {
  if (n === 0) return;
  // Orders 1 and 2 in closed form: most ligand-field blocks are that small, and
  // the general path (scaling, Householder, QL) costs far more than the answer.
  // Tested against the general path in tests/ligand-field/eigen-symmetric.test.ts.
  if (n === 1) {
    const v = a[0]!;
    if (!(Math.abs(v) < Infinity)) refuseEntry(v, 0, 0);
    values[0] = v;
    return;
  }
  if (n === 2) {
    eigenvaluesOfTwoByTwo(a[0]!, a[2]!, a[3]!, values);
    return;
  }
  const e = workspace.offDiagonal;
  const factor = scaleLowerTriangle(a, n);
  tridiagonalise(a, n, values, e, false);
  tridiagonalEigenvaluesRootFree(values, e, n);
  if (factor !== 1) for (let i = 0; i < n; i++) values[i]! /= factor;
}

/**
 * The Householder tridiagonal form of the symmetric n×n matrix a (destroyed;
 * lower triangle read), scaled by the returned power of two (exact, as
 * symmetricEigenvaluesInPlace scales): diagonal in d[0..n−1], sub-diagonal in
 * e[1..n−1] (e[i] couples rows i − 1 and i). Its eigenvalues are factor × those
 * of a. For sturm-count.ts, when the order of eigenvalues against given
 * values is wanted and the eigenvalues themselves are not.
 */
export function symmetricTridiagonalInPlace(a: Float64Array, n: number, d: Float64Array, e: Float64Array): number {
  if (n === 0) return 1;
  const factor = scaleLowerTriangle(a, n);
  tridiagonalise(a, n, d, e, false);
  return factor;
}

/**
 * Eigenvalues of [[p, q], [q, r]] (lower triangle: p, q, r), ascending, into
 * out[0], out[1]: centre ± radius, centre = (p + r)/2, radius =
 * hypot((p − r)/2, q), with no intermediate overflow.
 * Absolute error a few ulps of the matrix norm, as the general path.
 */
function eigenvaluesOfTwoByTwo(p: number, q: number, r: number, out: Float64Array): void {
  if (!(Math.abs(p) < Infinity)) refuseEntry(p, 0, 0);
  if (!(Math.abs(q) < Infinity)) refuseEntry(q, 1, 0);
  if (!(Math.abs(r) < Infinity)) refuseEntry(r, 1, 1);
  // Halving first guards against overflow near 1e308; halving last keeps subnormal entries exact.
  const big = Math.abs(p) + Math.abs(r) > 1e300;
  const centre = big ? p / 2 + r / 2 : (p + r) / 2;
  const radius = Math.hypot(big ? p / 2 - r / 2 : (p - r) / 2, q);
  out[0] = centre - radius;
  out[1] = centre + radius;
}

/** Eigenvalues of the symmetric n×n matrix a (not modified), ascending. */
export function symmetricEigenvalues(a: Float64Array, n: number): Float64Array {
  const values = new Float64Array(n);
  symmetricEigenvaluesInPlace(Float64Array.from(a.subarray(0, n * n)), n, values);
  return values;
}

export interface SymmetricEigen {
  /** Ascending. */
  values: Float64Array;
  /** Row-major n×n; column j is the unit eigenvector of values[j]. */
  vectors: Float64Array;
}

/** Eigenvalues and orthonormal eigenvectors of the symmetric n×n matrix a (not modified). */
export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
  const z = Float64Array.from(a.subarray(0, n * n));
  const d = new Float64Array(n);
  const e = new Float64Array(Math.max(n, 1));
  if (n > 0) {
    const factor = scaleLowerTriangle(z, n);
    tridiagonalise(z, n, d, e, true);
    tridiagonalQl(d, e, n, z);
    if (factor !== 1) for (let i = 0; i < n; i++) d[i]! /= factor;
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((i, j) => d[i]! - d[j]!);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  order.forEach((source, target) => {
    values[target] = d[source]!;
    for (let k = 0; k < n; k++) vectors[k * n + target] = z[k * n + source]!;
  });
  return { values, vectors };
}
