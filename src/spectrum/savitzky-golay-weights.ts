/**
 * Savitzky–Golay convolution weights by Gorry's Gram-polynomial method
 * (P. A. Gorry, "General least-squares smoothing and differentiation by the
 * convolution (Savitzky–Golay) method", Anal. Chem. 62, 570 (1990)), cached
 * by window, polynomial order and derivative.
 *
 * Why our own: ml-savitzky-golay-generalized (which ml-gsd calls) rebuilds
 * the whole weight table on every call and exposes neither the table nor a
 * cache; rebuilding it was about 13 % of an analysis. The expressions below
 * are Gorry's in the same order of operations as that library, so the
 * weights are the same numbers (tests/spectrum/savitzky-golay.test.ts
 * compares them and the filtered output with the library's).
 *
 * Convention: weights[t + m][j + m] (t, j = −m..m, windowSize = 2m + 1) is
 * the weight of the point at offset j for the value (or derivative, per unit
 * step) at offset t of a window; t = 0 is the centre, the others serve the
 * first and last m points of a series.
 */

/** Gram polynomial of order k (derivative s) at point i of a 2m + 1 window (Gorry 1990, eq. 8). */
function gramPolynomial(i: number, m: number, k: number, s: number, memo: Map<number, number>): number {
  if (k <= 0) return k === 0 && s === 0 ? 1 : 0;
  if (s < 0) return 0;
  const key = k * 64 + s;
  const known = memo.get(key);
  if (known !== undefined) return known;
  const value =
    ((4 * k - 2) / (k * (2 * m - k + 1))) *
      (i * gramPolynomial(i, m, k - 1, s, memo) + s * gramPolynomial(i, m, k - 1, s - 1, memo)) -
    (((k - 1) * (2 * m + k)) / (k * (2 * m - k + 1))) * gramPolynomial(i, m, k - 2, s, memo);
  memo.set(key, value);
  return value;
}

/** a (a − 1) … (a − b + 1), 1 when b > a (Gorry's generalised factorial). */
function generalisedFactorial(a: number, b: number): number {
  let f = 1;
  if (a >= b) for (let j = a - b + 1; j <= a; j++) f *= j;
  return f;
}

/** The weight table of one window; see the file comment. */
export function savitzkyGolayWeightTable(windowSize: number, polynomial: number, derivative: number): Float64Array[] {
  const m = Math.floor(windowSize / 2);
  // Gram polynomials at each point for each derivative order, memoised per point.
  const memos = Array.from({ length: windowSize }, () => new Map<number, number>());
  const factors = new Float64Array(polynomial + 1);
  for (let k = 0; k <= polynomial; k++) factors[k] = (2 * k + 1) * (generalisedFactorial(2 * m, k) / generalisedFactorial(2 * m + k + 1, k + 1));
  const table: Float64Array[] = [];
  for (let t = -m; t <= m; t++) {
    const row = new Float64Array(windowSize);
    for (let j = -m; j <= m; j++) {
      let sum = 0;
      for (let k = 0; k <= polynomial; k++) {
        sum += (factors[k] as number) * gramPolynomial(j, m, k, 0, memos[j + m]!) * gramPolynomial(t, m, k, derivative, memos[t + m]!);
      }
      row[j + m] = sum;
    }
    table.push(row);
  }
  return table;
}

/** Tables kept: a process sees few distinct windows (they follow the grid step), but a batch of odd files must not grow it without end. */
const CACHE_LIMIT = 64;
const cache = new Map<string, readonly Float64Array[]>();

/**
 * The weight table for (windowSize, polynomial, derivative), built once and
 * then shared: callers must not write to it.
 */
export function savitzkyGolayWeights(windowSize: number, polynomial: number, derivative: number): readonly Float64Array[] {
  const key = `${windowSize}/${polynomial}/${derivative}`;
  let table = cache.get(key);
  if (table === undefined) {
    table = savitzkyGolayWeightTable(windowSize, polynomial, derivative);
    if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
    cache.set(key, table);
  }
  return table;
}
