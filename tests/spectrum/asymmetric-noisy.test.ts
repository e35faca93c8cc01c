/**
 * One asymmetric band on noisy data is one band: the Gaussian band model's
 * misfit to a log-normal band (skewness ρ = 1.25, within the 1.05–1.3 of
 * measured d–d bands; band shape of Siano & Metzler, J. Chem. Phys. 51
 * (1969) 1856) exceeds a noise of 0.002 absorbance at a peak of 0.6, and it
 * must not be read as a second band. The spectra are invented test data
 * made with the corpus generator (tests/accuracy/generate-spectrum.ts).
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { WINDOWS, generateSpectrum } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

const band = (position: number, fwhm: number, skew: number, epsilon: number): TruthBand => ({
  label: 'test', level: 'test', centre: position, position, fwhm, skew, epsilon, kind: 'spin-allowed', weak: false,
});

function bandsOf(bands: TruthBand[], noise: number, seed: number) {
  const s = generateSpectrum(bands, WINDOWS['uv-vis'], { digits: 3, noise, offset: 0.01, slope: 0.005, scatter: 0.005 }, 0.02, seed);
  return processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: 0.02 }).bands;
}

describe('asymmetric bands on noisy data', () => {
  for (const seed of [1, 2, 3]) {
    it(`a log-normal band (ρ 1.25) with noise 0.002 is one band, its maximum within 300 cm-1 (seed ${seed})`, () => {
      const found = bandsOf([band(20500, 2900, 1.25, 30)], 0.002, seed);
      expect(found.length).toBe(1);
      // A Gaussian's centre lies toward the long tail of an asymmetric band by about FWHM·(ρ − 1)/(2(ρ + 1)) ≈ 160 cm-1 here.
      expect(Math.abs(found[0]!.position - 20500)).toBeLessThan(300);
    });
  }

  it('two asymmetric bands 8 000 cm-1 apart are two bands, not four', () => {
    const found = bandsOf([band(16500, 3000, 1.2, 30), band(24800, 3300, 1.2, 40)], 0.002, 4);
    expect(found.map((b) => Math.round(b.position / 1000))).toEqual([17, 25]);
  });

  it('a real shoulder a quarter of the main band and 3 000 cm-1 above it is still found, the main band at its maximum', () => {
    const found = bandsOf([band(17000, 2800, 1.15, 40), band(20000, 2600, 1.15, 10)], 0.002, 5);
    expect(found.length).toBe(2);
    expect(Math.abs(found[0]!.position - 17000)).toBeLessThan(300);
    // The shoulder's Gaussian also takes the main band's long tail, so its centre is only good to about a third of its width.
    expect(Math.abs(found[1]!.position - 20000)).toBeLessThan(1000);
  });
});
