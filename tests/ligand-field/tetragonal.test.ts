import { describe, expect, it } from 'vitest';
import { computeFieldLevels, spinOrbitEnergies, validateTetragonalParameters } from '../../src/ligand-field/field-levels.js';
import { computeLevels } from '../../src/ligand-field/levels.js';
import { tetragonalOrbitalEnergies } from '../../src/ligand-field/tetragonal-field.js';
import { referenceFieldEnergies } from '../reference/dense-field-hamiltonian.js';
import { seededRandom } from '../reference/seeded-random.js';
import { FieldgapError } from '../../src/errors.js';

const binomial = (n: number, k: number): number => (k === 0 ? 1 : (binomial(n, k - 1) * (n - k + 1)) / k);

/** Every state's energy, each level repeated by its degeneracy, ascending. */
function stateEnergies(levels: ReadonlyArray<{ energy: number; degeneracy: number }>): number[] {
  return levels.flatMap((l) => new Array<number>(l.degeneracy).fill(l.energy)).sort((x, y) => x - y);
}

describe('tetragonal field and spin–orbit coupling against the dense reference', () => {
  const random = seededRandom(15);
  const draw = (lo: number, hi: number): number => lo + (hi - lo) * random();
  for (let d = 1; d <= 9; d++) {
    const cases = [
      { geometry: 'octahedral' as const, ds: draw(-800, 800), dt: draw(-300, 300), zeta: 0 },
      { geometry: 'octahedral' as const, ds: draw(-800, 800), dt: draw(-300, 300), zeta: draw(50, 900) },
      { geometry: 'octahedral' as const, ds: 0, dt: 0, zeta: draw(50, 900) },
      { geometry: 'tetrahedral' as const, ds: 0, dt: 0, zeta: draw(50, 900) },
    ];
    for (const { geometry, ds, dt, zeta } of cases) {
      const params = { dq: draw(200, 2500), b: draw(400, 1100), c: draw(1600, 4800), ds, dt, zeta };
      it(`d${d} ${geometry} Ds=${ds.toFixed(1)} Dt=${dt.toFixed(1)} ζ=${zeta.toFixed(1)}: every state within 1e-6 cm-1`, () => {
        // Reference: tests/reference/dense-field-hamiltonian.ts (independent dense build, Jacobi).
        const reference = referenceFieldEnergies(d, geometry, params);
        const result = computeFieldLevels(d, geometry, params);
        const engine = stateEnergies(result.levels);
        expect(engine.length).toBe(binomial(10, d));
        expect(reference.length).toBe(engine.length);
        for (let i = 0; i < engine.length; i++) expect(Math.abs(engine[i]! - reference[i]!)).toBeLessThan(1e-6);
        if (zeta > 0 && d % 2 === 1) for (const level of result.levels) expect(level.degeneracy % 2).toBe(0); // Kramers
        // Levels are distinct: a level's degeneracy is the whole set of equal states.
        for (let i = 1; i < result.levels.length; i++) {
          expect(result.levels[i]!.energy).toBeGreaterThanOrEqual(result.levels[i - 1]!.energy);
        }
      });
    }
  }
});

describe('one-electron energies (d1 and d9) in the tetragonal convention', () => {
  // Convention of issue 15, the usual crystal-field definition of Ds and Dt (common practice):
  // a1g = 6Dq − 2Ds − 6Dt, b1g = 6Dq + 2Ds − Dt, b2g = −4Dq + 2Ds − Dt, eg = −4Dq − Ds + 4Dt.
  const dq = 1000;
  const ds = 300;
  const dt = 100;
  const e = { a1g: 4800, b1g: 6500, b2g: -3500, eg: -3900 };
  it('d1: the four orbital energies, with their degeneracies and D4h labels', () => {
    expect(tetragonalOrbitalEnergies(dq, ds, dt)).toEqual(e);
    const levels = computeFieldLevels(1, 'octahedral', { dq, b: 800, c: 3200, ds, dt }).levels;
    expect(levels.map((l) => [l.term, l.degeneracy])).toEqual([['2Eg', 4], ['2B2g', 2], ['2A1g', 2], ['2B1g', 2]]);
    [0, e.b2g - e.eg, e.a1g - e.eg, e.b1g - e.eg].forEach((energy, i) => expect(levels[i]!.energy).toBeCloseTo(energy, 9));
    expect(levels.map((l) => l.parent)).toEqual(['2T2g(D)', '2T2g(D)', '2Eg(D)', '2Eg(D)']);
  });
  it('d9 (one hole): the order is reversed; elongation (Ds, Dt > 0) puts the hole in b1g', () => {
    const levels = computeFieldLevels(9, 'octahedral', { dq, b: 800, c: 3200, ds, dt }).levels;
    expect(levels.map((l) => l.term)).toEqual(['2B1g', '2A1g', '2B2g', '2Eg']);
    [0, e.b1g - e.a1g, e.b1g - e.b2g, e.b1g - e.eg].forEach((energy, i) => expect(levels[i]!.energy).toBeCloseTo(energy, 9));
  });
});

