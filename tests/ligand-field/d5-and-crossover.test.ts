import { describe, expect, it } from 'vitest';
import { computeLevels, crossoverDqOverB, spinStateChoice } from '../../src/ligand-field/index.js';

describe('d5 accidental degeneracy', () => {
  // 4A1g and 4Eg from 4G both lie at 10B + 5C above 6A1g at every Dq (high-spin region), and
  // 4Eg(D) at 17B + 5C: the free-ion 4G at 10B + 5C and 4D at 17B + 5C (found: Jørgensen, Absorption Spectra and Chemical
  // Bonding in Complexes (1962), Table 2, docs/sources.md JORGENSEN-1962-T2), field-independent in the d5 diagram of
  // Tanabe & Sugano, J. Phys. Soc. Jpn. 9, 753 (1954): common practice.
  it.each([0, 300, 900, 1500, 1800])('Dq = %i cm-1 (B = 800, C = 3200)', (dq) => {
    const b = 800;
    const c = 3200;
    const result = computeLevels(5, 'octahedral', { dq, b, c });
    expect(result.groundTerm).toBe('6A1g');
    const a1 = result.levels.filter((l) => l.label === '4A1g(G)');
    const e = result.levels.filter((l) => l.label === '4Eg(G)');
    const eD = result.levels.filter((l) => l.label === '4Eg(D)');
    expect(a1).toHaveLength(1);
    expect(e).toHaveLength(1);
    expect(eD).toHaveLength(1);
    expect(a1[0]!.energy).toBeCloseTo(10 * b + 5 * c, 6);
    expect(e[0]!.energy).toBeCloseTo(10 * b + 5 * c, 6);
    expect(eD[0]!.energy).toBeCloseTo(17 * b + 5 * c, 6);
    expect(a1[0]!.degeneracy + e[0]!.degeneracy).toBe(12);
  });

  it('also in a tetrahedral field, labelled without g', () => {
    const result = computeLevels(5, 'tetrahedral', { dq: 400, b: 700, c: 3000 });
    expect(result.levels.find((l) => l.label === '4A1(G)')!.energy).toBeCloseTo(10 * 700 + 5 * 3000, 6);
    expect(result.levels.find((l) => l.label === '4E(G)')!.energy).toBeCloseTo(10 * 700 + 5 * 3000, 6);
  });
});

describe('spin crossover, octahedral d4–d7', () => {
  // Tanabe & Sugano (1954) diagrams at their C/B values; crossover Dq/B read from the diagrams (from memory), ±0.1.
  it.each([
    [4, 4.61, 2.7],
    [5, 4.477, 2.8],
    [6, 4.8, 2.0],
    [7, 4.633, 2.2],
  ])('d%i at C/B = %f crosses near Dq/B = %f', (d, cOverB, expected) => {
    const x = crossoverDqOverB(d, 'octahedral', cOverB)!;
    expect(Math.abs(x - expected)).toBeLessThanOrEqual(0.1);
    const b = 700;
    const below = computeLevels(d, 'octahedral', { dq: (x - 0.01) * b, b, c: cOverB * b });
    const above = computeLevels(d, 'octahedral', { dq: (x + 0.01) * b, b, c: cOverB * b });
    expect(below.spinState).toBe('high-spin');
    expect(above.spinState).toBe('low-spin');
    expect(below.unpairedElectrons).toBe(d <= 5 ? d : 10 - d);
    expect(above.unpairedElectrons).toBe({ 4: 2, 5: 1, 6: 0, 7: 1 }[d]);
  });

  it('no crossover where there is no choice', () => {
    for (const d of [1, 2, 3, 8, 9]) expect(crossoverDqOverB(d, 'octahedral', 4.5)).toBeUndefined();
    for (const d of [1, 2, 7, 8, 9]) expect(crossoverDqOverB(d, 'tetrahedral', 4.5)).toBeUndefined();
  });
});

describe('spin-state choice', () => {
  it('octahedral d4–d7 and tetrahedral d3–d6 have a choice', () => {
    // common practice (strong- vs weak-field ground configurations)
    const oct = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10].filter((d) => spinStateChoice(d, 'octahedral'));
    const tet = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10].filter((d) => spinStateChoice(d, 'tetrahedral'));
    expect(oct).toEqual([4, 5, 6, 7]);
    expect(tet).toEqual([3, 4, 5, 6]);
  });

  it('no-choice ions report no-choice', () => {
    expect(computeLevels(3, 'octahedral', { dq: 5000, b: 700, c: 3000 }).spinState).toBe('no-choice');
    expect(computeLevels(8, 'tetrahedral', { dq: 500, b: 700, c: 3000 }).spinState).toBe('no-choice');
  });
});
