/**
 * A band whose maximum lies just beyond the red end of the range is proposed
 * from its flank even where the flank is convex (xyLowEndBandCandidate): the
 * flank of a band is convex beyond its inflection point, about half a FWHM
 * from the centre, and there it falls far faster than a baseline straight in
 * wavelength. Spectra from the corpus generator (tests/accuracy/
 * generate-spectrum.ts: asymmetric log-normal bands, a CT band above the
 * range, ∝ ν̃⁴ scattering, a sloping offset, 200–1100 nm at 1 nm,
 * absorbance rounded to 0.01, no noise): synthetic, not measurements.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

// [Ni(H2O)6]2+: 3T2g ≈ 8 500, 3T1g(F) ≈ 13 800–14 400 with the 1Eg shoulder near 15 200, 3T1g(P) ≈ 25 300–25 700 cm-1,
// ε ≈ 2–5 (Lever, Inorganic Electronic Spectroscopy, 2nd ed., 1984, from memory). Widths, skews, CT band and scattering
// are invented to look measured.
const nickel = (first: number, skew: number): TruthBand[] => [
  { label: '3T2g(F)', level: '3T2g#0', centre: first, position: first, fwhm: 3450, skew, epsilon: 2.7, kind: 'spin-allowed', weak: false },
  { label: '3T1g(F)', level: '3T1g#0', centre: 14390, position: 14390, fwhm: 3720, skew: 1.19, epsilon: 2.6, kind: 'spin-allowed', weak: false },
  { label: '1Eg(D)', level: '1Eg#0', centre: 15250, position: 15250, fwhm: 900, skew: 1.03, epsilon: 0.8, kind: 'spin-forbidden', weak: false },
  { label: '3T1g(P)', level: '3T1g#1', centre: 25700, position: 25700, fwhm: 4040, skew: 1.22, epsilon: 2.7, kind: 'spin-allowed', weak: false },
];

describe('a band maximum just beyond the red end (200–1100 nm, 0.01, no concentration)', () => {
  // Before the straight-in-nm comparison each of these lost the 3T2g band (a convex flank that fell "only" 45–49 % of
  // the range's height within 1 500 cm-1), and with it 10Dq.
  const settings: Array<[first: number, skew: number]> = [[8550, 1.2], [8700, 1.2], [8850, 1.05], [8850, 1.2]];
  it.each(settings)('Ni(II) aqua with 3T2g at %i cm-1 (skew %f): reported beyond the red end, near its maximum', (first, skew) => {
    const s = generateSpectrum(nickel(first, skew), WINDOWS['uv-vis'], {
      digits: 2, noise: 0, offset: 0.01, slope: 0.005, scatter: 0.01, chargeTransfer: { edgeAbsorbance: 1.8, fwhm: 7000, epsilon: 3000 },
    }, 0.3, 1);
    const r = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral' });
    const red = r.bands[0]!;
    expect(red.window).toBe('beyond-red-end');
    expect(red.maximumInWindow).toBe(false);
    // Estimated from its flank: within 700 cm-1 (a fifth of its width).
    expect(Math.abs(red.position - first)).toBeLessThan(700);
    // The other two spin-allowed bands stay.
    for (const p of [14390, 25700]) expect(r.bands.some((b) => Math.abs(b.position - p) < 700), `${p}`).toBe(true);
  });
});
