import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

// Issue 18: one concept per file; a file in src/ligand-field past 400 lines holds more than one and is split.
const DIR = join(import.meta.dirname, '../../src/ligand-field');
const LIMIT = 400;

/** Lines as wc -l counts them (a final newline ends the last line, it does not start another). */
function lineCount(text: string): number {
  return text.split('\n').length - (text.endsWith('\n') ? 1 : 0);
}

describe('src/ligand-field file sizes', () => {
  it(`every file is under ${LIMIT} lines`, () => {
    const files = readdirSync(DIR, { recursive: true, encoding: 'utf8' }).filter((name) => name.endsWith('.ts'));
    expect(files.length).toBeGreaterThan(10);
    const long = files
      .map((name) => ({ name, lines: lineCount(readFileSync(join(DIR, name), 'utf8')) }))
      .filter(({ lines }) => lines >= LIMIT);
    expect(long).toEqual([]);
  });
});
