/**
 * xyBandMaximum against a slow, obviously correct reference: the maximum of
 * the band's own data by a dense scan of the exact log-normal shape
 * (Siano & Metzler, J. Chem. Phys. 51 (1969) 1856; tests/accuracy/band-shape.ts).
 */
import { describe, expect, it } from 'vitest';
import { xyBandMaximum } from '../../src/spectrum/xyBandMaximum.js';
import { logNormalBand } from '../accuracy/band-shape.js';

const grid = (from: number, to: number, step: number) => Float64Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

/** Slow reference: the highest value of f on a 1 cm-1 scan. */
function scanMaximum(f: (x: number) => number, from: number, to: number): number {
  let best = from;
  for (let x = from; x <= to; x += 1) if (f(x) > f(best)) best = x;
  return best;
}

describe('xyBandMaximum', () => {
  for (const skew of [1, 1.1, 1.2, 1.3]) {
    it(`finds the maximum of a log-normal band of skewness ${skew} from its Gaussian centre (within 40 cm-1 on a 100 cm-1 grid)`, () => {
      const f = (x: number) => 0.6 * logNormalBand(x, 18000, 3000, skew);
      const x = grid(10000, 30000, 100);
      const y = Float64Array.from(x, f);
      // A Gaussian fitted to the band has its centre on the long (high-energy) tail.
      const centre = 18000 + 3000 * (skew - 1) / (skew + 1);
      const truth = scanMaximum(f, 15000, 21000);
      const found = xyBandMaximum(x, y, centre, 3000);
      expect(found).not.toBeNull();
      expect(Math.abs(found! - truth)).toBeLessThan(40);
    });
  }

  it('keeps the centre (null) when the top lies above the centre: unresolved components', () => {
    const f = (x: number) => 0.3 * logNormalBand(x, 9000, 2400, 1.2) + 0.5 * logNormalBand(x, 11000, 2400, 1.2);
    const x = grid(8000, 20000, 100);
    expect(xyBandMaximum(x, Float64Array.from(x, f), 10300, 3700)).toBeNull();
  });

  it('keeps the centre (null) for a line narrower than a few grid steps', () => {
    const x = grid(20000, 30000, 100);
    const y = Float64Array.from(x, (v) => logNormalBand(v, 25000, 250, 1.1));
    expect(xyBandMaximum(x, y, 25010, 250)).toBeNull();
  });
});
