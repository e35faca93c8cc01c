import { describe, expect, it } from 'vitest';
import { computeLevels, freeIonTerms } from '../../src/ligand-field/index.js';
import { cubicComponentsOfL } from '../../src/ligand-field/term-splitting.js';

const ALL_D = [1, 2, 3, 4, 5, 6, 7, 8, 9];

describe('parent labels follow the non-crossing rule', () => {
  it.each(ALL_D)('octahedral d%i: along Dq/B = 0.01 … 4 no gap between same-(S, Γ) levels closes', (d) => {
    const b = 1;
    const c = 4.5;
    let smallest = Infinity;
    for (let i = 1; i <= 400; i++) {
      const dq = (4 * i) / 400;
      const levels = computeLevels(d, 'octahedral', { dq, b, c }).levels;
      const byKey = new Map<string, number[]>();
      for (const l of levels) byKey.set(`${l.multiplicity}${l.irrep}`, [...(byKey.get(`${l.multiplicity}${l.irrep}`) ?? []), l.energy]);
      // Energies are from the ground level, which shifts all levels alike: gaps are unaffected.
      for (const energies of byKey.values()) for (let k = 1; k < energies.length; k++) smallest = Math.min(smallest, energies[k]! - energies[k - 1]!);
    }
    // d3 has 2H and 2P at the same free-ion energy (9B + 3C), so their 2T1g levels start together at Dq = 0.
    expect(smallest).toBeGreaterThan(1e-3 * b);
  });

  it.each(ALL_D)('d%i: at small Dq every level sits nearest to its own parent term', (d) => {
    const b = 800;
    const c = 3600;
    const dq = 2; // Dq/B = 0.0025: splittings of a term are a few Dq
    const terms = freeIonTerms(d, b, c);
    for (const geometry of ['octahedral', 'tetrahedral'] as const) {
      const result = computeLevels(d, geometry, { dq, b, c });
      for (const level of result.levels) {
        const parent = terms.find((t) => t.term === level.parent)!;
        expect(parent.multiplicity).toBe(level.multiplicity);
        expect(cubicComponentsOfL(parent.L)).toContain(level.cubicIrrep);
        // The ground level lies within ~12Dq of the ground term; so does each level of its term.
        expect(Math.abs(level.energy - parent.energy)).toBeLessThan(30 * dq);
        const candidates = terms.filter((t) => t.multiplicity === level.multiplicity && cubicComponentsOfL(t.L).includes(level.cubicIrrep));
        const nearest = Math.min(...candidates.map((t) => Math.abs(level.energy - t.energy)));
        expect(Math.abs(level.energy - parent.energy)).toBeLessThanOrEqual(nearest + 30 * dq);
      }
    }
  });
});

describe('familiar labels', () => {
  // Tanabe & Sugano (1954) diagrams and the usual band assignments: common practice. Found for d8: [Ni(H2O)6]2+ bands
  // assigned 3A2g → 3T2g, 3T1g(F), 3T1g(P) with 1Eg and 1T2g spin-forbidden (docs/sources.md NI-AQUA-VN); for d3:
  // Cr(III) 4A2g → 4T2g and 4A2g → 4T1g as the two main bands (a glass study quoted on th4.ilovetranslation.com);
  // for d5 the quartets of 4G as the lowest (Jørgensen 1962, Table 2: 4G at 10B + 5C, the lowest quartet term).
  it('octahedral d3 (Cr3+): 4A2g(F) → 4T2g(F), 4T1g(F), 4T1g(P); 2Eg(G) below 4T2g', () => {
    const labels = computeLevels(3, 'octahedral', { dq: 1740, b: 725, c: 2900 }).levels.map((l) => l.label);
    expect(labels[0]).toBe('4A2g(F)');
    const quartets = labels.filter((l) => l.startsWith('4'));
    expect(quartets).toEqual(['4A2g(F)', '4T2g(F)', '4T1g(F)', '4T1g(P)']);
    expect(labels.indexOf('2Eg(G)')).toBeLessThan(labels.indexOf('4T2g(F)'));
  });

  it('octahedral d8 (Ni2+): 3A2g(F) → 3T2g(F), 3T1g(F), 3T1g(P) and 1Eg(D)', () => {
    const result = computeLevels(8, 'octahedral', { dq: 850, b: 1030, c: 4300 });
    expect(result.levels.filter((l) => l.multiplicity === 3).map((l) => l.label)).toEqual(['3A2g(F)', '3T2g(F)', '3T1g(F)', '3T1g(P)']);
    expect(result.levels.some((l) => l.label === '1Eg(D)')).toBe(true);
  });

  it('octahedral d6 low spin (Co3+): 1A1g(I) ground, 1T1g(I) and 1T2g(I) the spin-allowed bands', () => {
    const result = computeLevels(6, 'octahedral', { dq: 2000, b: 650, c: 3100 });
    expect(result.levels[0]!.label).toBe('1A1g(I)');
    expect(result.spinState).toBe('low-spin');
    const singlets = result.levels.filter((l) => l.multiplicity === 1).slice(1, 3).map((l) => l.label);
    expect(singlets).toEqual(['1T1g(I)', '1T2g(I)']);
  });

  it('octahedral d5 high spin (Mn2+): 6A1g(S), then 4T1g(G), 4T2g(G), 4A1g(G) and 4Eg(G)', () => {
    const quartets = computeLevels(5, 'octahedral', { dq: 800, b: 850, c: 3400 }).levels.filter((l) => l.multiplicity === 4);
    expect(quartets.slice(0, 4).map((l) => l.label).sort()).toEqual(['4A1g(G)', '4Eg(G)', '4T1g(G)', '4T2g(G)']);
    expect(quartets[0]!.label).toBe('4T1g(G)');
  });

  it('repeated free-ion terms carry their number: d5 2T2g(D2)', () => {
    const labels = computeLevels(5, 'octahedral', { dq: 1000, b: 800, c: 3200 }).levels.map((l) => l.label);
    expect(labels).toContain('2T2g(D1)');
    expect(labels).toContain('2T2g(D2)');
    expect(labels).toContain('2T2g(D3)');
  });

  it('rank numbers the levels of each (S, Γ) from 0 by ascending energy', () => {
    const levels = computeLevels(4, 'octahedral', { dq: 1500, b: 800, c: 3500 }).levels;
    const seen = new Map<string, number>();
    for (const level of levels) {
      const key = `${level.multiplicity}${level.irrep}`;
      expect(level.rank).toBe(seen.get(key) ?? 0);
      seen.set(key, level.rank + 1);
    }
  });
});
