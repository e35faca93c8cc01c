import { describe, expect, it } from 'vitest';
import { parseIon } from '../../src/chemistry/ions.js';
import { parseFormula } from '../../src/chemistry/formula.js';
import { errorOf } from '../helpers/errors.js';


/** AUDIT2 findings 9 and 11: errors that named the wrong problem. */
describe('formula and ion errors say the real problem', () => {
  it('a second metal atom is named as such, not as an unreadable ligand', () => {
    const e = errorOf(() => parseFormula('[Cr2O7]2-'));
    expect(e.path).toBe('formula');
    expect(e.message).toMatch(/^2 Cr atoms: a formula with more than one metal centre cannot be read/);
    expect(e.message).not.toMatch(/cannot read a ligand/);
    expect(errorOf(() => parseFormula('[Fe2(CO)9]')).message).toMatch(/^2 Fe atoms/);
  });

  it('one metal atom with a counted ligand still reads', () => {
    expect(parseFormula('[CrO4]2-').coordinationNumber).toBe(4); // common practice: chromate, four oxido ligands
    expect(errorOf(() => parseFormula('[Co(NH3)6 5]3+')).message).not.toMatch(/metal centre/);
  });

  it('a charge without its sign says how to write it, also in a URL', () => {
    const e = errorOf(() => parseIon('Cr3 '));
    expect(e.path).toBe('ion');
    expect(e.message).toMatch(/cannot read the charge "3": a charge needs its sign, Cr3\+ or Cr3-/);
    expect(e.message).toMatch(/ion=Cr3%2B/);
  });

  it('other unreadable charges get no URL hint', () => {
    expect(errorOf(() => parseIon('Fe(IIII)')).message).not.toMatch(/%2B/);
  });
});
