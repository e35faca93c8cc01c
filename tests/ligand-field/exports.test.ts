import { expect, it } from 'vitest';
import * as api from '../../src/ligand-field/index.js';

it('the public API of src/ligand-field (a change here is a change of contract)', () => {
  expect(Object.keys(api).sort()).toEqual([
    'DIAGRAM_DEFAULTS', 'FIELD_DIAGRAM_AXES', 'FREE_ION_ZETA', 'GEOMETRIES', 'REAL_D_ORBITALS', 'angularOverlapField', 'computeDiagram', 'computeFieldDiagram',
    'computeFieldLevels', 'computeLevels', 'crossoverDqOverB', 'cubicOrbitalField', 'diagramDocument', 'fieldDiagramDocument', 'fieldLevelsDocument',
    'freeIonTerms', 'freeIonZeta', 'generalFieldLevels', 'levelsDocument', 'spinOrbitEnergies', 'spinStateChoice', 'tetragonalOrbitalEnergies',
    'tetragonalOrbitalField',
  ]);
});
