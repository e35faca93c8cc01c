/**
 * Bands are reported at their maximum as the data show it
 * (xyBandDataMaxima), not at the centre of a symmetric Gaussian fitted to an
 * asymmetric band. The asymmetric band is the log-normal of D. B. Siano and
 * D. E. Metzler, J. Chem. Phys. 51 (1969) 1856 (tests/accuracy/band-shape.ts),
 * whose maximum is its parameter ν₀: the check value is that parameter of
 * invented bands, and the parabola's vertex is checked against exact algebra.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { xyBandDataMaxima, xyParabolaVertex } from '../../src/spectrum/xyBandDataMaxima.js';
import { logNormalBand } from '../accuracy/band-shape.js';

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

describe('xyBandDataMaxima', () => {
  it('moves a Gaussian centre placed 200 cm-1 up the tail of a log-normal band (skew 1.3) to its maximum', () => {
    const grid = Float64Array.from({ length: 601 }, (_, i) => 10000 + 25 * i);
    const signal = Float64Array.from(grid, (x) => 0.8 * logNormalBand(x, 17000, 3000, 1.3));
    const { positions, sd } = xyBandDataMaxima(grid, signal, new Float64Array(grid.length), [{ position: 17200, height: 0.8, fwhm: 3000 }]);
    expect(Math.abs(positions[0]! - 17000)).toBeLessThan(40);
    expect(sd[0]).toBeGreaterThan(0);
  });

  it('keeps the fitted centre where the data have no maximum near it (a band on a masked stretch)', () => {
    const grid = Float64Array.from({ length: 601 }, (_, i) => 10000 + 25 * i);
    const signal = Float64Array.from(grid, (x) => (Math.abs(x - 17100) < 100 ? Number.NaN : logNormalBand(x, 17000, 3000, 1.3)));
    const { positions, sd } = xyBandDataMaxima(grid, signal, new Float64Array(grid.length), [{ position: 17200, height: 1, fwhm: 3000 }]);
    expect(positions[0]).toBe(17200);
    expect(sd[0]).toBe(0);
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
