import { describe, expect, it } from 'vitest';
import * as chemistry from '../../src/chemistry/index.js';
import * as series from '../../src/series/index.js';
import * as predict from '../../src/predict/index.js';

// The public API of src/chemistry and src/series: a change here is a change of contract.
describe('public exports', () => {
  it('src/chemistry/index.ts', () => {
    expect(Object.keys(chemistry).sort()).toEqual([
      'ELEMENT_SYMBOLS', 'FREE_ION_RACAH', 'ION_FORMS', 'JORGENSEN_F', 'JORGENSEN_G', 'JORGENSEN_H', 'JORGENSEN_K',
      'JORGENSEN_SOURCE', 'LIGANDS', 'MAX_OXIDATION_STATE', 'MIN_OXIDATION_STATE', 'TRANSITION_ELEMENTS',
      'bareLigandAt', 'chargeFromText', 'counterIonAt', 'counterIonByFormula', 'elementSymbolFromText', 'findLigand',
      'freeIonRacah', 'ionFromOxidationState', 'ionLabel', 'jorgensenF', 'jorgensenG', 'jorgensenH', 'jorgensenK',
      'ligandByKey', 'parseFormula', 'parseIon', 'romanOxidationState',
    ]);
  });
  it('src/series/index.ts', () => {
    expect(Object.keys(series).sort()).toEqual([
      'averageEnvironmentFactor', 'averageEnvironmentTenDq', 'canonicalLigand', 'combine', 'fitLigandFactors',
      'ownFactorsFromFit', 'predictComplex', 'rankByNephelauxetic', 'rankByTenDq', 'validateSeriesAnalyses', 'valuesOverlap',
    ]);
  });
  it('src/predict/index.ts', () => {
    expect(Object.keys(predict).sort()).toEqual([
      'BORDERLINE_PROBABILITY', 'HALIDES', 'NEPHELAUXETIC_ESTIMATE', 'PAIRING_ENERGY_SOURCE', 'PI_ACCEPTORS', 'RULES',
      'SPECTROCHEMICAL_ESTIMATE', 'SQUARE_PLANAR_LIGANDS', 'STRONG_FIELD', 'boxArrows', 'decideSpin', 'erfc', 'fourCoordinateRule',
      'ligandF', 'ligandH', 'ligandsWithF', 'meanPairingEnergy', 'metalG', 'metalK', 'normalCdf', 'orbitalContribution', 'orbitalOccupation',
      'pairingEnergyExpression', 'spinNumbers', 'spinRule',
    ]);
  });
});
