import { describe, expect, it } from 'vitest';
import * as spectrum from '../../src/spectrum/index.js';
import {
  bandKindFromEpsilon, bandsClassify, defaultThresholds, formatDelimited, formatJcamp, parseSpectrumText, synthesizeSpectrum,
} from '../../src/spectrum/index.js';

describe('classification thresholds (common practice, Lever 1984)', () => {
  const oct = defaultThresholds('octahedral');
  const tet = defaultThresholds('tetrahedral');
  const band = (epsilon: number, fwhm = 3000, position = 17000) => ({ position, fwhm, height: 0, epsilon });

  it('octahedral: ε 1–150 broad is d–d, ε < 1 or narrow and well below the strongest is spin-forbidden, ε ≥ 1000 is charge transfer', () => {
    expect(bandKindFromEpsilon(band(10), oct)).toBe('d-d'); // common practice: octahedral spin-allowed ε ≈ 1–150
    expect(bandKindFromEpsilon(band(140), oct)).toBe('d-d'); // common practice: octahedral spin-allowed ε ≈ 1–150
    expect(bandKindFromEpsilon(band(0.3), oct)).toBe('spin-forbidden'); // common practice: spin-forbidden ε < ~1
    expect(bandKindFromEpsilon(band(3, 600), oct, 30)).toBe('spin-forbidden'); // common practice: narrow spin-flip band well below the spin-allowed ones
    expect(bandKindFromEpsilon(band(6, 600), oct)).toBe('d-d'); // alone it is the strongest band: never spin-forbidden (area of ε 1.4 at 2500 cm-1)
    expect(bandKindFromEpsilon(band(3, 600), oct)).toBe('spin-forbidden'); // alone, but its area is that of ε 0.72 at the typical width: below ε 1 (common practice)
    expect(bandKindFromEpsilon(band(5000), oct)).toBe('charge-transfer'); // common practice: CT ε > ~1000
    expect(bandKindFromEpsilon(band(400, 7000, 32000), oct)).toBe('charge-transfer'); // broad and strong at the UV edge
  });

  it('tetrahedral: ε 50–1500 is d–d, narrow components of an intense multiplet too', () => {
    expect(bandKindFromEpsilon(band(600), tet)).toBe('d-d'); // common practice: tetrahedral d–d ε ≈ 50–1500
    expect(bandKindFromEpsilon(band(1200), tet)).toBe('d-d'); // common practice: tetrahedral d–d ε ≈ 50–1500
    expect(bandKindFromEpsilon(band(2000), tet)).toBe('charge-transfer'); // common practice: above the tetrahedral d–d range
    // The visible multiplet of tetrahedral Co(II): components 360–600, narrow (issue 13's report).
    const multiplet = [band(600, 800, 16000), band(520, 900, 17000), band(360, 800, 18500), band(40, 500, 20000)];
    expect(bandsClassify(multiplet, tet).kinds).toEqual(['d-d', 'd-d', 'd-d', 'spin-forbidden']);
  });

  it('without ε classifies by relative height and width, and says so', () => {
    const { kinds, relative } = bandsClassify(
      [
        { position: 17000, fwhm: 3000, height: 0.3, epsilon: null },
        { position: 15000, fwhm: 500, height: 0.03, epsilon: null },
        { position: 31000, fwhm: 6000, height: 3.5, epsilon: null },
      ],
      oct,
    );
    expect(relative).toBe(true);
    expect(kinds).toEqual(['d-d', 'spin-forbidden', 'charge-transfer']);
  });
});

