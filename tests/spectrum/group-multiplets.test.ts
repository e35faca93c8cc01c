/**
 * gaussiansGroupMultiplets: overlapping components of one envelope become one
 * band at the envelope's maximum; resolved pairs and narrow lines stay apart.
 * Invented components; the reference for the maximum is a dense sampling of
 * the sum (slow and obviously correct), not an outside value.
 */
import { describe, expect, it } from 'vitest';
import { gaussiansCurvatureMinima, gaussiansGroupMultiplets } from '../../src/spectrum/gaussians-group-multiplets.js';
import type { GaussianParameters } from '../../src/spectrum/xy-refine-bands.js';

const value = (x: number, parts: GaussianParameters[]): number =>
  parts.reduce((s, b) => s + b.height * Math.exp(-4 * Math.LN2 * ((x - b.position) / b.fwhm) ** 2), 0);

/** Slow reference: the maximum of the sum on a 0.5 cm-1 grid. */
function envelopeMaximum(parts: GaussianParameters[]): { position: number; height: number } {
  let best = { position: 0, height: -1 };
  for (let x = 5000; x <= 30000; x += 0.5) {
    const v = value(x, parts);
    if (v > best.height) best = { position: x, height: v };
  }
  return best;
}

const area = (parts: GaussianParameters[]): number => parts.reduce((s, b) => s + b.height * b.fwhm, 0);

describe('gaussiansGroupMultiplets', () => {
  it('joins two Gaussians that describe one asymmetric band: at the maximum of their sum, area kept', () => {
    const parts = [{ position: 16400, height: 1, fwhm: 2600 }, { position: 17600, height: 0.45, fwhm: 3000 }];
    expect(gaussiansCurvatureMinima(parts)).toBe(1);
    const g = gaussiansGroupMultiplets(parts, Float64Array.of(10, 20));
    expect(g.bands).toHaveLength(1);
    expect(g.components[0]).toHaveLength(2);
    const reference = envelopeMaximum(parts);
    const band = g.bands[0]!;
    expect(Math.abs(band.position - reference.position)).toBeLessThanOrEqual(2);
    expect(band.height).toBeCloseTo(reference.height, 4);
    expect(band.height * band.fwhm).toBeCloseTo(area(parts), 6);
    // σ of the area-weighted mean: √Σ (a_k/A)² σ_k²
    const a = parts.map((b) => b.height * b.fwhm / area(parts));
    expect(g.positionSd[0]).toBeCloseTo(Math.hypot(a[0]! * 10, a[1]! * 20), 9);
  });

  it('joins the three components of an unresolved spin–orbit multiplet into one band', () => {
    const parts = [{ position: 15400, height: 0.8, fwhm: 2000 }, { position: 16100, height: 1, fwhm: 2000 }, { position: 16750, height: 0.7, fwhm: 2000 }];
    const g = gaussiansGroupMultiplets(parts, new Float64Array(3));
    expect(g.bands).toHaveLength(1);
    expect(Math.abs(g.bands[0]!.position - envelopeMaximum(parts).position)).toBeLessThanOrEqual(2);
  });

  it('keeps a resolved doublet (two maxima) and a distinct shoulder as two bands', () => {
    const doublet = [{ position: 13800, height: 1, fwhm: 1600 }, { position: 15300, height: 0.9, fwhm: 1300 }];
    expect(gaussiansCurvatureMinima(doublet)).toBe(2);
    expect(gaussiansGroupMultiplets(doublet, new Float64Array(2)).bands).toHaveLength(2);
    const shoulder = [{ position: 19400, height: 1, fwhm: 2600 }, { position: 21300, height: 0.45, fwhm: 2400 }];
    expect(gaussiansCurvatureMinima(shoulder)).toBe(2);
    expect(gaussiansGroupMultiplets(shoulder, new Float64Array(2)).bands).toHaveLength(2);
  });

  it('never joins a narrow (spin-forbidden) line to a broad band, nor components spanning more than 2000 cm-1', () => {
    const line = [{ position: 14000, height: 1, fwhm: 3000 }, { position: 14500, height: 0.2, fwhm: 600 }];
    expect(gaussiansGroupMultiplets(line, new Float64Array(2)).bands).toHaveLength(2);
    const wide = [{ position: 12000, height: 1, fwhm: 5000 }, { position: 14200, height: 0.6, fwhm: 5000 }];
    expect(gaussiansCurvatureMinima(wide)).toBe(1);
    expect(gaussiansGroupMultiplets(wide, new Float64Array(2)).bands).toHaveLength(2);
  });

  it('returns a lone band unchanged, sorted by position', () => {
    const parts = [{ position: 25000, height: 1, fwhm: 3000 }, { position: 9000, height: 2, fwhm: 3000 }];
    const g = gaussiansGroupMultiplets(parts, Float64Array.of(5, 7));
    expect(g.bands.map((b) => b.position)).toEqual([9000, 25000]);
    expect(Array.from(g.positionSd)).toEqual([7, 5]);
  });
});

describe('gaussiansGroupMultiplets with the bands the data showed', () => {
  it('joins two components whose sum shows a shoulder when the data showed one band there, not when they showed two', () => {
    const parts = [{ position: 16193, height: 0.487, fwhm: 2254 }, { position: 18085, height: 0.221, fwhm: 2105 }];
    expect(gaussiansCurvatureMinima(parts)).toBe(2);
    expect(gaussiansGroupMultiplets(parts, new Float64Array(2)).bands).toHaveLength(2);
    expect(gaussiansGroupMultiplets(parts, new Float64Array(2), { dataBands: [16400] }).bands).toHaveLength(1);
    expect(gaussiansGroupMultiplets(parts, new Float64Array(2), { dataBands: [16200, 18100] }).bands).toHaveLength(2);
  });
});
