import { describe, expect, it } from 'vitest';
import { parseSpectrumText } from '../../src/spectrum/index.js';
import { fixtureBytes } from './load.js';
import { jcampDamageFromLog } from '../../src/spectrum/parse/jcamp-library-message.js';

const reference = parseSpectrumText(fixtureBytes('header.csv')).spectra[0]!;

describe('JCAMP-DX', () => {
  it('reads compressed XYDATA (SQZ/DIF/DUP) with units from ##XUNITS and ##YUNITS', () => {
    const parsed = parseSpectrumText(fixtureBytes('xydata-difdup.jdx'), { fileName: 'xydata-difdup.jdx' });
    expect(parsed.format).toBe('jcamp');
    expect(parsed.warnings).toEqual([]);
    const s = parsed.spectra[0]!;
    expect(s.name).toBe('invented Cr(III) solution');
    expect(s.xUnit).toBe('nm');
    expect(s.yUnit).toBe('absorbance');
    expect(Array.from(s.x)).toEqual(Array.from(reference.x));
    for (let i = 0; i < s.y.length; i++) expect(s.y[i]).toBeCloseTo(reference.y[i]!, 9);
    expect(s.metadata['jcampForm']).toBe('XYDATA');
  });

  it('reads plain AFFN XYDATA in descending x', () => {
    const s = parseSpectrumText(fixtureBytes('xydata-affn.jdx')).spectra[0]!;
    expect(s.x[0]).toBe(800);
    expect(s.x[20]).toBe(400);
    for (let i = 0; i < s.y.length; i++) expect(s.y[i]).toBeCloseTo(reference.y[20 - i]!, 9);
  });

  it('reads a PEAK TABLE in cm-1', () => {
    const s = parseSpectrumText(fixtureBytes('peak-table.jdx')).spectra[0]!;
    expect(s.xUnit).toBe('cm-1');
    expect(Array.from(s.x)).toEqual([17400, 24600]);
    expect(Array.from(s.y)).toEqual([0.31, 0.27]);
    expect(s.metadata['jcampForm']).toBe('PEAK TABLE');
  });

  it('refuses an XYDATA record whose point count disagrees with ##NPOINTS', () => {
    expect(() => parseSpectrumText(fixtureBytes('jcamp-npoints-mismatch.jdx'), { fileName: 's.jdx' })).toThrow(
      expect.objectContaining({ code: 'parse-error', path: 's.jdx:##XYDATA' }),
    );
  });

  it('refuses garbage in an XYDATA record instead of returning made-up numbers', () => {
    expect(() => parseSpectrumText(fixtureBytes('jcamp-garbage.jdx'), { fileName: 's.jdx' })).toThrow(
      expect.objectContaining({ code: 'parse-error', path: 's.jdx:##XYDATA' }),
    );
  });

  it('refuses a failed X check (a line whose X does not follow the spacing)', () => {
    const lines = new TextDecoder().decode(fixtureBytes('xydata-affn.jdx')).split('\n');
    const i = lines.findIndex((l) => l.startsWith('##XYDATA'));
    // The fixture fits on one data line (X = 800, then 21 ordinates): split it
    // after 10 ordinates, so the second line starts at point 11, X = 600.
    const tokens = lines[i + 1]!.split(' ');
    const withX = (x: string) => [...lines.slice(0, i + 1), tokens.slice(0, 11).join(' '), [x, ...tokens.slice(11)].join(' '), ...lines.slice(i + 2)].join('\n');
    expect(parseSpectrumText(withX('600')).spectra[0]!.y.length).toBe(21);
    expect(() => parseSpectrumText(withX('700'), { fileName: 's.jdx' })).toThrow(
      expect.objectContaining({ code: 'parse-error', path: 's.jdx:##XYDATA' }),
    );
  });

  it('refuses ##XYPOINTS, which it does not read, naming the record', () => {
    const text = '##TITLE= t\n##JCAMP-DX= 4.24\n##XUNITS= NANOMETERS\n##YUNITS= ABSORBANCE\n##XYPOINTS= (XY..XY)\n400, 0.1; 410, 0.2\n##END=\n';
    expect(() => parseSpectrumText(text, { fileName: 's.jdx' })).toThrow(
      expect.objectContaining({ code: 'unsupported-format', path: 's.jdx:##XYPOINTS' }),
    );
  });

  it('refuses a JCAMP-DX file without a data record', () => {
    expect(() => parseSpectrumText('##TITLE= t\n##JCAMP-DX= 4.24\n##END=\n', { fileName: 's.jdx' })).toThrow(
      expect.objectContaining({ code: 'parse-error', path: 's.jdx' }),
    );
  });
});

describe('JCAMP-DX damage in fieldgap\'s words (AUDIT2 finding 18)', () => {
  it('a failed X check names the file line and says what is wrong, without the converter\'s text', () => {
    const lines = new TextDecoder().decode(fixtureBytes('xydata-affn.jdx')).split('\n');
    const i = lines.findIndex((l) => l.startsWith('##XYDATA'));
    const tokens = lines[i + 1]!.split(' ');
    // the second data line (file line i + 3, 1-based) starts at X = 700 where the spacing puts 600
    const text = [...lines.slice(0, i + 1), tokens.slice(0, 11).join(' '), ['700', ...tokens.slice(11)].join(' '), ...lines.slice(i + 2)].join('\n');
    let message = '';
    try {
      parseSpectrumText(text, { fileName: 's.jdx' });
    } catch (error) {
      message = (error as Error).message;
    }
    expect(message).toBe(`damaged data: line ${i + 3}: the line starts at X = 700, but ##FIRSTX and ##DELTAX put the next point at X = 600: a line is missing, repeated or damaged`);
    expect(message).not.toMatch(/Data line|is too high/);
  });

  it('garbage in XYDATA: the first character that is not JCAMP-DX, with line and column', () => {
    expect(() => parseSpectrumText(fixtureBytes('jcamp-garbage.jdx'), { fileName: 's.jdx' })).toThrow('line 15, column 1: character "t" is not valid in JCAMP-DX XYDATA');
  });

  it('the converter\'s other messages are translated; an unknown one gives no library text', () => {
    expect(jcampDamageFromLog('Data line 2: After a duplicate the next line should repeat the same value 5 !== 6', 9)).toEqual({ line: 13, message: expect.stringMatching(/^after a line that ends in a duplicate \(DUP\)/) });
    expect(jcampDamageFromLog('Format error: 1,2,3', 4)).toEqual({ line: undefined, message: expect.stringContaining('odd number of values (1,2,3)') });
    expect(jcampDamageFromLog('Data line 0: something new from the library', 0).message).toBe('the data cannot be decoded');
  });
});
