import { describe, expect, it } from 'vitest';
import { bareLigandAt, findLigand, LIGANDS, ligandByKey } from '../../src/chemistry/ligands.js';

describe('ligands table', () => {
  it('keys are unique and denticity equals the number of donor atoms', () => {
    expect(new Set(LIGANDS.map((l) => l.key)).size).toBe(LIGANDS.length);
    for (const l of LIGANDS) expect(l.denticity).toBe(l.donors.length);
  });

  it('charges and denticities of common ligands', () => {
    // common practice
    expect(ligandByKey('H2O')).toMatchObject({ charge: 0, denticity: 1, donors: ['O'] });
    expect(ligandByKey('ox')).toMatchObject({ formula: 'C2O4', charge: -2, denticity: 2 });
    expect(ligandByKey('edta')).toMatchObject({ charge: -4, denticity: 6 });
    expect(ligandByKey('acac')).toMatchObject({ charge: -1, denticity: 2 });
    expect(ligandByKey('NO2')?.donors).toEqual(['N']);
    expect(ligandByKey('ONO')?.donors).toEqual(['O']);
  });

  it('finds ligands by formula, abbreviation, name and charged spelling', () => {
    expect(findLigand('C2O4')?.key).toBe('ox');
    expect(findLigand('ox')?.key).toBe('ox');
    expect(findLigand('EDTA')?.key).toBe('edta');
    expect(findLigand('ammine')?.key).toBe('NH3');
    expect(findLigand('OH2')?.key).toBe('H2O');
    expect(findLigand('bipy')?.key).toBe('bpy');
    expect(findLigand('CN-')?.key).toBe('CN');
    expect(findLigand('C2O4 2-')?.key).toBe('ox');
    expect(findLigand('CO')?.key).toBe('CO');
    expect(findLigand('CN+')).toBeUndefined();
    expect(findLigand('xyz')).toBeUndefined();
  });

  it('reads bare ligands longest first', () => {
    expect(bareLigandAt('[Fe(H2O)5OH2]', 9)?.ligand.key).toBe('H2O');
    expect(bareLigandAt('[Fe(H2O)5OH]', 9)?.ligand.key).toBe('OH');
    expect(bareLigandAt('[CrO4]', 3)?.ligand.key).toBe('O');
    expect(bareLigandAt('[Cr(NH3)3(NCS)3]', 4)?.ligand.key).toBe('NH3');
    expect(bareLigandAt('en', 0)).toBeUndefined();
  });
});
