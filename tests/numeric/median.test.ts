import { describe, expect, it } from 'vitest';
import { median } from '../../src/numeric/median.js';

/** The slow, obviously correct reference: sort a copy, take the middle or the mean of the two middles. */
function sortedMedian(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  if (s.length === 0) return Number.NaN;
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

describe('the one median', () => {
  it('matches the sort-based reference on seeded random arrays of odd and even length', () => {
    let seed = 12_345;
    const random = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31) / 2 ** 31) * 200 - 100;
    for (let n = 1; n <= 40; n++) {
      const values = Array.from({ length: n }, random);
      expect(median(values)).toBe(sortedMedian(values));
      expect(median(Float64Array.from(values))).toBe(sortedMedian(values));
    }
  });

  it('is NaN for no values and leaves its input as it was', () => {
    expect(median([])).toBeNaN();
    const input = Float64Array.from([3, 1, 2, 4]);
    expect(median(input)).toBe(2.5);
    expect([...input]).toEqual([3, 1, 2, 4]);
  });
});
