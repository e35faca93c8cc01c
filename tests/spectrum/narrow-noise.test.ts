/**
 * Smoothed noise is not a narrow band (bandsAboveResidual): instrument
 * smoothing (a 5-point moving average) hides noise from neighbouring-point
 * second differences, so the noise model underrates it; the fit's residual
 * beside a narrow band does not. Real sharp lines stand far above it. The
 * spectra are invented test data from the corpus generator.
 */
import { describe, expect, it } from 'vitest';
import { bandsAboveResidual } from '../../src/spectrum/bands-above-residual.js';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { WINDOWS, generateSpectrum } from '../accuracy/generate-spectrum.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';
import { mulberry32 } from '../../src/spectrum/random.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

const band = (position: number, fwhm: number, skew: number, epsilon: number): TruthBand => ({
  label: 'test', level: 'test', centre: position, position, fwhm, skew, epsilon, kind: 'spin-allowed', weak: false,
});

describe('bandsAboveResidual', () => {
  const x = Float64Array.from({ length: 200 }, (_, i) => 20000 + 50 * i);
  const random = mulberry32(7);
  const residual = Float64Array.from(x, () => 0.002 * (random() - 0.5) * Math.sqrt(12));

  it('drops a narrow band under five residual deviations and keeps one above, and every broad band', () => {
    const bands = [
      { position: 24000, fwhm: 400, height: 0.004 }, // 2 σ
      { position: 26000, fwhm: 400, height: 0.02 }, // 10 σ
      { position: 22000, fwhm: 3000, height: 0.004 }, // broad: left to the band fit
    ];
    expect(bandsAboveResidual(bands, x, residual, 600)).toEqual([1, 2]);
  });
});

describe('smoothed noisy spectra', () => {
  it('hold no narrow band that is only smoothed noise (the corpus case cu2-aqua/nir: a bump near 27 700 cm-1 on the CT tail)', () => {
    const c = corpusCases().find((k) => k.id === 'cu2-aqua/nir')!;
    const found = processSpectrum(parseSpectrumText(caseSpectrum(c).csv).spectra[0]!, { geometry: 'octahedral', concentration: c.concentration }).bands;
    expect(found.filter((b) => b.fwhm < 1200)).toEqual([]);
    expect(found).toHaveLength(2);
  });

  it('keep the sharp spin-forbidden lines of Mn(II) (ε 0.03 on 250 cm-1 at 1.5 mol/L, 10 cm)', () => {
    const lines = [band(19000, 2200, 1.1, 0.011), band(22400, 1700, 1.2, 0.014), { ...band(25100, 250, 1.2, 0.035), kind: 'spin-forbidden' as const }];
    const s = generateSpectrum(lines, WINDOWS['uv-vis'], { digits: 3, noise: 0.0015, smooth: 5, offset: 0.02, slope: 0, scatter: 0.01 }, 1.5, 21, 10);
    const found = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: 1.5, pathLength: 10 }).bands;
    expect(found.some((b) => Math.abs(b.position - 25100) < 100 && b.fwhm < 600)).toBe(true);
  });
});
