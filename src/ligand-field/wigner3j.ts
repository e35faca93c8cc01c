/**
 * Wigner 3j symbols for integer angular momenta, by the Racah formula.
 *
 * Exact in the sense that it sums the Racah series with factorials of small
 * integers (all exactly representable up to 18!); the result is one square
 * root times a rational sum, so it is correct to the last bit or two of a
 * double. Only integer j and m are needed for a d shell (l = 2, k ≤ 4).
 */

const FACTORIALS: number[] = [1];
for (let i = 1; i <= 30; i++) FACTORIALS.push(FACTORIALS[i - 1]! * i);

function factorial(n: number): number {
  const value = FACTORIALS[n];
  if (value === undefined) throw new RangeError(`factorial(${n}) outside the table`);
  return value;
}

/** True when j1, j2, j3 satisfy the triangle rule and j1 + j2 + j3 is whole. */
function triangle(j1: number, j2: number, j3: number): boolean {
  return j3 >= Math.abs(j1 - j2) && j3 <= j1 + j2;
}

/**
 * The 3j symbol (j1 j2 j3; m1 m2 m3) for integer arguments; 0 when the
 * selection rules (m1 + m2 + m3 = 0, |m_i| ≤ j_i, triangle) fail.
 */
export function wigner3j(j1: number, j2: number, j3: number, m1: number, m2: number, m3: number): number {
  const args = [j1, j2, j3, m1, m2, m3];
  if (!args.every(Number.isInteger)) throw new RangeError('wigner3j: integer arguments only');
  if (m1 + m2 + m3 !== 0 || !triangle(j1, j2, j3)) return 0;
  if (Math.abs(m1) > j1 || Math.abs(m2) > j2 || Math.abs(m3) > j3) return 0;
  const delta =
    (factorial(j1 + j2 - j3) * factorial(j1 - j2 + j3) * factorial(-j1 + j2 + j3)) / factorial(j1 + j2 + j3 + 1);
  const norm =
    factorial(j1 + m1) * factorial(j1 - m1) * factorial(j2 + m2) * factorial(j2 - m2) *
    factorial(j3 + m3) * factorial(j3 - m3);
  const tMin = Math.max(0, j2 - j3 - m1, j1 - j3 + m2);
  const tMax = Math.min(j1 + j2 - j3, j1 - m1, j2 + m2);
  let sum = 0;
  for (let t = tMin; t <= tMax; t++) {
    const denominator =
      factorial(t) * factorial(j3 - j2 + t + m1) * factorial(j3 - j1 + t - m2) *
      factorial(j1 + j2 - j3 - t) * factorial(j1 - t - m1) * factorial(j2 - t + m2);
    sum += (t % 2 === 0 ? 1 : -1) / denominator;
  }
  const phase = (j1 - j2 - m3) % 2 === 0 ? 1 : -1;
  return phase * Math.sqrt(delta * norm) * sum;
}
