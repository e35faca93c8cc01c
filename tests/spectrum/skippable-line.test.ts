import { describe, expect, it } from 'vitest';
import { isSkippableLine } from '../../src/spectrum/parse/find-numeric-block.js';

/** The obviously correct reference the character scan replaces. */
function isSkippableLineByTrim(line: string): boolean {
  const t = line.trim();
  return t === '' || t.startsWith('#') || t.startsWith('//');
}

describe('isSkippableLine', () => {
  const lines = [
    '', ' ', '\t', ' \t \r', '#', '  # comment', '//', ' // note', '/', ' /x', '/ /', '400,0.1', ' 400 0.1', '\t#',
    '\u00a0', '\u00a0#x', '\u3000', '\u3000//', '\ufeff400,1', '\ufeff', '\u2028', 'a#', '-#', '\v\f#', '\u00a0400',
  ];
  it.each(lines.map((l) => [JSON.stringify(l), l]))('agrees with the trim() reference on %s', (_, line) => {
    expect(isSkippableLine(line)).toBe(isSkippableLineByTrim(line));
  });
});
