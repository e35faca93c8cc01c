/**
 * xyBandMaximum against a slow, obviously correct reference: the maximum of
 * the band's own data by a dense scan of the exact log-normal shape
 * (Siano & Metzler, J. Chem. Phys. 51 (1969) 1856; tests/accuracy/band-shape.ts),
 * whose maximum is also its parameter ν₀ (invented bands); the parabola's
 * vertex is checked against exact algebra.
 */
import { describe, expect, it } from 'vitest';
import { xyBandMaximum, xyParabolaVertex } from '../../src/spectrum/xy-band-maximum.js';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
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
      expect(Math.abs(found!.position - truth)).toBeLessThan(40);
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

describe('xyParabolaVertex', () => {
  it('finds the vertex of an exact parabola with no spread, and refuses one that opens upward', () => {
    const t = Array.from({ length: 11 }, (_, i) => -0.25 + 0.05 * i);
    const v = xyParabolaVertex(t, t.map((x) => 3 - 2 * (x - 0.05) ** 2));
    expect(v!.t).toBeCloseTo(0.05, 12);
    expect(v!.sd).toBeLessThan(1e-9);
    expect(xyParabolaVertex(t, t.map((x) => 1 + x * x))).toBeNull();
    expect(xyParabolaVertex(t.slice(0, 5), t.slice(0, 5))).toBeNull();
  });
});

describe('xyBandMaximum on a 25 cm-1 grid', () => {
  it('moves a Gaussian centre placed 200 cm-1 up the tail of a log-normal band (skew 1.3) to its maximum, with a σ', () => {
    const x = grid(10000, 25000, 25);
    const found = xyBandMaximum(x, Float64Array.from(x, (v) => 0.8 * logNormalBand(v, 17000, 3000, 1.3)), 17200, 3000);
    expect(Math.abs(found!.position - 17000)).toBeLessThan(40);
    expect(found!.sd).toBeGreaterThan(0);
  });

  it('keeps the fitted centre (null) where the top of the band is masked', () => {
    const x = grid(10000, 25000, 25);
    const own = Float64Array.from(x, (v) => (Math.abs(v - 17100) < 100 ? Number.NaN : logNormalBand(v, 17000, 3000, 1.3)));
    expect(xyBandMaximum(x, own, 17200, 3000)).toBeNull();
  });
});

describe('processSpectrum reports an asymmetric band as one band at its maximum', () => {
  it('two log-normal bands (skew 1.25, 1.3) on a 1 nm grid, rounded to 0.001: two bands, the lower within 80 cm-1 of its maximum', () => {
    const truth = [{ at: 16500, fwhm: 3200, skew: 1.25, a: 0.5 }, { at: 23500, fwhm: 3500, skew: 1.3, a: 0.6 }];
    const lines = ['nm,A'];
    for (let nm = 300; nm <= 800; nm++) {
      const x = 1e7 / nm;
      lines.push(`${nm},${(0.02 + truth.reduce((s, b) => s + b.a * logNormalBand(x, b.at, b.fwhm, b.skew), 0)).toFixed(3)}`);
    }
    const result = processSpectrum(parseSpectrumText(`${lines.join('\n')}\n`).spectra[0]!);
    // The skewed band is not split into a band and a false shoulder (the data's second derivative shows one band).
    expect(result.bands).toHaveLength(2);
    const low = result.bands.find((f) => Math.abs(f.position - 16500) < 1000)!;
    expect(Math.abs(low.position - 16500)).toBeLessThan(80);
  });
});
