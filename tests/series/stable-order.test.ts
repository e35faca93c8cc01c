import { describe, expect, it } from 'vitest';
import { stableOrderOfValues } from '../../src/series/stable-order.js';
import { seededLcg } from '../reference/seeded-random.js';

/** The slow, obviously correct reference: Array.prototype.sort is stable (ES2019), so equal values keep their index order. */
function referenceOrder(values: Float64Array): number[] {
  return Array.from(values, (_v, i) => i).sort((i, j) => (values[i] as number) - (values[j] as number));
}

describe('stableOrderOfValues against the comparison sort', () => {
  it.each([1, 2, 3, 4])('gives the same order for 20 000 seeded values with ties, signs, zeros and extremes (seed %i)', (seed) => {
    const next = seededLcg(seed);
    const pool = [0, -0, 1, -1, 5e-324, -5e-324, Number.MAX_VALUE, -Number.MAX_VALUE, Infinity, -Infinity, 0.1 + 0.2, 0.3];
    const values = Float64Array.from({ length: 20_000 }, () => {
      const r = next();
      if (r < 0.1) return pool[Math.floor(next() * pool.length)]!;
      if (r < 0.5) return Math.round(next() * 200) / 10; // many equal values
      if (r < 0.7) return (next() - 0.5) * 10 ** Math.floor(next() * 40 - 20);
      return 15_000 + 10_000 * next();
    });
    expect(Array.from(stableOrderOfValues(values))).toEqual(referenceOrder(values));
  });

  it('keeps index order among equal values, 0 and -0 included, and sorts only the first `count`', () => {
    const values = Float64Array.from([2, -0, 1, 0, 2, -0, 7, -3]);
    expect(Array.from(stableOrderOfValues(values))).toEqual([7, 1, 3, 5, 2, 0, 4, 6]);
    expect(Array.from(stableOrderOfValues(values, 4))).toEqual([1, 3, 2, 0]);
    expect(stableOrderOfValues(new Float64Array(0)).length).toBe(0);
  });
});