describe('spin–orbit coupling in the free ion: Landé interval rule', () => {
  it('d1 2D: J = 5/2 lies 5ζ/2 above J = 3/2; d9 inverted', () => {
    // Landé interval rule E(J) − E(J−1) = λJ, λ = ζ for one electron, −ζ for one hole (common practice).
    const zeta = 154;
    const d1 = computeFieldLevels(1, 'octahedral', { dq: 0, b: 700, c: 2800, zeta }).levels;
    expect(d1.map((l) => l.degeneracy)).toEqual([4, 6]);
    expect(d1[1]!.energy).toBeCloseTo(2.5 * zeta, 9);
    const d9 = computeFieldLevels(9, 'octahedral', { dq: 0, b: 700, c: 2800, zeta }).levels;
    expect(d9.map((l) => l.degeneracy)).toEqual([6, 4]);
    expect(d9[1]!.energy).toBeCloseTo(2.5 * zeta, 9);
  });
  it('d2 and d8 3F: intervals 3λ and 4λ with λ = ±ζ/2S to first order in ζ', () => {
    // Landé interval rule; λ = ζ/2S below half filling, −ζ/2S above (common practice).
    const zeta = 1; // small beside the repulsion, so first-order perturbation holds to ~1e-4
    for (const [d, order] of [[2, [5, 7, 9]], [8, [9, 7, 5]]] as const) {
      const levels = computeFieldLevels(d, 'octahedral', { dq: 0, b: 1000, c: 4000, zeta }).levels.slice(0, 3);
      expect(levels.map((l) => l.degeneracy)).toEqual(order);
      const lambda = zeta / 2;
      expect(levels[1]!.energy).toBeCloseTo((d === 2 ? 3 : 4) * lambda, 3);
      expect(levels[2]!.energy - levels[1]!.energy).toBeCloseTo((d === 2 ? 4 : 3) * lambda, 3);
    }
  });
});

describe('labels', () => {
  it('with Ds = Dt = ζ = 0 the cubic levels are unchanged', () => {
    const cubic = computeLevels(3, 'octahedral', { dq: 1740, b: 725, c: 2900 });
    const field = computeFieldLevels(3, 'octahedral', { dq: 1740, b: 725, c: 2900, ds: 0, dt: 0, zeta: 0 });
    expect(field.levels.map((l) => [l.energy, l.term, l.degeneracy, l.parent])).toEqual(
      cubic.levels.map((l) => [l.energy, l.term, l.degeneracy, l.parent]),
    );
    expect(field.group).toBe('Oh');
  });
  it('d3 trans-distortion: 4T2g → 4B2g + 4Eg and 4T1g(F) → 4A2g + 4Eg, each named by its octahedral parent', () => {
    const levels = computeFieldLevels(3, 'octahedral', { dq: 1740, b: 725, c: 2900, ds: 200, dt: 80 }).levels;
    const quartets = levels.filter((l) => l.multiplicity === 4);
    expect(quartets[0]!.term).toBe('4B1g'); // A2g of Oh → B1g of D4h
    const children = (parent: string): string[] => quartets.filter((l) => l.parent === parent).map((l) => l.term).sort();
    expect(children('4T2g(F)')).toEqual(['4B2g', '4Eg']);
    expect(children('4T1g(F)')).toEqual(['4A2g', '4Eg']);
    expect(children('4T1g(P)')).toEqual(['4A2g', '4Eg']);
  });
  it('square planar (large positive Ds, Dt) d8 is low-spin 1A1g, reached without special cases', () => {
    const result = computeFieldLevels(8, 'octahedral', { dq: 2000, b: 700, c: 2800, ds: 4000, dt: 2000 });
    expect(result.groundTerm).toBe('1A1g');
    expect(result.group).toBe('D4h');
  });
  it('tetrahedral Co(II) with ζ: 4A2 → Γ8, 4T2 and 4T1(F) → Γ6 + Γ7 + 2Γ8 (Td double group)', () => {
    // T1 ⊗ D(3/2) = Γ6 + Γ7 + 2Γ8 and A2 ⊗ D(3/2) = Γ8 (Bethe; common practice).
    const levels = computeFieldLevels(7, 'tetrahedral', { dq: 400, b: 780, c: 3500, zeta: 500 }).levels;
    expect(levels[0]!.term).toBe('Γ8');
    expect(levels[0]!.parent).toBe('4A2(F)');
    for (const parent of ['4T2(F)', '4T1(F)']) {
      const terms = levels.filter((l) => l.parent === parent).map((l) => l.term).sort();
      expect(terms).toEqual(['Γ6', 'Γ7', 'Γ8', 'Γ8']);
    }
    for (const level of levels) expect(level.parentWeight).toBeGreaterThan(0.3);
  });
  it('d2 octahedral 3T1g with ζ → Γ1 + Γ3 + Γ4 + Γ5', () => {
    // T1 ⊗ T1 = A1 + E + T1 + T2 (common practice).
    const levels = computeFieldLevels(2, 'octahedral', { dq: 1800, b: 700, c: 3000, zeta: 200 }).levels;
    const ground = levels.filter((l) => l.parent === '3T1g(F)').map((l) => l.term).sort();
    expect(ground).toEqual(['Γ1', 'Γ3', 'Γ4', 'Γ5']);
  });
  it('tetragonal d5 with ζ: D4\' labels Γ6, Γ7 only, all Kramers pairs', () => {
    const result = computeFieldLevels(5, 'octahedral', { dq: 1800, b: 700, c: 3000, ds: 100, dt: 50, zeta: 300 });
    expect(result.group).toBe("D4'");
    expect(new Set(result.levels.map((l) => l.term))).toEqual(new Set(['Γ6', 'Γ7']));
    expect(result.levels.length).toBe(126);
    expect(result.levels[0]!.parent).toBe('6A1g[6A1g(S)]');
  });
  it('spinOrbitEnergies (the eigenvalue-only path) gives the same levels', () => {
    const p = { dq: 1800, b: 700, c: 3000, ds: 100, dt: 50, zeta: 300 };
    const { energies, degeneracies } = spinOrbitEnergies(5, 'octahedral', p);
    const levels = computeFieldLevels(5, 'octahedral', p).levels;
    expect(degeneracies.reduce((s, g) => s + g, 0)).toBe(252);
    levels.forEach((l, i) => expect(energies[i]! - energies[0]!).toBeCloseTo(l.energy, 6));
  });
});

