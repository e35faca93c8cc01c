/**
 * The accepted parameter ranges hold every value of the project's own
 * free-ion table (an internal consistency check, not an outside one: the
 * table's values are from memory, see src/chemistry/free-ion-racah.ts), with β
 * down to 0.2, and refuse the ends of the double range with a message
 * naming the option.
 */
import { describe, expect, it } from 'vitest';
import { FREE_ION_RACAH } from '../../src/chemistry/free-ion-racah.js';
import { checkParameterRange, PARAMETER_BOUNDS } from '../../src/ligand-field/parameter-bounds.js';

describe('parameter bounds', () => {
  it('hold the tabulated free-ion B0 and C0, and B reduced to β = 0.2', () => {
    expect(FREE_ION_RACAH.size).toBeGreaterThan(5);
    for (const [ion, { b, c }] of FREE_ION_RACAH) {
      expect(() => checkParameterRange('b', b, '--b'), ion).not.toThrow();
      expect(() => checkParameterRange('b', 0.2 * b, '--b'), ion).not.toThrow();
      expect(() => checkParameterRange('c', c, '--c'), ion).not.toThrow();
      expect(() => checkParameterRange('cOverB', c / b, '--c-over-b'), ion).not.toThrow();
    }
  });

  it('refuse the ends of the double range, naming the option and the range', () => {
    expect(() => checkParameterRange('b', 1e-150, '--b')).toThrow(/^--b: 1e-150 cm-1 is outside the range fieldgap accepts for Racah B, 10 to 5000 cm-1$/);
    expect(() => checkParameterRange('dq', 1e300, 'dq')).toThrow(expect.objectContaining({ code: 'invalid-argument', path: 'dq' }));
    expect(() => checkParameterRange('c', Number.NaN, '--c')).toThrow(/--c/);
    expect(PARAMETER_BOUNDS.dq.max * 10).toBe(100_000);
  });
});
