/**
 * The stable ascending order of `count` numbers: the indices 0 … count−1
 * sorted by value, equal values (0 and −0 count as equal, as `a − b` says)
 * keeping their index order. It is what
 * `[...indices].sort((i, j) => values[i] − values[j])` gives for values that
 * are not NaN, in linear time: a least-significant-digit radix sort (four
 * passes of 16 bits) on the IEEE-754 bits made order-preserving (the sign bit
 * flipped for positive numbers, every bit for negative ones). A ranking of
 * 100 000 varied values takes ~5 ms instead of ~100 ms with the comparison
 * sort. Written here because no kept npm package sorts indices by float keys;
 * tests/series/stable-order.test.ts checks it against the comparison sort.
 *
 * NaN has no place in an order; the callers check their values first.
 */
export function stableOrderOfValues(values: Float64Array, count = values.length): Uint32Array {
  // The words of each key, low and high, as unsigned integers that order like the numbers.
  const lo = new Uint32Array(count);
  const hi = new Uint32Array(count);
  const view = new DataView(new ArrayBuffer(8));
  for (let k = 0; k < count; k++) {
    const value = values[k] as number;
    // −0 sorts with 0 (their difference is 0).
    view.setFloat64(0, value === 0 ? 0 : value, true);
    const l = view.getUint32(0, true);
    const h = view.getUint32(4, true);
    if (h & 0x8000_0000) {
      hi[k] = ~h >>> 0;
      lo[k] = ~l >>> 0;
    } else {
      hi[k] = (h | 0x8000_0000) >>> 0;
      lo[k] = l;
    }
  }
  let order = new Uint32Array(count);
  let next = new Uint32Array(count);
  for (let k = 0; k < count; k++) order[k] = k;
  const starts = new Uint32Array(65_536);
  for (let pass = 0; pass < 4; pass++) {
    const word = pass < 2 ? lo : hi;
    const shift = (pass & 1) * 16;
    starts.fill(0);
    for (let k = 0; k < count; k++) starts[((word[k] as number) >>> shift) & 0xffff]! += 1;
    let sum = 0;
    for (let d = 0; d < 65_536; d++) {
      const c = starts[d] as number;
      starts[d] = sum;
      sum += c;
    }
    // Each pass keeps the order of the previous one among equal digits: the sort is stable.
    for (let k = 0; k < count; k++) {
      const i = order[k] as number;
      const digit = ((word[i] as number) >>> shift) & 0xffff;
      next[starts[digit] as number] = i;
      starts[digit]! += 1;
    }
    const done = order;
    order = next;
    next = done;
  }
  return order;
}
