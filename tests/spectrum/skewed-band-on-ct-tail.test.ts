/**
 * A d–d band skewed to high energy on a charge-transfer tail, recorded as a
 * visible spectrometer exports it (380–780 nm, 1 nm steps, absorbance
 * rounded to 0.01, no noise of its own): one band, not a band and a false
 * shoulder where its heavy high-energy side meets the rise (issue 13, the
 * known false shoulder; the fix: skewExplains in src/spectrum/fit-band-model.ts).
 *
 * The spectra are built with tests/spectrum/realistic.ts (split Gaussians in
 * energy, a Gaussian CT band above the range). Positions, widths and ε are
 * invented to span what such spectra show (a spin-allowed octahedral band of
 * ε ≈ 12 and FWHM 3 000–4 200 cm-1, skewness 1.2–1.6, a CT band centred
 * 30 000–36 000 cm-1; common practice), so no number here is an outside
 * check value: the test checks what the spectrum stage finds against what
 * the spectrum was built with.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { realisticCsv, type RealisticBand, type RealisticOptions } from './realistic.js';

const CT = {
  steep: { position: 36_000, fwhm: 8000, epsilon: 4000 },
  moderate: { position: 33_000, fwhm: 6000, epsilon: 2000 },
  near: { position: 30_000, fwhm: 5000, epsilon: 600 },
} as const;

function ddBands(options: RealisticOptions) {
  const spectrum = parseSpectrumText(realisticCsv(options)).spectra[0]!;
  return processSpectrum(spectrum, { geometry: 'octahedral' }).bands.filter((b) => b.kind !== 'charge-transfer');
}

describe('a skewed d–d band on a charge-transfer tail, 380–780 nm, rounded to 0.01', () => {
  it('the case that showed it: one band at 17 000 cm-1 (skew 1.4) under a steep rise gives no shoulder near 24 400', () => {
    // Before the fix: bands at 17 065 and 24 416 cm-1, the second flagged as a shoulder with σ 790 cm-1.
    const bands = ddBands({ bands: [{ position: 17_000, epsilon: 12, fwhm: 3000, skew: 1.4 }], concentration: 0.05, chargeTransfer: CT.steep });
    expect(bands.map((b) => Math.round(b.position))).toHaveLength(1);
    expect(Math.abs(bands[0]!.position - 17_000)).toBeLessThan(300);
  });

  // 72 spectra: four positions, three skews, two widths, three CT tails.
  const cases: Array<{ band: RealisticBand; ct: keyof typeof CT }> = [];
  for (const position of [15_000, 17_000, 19_000, 21_000]) {
    for (const skew of [1.2, 1.4, 1.6]) {
      for (const fwhm of [3000, 4200]) for (const ct of Object.keys(CT) as Array<keyof typeof CT>) cases.push({ band: { position, epsilon: 12, fwhm, skew }, ct });
    }
  }
  it.each(cases)('one band for %o', ({ band, ct }) => {
    const bands = ddBands({ bands: [band], concentration: 0.05, chargeTransfer: CT[ct] });
    expect(bands).toHaveLength(1);
    expect(Math.abs(bands[0]!.position - band.position)).toBeLessThan(0.15 * band.fwhm);
  });

  it('a real second band under the rise still shows (ν2 of a two-band spectrum, 8 000 cm-1 above ν1)', () => {
    // The cases that lost it before the fix was limited to one skewed band (its components within 2 000 cm-1 and
    // 1.6× in width): a broad "skew component" had reached for this band.
    for (const ct of ['moderate', 'steep'] as const) {
      const bands = ddBands({
        bands: [{ position: 17_000, epsilon: 12, fwhm: 3200, skew: 1.4 }, { position: 25_300, epsilon: 5, fwhm: 3500, skew: 1.4 }],
        concentration: 0.05, chargeTransfer: CT[ct],
      });
      expect(bands, ct).toHaveLength(2);
      expect(Math.abs(bands[1]!.position - 25_300), ct).toBeLessThan(1000);
    }
  });
});
