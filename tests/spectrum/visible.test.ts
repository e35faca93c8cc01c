/**
 * Visible-only spectra (380–780 nm, 1 nm steps, absorbance rounded to 0.01
 * or 0.001, no noise of their own) of aqueous Ni(II), Co(II), Cu(II) and
 * permanganate, as instruments export them (realistic.ts: asymmetric
 * bands, a split band, a shoulder, a Jahn–Teller component, scattering and
 * a charge-transfer tail). Band positions and ε are published values
 * (visible-cases.ts names each source); the truth a check compares with is
 * the maximum of the generated spectrum, which is computed here, so the
 * checks test the band finder against the spectrum it was given, and the
 * published position is quoted beside each.
 */
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { FieldgapError } from '../../src/errors.js';
import { parseSpectrumText, processSpectrum, type ProcessSpectrumOptions } from '../../src/spectrum/index.js';
import type { Band, ProcessedSpectrum } from '../../src/spectrum/types.js';
import { realisticAbsorbance, realisticCsv, type RealisticOptions } from './realistic.js';
import { COBALT, COPPER, NICKEL, PERMANGANATE } from './visible-cases.js';

function process(o: RealisticOptions, options: ProcessSpectrumOptions = {}): ProcessedSpectrum {
  const spectrum = parseSpectrumText(realisticCsv(o)).spectra[0]!;
  return processSpectrum(spectrum, options);
}

/** The band nearest to a position (cm-1). */
function nearest(bands: Band[], position: number): Band {
  return bands.reduce((best, b) => (Math.abs(b.position - position) < Math.abs(best.position - position) ? b : best));
}

/** Position of the largest absorbance of the generated spectrum between two wavenumbers (slow, 1 cm-1 steps). */
function trueMaximum(o: RealisticOptions, from: number, to: number): number {
  let best = from;
  for (let nu = from; nu <= to; nu++) if (realisticAbsorbance(1e7 / nu, o) > realisticAbsorbance(1e7 / best, o)) best = nu;
  return best;
}

const ROUNDINGS = [2, 3];

describe.each(ROUNDINGS)('visible-only spectra rounded to %i decimals', (decimals) => {
  const at = (o: RealisticOptions): RealisticOptions => ({ ...o, decimals });

  it('[Ni(H2O)6]2+: the two visible bands where they are, the 395 nm band near the blue end and no edge in its place', () => {
    const o = at(NICKEL.spectrum);
    const r = process(o, { concentration: o.concentration, geometry: 'octahedral' });
    expect(r.quantization).toBeCloseTo(10 ** -decimals, 12);
    expect(r.stepCorrections).toEqual([]);
    // The split 3T1g(F) band (two maxima, 725 and 655 nm) and 3T1g(P) (395 nm): three bands, no more.
    expect(r.bands.map((b) => b.kind)).toEqual(['d-d', 'd-d', 'd-d']);
    const blue = nearest(r.bands, 25_300); // published 25 300 cm-1 (found: thesis chapter on Ni(II) spectra, 123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN)
    expect(Math.abs(blue.position - trueMaximum(o, 24_000, 26_316))).toBeLessThan(300);
    expect(blue.window).toBe('near-blue-end');
    expect(blue.maximumInWindow).toBe(true);
    expect(r.warnings.some((w) => /maximum near the blue/.test(w))).toBe(true);
    if (r.edge !== null) expect(r.edge.position).toBeGreaterThan(r.range[1]);
    const low = nearest(r.bands, 13_800); // published 13 800 cm-1 (found: thesis chapter on Ni(II) spectra, 123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN)
    expect(Math.abs(low.position - trueMaximum(o, 13_000, 14_300))).toBeLessThan(300);
    expect(Math.abs(nearest(r.bands, 15_300).position - trueMaximum(o, 14_700, 16_000))).toBeLessThan(300);
  });

  it('[Co(H2O)6]2+: one band near 510 nm with its shoulder, the weak 4A2g band, no spurious band', () => {
    const o = at(COBALT.spectrum);
    const r = process(o, { concentration: o.concentration, geometry: 'octahedral' });
    expect(r.stepCorrections).toEqual([]);
    expect(r.bands).toHaveLength(3);
    const main = nearest(r.bands, 19_400); // published 19 400 cm-1 (from memory, Lever 1984); found 512 nm = 19 531 (+0.7 %), docs/sources.md CO-AQUA-IASJ
    expect(Math.abs(main.position - trueMaximum(o, 18_000, 20_500))).toBeLessThan(500);
    expect(main.kind).toBe('d-d');
    const shoulder = nearest(r.bands, 21_500);
    expect(shoulder.shoulder).toBe(true);
    expect(shoulder.position).toBeGreaterThan(main.position + 1000);
    // ε 0.5 (from memory): below the octahedral spin-allowed range, and well below the main band.
    expect(nearest(r.bands, 16_000).kind).toBe('spin-forbidden');
    expect(r.bands.every((b) => b.window === 'inside')).toBe(true);
  });

  it('[Cu(H2O)6]2+: ONE band, its maximum beyond the red end, centre within ±1000 cm-1, flagged', () => {
    const o = at(COPPER.spectrum);
    const r = process(o, { concentration: o.concentration, geometry: 'octahedral' });
    expect(r.stepCorrections).toEqual([]);
    expect(r.bands).toHaveLength(1);
    const band = r.bands[0]!;
    expect(band.window).toBe('beyond-red-end');
    expect(band.maximumInWindow).toBe(false);
    expect(Math.abs(band.position - trueMaximum(o, 9000, 16_000))).toBeLessThan(1000);
    expect(Math.abs(band.position - 12_300)).toBeLessThan(1000); // published maximum ≈ 12 300 cm-1 (from memory, Lever 1984)
    // An honest uncertainty: the centre is extrapolated from one flank.
    expect(band.positionUncertainty).toBeGreaterThan(300);
    expect(r.warnings.some((w) => /outside the measured range, beyond the red/.test(w))).toBe(true);
  });

  it('MnO4- (d0): charge-transfer bands only, with ε and with the ion alone', () => {
    const o = at(PERMANGANATE.spectrum);
    const withEpsilon = process(o, { concentration: o.concentration });
    expect(withEpsilon.bands.length).toBeGreaterThan(0);
    expect(withEpsilon.bands.every((b) => b.kind === 'charge-transfer')).toBe(true); // common practice: CT ε > ~1000
    expect(withEpsilon.stepCorrections).toEqual([]);
    const byIon = process(o, { chargeTransferOnly: true });
    expect(byIon.bands.every((b) => b.kind === 'charge-transfer')).toBe(true);
  });
});

