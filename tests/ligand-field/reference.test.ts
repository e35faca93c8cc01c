import { describe, expect, it } from 'vitest';
import { computeLevels } from '../../src/ligand-field/index.js';
import type { Geometry } from '../../src/ligand-field/types.js';
import { referenceSpectrum } from '../reference/dense-hamiltonian.js';
import { seededRandom } from '../reference/seeded-random.js';

/**
 * The fast, symmetry-blocked path against the dense reference (one C(10, n)
 * matrix, second-quantised operators, Jacobi, spin from <S²>), on seeded
 * random parameters: every eigenvalue with its multiplicity and spin.
 */

function expandLevels(d: number, geometry: Geometry, params: { dq: number; b: number; c: number }) {
  const states: Array<{ energy: number; twoS: number }> = [];
  for (const level of computeLevels(d, geometry, params).levels)
    for (let i = 0; i < level.degeneracy; i++) states.push({ energy: level.energy, twoS: level.multiplicity - 1 });
  return states.sort((x, y) => x.energy - y.energy || x.twoS - y.twoS);
}

describe.each(['octahedral', 'tetrahedral'] as const)('fast path = dense reference, %s', (geometry) => {
  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i, seeded random Dq, B, C', (d) => {
    const random = seededRandom(1000 * d + (geometry === 'octahedral' ? 1 : 2));
    const trials = d >= 4 && d <= 6 ? 1 : 2;
    for (let t = 0; t < trials; t++) {
      const params = { dq: 3000 * random(), b: 400 + 800 * random(), c: 1500 + 3000 * random() };
      const reference = referenceSpectrum(d, geometry, params);
      const fast = expandLevels(d, geometry, params);
      const scale = reference.states.at(-1)!.energy;
      expect(fast.length).toBe(reference.states.length);
      const tol = 1e-6 * scale;
      // Spins compared as multisets within each energy cluster (degenerate levels may come in any order).
      const refSorted = [...reference.states].sort((x, y) => x.energy - y.energy);
      for (let i = 0; i < fast.length; i++) {
        expect(Math.abs(fast[i]!.energy - refSorted[i]!.energy)).toBeLessThanOrEqual(1e-8 * scale);
      }
      for (let i = 0; i < fast.length; ) {
        let j = i + 1;
        while (j < fast.length && fast[j]!.energy - fast[j - 1]!.energy <= tol) j++;
        const spins = (list: Array<{ twoS: number }>) => list.slice(i, j).map((s) => s.twoS).sort();
        expect(spins(fast)).toEqual(spins(refSorted));
        i = j;
      }
    }
  });
});
