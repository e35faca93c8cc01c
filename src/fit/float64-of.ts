/**
 * Float64Array.from(items, value) as a plain indexed loop: the same numbers
 * (value(item, i) stored as a double), without the iterator protocol, whose
 * result objects and list copy made evaluate-scan.ts one of the fit's larger
 * allocators (~25 kB per two-band fit, V8 sampling heap profile).
 */
export function float64Of<T>(items: ArrayLike<T>, value: (item: T, index: number) => number): Float64Array {
  const out = new Float64Array(items.length);
  for (let i = 0; i < items.length; i++) out[i] = value(items[i]!, i);
  return out;
}
