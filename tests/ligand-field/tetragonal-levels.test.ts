import { describe, expect, it } from 'vitest';
import { spinFreeFieldLevels, spinFreeTetragonalLevelsViaCubic, validateTetragonalParameters } from '../../src/ligand-field/field-levels.js';
import { tetragonalEnergies, tetragonalRawLevels } from '../../src/ligand-field/field-levels.js';
import { seededRandom } from '../reference/seeded-random.js';
import { tetragonalLevelsMainAsFieldLevels } from '../reference/tetragonal-levels-main.js';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';

/**
 * The fast labelled tetragonal path (tetragonal-levels.ts: cubic block
 * eigenvalues and name tables, no cubic Level objects) against the plain
 * one (a labelled computeLevels, then parents by rank): the same levels,
 * energies, parents and order. A check of the code against itself (both use
 * this engine's blocks); the outside checks of the energies are the dense
 * references in tests/ligand-field/tetragonal.test.ts.
 */
describe('tetragonal labelled levels: fast path = plain path', () => {
  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i on seeded parameters of both signs, incl. strong fields and square-planar-like Ds, Dt', (d) => {
    const random = seededRandom(100 + d);
    for (let trial = 0; trial < 25; trial++) {
      const b = 500 + 600 * random();
      const p = validateTetragonalParameters('octahedral', {
        dq: 200 + 3500 * random(), b, c: b * (3 + 2 * random()),
        ds: (trial % 5 === 4 ? 6000 : 1200) * (random() - 0.3), dt: (trial % 5 === 4 ? 2000 : 500) * (random() - 0.3),
      });
      expect(spinFreeFieldLevels(d, 'octahedral', p)).toEqual(spinFreeTetragonalLevelsViaCubic(d, p));
    }
  });

  it('keeps the exact coincidence 4A1g + 4Eg of d5 (4G) apart as two parents in the right order', () => {
    // In Oh, 4A1g and 4Eg from 4G coincide at every Dq (common practice: they are the flat lines of the d5 Tanabe–Sugano diagram).
    const p = validateTetragonalParameters('octahedral', { dq: 1500, b: 800, c: 3200, ds: 50, dt: 10 });
    const fast = spinFreeFieldLevels(5, 'octahedral', p);
    expect(fast).toEqual(spinFreeTetragonalLevelsViaCubic(5, p));
    const parents = fast.map((l) => l.parent);
    // 4A1g(G) → 4A1g; 4Eg(G) → 4A1g + 4B1g: one and two levels, not a mix-up of the two coincident parents.
    expect(parents.filter((name) => name === '4A1g(G)')).toHaveLength(1);
    expect(parents.filter((name) => name === '4Eg(G)')).toHaveLength(2);
    expect(fast.find((l) => l.parent === '4A1g(G)')!.irrep).toBe('A1g');
  });

  it('the unsorted energies carry the same levels as the sorted objects, ground marked', () => {
    const random = seededRandom(7);
    for (let d = 1; d <= 9; d++) {
      const p = validateTetragonalParameters('octahedral', { dq: 1800 * random() + 100, b: 700, c: 3000, ds: 800 * (random() - 0.5), dt: 300 * (random() - 0.5) });
      const sorted = tetragonalRawLevels(d, p);
      const { count, energy, keys, ground } = tetragonalEnergies(d, p);
      expect(count).toBe(sorted.length);
      expect(energy[ground]).toBe(sorted[0]!.energy);
      const byKey = new Map(Array.from({ length: count }, (_, i) => [keys[i]!, energy[i]!]));
      for (const r of sorted) expect(byKey.get(`${r.twoS}:${['A1', 'A2', 'E', 'B1', 'B2'][r.channel]}#${r.rank}`)).toBe(r.energy);
    }
  });
});

/**
 * The per-d^n plan of tetragonal-levels.ts against main's earlier fast path,
 * kept unchanged in tests/reference/tetragonal-levels-main.ts: the same
 * objects (energies, irreps, parents, labels, order) on every d^n. A check
 * of the code against its own earlier version (same blocks and tables); the
 * outside checks of the energies are the dense references.
 */
describe('tetragonal labelled levels: the planned path = main\'s earlier path', () => {
  const tolerance = (p: { dq: number; b: number; c: number; ds: number; dt: number }): number =>
    1e-9 * (10 * Math.abs(p.dq) + 20 * p.b + 10 * p.c + 10 * Math.abs(p.ds) + 10 * Math.abs(p.dt));

  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i: weak to strong fields, both signs of Ds and Dt, square-planar-like limits', (d) => {
    const random = seededRandom(900 + d);
    for (let trial = 0; trial < 40; trial++) {
      const b = 400 + 700 * random();
      const strong = trial % 4 === 3;
      const p = validateTetragonalParameters('octahedral', {
        dq: (strong ? 2500 : 100) + 3000 * random(), b, c: b * (3 + 2 * random()),
        ds: (strong ? 8000 : 1500) * (random() - 0.4), dt: (strong ? 3000 : 600) * (random() - 0.4),
      });
      const expected = tetragonalLevelsMainAsFieldLevels(d, p.dq, p.b, p.c, p.ds, p.dt, tolerance(p));
      expect(computeFieldLevels(d, 'octahedral', p).levels).toEqual(expected);
    }
  });

  it('agrees where cubic levels of two irreps cross (d6 at the 5T2g/1A1g crossover region) and at tiny Ds', () => {
    for (let dq = 1800; dq <= 2300; dq += 25) {
      for (const [ds, dt] of [[1e-3, 0], [0, -1e-3], [300, 100]] as const) {
        const p = validateTetragonalParameters('octahedral', { dq, b: 700, c: 3000, ds, dt });
        expect(computeFieldLevels(6, 'octahedral', p).levels).toEqual(tetragonalLevelsMainAsFieldLevels(6, dq, 700, 3000, ds, dt, tolerance(p)));
      }
    }
  });
});
