import { describe, expect, it } from 'vitest';
import { parseFormula } from '../../src/chemistry/formula.js';
import { errorOf } from '../helpers/errors.js';


// Oxidation states and d-counts of these well-known complexes: common practice
// (formal charges: complex charge minus ligand charges; d = group − oxidation state).
const CASES: [formula: string, ion: string, ox: number, d: number, ligands: [string, number][], cn: number, geometry: string | undefined][] = [
  ['[Ni(NH3)6]Cl2', 'Ni2+', 2, 8, [['NH3', 6]], 6, 'octahedral'],
  ['K3[Fe(C2O4)3]', 'Fe3+', 3, 5, [['ox', 3]], 6, 'octahedral'],
  ['K3[Fe(ox)3]', 'Fe3+', 3, 5, [['ox', 3]], 6, 'octahedral'],
  ['[Co(en)2Cl2]+', 'Co3+', 3, 6, [['en', 2], ['Cl', 2]], 6, 'octahedral'],
  ['[Co(NH3)6]3+', 'Co3+', 3, 6, [['NH3', 6]], 6, 'octahedral'],
  ['[CoCl4]2-', 'Co2+', 2, 7, [['Cl', 4]], 4, 'tetrahedral'],
  ['[Fe(CN)6]4-', 'Fe2+', 2, 6, [['CN', 6]], 6, 'octahedral'],
  ['[Cr(H2O)6]Cl3', 'Cr3+', 3, 3, [['H2O', 6]], 6, 'octahedral'],
  ['[Cu(H2O)6](NO3)2', 'Cu2+', 2, 9, [['H2O', 6]], 6, 'octahedral'],
  ['Na2[Ni(CN)4]', 'Ni2+', 2, 8, [['CN', 4]], 4, 'tetrahedral'],
  ['[Mn(H2O)6]SO4', 'Mn2+', 2, 5, [['H2O', 6]], 6, 'octahedral'],
  ['CoCl4 2-', 'Co2+', 2, 7, [['Cl', 4]], 4, 'tetrahedral'],
  ['Co(NH3)6^3+', 'Co3+', 3, 6, [['NH3', 6]], 6, 'octahedral'],
  ['[Co(NH3)6]^3+', 'Co3+', 3, 6, [['NH3', 6]], 6, 'octahedral'],
  ['[Co(NH3)6]³⁺', 'Co3+', 3, 6, [['NH3', 6]], 6, 'octahedral'],
  ['[Co(NH3)5Cl]Cl2', 'Co3+', 3, 6, [['NH3', 5], ['Cl', 1]], 6, 'octahedral'],
  ['[Cr(H2O)6]2(SO4)3', 'Cr3+', 3, 3, [['H2O', 6]], 6, 'octahedral'],
  ['(NEt4)2[NiCl4]', 'Ni2+', 2, 8, [['Cl', 4]], 4, 'tetrahedral'],
  ['(NH4)2[Fe(H2O)6](SO4)2', 'Fe2+', 2, 6, [['H2O', 6]], 6, 'octahedral'],
  ['K4[Fe(CN)6]·3H2O', 'Fe2+', 2, 6, [['CN', 6]], 6, 'octahedral'],
  ['[Co(edta)]-', 'Co3+', 3, 6, [['edta', 1]], 6, 'octahedral'],
  ['[Cr(acac)3]', 'Cr3+', 3, 3, [['acac', 3]], 6, 'octahedral'],
  ['[Fe(H2O)5OH]2+', 'Fe3+', 3, 5, [['H2O', 5], ['OH', 1]], 6, 'octahedral'],
  ['[Co(NH3)5(ONO)]2+', 'Co3+', 3, 6, [['NH3', 5], ['ONO', 1]], 6, 'octahedral'],
  ['[Cr(NCS)6]3-', 'Cr3+', 3, 3, [['NCS', 6]], 6, 'octahedral'],
  ['[Ru(bpy)3]2+', 'Ru2+', 2, 6, [['bpy', 3]], 6, 'octahedral'],
  ['[PtCl6]2-', 'Pt4+', 4, 6, [['Cl', 6]], 6, 'octahedral'],
  ['[Ni(dmso)6](ClO4)2', 'Ni2+', 2, 8, [['dmso', 6]], 6, 'octahedral'],
  ['Cr(CO)6', 'Cr0', 0, 6, [['CO', 6]], 6, 'octahedral'],
  ['[Ag(NH3)2]+', 'Ag+', 1, 10, [['NH3', 2]], 2, undefined],
];