describe('the pipeline on the visible-only spectra', () => {
  it('gives no ligand-field fit for a d0 oxo-anion, and says why and what it found', () => {
    const csv = realisticCsv(PERMANGANATE.spectrum);
    let error: unknown;
    try {
      analyzeSpectrum(csv, { ion: 'Mn7+', fileName: 'mno4.csv' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(FieldgapError);
    expect((error as FieldgapError).code).toBe('unexplained');
    expect((error as FieldgapError).path).toBe('mno4.csv');
    expect((error as FieldgapError).message).toMatch(/no ligand-field fit: a d0 ion has no d–d transitions; charge-transfer bands were found \(\d+/);
  });

  it('Cu(II): one band given to the fit, 10Dq from it beyond the window, the note in the warnings', () => {
    const r = analyzeSpectrum(realisticCsv(COPPER.spectrum), { ion: 'Cu2+', concentration: COPPER.spectrum.concentration });
    expect(r.bands).toHaveLength(1);
    expect(Math.abs(r.fit.tenDq! - 12_300)).toBeLessThan(1000); // published ≈ 12 300 cm-1 (from memory, Lever 1984)
    expect(r.warnings.some((w) => /outside the measured range/.test(w))).toBe(true);
  });

  it('Co(II) with ε: high-spin', () => {
    const r = analyzeSpectrum(realisticCsv(COBALT.spectrum), { ion: 'Co2+', concentration: COBALT.spectrum.concentration });
    expect(r.fit.spinState).toBe('high-spin'); // common practice: [Co(H2O)6]2+ is high-spin
  });
});

describe('window of each band', () => {
  it('a band centred beyond the red end of a 300–1100 nm spectrum (Ni(II) 3T2g at 8 500 cm-1) is found there', () => {
    const o: RealisticOptions = { ...NICKEL.spectrum, fromNm: 300, toNm: 1100 };
    const r = process(o, { concentration: o.concentration });
    const nir = nearest(r.bands, 8500); // published 8 500 cm-1 (found: thesis chapter on Ni(II) spectra, 123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN)
    expect(nir.window).toBe('beyond-red-end');
    expect(Math.abs(nir.position - trueMaximum(o, 7000, 9500))).toBeLessThan(700);
  });

  it('every other band of a full-range spectrum is inside', () => {
    const o: RealisticOptions = { ...COBALT.spectrum, fromNm: 300, toNm: 1100 };
    const r = process(o, { concentration: o.concentration });
    for (const b of r.bands.filter((b) => b.position > 12_000)) expect(b.window).toBe('inside');
  });
});

describe('intensity-aware classes on a recorded-looking spectrum', () => {
  it('tetrahedral Co(II): the intense visible multiplet (ε 360–600, narrow components) is spin-allowed d–d', () => {
    // Components near 14 700, 15 900 and 16 900 cm-1, ε 400–600 — from memory (Lever 1984, [CoCl4]2-); a weak
    // spin-forbidden band near 20 000 cm-1 added (invented size). Rounded to 0.01 at 2 mmol/L.
    const o: RealisticOptions = {
      concentration: 0.002, scatterAt400: 0.01,
      bands: [
        { position: 14_700, epsilon: 550, fwhm: 900 }, { position: 15_900, epsilon: 600, fwhm: 1000 },
        { position: 16_900, epsilon: 420, fwhm: 900 }, { position: 20_000, epsilon: 30, fwhm: 1500 },
      ],
    };
    const r = process(o, { concentration: o.concentration, geometry: 'tetrahedral' });
    expect(r.stepCorrections).toEqual([]);
    const strong = r.bands.filter((b) => b.epsilon! > 200);
    expect(strong.length).toBeGreaterThanOrEqual(3);
    expect(strong.every((b) => b.kind === 'd-d')).toBe(true); // common practice: tetrahedral d–d ε 50–1500
    expect(nearest(r.bands, 20_000).kind).toBe('spin-forbidden'); // well below the spin-allowed bands of the spectrum
  });
});
