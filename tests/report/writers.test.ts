import Papa from 'papaparse';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { csvLine, csvText } from '../../src/report/csv.js';
import { decimalsForUncertainty, formatPlusMinus } from '../../src/report/plus-minus.js';
import { percentText, probabilityText } from '../../src/report/probability.js';
import { NO_SPIN_STATE_CHOICE, spinStateSentence, spinStateWords } from '../../src/report/spin-state-wording.js';
import { columnWidths, textTableLine, textTableLines } from '../../src/report/text-table.js';

describe('the one CSV writer', () => {
  it('writes what a CSV reader gives back: commas, quotes, line breaks, empty and null cells', () => {
    const rows = [['a, b', 'say "hi"', 'two\nlines', '', null, 1.5, -0.25, 17_400]];
    const text = csvText(['x', 'y', 'z', 'e', 'n', 'f', 'neg', 'big'], rows);
    const parsed = Papa.parse<string[]>(text.trimEnd(), { newline: '\r\n' }); // papaparse as the reference reader
    expect(parsed.errors).toEqual([]);
    expect(parsed.data[1]).toEqual(['a, b', 'say "hi"', 'two\nlines', '', '', '1.5', '-0.25', '17400']);
  });

  it.each(['=1+1', '+1', '-1', '@SUM(A1)', '\tx', '\rx'])('neutralises a text cell a spreadsheet would run: %j', (cell) => {
    const back = Papa.parse<string[]>(csvLine(['ok', cell])).data[0];
    expect(back?.[1]).toBe(`'${cell}`); // OWASP, "CSV Injection" (a leading ' makes the cell text)
  });

  it('leaves numbers alone, negative ones included, and text that only contains the characters', () => {
    expect(csvLine([-5, 'a=b', 'x-y', 'mail@host'])).toBe('-5,a=b,x-y,mail@host');
  });

  it('ends rows with the newline asked for, the last with `end`, and writes nothing for no rows', () => {
    expect(csvText(['a'], [[1], [2]])).toBe('a\r\n1\r\n2\r\n');
    expect(csvText(['a'], [[1]], { newline: '\n' })).toBe('a\n1\n');
    expect(csvText(['a'], [[1]], { end: '\n' })).toBe('a\r\n1\n');
    expect(csvText(null, [])).toBe('');
    expect(csvText(null, [['a'], [], ['b']], { newline: '\n' })).toBe('a\n\nb\n');
  });

  it('quotes the cells asked for', () => {
    expect(csvLine(['x', 'name', 3], { quote: (v, c) => c === 1 && typeof v === 'string' })).toBe('x,"name",3');
  });
});

describe('the one text table', () => {
  it('pads each column to its widest cell, two spaces apart, no trailing spaces', () => {
    const lines = textTableLines([['name', 'value'], ['β', '0.76'], ['10Dq', '17400']], { align: ['left', 'right'], indent: '  ' });
    expect(lines).toEqual(['  name  value', '  β      0.76', '  10Dq  17400']);
  });

  it('counts code points, not UTF-16 units', () => {
    expect(columnWidths([['𝛽x'], ['ab']])).toEqual([2]);
    expect(textTableLine(['a', 'b'], [3, 1])).toBe('a    b');
  });
});

describe('the one ± formatter', () => {
  it('writes value and uncertainty at the same digits, the value alone without one', () => {
    expect(formatPlusMinus(17_448.6, 139.2)).toBe('17449 ± 139');
    expect(formatPlusMinus(0.7812, 0.0123, { digits: 3 })).toBe('0.781 ± 0.012');
    expect(formatPlusMinus(17_448.6, null)).toBe('17449');
    expect(formatPlusMinus(17_448.6, 0)).toBe('17449');
    expect(formatPlusMinus(17_448.6, 0, { showZero: true })).toBe('17449 ± 0');
  });

  it('shows the uncertainty to two significant figures when asked', () => {
    expect(decimalsForUncertainty(150)).toBe(0);
    expect(decimalsForUncertainty(0.012)).toBe(3);
    expect(formatPlusMinus(17_412, 150, { digits: 'two-significant' })).toBe('17412 ± 150');
    expect(formatPlusMinus(0.78123, 0.0123, { digits: 'two-significant' })).toBe('0.781 ± 0.012');
    expect(formatPlusMinus(0.7, null, { digits: 'two-significant', minDigits: 2 })).toBe('0.70');
    expect(formatPlusMinus(1, 1e-9, { digits: 'two-significant', maxDigits: 6 })).toBe('1.000000 ± 0.000000');
  });
});

describe('the one spin-state wording', () => {
  it('says a configuration with one spin state the same way everywhere', () => {
    expect(spinStateSentence('no-choice', 3, 'octahedral')).toBe(`${NO_SPIN_STATE_CHOICE} for d3 octahedral`);
    expect(spinStateSentence('high-spin', 6, 'octahedral')).toBe('high-spin');
    expect(spinStateWords('low-spin')).toBe('low spin');
  });
});

describe('the one wording of a probability', () => {
  it('gives two significant figures, three near certainty, and a floor', () => {
    expect(percentText(0.9731)).toBe('97%');
    expect(percentText(0.031)).toBe('3.1%');
    expect(percentText(0.9972)).toBe('99.7%');
    expect(percentText(0.0004)).toBe('< 0.1%');
    expect(percentText(0.9731, { space: true })).toBe('97 %');
    expect(percentText(0.0004, { space: true })).toBe('< 0.1 %');
  });

  it('says P to two decimals, and only a bound where two decimals cannot say more', () => {
    expect(probabilityText(0.87)).toBe('P = 0.87');
    expect(probabilityText(0.996)).toBe('P > 0.99');
    expect(probabilityText(0.004)).toBe('P < 0.01');
    expect(probabilityText(0.995)).toBe('P = 0.99');
  });
});

describe('one writer per output', () => {
  const root = fileURLToPath(new URL('../..', import.meta.url));
  const sources = (folder: string) =>
    readdirSync(join(root, folder), { recursive: true, withFileTypes: true })
      .filter((e) => e.isFile() && e.name.endsWith('.ts'))
      .map((e) => ({ path: join(e.parentPath, e.name).slice(root.length), text: readFileSync(join(e.parentPath, e.name), 'utf8') }));

  it('only src/report/ turns rows into CSV or pads table columns', () => {
    const files = [...sources('src'), ...sources('server'), ...sources('web')].filter((f) => !f.path.startsWith('src/report/'));
    expect(files.length).toBeGreaterThan(100);
    expect(files.filter((f) => /\bunparse\(/.test(f.text)).map((f) => f.path)).toEqual([]);
    // A column padded to widths computed over rows is a table renderer of its own.
    expect(files.filter((f) => /padEnd\(widths\[|padStart\(widths\[/.test(f.text)).map((f) => f.path)).toEqual([]);
  });

  it('only src/report/ words a probability as a percentage or as P', () => {
    const files = [...sources('src'), ...sources('server'), ...sources('web')].filter((f) => !f.path.startsWith('src/report/'));
    expect(files.filter((f) => /toPrecision\(p >= 0\.995|'P > 0\.99'/.test(f.text)).map((f) => f.path)).toEqual([]);
  });
});