describe('parseFormula: oxidation state, d-count, ligands', () => {
  for (const [formula, ion, ox, d, ligands, cn, geometry] of CASES) {
    it(`${formula} → ${ion}, d${d}`, () => {
      const parsed = parseFormula(formula);
      expect(parsed.metal.label).toBe(ion);
      expect(parsed.oxidationState).toBe(ox);
      expect(parsed.d).toBe(d);
      expect(parsed.ligands.map((l) => [l.key, l.count])).toEqual(ligands);
      expect(parsed.coordinationNumber).toBe(cn);
      expect(parsed.geometry).toBe(geometry);
    });
  }

  it('reports counter-ions, charge source, hydrate water and the rewritten complex ion', () => {
    const salt = parseFormula('[Cr(H2O)6]Cl3·6H2O');
    expect(salt.counterIons).toEqual([{ formula: 'Cl', count: 3, charge: -1 }]);
    expect(salt.chargeSource).toBe('counter-ions');
    expect(salt.complexCharge).toBe(3);
    expect(salt.hydrateWater).toBe(6);
    expect(salt.complexIon).toBe('[Cr(H2O)6]3+');
    expect(parseFormula('[Co(NH3)5Cl]Cl2').complexIon).toBe('[Co(NH3)5Cl]2+');
    expect(parseFormula('[Co(NH3)6]3+').chargeSource).toBe('stated');
    expect(parseFormula('[Cr(H2O)6]2(SO4)3').complexCount).toBe(2);
  });

  it('ligand data: charge, denticity, donors (common practice)', () => {
    const [en] = parseFormula('[Co(en)3]3+').ligands;
    expect(en).toMatchObject({ key: 'en', charge: 0, denticity: 2, donors: ['N', 'N'], name: 'ethylenediamine' });
    const [edta] = parseFormula('[Co(edta)]-').ligands;
    expect(edta).toMatchObject({ charge: -4, denticity: 6 });
    expect(parseFormula('[Cr(NCS)6]3-').ligands[0]?.donors).toEqual(['N']);
    expect(parseFormula('[Cr(SCN)6]3-').ligands[0]?.donors).toEqual(['S']);
  });

  it('warns: guessed geometry, d8 four-coordinate, assumed charge, mixed ligands, d0/d10', () => {
    expect(parseFormula('[CoCl4]2-').warnings).toContain('geometry guessed from the coordination number 4: tetrahedral');
    expect(parseFormula('Na2[Ni(CN)4]').warnings.join(' ')).toMatch(/often square planar/);
    expect(parseFormula('[PtCl4]2-').warnings.join(' ')).toMatch(/almost always square planar/);
    expect(parseFormula('[CoCl4]2-').warnings.join(' ')).not.toMatch(/square planar/);
    expect(parseFormula('[Co(NH3)3Cl3]').warnings).toContain('no charge and no counter-ions given: the complex is taken as neutral');
    expect(parseFormula('[Co(NH3)5Cl]2+').warnings.join(' ')).toMatch(/mixed ligands/);
    expect(parseFormula('[Zn(H2O)6]2+').warnings.join(' ')).toMatch(/d10: it has no d–d transitions/);
    expect(parseFormula('[Ag(NH3)2]+').warnings.join(' ')).toMatch(/coordination number 2: no geometry guessed/);
    expect(parseFormula('Co(NH3)6Cl3').warnings.join(' ')).toMatch(/without brackets every group counts as a ligand/);
  });
});

describe('parseFormula: errors', () => {
  it('pins the message for an unknown ligand', () => {
    const error = errorOf(() => parseFormula('[Co(xyz)6]3+'));
    expect(error.code).toBe('parse-error');
    expect(error.path).toBe('formula');
    expect(error.message).toBe('unknown ligand "xyz" (character 5 of "[Co(xyz)6]3+")');
  });
  const bad: [string, RegExp][] = [
    ['[Co(NH3)6', /^unbalanced brackets: "\[" is never closed \(character 1 of/],
    ['[Co(NH3)6]]', /^unbalanced brackets: "\]" closes nothing \(character 11 of/],
    ['[Co(NH3)6)', /^unbalanced brackets: "\)" closes "\[" \(character 10 of/],
    ['[Q(NH3)6]3+', /^unknown element "Q" where the metal should be \(character 2/],
    ['[AlCl4]-', /^Al is not a transition metal/],
    ['[Co(NH3)6]Xy3', /^unknown counter-anion "Xy3" after the complex \(character 11/],
    ['Qq[Co(NH3)6]', /^unknown counter-cation "Qq" before the complex \(character 1/],
    ['[Co(NH3)6]3+Cl3', /^give either the charge of the complex or its counter-ions, not both/],
    ['[Co(NH3)6]9+', /^charges do not balance \(complex \+9, ligands 0\): Co\(\+9\) is an impossible oxidation state/],
    ['[Cr(CN)6]2+', /^charges do not balance \(complex \+2, ligands -6\): Cr\(VIII\) is an impossible oxidation state/],
    ['[Co(NH3)6]2(NO3)3', /^charges do not balance: counter-ions of total charge -3 cannot be shared by 2 complex ions/],
    ['[Co(NH3)6][Cr(CN)6]', /^a second complex ion is not supported/],
    ['[CoCl4x]2-', /^cannot read a ligand in "x"/],
    ['[Co]3+', /^no ligands after the metal/],
    ['CoCl42-', /^without brackets, write the charge after a space or \^/],
    ['[Co(NH3)6]Cl3.5H2', /^cannot read what follows the dot/],
    ['  ', /^the formula is empty$/],
  ];
  for (const [formula, message] of bad) {
    it(`rejects ${JSON.stringify(formula)}`, () => {
      const error = errorOf(() => parseFormula(formula));
      expect(error.code).toBe('parse-error');
      expect(error.path).toBe('formula');
      expect(error.message).toMatch(message);
    });
  }
});
