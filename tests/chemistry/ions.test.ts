import { describe, expect, it } from 'vitest';
import { ionLabel, parseIon } from '../../src/chemistry/ions.js';
import { TRANSITION_ELEMENTS, ELEMENT_SYMBOLS } from '../../src/chemistry/elements.js';
import { errorOf } from '../helpers/errors.js';


describe('parseIon: accepted spellings', () => {
  const cases: [string, string, number, number][] = [
    // text, label, oxidation state, d-count: d = group − oxidation state (common practice)
    ['Cr3+', 'Cr3+', 3, 3],
    ['Cr(III)', 'Cr3+', 3, 3],
    ['Cr 3+', 'Cr3+', 3, 3],
    ['cr3+', 'Cr3+', 3, 3],
    ['CR(iii)', 'Cr3+', 3, 3],
    ['Cr III', 'Cr3+', 3, 3],
    ['Cr^3+', 'Cr3+', 3, 3],
    ['Cr³⁺', 'Cr3+', 3, 3],
    ['Cr(3+)', 'Cr3+', 3, 3],
    ['  Fe2+ ', 'Fe2+', 2, 6],
    ['Fe(II)', 'Fe2+', 2, 6],
    ['Co+2', 'Co2+', 2, 7],
    ['Cu+', 'Cu+', 1, 10],
    ['Fe+++', 'Fe3+', 3, 5],
    ['Cu2+', 'Cu2+', 2, 9],
    ['Cr(0)', 'Cr0', 0, 6],
    ['Fe(-II)', 'Fe2-', -2, 10],
  ];
  for (const [text, label, charge, d] of cases) {
    it(`${text} → ${label}, d${d}`, () => {
      const ion = parseIon(text);
      expect(ion.label).toBe(label);
      expect(ion.charge).toBe(charge);
      expect(ion.d).toBe(d);
    });
  }
});

describe('parseIon: every transition row', () => {
  const cases: [string, string, 1 | 2 | 3, number, string][] = [
    // d-counts and rows: IUPAC group numbers, d = group − oxidation state (common practice)
    ['Sc3+', 'Sc', 1, 0, 'scandium'],
    ['Ti3+', 'Ti', 1, 1, 'titanium'],
    ['V3+', 'V', 1, 2, 'vanadium'],
    ['Mn2+', 'Mn', 1, 5, 'manganese'],
    ['Ni2+', 'Ni', 1, 8, 'nickel'],
    ['Zn2+', 'Zn', 1, 10, 'zinc'],
    ['Y3+', 'Y', 2, 0, 'yttrium'],
    ['Mo3+', 'Mo', 2, 3, 'molybdenum'],
    ['Ru(II)', 'Ru', 2, 6, 'ruthenium'],
    ['Rh3+', 'Rh', 2, 6, 'rhodium'],
    ['Pd(II)', 'Pd', 2, 8, 'palladium'],
    ['Ag+', 'Ag', 2, 10, 'silver'],
    ['Cd2+', 'Cd', 2, 10, 'cadmium'],
    ['La3+', 'La', 3, 0, 'lanthanum'],
    ['W(VI)', 'W', 3, 0, 'tungsten'],
    ['Re(IV)', 'Re', 3, 3, 'rhenium'],
    ['Os(VIII)', 'Os', 3, 0, 'osmium'],
    ['Ir3+', 'Ir', 3, 6, 'iridium'],
    ['Pt(IV)', 'Pt', 3, 6, 'platinum'],
    ['Pt2+', 'Pt', 3, 8, 'platinum'],
    ['Au3+', 'Au', 3, 8, 'gold'],
    ['Hg2+', 'Hg', 3, 10, 'mercury'],
  ];
  for (const [text, symbol, row, d, name] of cases) {
    it(`${text}: row ${row}, d${d}`, () => {
      const ion = parseIon(text);
      expect(ion.symbol).toBe(symbol);
      expect(ion.row).toBe(row);
      expect(ion.d).toBe(d);
      expect(ion.name).toBe(name);
    });
  }

  it('knows 30 transition metals, 10 per row, and all 118 symbols', () => {
    expect(TRANSITION_ELEMENTS.size).toBe(30); // IUPAC periodic table: groups 3–12, periods 4–6
    for (const row of [1, 2, 3]) {
      expect([...TRANSITION_ELEMENTS.values()].filter((e) => e.row === row)).toHaveLength(10);
    }
    expect(ELEMENT_SYMBOLS).toHaveLength(118); // IUPAC periodic table
    expect(new Set(ELEMENT_SYMBOLS).size).toBe(118);
    expect(ELEMENT_SYMBOLS[25]).toBe('Fe'); // IUPAC: iron is element 26
  });

  it('d0 and d10 are valid ions with a note', () => {
    expect(parseIon('Ti4+').note).toMatch(/d0: it has no d–d transitions/);
    expect(parseIon('Zn2+').note).toMatch(/d10: it has no d–d transitions/);
    expect(parseIon('Cr3+').note).toBeUndefined();
  });
});

describe('parseIon: errors', () => {
  it('pins the message for an unknown element', () => {
    const error = errorOf(() => parseIon('Xx3+'));
    expect(error.code).toBe('invalid-argument');
    expect(error.path).toBe('ion');
    expect(error.message).toBe('unknown element "Xx" in "Xx3+"');
  });
  it('names a non-transition element', () => {
    expect(errorOf(() => parseIon('Al3+')).message).toMatch(/^Al is not a transition metal/);
    expect(errorOf(() => parseIon('Ce3+')).message).toMatch(/^Ce is not a transition metal/);
  });
  it('rejects impossible oxidation states', () => {
    expect(errorOf(() => parseIon('Cr(VII)')).message).toBe(
      'Cr(VII) is an impossible oxidation state: Cr is in group 6, so it would have -1 d electrons (possible: 0 to 10)',
    );
    expect(errorOf(() => parseIon('Ni(-I)')).message).toMatch(/would have 11 d electrons/);
  });
  it('rejects missing, bare or unreadable charges', () => {
    expect(errorOf(() => parseIon('Fe')).message).toMatch(/no charge or oxidation state after Fe/);
    expect(errorOf(() => parseIon('Fe3')).message).toMatch(/cannot read the charge "3"/);
    expect(errorOf(() => parseIon('Fe(IIII)')).message).toMatch(/cannot read the charge/);
    expect(errorOf(() => parseIon('')).message).toMatch(/it is empty/);
    expect(errorOf(() => parseIon('3+')).message).toMatch(/does not start with an element symbol/);
  });
  it('hints at brackets for a glued Roman numeral and uses the given path', () => {
    const error = errorOf(() => parseIon('CrIII', { path: 'metal' }));
    expect(error.message).toMatch(/write Cr\(III\)/);
    expect(error.path).toBe('metal');
  });
});

describe('ionLabel', () => {
  it('writes charges the usual way', () => {
    expect(ionLabel('Cu', 1)).toBe('Cu+');
    expect(ionLabel('Cr', 0)).toBe('Cr0');
    expect(ionLabel('Fe', -2)).toBe('Fe2-');
  });
});
