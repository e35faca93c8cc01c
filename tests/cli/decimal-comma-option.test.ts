/**
 * AUDIT3: a chemist used to decimal commas types `--conc 0,012`. The option
 * is refused (fieldgap does not guess between a decimal comma and a list),
 * and the message says how to write it.
 */
import { describe, expect, it } from 'vitest';
import { numberOption } from '../../src/arguments.js';
import { errorOf } from '../helpers/errors.js';

describe('a number option written with a decimal comma', () => {
  it('is refused with the value rewritten with a decimal point', () => {
    const e = errorOf(() => numberOption('conc', '0,012', { min: Number.MIN_VALUE }));
    expect(e.message).toBe('--conc: expected a number, got "0,012" (write the decimal point: 0.012)');
    expect(e.path).toBe('--conc');
  });

  it('other non-numbers get no such hint', () => {
    expect(errorOf(() => numberOption('conc', 'abc')).message).toBe('--conc: expected a number, got "abc"');
    expect(errorOf(() => numberOption('conc', '1,2,3')).message).toBe('--conc: expected a number, got "1,2,3"');
  });
});
