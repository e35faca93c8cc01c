import { describe, expect, it } from 'vitest';
import {
  absorbanceToEpsilon, bandOscillatorStrength, CM1_PER_EV, epsilonToAbsorbance, gaussianArea, integratedEpsilonToOscillatorStrength,
  parseXUnitOption, valueToWavenumber, wavenumberToValue, xToWavenumber, yToAbsorbance,
} from '../../src/spectrum/index.js';
import { mulberry32 } from '../../src/spectrum/random.js';

describe('x units', () => {
  it('uses the CODATA 2018 eV–wavenumber relationship', () => {
    expect(CM1_PER_EV).toBeCloseTo(8065.544, 3); // CODATA 2018: 1 eV ↔ 8065.543937 cm-1
    expect(valueToWavenumber(1, 'eV')).toBeCloseTo(8065.544, 3); // CODATA 2018
    expect(valueToWavenumber(2, 'eV')).toBeCloseTo(16131.088, 2); // CODATA 2018
  });

  it('converts wavelengths: 500 nm = 20 000 cm-1 = 0.5 µm', () => {
    expect(valueToWavenumber(500, 'nm')).toBe(20000); // definition ν̃ = 1/λ, common practice
    expect(valueToWavenumber(0.5, 'um')).toBe(20000); // definition ν̃ = 1/λ, common practice
    expect(wavenumberToValue(20000, 'nm')).toBe(500); // definition, common practice
  });

  it('round-trips every unit on seeded random values', () => {
    const random = mulberry32(7);
    for (const unit of ['nm', 'cm-1', 'eV', 'um'] as const) {
      for (let k = 0; k < 50; k++) {
        const nu = 5000 + 45000 * random();
        expect(valueToWavenumber(wavenumberToValue(nu, unit), unit)).toBeCloseTo(nu, 8);
      }
    }
  });

  it('refuses non-positive wavelengths and unknown unit names', () => {
    expect(() => xToWavenumber(Float64Array.of(400, 0), 'nm', 'a.csv')).toThrow(expect.objectContaining({ code: 'parse-error' }));
    expect(() => parseXUnitOption('furlong', '--x-unit')).toThrow(expect.objectContaining({ code: 'invalid-argument', path: '--x-unit' }));
    expect(parseXUnitOption('µm')).toBe('um');
    expect(parseXUnitOption('1/CM')).toBe('cm-1');
  });
});

describe('y units and Beer–Lambert', () => {
  it('converts transmittance to absorbance, A = −log10 T', () => {
    const a = yToAbsorbance(Float64Array.of(1, 0.1, 0.01, 0), 'transmittance');
    expect(Array.from(a)).toEqual([-0, 1, 2, Number.POSITIVE_INFINITY]); // definition of absorbance, IUPAC Gold Book
    expect(yToAbsorbance(Float64Array.of(50), 'transmittance-percent')[0]).toBeCloseTo(0.30103, 5); // −log10 0.5, IUPAC Gold Book definition
  });

  it('reproduces a Beer–Lambert worked example', () => {
    // A = 0.50 in a 1.00 cm cell at c = 0.010 mol/L gives ε = 50 L mol-1 cm-1
    // (the definition ε = A/(c·l): IUPAC Gold Book, "molar absorption coefficient", doi:10.1351/goldbook.M03972, found).
    expect(absorbanceToEpsilon(0.5, 0.01, 1)).toBeCloseTo(50, 12);
    expect(absorbanceToEpsilon(0.5, 0.01, 0.5)).toBeCloseTo(100, 12);
    expect(epsilonToAbsorbance(50, 0.01, 1)).toBeCloseTo(0.5, 12);
    expect(() => absorbanceToEpsilon(1, 0)).toThrow(expect.objectContaining({ path: 'concentration' }));
    expect(() => absorbanceToEpsilon(1, 1, -1)).toThrow(expect.objectContaining({ path: 'pathLength' }));
  });
});

describe('oscillator strength', () => {
  it('uses f = 4.32e-9 ∫ε dν̃', () => {
    // The constant 4.32 × 10⁻⁹ mol L-1 cm2: Lever, Inorganic Electronic Spectroscopy (1984), common practice.
    expect(integratedEpsilonToOscillatorStrength(1e6)).toBeCloseTo(4.32e-3, 12);
  });

  it('integrates a Gaussian band as 1.0645 ε·FWHM, so a typical d–d band has f ~ 1e-4', () => {
    // ∫ of a Gaussian = h · w · √(π / 4 ln 2) = 1.064467 h w (standard integral, common practice)
    expect(gaussianArea(1, 1)).toBeCloseTo(1.064467, 6);
    // A typical octahedral spin-allowed band: ε = 10, FWHM = 3000 cm-1 → f = 4.32e-9 × 1.064467 × 3e4 ≈ 1.38e-4
    // (order 10⁻⁴ as for Laporte-forbidden d–d bands; Lever 1984, common practice)
    expect(bandOscillatorStrength(10, 3000)).toBeCloseTo(1.3796e-4, 7);
  });
});
