import { expect, it } from 'vitest';
import * as api from '../../src/ligand-field/index.js';

it('the public API of src/ligand-field (a change here is a change of contract)', () => {
  expect(Object.keys(api).sort()).toEqual([
    'DIAGRAM_DEFAULTS', 'GEOMETRIES', 'computeDiagram', 'computeLevels', 'crossoverDqOverB', 'diagramDocument', 'freeIonTerms', 'levelsDocument', 'spinStateChoice',
  ]);
});
