/**
 * The cached Savitzky–Golay weights and filter (src/spectrum/
 * savitzky-golay-weights.ts, x-savitzky-golay.ts) against
 * ml-savitzky-golay-generalized 5 (the library ml-gsd filters with), used as
 * reference: the same weights and the same filtered series to 1e-12
 * (relative to the largest value).
 */
import { sgg } from 'ml-savitzky-golay-generalized';
import { describe, expect, it } from 'vitest';
import { gaussianDeviates, mulberry32 } from '../../src/spectrum/random.js';
import { savitzkyGolayWeights, savitzkyGolayWeightTable } from '../../src/spectrum/savitzky-golay-weights.js';
import { xSavitzkyGolay } from '../../src/spectrum/x-savitzky-golay.js';

function maxAbs(values: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < values.length; i++) m = Math.max(m, Math.abs(values[i]!));
  return m;
}

function expectClose(actual: ArrayLike<number>, expected: ArrayLike<number>, what: string): void {
  expect(actual.length, what).toBe(expected.length);
  const scale = Math.max(maxAbs(expected), 1e-300);
  let worst = 0;
  for (let i = 0; i < expected.length; i++) worst = Math.max(worst, Math.abs(actual[i]! - expected[i]!));
  expect(worst / scale, what).toBeLessThanOrEqual(1e-12);
}

describe('Savitzky–Golay weights', () => {
  it('match ml-savitzky-golay-generalized, read off its response to a unit impulse (step 1)', () => {
    for (const windowSize of [5, 7, 9, 15, 25, 41]) {
      for (const polynomial of [2, 3, 4]) {
        for (const derivative of [0, 1, 2]) {
          const table = savitzkyGolayWeightTable(windowSize, polynomial, derivative);
          const m = (windowSize - 1) / 2;
          for (let j = 0; j < windowSize; j++) {
            // sgg over a window-long unit impulse at j: output t is the weight of point j for row t.
            const impulse = new Float64Array(windowSize);
            impulse[j] = 1;
            const response = sgg(impulse, 1, { windowSize, polynomial, derivative });
            const column = table.map((row) => row[j]!);
            expectClose(column, response, `window ${windowSize}, order ${polynomial}, derivative ${derivative}, point ${j - m}`);
          }
        }
      }
    }
  });

  it('smooth exactly a polynomial of their order, and differentiate it (invariants)', () => {
    // A cubic is reproduced by a cubic fit at every row of the window: value, slope and curvature.
    const m = 6;
    const cubic = (t: number) => 0.3 - 1.2 * t + 0.05 * t * t + 0.002 * t ** 3;
    const slope = (t: number) => -1.2 + 0.1 * t + 0.006 * t * t;
    const curvature = (t: number) => 0.1 + 0.012 * t;
    for (const [derivative, f] of [[0, cubic], [1, slope], [2, curvature]] as const) {
      const table = savitzkyGolayWeightTable(2 * m + 1, 3, derivative);
      for (let t = -m; t <= m; t++) {
        let v = 0;
        for (let j = -m; j <= m; j++) v += table[t + m]![j + m]! * cubic(j);
        expect(v).toBeCloseTo(f(t), 10);
      }
    }
  });

  it('are built once per window, order and derivative', () => {
    expect(savitzkyGolayWeights(11, 3, 2)).toBe(savitzkyGolayWeights(11, 3, 2));
    expect(savitzkyGolayWeights(11, 3, 1)).not.toBe(savitzkyGolayWeights(11, 3, 2));
  });
});

describe('xSavitzkyGolay', () => {
  it('gives sgg(y, step, options) on noisy spectra for every window, order and derivative', () => {
    const random = mulberry32(7);
    const normal = gaussianDeviates(mulberry32(8));
    for (let trial = 0; trial < 12; trial++) {
      const n = 50 + Math.floor(random() * 400);
      const step = 5 + 60 * random();
      // Overlapping asymmetric bands on a slope with noise, rounded to 0.01 like an instrument's export.
      const y = Float64Array.from({ length: n }, (_, i) => {
        const x = 10_000 + i * step;
        const band = (c: number, w: number, h: number) => h * Math.exp(-4 * Math.LN2 * ((x - c) / (x < c ? w : 1.4 * w)) ** 2);
        const v = 0.05 + 2e-6 * (x - 10_000) + band(10_000 + 0.4 * n * step, 40 * step, 0.8) + band(10_000 + 0.55 * n * step, 25 * step, 0.3);
        return Math.round((v + 0.003 * normal()) * 100) / 100;
      });
      for (const windowSize of [5, 9, 21, 2 * Math.floor(n / 6) + 1]) {
        for (const polynomial of [2, 3]) {
          for (const derivative of [0, 1, 2]) {
            const options = { windowSize, polynomial, derivative };
            expectClose(xSavitzkyGolay(y, step, options), sgg(y, step, options), `trial ${trial}, ${JSON.stringify(options)}`);
          }
        }
      }
    }
  });

  it('refuses a window the library would refuse, naming the allowed range', () => {
    const y = new Float64Array(20);
    expect(() => xSavitzkyGolay(y, 1, { windowSize: 8 })).toThrow(/odd whole number from 5 to 20, got 8/);
    expect(() => xSavitzkyGolay(y, 1, { windowSize: 21 })).toThrow(/got 21/);
    expect(() => xSavitzkyGolay(y, 1, { windowSize: 3 })).toThrow(/got 3/);
  });
});