describe('input checks', () => {
  it('names the parameter', () => {
    const fail = (f: () => unknown): FieldgapError => {
      try {
        f();
      } catch (error) {
        return error as FieldgapError;
      }
      throw new Error('no error');
    };
    expect(fail(() => validateTetragonalParameters('octahedral', { dq: 1, b: 1, c: 1, zeta: -1 })).path).toBe('zeta');
    expect(fail(() => validateTetragonalParameters('octahedral', { dq: 1, b: 1, c: 1, ds: Number.NaN })).path).toBe('ds');
    expect(fail(() => computeFieldLevels(3, 'tetrahedral', { dq: 1, b: 1, c: 1, dt: 5 })).path).toBe('dt');
    expect(fail(() => computeFieldLevels(3, 'tetrahedral', { dq: 1, b: 1, c: 1, ds: 5 })).path).toBe('ds');
  });
});

describe('double-group labels decompose every d^n cleanly', () => {
  const DIMENSION: Record<string, number> = { 'Γ1': 1, 'Γ2': 1, 'Γ3': 2, 'Γ4': 3, 'Γ5': 3, 'Γ6': 2, 'Γ7': 2, 'Γ8': 4 };
  for (let d = 1; d <= 9; d++) {
    it(`d${d}: in O' every level is one Γ whose dimension is its degeneracy; in D4' likewise`, () => {
      // Dimensions of the irreps of O' and D4' (Bethe; common practice).
      const cubic = computeFieldLevels(d, 'octahedral', { dq: 1500, b: 800, c: 3400, zeta: 350 }).levels;
      for (const level of cubic) {
        expect(DIMENSION[level.term]).toBe(level.degeneracy);
        expect(level.parent).not.toMatch(/\?/);
      }
      const tetragonal = computeFieldLevels(d, 'octahedral', { dq: 1500, b: 800, c: 3400, zeta: 350, ds: 250, dt: 90 }).levels;
      const d4Dimension: Record<string, number> = { 'Γ1': 1, 'Γ2': 1, 'Γ3': 1, 'Γ4': 1, 'Γ5': 2, 'Γ6': 2, 'Γ7': 2 };
      for (const level of tetragonal) expect(d4Dimension[level.term]).toBe(level.degeneracy);
      expect(tetragonal.reduce((s, l) => s + l.degeneracy, 0)).toBe(binomial(10, d));
    });
  }
});
