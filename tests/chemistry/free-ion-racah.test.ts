import { describe, expect, it } from 'vitest';
import { freeIonRacah, FREE_ION_RACAH } from '../../src/chemistry/free-ion-racah.js';
import { parseIon } from '../../src/chemistry/ions.js';

describe('freeIonRacah', () => {
  // Free-ion B0 in cm-1 as the table holds them: from memory; cf. Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984)
  // and Figgis & Hitchman, Ligand Field Theory and Its Applications (2000), free-ion tables. A found table (Jolly,
  // Modern Inorganic Chemistry, 1989, p. 411) agrees for V3+ and Cr3+ and gives lower M2+ values (its numbers are in the
  // source strings); Mn3+, Mn4+, Fe2+, Ni3+ (and C0 of Fe3+) are derived from NIST levels, and every value
  // with a NIST level list is checked in free-ion-nist.test.ts.
  const recalled: [string, number][] = [
    ['Ti2+', 718], // from memory (Figgis & Hitchman 2000 table); NIST-level fit 716; found: Jolly (1989) 695, differs by −3.2 %
    ['V2+', 766], // from memory (Figgis & Hitchman 2000 table); NIST-level fit 772; found: Jolly (1989) 755, differs by −1.4 %
    ['V3+', 861], // from memory (Figgis & Hitchman 2000 table); Jolly (1989), p. 411: 861; NIST-level fit 862
    ['Cr2+', 830], // from memory (Figgis & Hitchman 2000 table); NIST-level fit 841; found: Jolly (1989) 810, differs by −2.4 %
    ['Cr3+', 918], // from memory (Figgis & Hitchman 2000 table); Jolly (1989), p. 411: 918; NIST-level fit 946
    ['Mn2+', 960], // from memory (Figgis & Hitchman 2000 table); the NIST-level fit gives 880 (see free-ion-nist.test.ts); found: Jolly (1989) 860, differs by −10.4 %
    ['Co2+', 1115], // from memory (Figgis & Hitchman 2000 table); the NIST-level fit gives 994 (see free-ion-nist.test.ts); found: Jolly (1989) 971, differs by −12.9 %
    ['Ni2+', 1041], // from memory (Figgis & Hitchman 2000 table; 1080 also quoted); NIST-level fit 1086; found: Jolly (1989) 1030, differs by −1.1 %
  ];
  for (const [label, b] of recalled) {
    it(`${label}: B0 = ${b} cm-1`, () => {
      const entry = freeIonRacah(parseIon(label));
      expect(entry?.b).toBe(b);
      expect(entry?.source).toMatch(/^from memory/);
    });
  }

  it('Mn2+ C0 = 3325 cm-1 and Cr3+ C0 = 3850 cm-1', () => {
    expect(freeIonRacah(parseIon('Mn2+'))?.c).toBe(3325); // from memory (Figgis & Hitchman 2000 table)
    expect(freeIonRacah(parseIon('Cr3+'))?.c).toBe(3850); // from memory (Figgis & Hitchman 2000 table)
  });

  it('every entry is a d2–d8 ion with a named source and a C/B ratio in the usual range', () => {
    for (const [label, entry] of FREE_ION_RACAH) {
      const ion = parseIon(label);
      expect(ion.d).toBeGreaterThanOrEqual(2);
      expect(ion.d).toBeLessThanOrEqual(8);
      expect(entry.source).toMatch(/from memory|NIST/);
      // C/B between about 3 and 5 for free 3d ions: common practice
      expect(entry.c / entry.b).toBeGreaterThan(3);
      expect(entry.c / entry.b).toBeLessThan(5);
    }
  });

  it('has no entry for d1, d9 or ions without a recalled value', () => {
    expect(freeIonRacah(parseIon('Ti3+'))).toBeUndefined();
    expect(freeIonRacah(parseIon('Cu2+'))).toBeUndefined();
    expect(freeIonRacah(parseIon('Rh3+'))).toBeUndefined();
  });

  it('returns a copy that cannot change the table', () => {
    const entry = freeIonRacah(parseIon('Cr3+'));
    if (entry) entry.b = 0;
    expect(freeIonRacah(parseIon('Cr3+'))?.b).toBe(918);
  });
});
