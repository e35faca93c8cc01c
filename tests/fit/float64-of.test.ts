/**
 * float64Of (src/fit/float64-of.ts), the fit's loop in place of
 * Float64Array.from(items, value): the same doubles, bit for bit, for
 * arrays of objects and typed arrays, values passed with their index. The
 * reference is Float64Array.from itself (the JavaScript standard library).
 */
import { describe, expect, it } from 'vitest';
import { float64Of } from '../../src/fit/float64-of.js';
import { seededRandom } from '../reference/seeded-random.js';

describe('float64Of', () => {
  it('gives what Float64Array.from gives, for objects, typed arrays and index-dependent values', () => {
    const random = seededRandom(7);
    const observations = Array.from({ length: 50 }, () => ({ position: 5000 + random() * 30_000, sigma: 50 + random() * 500 }));
    const same = (a: Float64Array, b: Float64Array) => expect(Array.from(a, (v, i) => Object.is(v, b[i]))).toEqual(Array.from(a, () => true));
    same(float64Of(observations, (o) => 1 / o.sigma ** 2), Float64Array.from(observations, (o) => 1 / o.sigma ** 2));
    const levels = Int32Array.from({ length: 40 }, () => Math.floor(random() * 30));
    same(float64Of(levels, (k, i) => k * 0.1 + i), Float64Array.from(levels, (k, i) => k * 0.1 + i));
    expect(float64Of([], () => 1)).toEqual(new Float64Array(0));
    // Stored as doubles as Float64Array.from stores them: a non-number value becomes NaN there too.
    same(float64Of([1, 2], () => Number('x')), Float64Array.from([1, 2], () => Number('x')));
  });
});
