/**
 * A narrow spin-forbidden line on the high-energy side of a broad
 * spin-allowed band: the fit must not end with a narrower component on the
 * band's low-energy flank and the broad band, too narrow, between the two
 * (fit-band-model.ts, narrowLineRestart). Spectra from the corpus generator
 * (tests/accuracy/generate-spectrum.ts: asymmetric log-normal bands, a CT
 * band above the range, ∝ ν̃⁴ scattering, a sloping offset, 380–780 nm at
 * 1 nm listed from long to short, absorbance rounded to 0.01, no noise):
 * synthetic, not measurements.
 */
import { describe, expect, it } from 'vitest';
import { parseSpectrumText, processSpectrum } from '../../src/spectrum/index.js';
import { generateSpectrum, WINDOWS } from '../accuracy/generate-spectrum.js';
import type { TruthBand } from '../accuracy/truth-bands.js';

// [Ni(H2O)6]2+: 3T2g ≈ 8 500–8 800 (outside this window), 3T1g(F) ≈ 13 800–14 600 with the 1Eg(D) line on its
// high-energy side near 15 200–15 800, 3T1g(P) ≈ 25 300 cm-1, ε ≈ 2–5 (Lever, Inorganic Electronic Spectroscopy,
// 2nd ed., 1984, from memory). Widths, skews, the line's strength, the CT band and the baseline are invented.
const BROAD = 14570;
const nickel = (line: number, skew: number, ratio: number): TruthBand[] => [
  { label: '3T2g(F)', level: '3T2g#0', centre: 8760, position: 8760, fwhm: 3460, skew: 1.22, epsilon: 5.4, kind: 'spin-allowed', weak: false },
  { label: '3T1g(F)', level: '3T1g#0', centre: BROAD, position: BROAD, fwhm: 4180, skew, epsilon: 5.0, kind: 'spin-allowed', weak: false },
  { label: '1Eg(D)', level: '1Eg#0', centre: line, position: line, fwhm: 900, skew: 1.14, epsilon: 5.0 * ratio, kind: 'spin-forbidden', weak: false },
  { label: '3T1g(P)', level: '3T1g#1', centre: 25300, position: 25300, fwhm: 3580, skew: 1.16, epsilon: 3.6, kind: 'spin-allowed', weak: false },
];

describe('a narrow line on the high-energy side of a broad band (Ni(II) aqua, 380–780 nm, 0.01)', () => {
  // Before narrowLineRestart each of these reported the broad band 700–950 cm-1 high (15 250–15 500 cm-1) and lost the line.
  const settings: Array<[line: number, skew: number, ratio: number]> = [[15450, 1.2, 0.3], [15650, 1.28, 0.36], [15850, 1.2, 0.3], [15850, 1.28, 0.36]];
  it.each(settings)('1Eg at %i cm-1 (3T1g(F) skew %f, line/band ε %f): the band at its maximum and the line apart', (line, skew, ratio) => {
    const s = generateSpectrum(nickel(line, skew, ratio), WINDOWS.visible, {
      digits: 2, noise: 0, offset: 0.004, slope: -0.006, scatter: 0.0095, chargeTransfer: { edgeAbsorbance: 0.9, fwhm: 7650, epsilon: 1940 }, descending: true,
    }, 0.19, 1);
    const r = processSpectrum(parseSpectrumText(s.csv).spectra[0]!, { geometry: 'octahedral', concentration: 0.19 });
    const dd = r.bands.filter((b) => b.kind === 'd-d');
    // The broad band within 400 cm-1 of its maximum (a tenth of its width; the line beside it pulls its reported maximum up).
    expect(dd.some((b) => Math.abs(b.position - BROAD) < 400), dd.map((b) => Math.round(b.position)).join(',')).toBe(true);
    // The line as a band of its own, near its position.
    expect(r.bands.some((b) => b.kind === 'spin-forbidden' && Math.abs(b.position - line) < 300)).toBe(true);
  });
});
