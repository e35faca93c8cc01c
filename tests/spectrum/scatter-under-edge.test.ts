/**
 * The bend below a charge-transfer edge is not a band (fit-band-model.ts,
 * bandUnderEdge and curvatureExplains): a band under the UV edge is kept
 * only where one more order of the baseline cannot take its place.
 *
 * Spectra from the corpus generator (tests/accuracy/generate-spectrum.ts):
 * asymmetric log-normal bands, a CT band above the range, ∝ ν̃⁴ scattering,
 * a sloping offset, 380–780 nm at 1 nm, absorbance rounded to 0.01, no
 * noise. They are synthetic, not measurements.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

// [Cu(NH3)4(H2O)2]2+: one broad d9 band near 16 000 cm-1 (610 nm), ε ≈ 50 (Lever, Inorganic Electronic Spectroscopy,
// 2nd ed., 1984, from memory), here as two Jahn–Teller components 2 800 cm-1 apart; widths, skews, the CT band and the
// baseline are invented to look measured.
const copperBands = (skew: number): TruthBand[] => [
  { label: '2T2g(D)', level: '2T2g#0', centre: 16150, position: 14300, fwhm: 2250, skew, epsilon: 24, kind: 'spin-allowed', weak: false },
  { label: '2T2g(D)', level: '2T2g#0', centre: 16150, position: 17100, fwhm: 2270, skew, epsilon: 49, kind: 'spin-allowed', weak: false },
];

const CONCENTRATION = 0.0098;

function processCopper(scatter: number, ctFwhm: number, edgeAbsorbance: number, skew: number) {
  const s = generateSpectrum(copperBands(skew), WINDOWS.visible, {
    digits: 2, noise: 0, offset: 0.02, slope: -0.006, scatter, chargeTransfer: { edgeAbsorbance, fwhm: ctFwhm, epsilon: 2350 },
  }, CONCENTRATION, 1);
  return processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: CONCENTRATION });
}

describe('the bend below a charge-transfer edge', () => {
  // Each of these gave a third band near 24 000–24 700 cm-1 before curvatureExplains: a d9 ion has one transition, and
  // the fit refused the three bands.
  const settings: Array<[scatter: number, ctFwhm: number, edge: number, skew: number]> = [
    [0, 8900, 1.7, 1.3],
    [0.02, 8900, 2.5, 1.3],
    [0.02, 11000, 1.7, 1.18],
    [0.04, 7000, 2.5, 1.3],
  ];
  it.each(settings)('adds no band between the Cu(II) ammine band and the CT rise (scatter %f, CT FWHM %i, edge %f, skew %f)', (scatter, ctFwhm, edge, skew) => {
    const r = processCopper(scatter, ctFwhm, edge, skew);
    expect(r.edge).not.toBeNull();
    // Nothing beyond the upper component's maximum plus its FWHM: the rise is the CT band and the scattering.
    expect(r.bands.filter((b) => b.position > 17100 + 2500).map((b) => Math.round(b.position))).toEqual([]);
    // Both Jahn–Teller components stay (within a quarter of their width).
    for (const p of [14300, 17100]) expect(r.bands.some((b) => Math.abs(b.position - p) < 600), `${p}`).toBe(true);
  });
});
