import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseSpectrumText } from '../../src/spectrum/index.js';
import { FIXTURES, fixtureBytes } from './load.js';
import { errorOf } from '../helpers/errors.js';


const parseFixture = (name: string, options: Parameters<typeof parseSpectrumText>[1] = {}) =>
  parseSpectrumText(fixtureBytes(name), { fileName: name, ...options });

describe('malformed input', () => {
  it('names the line and field of a non-numeric cell inside the data block (exact message)', () => {
    const error = errorOf(() => parseFixture('bad-cell.csv'));
    expect(error.toJSON()).toEqual({
      code: 'parse-error',
      path: 'bad-cell.csv:8:2',
      message: 'non-numeric cell "O.123" inside the data block',
    });
  });

  it('names the line where x stops being monotonic', () => {
    const error = errorOf(() => parseFixture('not-monotonic.csv'));
    expect(error.code).toBe('parse-error');
    expect(error.path).toBe('not-monotonic.csv:8:1');
    expect(error.message).toContain('x is not monotonic');
  });

  it('refuses too few points', () => {
    const error = errorOf(() => parseFixture('too-few-points.csv'));
    expect(error.code).toBe('parse-error');
    expect(error.message).toBe('column "A" has 5 data points; at least 10 are needed');
    expect(error.path).toBe('too-few-points.csv:2');
  });

  it('refuses an empty file', () => {
    expect(errorOf(() => parseFixture('empty.csv')).toJSON()).toEqual({ code: 'parse-error', path: 'empty.csv', message: 'the file is empty' });
  });

  it('refuses a binary file as unsupported', () => {
    const error = errorOf(() => parseFixture('binary.spc'));
    expect(error.code).toBe('unsupported-format');
    expect(error.path).toBe('binary.spc');
  });

  it('refuses text without a numeric block', () => {
    const error = errorOf(() => parseSpectrumText('Sample: none\nNo data was recorded.\n', { fileName: 'notes.txt' }));
    expect(error.code).toBe('parse-error');
    expect(error.path).toBe('notes.txt');
  });

  it('lists the available columns when a requested one does not exist', () => {
    const byIndex = errorOf(() => parseFixture('multi-column.csv', { column: 4 }));
    expect(byIndex.code).toBe('invalid-argument');
    expect(byIndex.path).toBe('column');
    expect(byIndex.message).toBe('column 4 does not exist in multi-column.csv; its y columns are 1 "0.5 eq", 2 "1.0 eq", 3 "2.0 eq"');
    const byName = errorOf(() => parseFixture('multi-column.csv', { column: '3 eq' }));
    expect(byName.message).toContain('no column named "3 eq"');
  });

  it('refuses a stray text line in the middle of the data, not just the part after it', () => {
    const lines = new TextDecoder().decode(fixtureBytes('header.csv')).split('\n');
    lines.splice(12, 0, 'lamp change');
    expect(errorOf(() => parseSpectrumText(lines.join('\n'), { fileName: 's.csv' })).path).toBe('s.csv:13:1');
  });

  it('refuses a dot-decimal cell in a decimal-comma file', () => {
    const text = 'nm;A\n' + Array.from({ length: 12 }, (_, i) => `${400 + i};0,${i + 10}`).join('\n').replace('405;0,15', '405;0.15');
    const error = errorOf(() => parseSpectrumText(text, { fileName: 'd.csv' }));
    expect(error.path).toBe('d.csv:7:2');
    expect(error.message).toContain('decimal comma');
  });

  it('refuses x values whose unit cannot be told', () => {
    const text = Array.from({ length: 12 }, (_, i) => `${20 + i},0.1`).join('\n');
    expect(errorOf(() => parseSpectrumText(text, { fileName: 'u.csv' })).message).toContain('give the x unit');
  });

  it('never modifies the file it reads (CLI-style load: read, parse, compare hash)', () => {
    for (const name of ['header.csv', 'semicolon-decimal-comma.csv', 'xydata-difdup.jdx', 'bad-cell.csv']) {
      const hash = () => createHash('sha256').update(readFileSync(FIXTURES + name)).digest('hex');
      const before = hash();
      const bytes = new Uint8Array(readFileSync(FIXTURES + name));
      const copy = bytes.slice();
      try {
        parseSpectrumText(bytes, { fileName: name });
      } catch {
        // bad-cell.csv fails to parse; the point is that nothing is written
      }
      expect(bytes).toEqual(copy);
      expect(hash()).toBe(before);
    }
  });
});
