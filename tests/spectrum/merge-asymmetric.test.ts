/**
 * gaussiansGroupMultiplets on the asymmetric case: a main band and a weaker
 * component on its high-energy side that together are one skewed band
 * (log-normal, ρ ≤ 1.35; Siano & Metzler, J. Chem. Phys. 51 (1969) 1856)
 * are one band; pairs that are not (a weaker component on the low-energy
 * side, two maxima, a narrow line, a shoulder of comparable height) stay
 * two. End to end: a log-normal band of skewness 1.29 on smoothed noisy
 * data, as a UV-vis-NIR instrument exports it (invented test data from the
 * corpus generator), is one band at its maximum.
 */
import { describe, expect, it } from 'vitest';
import { gaussiansGroupMultiplets } from '../../src/spectrum/gaussians-group-multiplets.js';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import type { GaussianParameters } from '../../src/spectrum/xy-refine-bands.js';
import { WINDOWS, generateSpectrum } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

const sd = (n: number) => new Float64Array(n).fill(50);
/** The one joining rule with processSpectrum's narrow-band limit (600 cm-1). */
const joinedBands = (bands: GaussianParameters[], positionSd: Float64Array) => gaussiansGroupMultiplets(bands, positionSd, { minFwhm: 600 });

/** Slow reference: the maximum of the pair's sum on a 0.5 cm-1 scan. */
function sumMaximum(parts: GaussianParameters[]): number {
  let best = 0;
  let at = 0;
  for (let x = 15000; x <= 27000; x += 0.5) {
    const v = parts.reduce((s, b) => s + b.height * Math.exp(-4 * Math.LN2 * ((x - b.position) / b.fwhm) ** 2), 0);
    if (v > best) [best, at] = [v, x];
  }
  return at;
}

describe('gaussiansGroupMultiplets: a skewed band fitted as two Gaussians', () => {
  it('joins a band and its high-energy asymmetry component (the two Gaussians a fit gives a ρ 1.3 band)', () => {
    const pair = [{ position: 20240, fwhm: 1970, height: 0.79 }, { position: 21830, fwhm: 2870, height: 0.34 }];
    const { bands, positionSd } = joinedBands(pair, sd(2));
    expect(bands).toHaveLength(1);
    expect(positionSd).toHaveLength(1);
    // Area kept.
    expect(bands[0]!.height * bands[0]!.fwhm).toBeCloseTo(0.79 * 1970 + 0.34 * 2870, 6);
    // At the maximum of the sum, below the area-weighted mean (the skew of a d–d band: the long tail is on the high-energy side).
    expect(Math.abs(bands[0]!.position - sumMaximum(pair))).toBeLessThanOrEqual(2);
    expect(bands[0]!.position).toBeLessThan((0.79 * 1970 * 20240 + 0.34 * 2870 * 21830) / (0.79 * 1970 + 0.34 * 2870));
  });

  it('keeps a Jahn–Teller pair whose weaker component lies on the low-energy side', () => {
    const pair = [{ position: 13840, fwhm: 2080, height: 0.39 }, { position: 16840, fwhm: 3010, height: 0.94 }];
    expect(joinedBands(pair, sd(2)).bands).toHaveLength(2);
  });

  it('keeps two bands whose sum has two maxima, and a narrow line on a band', () => {
    expect(joinedBands([{ position: 15000, fwhm: 2400, height: 1 }, { position: 18000, fwhm: 2400, height: 0.8 }], sd(2)).bands).toHaveLength(2);
    expect(joinedBands([{ position: 14400, fwhm: 3800, height: 0.7 }, { position: 15400, fwhm: 500, height: 0.2 }], sd(2)).bands).toHaveLength(2);
  });

  it('keeps a pair no skewed band describes: a weak component 2 400 cm-1 up with half the height', () => {
    expect(joinedBands([{ position: 15000, fwhm: 2400, height: 1 }, { position: 17400, fwhm: 2400, height: 0.5 }], sd(2)).bands).toHaveLength(2);
  });
});

describe('a skewed band on smoothed noisy data', () => {
  const band = (position: number, fwhm: number, skew: number, epsilon: number): TruthBand => ({
    label: 'test', level: 'test', centre: position, position, fwhm, skew, epsilon, kind: 'spin-allowed', weak: false,
  });
  for (const seed of [1, 3, 4]) {
    it(`is one band within 100 cm-1 of its maximum (ρ 1.29, seed ${seed})`, () => {
      const s = generateSpectrum([band(20500, 2900, 1.29, 100), band(28700, 3200, 1.15, 80)], WINDOWS['uv-vis-nir'], {
        digits: 3, noise: 0.001, smooth: 5, offset: 0.01, slope: 0, scatter: 0.003, chargeTransfer: { edgeAbsorbance: 1.5, fwhm: 7800, epsilon: 2300 },
      }, 0.0087, seed);
      const found = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral' }).bands;
      expect(found.map((b) => Math.round(b.position / 1000))).toEqual([21, 29]);
      expect(Math.abs(found[0]!.position - 20500)).toBeLessThan(100);
    });
  }
});

describe('a shoulder of comparable height', () => {
  it('stays a band of its own (the 4T1g(P) components of Co(II), 0.84 of the main band)', () => {
    const pair = [{ position: 19210, fwhm: 2370, height: 0.75 }, { position: 21110, fwhm: 2990, height: 0.63 }];
    expect(joinedBands(pair, new Float64Array(2)).bands).toHaveLength(2);
  });
});
