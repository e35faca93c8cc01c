import { describe, expect, it } from 'vitest';
import { parseSpectrumText } from '../../src/spectrum/index.js';
import { fixtureBytes } from './load.js';

/** The invented fixture spectrum: 400–800 nm every 20 nm (fixtures/spectra/header.csv). */
const NM = Array.from({ length: 21 }, (_, i) => 400 + 20 * i);

function parseFixture(name: string, options: Parameters<typeof parseSpectrumText>[1] = {}) {
  return parseSpectrumText(fixtureBytes(name), { fileName: name, ...options });
}

const reference = parseFixture('header.csv').spectra[0]!;

describe('delimited text', () => {
  it('reads a CSV with a header: units from the header, no warnings', () => {
    const parsed = parseFixture('header.csv');
    expect(parsed.format).toBe('delimited');
    expect(parsed.warnings).toEqual([]);
    expect(parsed.spectra).toHaveLength(1);
    const s = parsed.spectra[0]!;
    expect(Array.from(s.x)).toEqual(NM);
    expect(s.xUnit).toBe('nm');
    expect(s.yUnit).toBe('absorbance');
    expect(s.name).toBe('Absorbance');
    expect(s.column).toBe(1);
    expect(s.y[0]).toBe(0.02);
    expect(s.y[9]).toBe(0.5111);
  });

  it('reads a CSV without header in descending order, inferring nm with a warning', () => {
    const parsed = parseFixture('no-header-descending.csv');
    const s = parsed.spectra[0]!;
    expect(Array.from(s.x)).toEqual([...NM].reverse());
    expect(Array.from(s.y)).toEqual(Array.from(reference.y).reverse());
    expect(s.name).toBe('y1');
    expect(parsed.warnings.some((w) => w.includes('nm inferred'))).toBe(true);
    expect(parsed.warnings.some((w) => w.includes('absorbance assumed'))).toBe(true);
  });

  it('reads a semicolon, decimal-comma export with a preamble and a footer (CRLF)', () => {
    const parsed = parseFixture('semicolon-decimal-comma.csv');
    const s = parsed.spectra[0]!;
    expect(Array.from(s.x)).toEqual([...NM].reverse());
    expect(Array.from(s.y)).toEqual(Array.from(reference.y).reverse());
    expect(s.xUnit).toBe('nm');
    expect(s.yUnit).toBe('absorbance');
    expect(s.metadata['Slit width']).toBe('2,0 nm');
    expect(s.metadata['Sample']).toBe('invented Cr(III) solution');
    expect(parsed.warnings).toEqual(['semicolon-decimal-comma.csv: ignored 1 line(s) after the data block (from line 28)']);
  });

  it('reads tab- and whitespace-separated text', () => {
    for (const name of ['tab.txt', 'whitespace.txt']) {
      const s = parseFixture(name).spectra[0]!;
      expect(Array.from(s.x)).toEqual(NM);
      expect(Array.from(s.y)).toEqual(Array.from(reference.y));
    }
  });

  it('reads several y columns as several spectra, selectable by index and by name', () => {
    const all = parseFixture('multi-column.csv');
    expect(all.spectra.map((s) => [s.name, s.column])).toEqual([['0.5 eq', 1], ['1.0 eq', 2], ['2.0 eq', 3]]);
    const byIndex = parseFixture('multi-column.csv', { column: 2 }).spectra;
    const byName = parseFixture('multi-column.csv', { column: '2.0 EQ' }).spectra;
    expect(byIndex).toHaveLength(1);
    expect(byIndex[0]!.name).toBe('1.0 eq');
    expect(byName[0]!.column).toBe(3);
    expect(byName[0]!.y[9]).toBe(reference.y[9]);
    expect(all.spectra[0]!.y[9]).toBeCloseTo(0.25 * reference.y[9]!, 4);
  });

  it('skips missing cells and blank lines and says how many', () => {
    const parsed = parseFixture('missing-cells.csv');
    const [a, b] = parsed.spectra;
    expect(a!.x.length).toBe(20);
    expect(b!.x.length).toBe(20);
    expect(Array.from(a!.x)).not.toContain(480);
    expect(Array.from(b!.x)).not.toContain(440);
    expect(parsed.warnings).toContain('missing-cells.csv: column "Abs 1": skipped 1 row(s) with a missing value');
    expect(parsed.warnings).toContain('missing-cells.csv: column "Abs 2": skipped 1 row(s) with a missing value');
  });

  it('reads transmittance in percent and as a fraction from the header', () => {
    expect(parseFixture('transmittance-percent.csv').spectra[0]!.yUnit).toBe('transmittance-percent');
    expect(parseFixture('transmittance-fraction.csv').spectra[0]!.yUnit).toBe('transmittance');
  });

  it('reads eV and µm axes from the header', () => {
    const ev = parseFixture('energy-ev.csv').spectra[0]!;
    expect(ev.xUnit).toBe('eV');
    const um = parseFixture('wavelength-um.csv').spectra[0]!;
    expect(um.xUnit).toBe('um');
    expect(um.x[0]).toBe(0.4);
  });

  it('lets an explicit unit win over the header', () => {
    const s = parseFixture('header.csv', { xUnit: 'cm-1', yUnit: 'epsilon' }).spectra[0]!;
    expect(s.xUnit).toBe('cm-1');
    expect(s.yUnit).toBe('epsilon');
  });

  it('accepts a string as well as bytes', () => {
    const text = new TextDecoder().decode(fixtureBytes('header.csv'));
    expect(Array.from(parseSpectrumText(text).spectra[0]!.y)).toEqual(Array.from(reference.y));
  });
});
