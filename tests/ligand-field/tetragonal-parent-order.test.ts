import { describe, expect, it } from 'vitest';
import { spinFreeFieldLevels, spinFreeTetragonalLevelsViaCubic, validateTetragonalParameters } from '../../src/ligand-field/field-levels.js';
import { tetragonalEnergies } from '../../src/ligand-field/field-levels.js';
import { parentTableFor } from '../../src/ligand-field/parent-tables.js';
import { tetragonalParentRanks } from '../../src/ligand-field/tetragonal-levels.js';
import { seededRandom } from '../reference/seeded-random.js';

const D4H = ['A1g', 'A2g', 'Eg', 'B1g', 'B2g'];

/**
 * The octahedral parents of the fast path come from merging two cubic
 * (S, Γ) lists, one by its eigenvalues and the other by Sturm counts on its
 * tridiagonal form (tetragonal-levels.ts). Where the order of the two lists
 * changes (cubic levels of two irreps crossing as Dq/B or C/B moves) a
 * wrong count gives a wrong parent; these sweeps cross many such points
 * finely and compare with the plain path (a labelled computeLevels, parents
 * by rank: spinFreeTetragonalLevelsViaCubic). A check of the code against
 * itself; the energies' outside checks are the dense references.
 */
describe('tetragonal parents by Sturm counts = parents from a labelled cubic evaluation', () => {
  it.each([2, 3, 4, 5, 6, 7, 8])('d%i: a fine Dq/B sweep at three C/B, through the cubic crossings', (d) => {
    for (const cOverB of [3.2, 4.5, 5.8]) {
      for (let k = 0; k <= 160; k++) {
        const b = 750;
        const p = validateTetragonalParameters('octahedral', { dq: b * (0.02 + k * 0.025), b, c: b * cOverB, ds: 0.08 * b * (1 + (k % 3)), dt: -0.03 * b * (k % 4) });
        expect(spinFreeFieldLevels(d, 'octahedral', p), `Dq/B ${p.dq / b}, C/B ${cOverB}`).toEqual(spinFreeTetragonalLevelsViaCubic(d, p));
      }
    }
  });

  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i: 150 seeded fit-like parameter sets', (d) => {
    const random = seededRandom(4200 + d);
    for (let trial = 0; trial < 150; trial++) {
      const b = 400 + 800 * random();
      const dq = 50 + 3500 * random();
      const p = validateTetragonalParameters('octahedral', { dq, b, c: b * (2.5 + 3.5 * random()), ds: dq * 0.6 * (random() - 0.4), dt: dq * 0.3 * (random() - 0.4) });
      expect(spinFreeFieldLevels(d, 'octahedral', p)).toEqual(spinFreeTetragonalLevelsViaCubic(d, p));
    }
  });
});

/**
 * tetragonalParentRanks alone (the parent phase, by position): the name it
 * points to in the parent table is the parent the plain path gives the
 * level of the same (2S+1, D4h irrep, rank in its block); it depends on
 * Dq, B, C only, so one call serves two different (Ds, Dt). A check of the
 * code against itself, as above.
 */
describe('tetragonalParentRanks = the parents of the plain path, by position', () => {
  it.each([2, 3, 4, 5, 6, 7, 8])('d%i: 40 seeded parameter sets, two distortions each', (d) => {
    const random = seededRandom(7700 + d);
    for (let trial = 0; trial < 40; trial++) {
      const b = 400 + 800 * random();
      const dq = 50 + 3500 * random();
      const c = b * (2.5 + 3.5 * random());
      const { column, rank } = tetragonalParentRanks(d, dq, b, c);
      const names = parentTableFor(d, c / b).labels('octahedral');
      const { count, twoS, channel, rank: ownRank } = tetragonalEnergies(d, validateTetragonalParameters('octahedral', { dq, b, c, ds: 1, dt: 1 }));
      const byPosition = Array.from({ length: count }, (_, i) => `${twoS[i]! + 1}${D4H[channel[i]!]}#${ownRank[i]} ${names[5 * (twoS[i]! + 1) + column[i]!]![rank[i]!]}`);
      for (const [ds, dt] of [[0.3 * dq, 0.1 * dq], [-0.5 * dq, 0.2 * dq]] as const) {
        const plain = spinFreeTetragonalLevelsViaCubic(d, validateTetragonalParameters('octahedral', { dq, b, c, ds, dt }));
        // The k-th level of each (2S+1, irrep) in energy order is the block's rank k.
        const seen = new Map<string, number>();
        const expected = plain.map((level) => {
          const k = seen.get(level.term) ?? 0;
          seen.set(level.term, k + 1);
          return `${level.multiplicity}${level.irrep}#${k} ${level.parent}`;
        });
        expect([...byPosition].sort()).toEqual(expected.sort());
      }
    }
  });
});