describe('writers and the synthetic generator', () => {
  const s = synthesizeSpectrum({ bands: [{ position: 17000, fwhm: 3000, height: 0.5 }], noise: 0.001, seed: 2, descending: true });

  it('samples on the wavelength grid asked for, in scan order, reproducibly from the seed', () => {
    expect(s.wavelength.length).toBe(801);
    expect(s.wavelength[0]).toBe(1100);
    expect(s.wavelength[800]).toBe(300);
    const again = synthesizeSpectrum({ bands: [{ position: 17000, fwhm: 3000, height: 0.5 }], noise: 0.001, seed: 2, descending: true });
    expect(again.absorbance).toEqual(s.absorbance);
    const other = synthesizeSpectrum({ bands: [{ position: 17000, fwhm: 3000, height: 0.5 }], noise: 0.001, seed: 3, descending: true });
    expect(other.absorbance).not.toEqual(s.absorbance);
    expect(() => synthesizeSpectrum({ bands: [{ position: 17000, fwhm: 3000, epsilon: 10 }] })).toThrow(expect.objectContaining({ path: 'bands[0]' }));
  });

  it('round-trips every written form through the readers', () => {
    const forms = [
      formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['Wavelength (nm)', 'Absorbance'], digits: 12 }),
      formatDelimited({ x: s.wavelength, ys: [s.absorbance], separator: ';', decimalComma: true, preamble: ['Invented export', 'Operator;none'], header: ['nm', 'A'], digits: 12 }),
      formatDelimited({ x: s.wavelength, ys: [s.absorbance], separator: '\t', digits: 12, newline: '\r\n' }),
      formatJcamp({ title: 'invented', x: s.wavelength, y: s.absorbance, xUnits: 'NANOMETERS', yUnits: 'ABSORBANCE', yFactor: 1e-9 }),
      formatJcamp({ title: 'invented', x: s.wavelength, y: s.absorbance, xUnits: 'NANOMETERS', yUnits: 'ABSORBANCE', form: 'affn', yFactor: 1e-9 }),
    ];
    for (const text of forms) {
      const read = parseSpectrumText(text, { xUnit: 'nm', yUnit: 'absorbance' }).spectra[0]!;
      expect(Array.from(read.x)).toEqual(Array.from(s.wavelength));
      for (let i = 0; i < s.absorbance.length; i += 37) expect(read.y[i]).toBeCloseTo(s.absorbance[i]!, 8);
    }
  });

  it('refuses a decimal comma with a comma separator, and uneven x for XYDATA', () => {
    expect(() => formatDelimited({ x: s.wavelength, ys: [s.absorbance], decimalComma: true })).toThrow(expect.objectContaining({ path: 'decimalComma' }));
    expect(() => formatJcamp({ title: 't', x: Float64Array.of(1, 2, 4), y: Float64Array.of(1, 2, 3), xUnits: 'NANOMETERS', yUnits: 'ABSORBANCE' })).toThrow(expect.objectContaining({ path: 'x' }));
  });
});

describe('public API', () => {
  it('exports exactly these names (a change here is an API change)', () => {
    expect(Object.keys(spectrum).sort()).toMatchInlineSnapshot(`
      [
        "CM1_PER_EV",
        "OSCILLATOR_STRENGTH_FACTOR",
        "X_UNITS",
        "absorbanceToEpsilon",
        "bandKindFromEpsilon",
        "bandOscillatorStrength",
        "bandsClassify",
        "defaultThresholds",
        "epsilonToAbsorbance",
        "formatDelimited",
        "formatJcamp",
        "gaussianArea",
        "gaussianDeviates",
        "gaussianValue",
        "integratedEpsilonToOscillatorStrength",
        "maskAroundStep",
        "mulberry32",
        "parseSpectrumText",
        "parseXUnitOption",
        "processSpectrum",
        "synthesizeSpectrum",
        "valueToWavenumber",
        "wavenumberToValue",
        "xAddGaussian",
        "xChooseGridStep",
        "xNoiseFromSecondDifferences",
        "xNoiseLocal",
        "xPolynomialScale",
        "xPolynomialValues",
        "xToWavenumber",
        "xUniformGrid",
        "xUnitFromLabel",
        "xUnitFromName",
        "xyCorrectDetectorSteps",
        "xyFindBandCandidates",
        "xyFindDetectorSteps",
        "xyLowerHull",
        "xyMaskPoints",
        "xyMaskedRegions",
        "xyPolynomialFit",
        "xyRefineBands",
        "xyResampleUniform",
        "xyResampleUniformWithCounts",
        "yAbsorbanceToEpsilon",
        "yToAbsorbance",
        "yUnitFromLabel",
      ]
    `);
  });
});
