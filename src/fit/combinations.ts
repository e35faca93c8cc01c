/**
 * Increasing k-subsets of {0, …, m−1} in lexicographic order, each passed to
 * `visit` as the same reused array (copy it to keep it). C(m, k) calls;
 * k = 0 gives one empty subset, k > m none.
 */
export function forEachCombination(m: number, k: number, visit: (subset: Int32Array) => void): void {
  if (k < 0 || k > m) return;
  const subset = Int32Array.from({ length: k }, (_, i) => i);
  for (;;) {
    visit(subset);
    let i = k - 1;
    while (i >= 0 && subset[i] === m - k + i) i--;
    if (i < 0) return;
    subset[i]!++;
    for (let j = i + 1; j < k; j++) subset[j] = subset[j - 1]! + 1;
  }
}

/** C(m, k). */
export function binomial(m: number, k: number): number {
  if (k < 0 || k > m) return 0;
  let result = 1;
  for (let i = 1; i <= k; i++) result = (result * (m - k + i)) / i;
  return Math.round(result);
}
