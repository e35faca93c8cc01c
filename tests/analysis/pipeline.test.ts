import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { FieldgapError } from '../../src/errors.js';
import { syntheticCsv, type KnownComplex } from './helpers.js';

// Synthetic spectra from known parameters: the pipeline must return them.
// Tolerances: 10Dq within 2 %, B within 8 % (band maxima of overlapping
// Gaussians on a sloping baseline with noise are not exactly the transitions).
// The d8 case needs the NIR: its 3T2g band lies near 1180 nm.
const CASES: Array<[string, KnownComplex, string, number]> = [
  ['d3 octahedral, two spin-allowed bands', {
    d: 3, geometry: 'octahedral', dq: 1650, b: 700, c: 700 * 3850 / 918,
    bands: [{ label: '4T2g(F)', epsilon: 15, fwhm: 2800 }, { label: '4T1g(F)', epsilon: 18, fwhm: 3200 }],
  }, 'Cr3+', 1100],
  ['d8 octahedral, three spin-allowed bands', {
    d: 8, geometry: 'octahedral', dq: 850, b: 900, c: 900 * 4831 / 1041,
    bands: [{ label: '3T2g(F)', epsilon: 5, fwhm: 3000 }, { label: '3T1g(F)', epsilon: 6, fwhm: 3500 }, { label: '3T1g(P)', epsilon: 9, fwhm: 3800 }],
  }, 'Ni2+', 1500],
];

describe('analyzeSpectrum on synthetic spectra of known complexes', () => {
  for (const [name, complex, ion, toNm] of CASES) {
    it(`${name}: recovers 10Dq and B`, () => {
      const result = analyzeSpectrum(syntheticCsv(complex, { toNm }), { fileName: 'synthetic.csv', ion, concentration: 0.05 });
      expect(result.spectrum.xUnit).toBe('nm');
      expect(result.fit.tenDq).toBeGreaterThan(10 * complex.dq * 0.98);
      expect(result.fit.tenDq).toBeLessThan(10 * complex.dq * 1.02);
      expect(result.fit.b).not.toBeNull();
      expect(Math.abs(result.fit.b! - complex.b) / complex.b).toBeLessThan(0.08);
      expect(result.fit.unpairedElectrons).toBe(complex.d === 3 ? 3 : 2);
      const dd = result.bands.filter((b) => b.kind === 'd-d');
      expect(dd.length).toBeGreaterThanOrEqual(complex.bands.length);
      for (const band of dd) expect(band.epsilon).not.toBeNull();
    });
  }

  it('returns the curves on request, one component per band', () => {
    const [, complex, ion] = CASES[0]!;
    const result = analyzeSpectrum(syntheticCsv(complex), { ion, curves: true });
    expect(result.curves).toBeDefined();
    const n = result.curves!.grid.length;
    expect(result.curves!.model).toHaveLength(n);
    expect(result.curves!.components).toHaveLength(result.bands.length);
  });

  it('needs an ion or a d-count', () => {
    const [, complex] = CASES[0]!;
    expect(() => analyzeSpectrum(syntheticCsv(complex), {})).toThrow(FieldgapError);
  });

  it('says when there are no d–d bands to fit, naming the file', () => {
    const flat = Array.from({ length: 400 }, (_, i) => `${400 + i},${(0.05 + 0.0001 * i).toFixed(5)}`).join('\n');
    try {
      analyzeSpectrum(`nm,A\n${flat}\n`, { fileName: 'flat.csv', ion: 'Cr3+' });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).code).toBe('unexplained');
      expect((error as FieldgapError).path).toBe('flat.csv');
    }
  });
});
