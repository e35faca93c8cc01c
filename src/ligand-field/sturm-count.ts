/**
 * How many eigenvalues of a symmetric tridiagonal matrix lie below x, by the
 * Sturm sequence (the signs of the pivots of the LDLᵀ factorisation of
 * T − x·I, Sylvester's law of inertia): O(n) divisions, no eigenvalue. The
 * tridiagonal is as symmetricTridiagonalInPlace leaves it: diagonal d[0..n−1],
 * sub-diagonal e[1..n−1].
 *
 * A pivot that vanishes (x on an eigenvalue of a leading block) is replaced
 * by −PIVOT_FLOOR, as LAPACK's bisection does, so the count goes on without
 * dividing by zero; the count is then that of a matrix within round-off of
 * T, as the eigenvalues of the QL iteration are. Far below the scaled
 * entries (< 1): e²/PIVOT_FLOOR stays finite.
 */
const PIVOT_FLOOR = 1e-290;

export function tridiagonalCountBelow(d: Float64Array, e: Float64Array, n: number, x: number): number {
  if (n === 0) return 0;
  let pivot = d[0]! - x;
  if (Math.abs(pivot) < PIVOT_FLOOR) pivot = -PIVOT_FLOOR;
  let count = pivot < 0 ? 1 : 0;
  for (let i = 1; i < n; i++) {
    const coupling = e[i]!;
    pivot = d[i]! - x - (coupling * coupling) / pivot;
    if (Math.abs(pivot) < PIVOT_FLOOR) pivot = -PIVOT_FLOOR;
    if (pivot < 0) count++;
  }
  return count;
}
