/**
 * A dense real-symmetric n×n matrix (row-major Float64Array) with entries
 * drawn uniformly from [−1, 1) by `random` (a seeded generator, so a failure
 * can be replayed): the test input of the eigensolver suites.
 */
export function randomSymmetricMatrix(n: number, random: () => number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) {
      const v = 2 * random() - 1;
      a[i * n + j] = v;
      a[j * n + i] = v;
    }
  return a;
}
