import { describe, expect, it } from 'vitest';
import {
  JORGENSEN_F, JORGENSEN_G, JORGENSEN_H, JORGENSEN_K, JORGENSEN_SOURCE,
  jorgensenF, jorgensenG, jorgensenH, jorgensenK,
} from '../../src/chemistry/jorgensen.js';
import { parseIon } from '../../src/chemistry/ions.js';
import { ligandByKey } from '../../src/chemistry/ligands.js';

describe('Jørgensen factors', () => {
  it('f values', () => {
    expect(jorgensenF('H2O')).toBe(1); // definition of the scale (Jørgensen 1962)
    expect(jorgensenF('Br')).toBe(0.72); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('Cl')).toBe(0.78); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('NH3')).toBe(1.25); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('en')).toBe(1.28); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('NO2')).toBe(1.4); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('SCN')).toBe(0.75); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('CN')).toBe(1.7); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenF('OH')).toBeUndefined();
  });

  it('g values in cm-1', () => {
    expect(jorgensenG(parseIon('Cr3+'))).toBe(17400); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenG(parseIon('Co(III)'))).toBe(18200); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenG(parseIon('Ni2+'))).toBe(8700); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenG(parseIon('Rh3+'))).toBe(27000); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenG(parseIon('Fe2+'))).toBe(8500); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenG(parseIon('Cu2+'))).toBeUndefined();
  });

  it('h and k values', () => {
    expect(jorgensenH('H2O')).toBe(1); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenH('F')).toBe(0.8); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenH('I')).toBeUndefined(); // not in the looked-up table: an estimate in src/predict
    expect(jorgensenK(parseIon('Mn2+'))).toBe(0.07); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
    expect(jorgensenK(parseIon('Co3+'))).toBe(0.35); // Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348
  });

  it('the spectrochemical and nephelauxetic orders the tables imply', () => {
    const byF = [...JORGENSEN_F].sort((a, b) => a[1] - b[1]).map(([k]) => k);
    // spectrochemical series Br < Cl < F < H2O < NH3 < en < CN: common practice
    const series = ['Br', 'Cl', 'F', 'H2O', 'NH3', 'en', 'CN'];
    expect(byF.filter((k) => series.includes(k))).toEqual(series);
    const byH = [...JORGENSEN_H].sort((a, b) => a[1] - b[1]).map(([k]) => k);
    // nephelauxetic series F < H2O < NH3 < Cl < Br: common practice
    const neph = ['F', 'H2O', 'NH3', 'Cl', 'Br'];
    expect(byH.filter((k) => neph.includes(k))).toEqual(neph);
  });

  it('every key is a known ligand or a parseable ion, and the source is named', () => {
    for (const key of [...JORGENSEN_F.keys(), ...JORGENSEN_H.keys()]) expect(ligandByKey(key), key).toBeDefined();
    for (const label of [...JORGENSEN_G.keys(), ...JORGENSEN_K.keys()]) expect(parseIon(label).label).toBe(label);
    expect(JORGENSEN_SOURCE).toMatch(/Jørgensen.*1971.*1962.*looked up/);
  });
});
