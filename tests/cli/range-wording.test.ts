import { describe, expect, it } from 'vitest';
import { numberOption, rangeWords } from '../../src/arguments.js';
import { FieldgapError } from '../../src/errors.js';

/** AUDIT2 finding 8: a range error says the range in words, never "5e-324 to Infinity". */
function message(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(FieldgapError);
    return (e as FieldgapError).message;
  }
  throw new Error('no error thrown');
}

describe('numberOption range errors', () => {
  it('says "greater than 0" for a positive-only option', () => {
    const m = message(() => numberOption('path', '0', { min: Number.MIN_VALUE }));
    expect(m).toBe('--path: 0 is not allowed: the value must be greater than 0');
    expect(message(() => numberOption('conc', '-0.1', { min: Number.MIN_VALUE }))).not.toMatch(/e-324|Infinity/);
  });

  it('keeps both ends when both are finite', () => {
    expect(message(() => numberOption('d', '11', { min: 0, max: 10 }))).toBe('--d: 11 is outside the allowed range 0 to 10');
    expect(message(() => numberOption('c-over-b', '30', { min: Number.MIN_VALUE, max: 20 }))).toBe('--c-over-b: 30 is not allowed: the value must be greater than 0 and at most 20');
  });

  it('leaves an infinite end unsaid', () => {
    expect(rangeWords(1, Infinity)).toBe('is not allowed: the value must be at least 1');
    expect(rangeWords(-Infinity, 5)).toBe('is not allowed: the value must be at most 5');
  });

  it('accepts values inside the range', () => {
    expect(numberOption('path', '0.1', { min: Number.MIN_VALUE })).toBe(0.1);
  });
});
