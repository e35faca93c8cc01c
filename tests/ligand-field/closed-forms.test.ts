import { describe, expect, it } from 'vitest';
import { computeLevels } from '../../src/ligand-field/index.js';
import type { Geometry, LevelsResult } from '../../src/ligand-field/types.js';

/** Energy of the level with this label (unique in these checks). */
function at(result: LevelsResult, label: string): number {
  const matches = result.levels.filter((l) => l.label === label);
  if (matches.length > 1) throw new Error(`label ${label} is not unique`);
  const level = matches[0];
  if (!level) throw new Error(`no level ${label} in d${result.d}: ${result.levels.map((l) => l.label).join(' ')}`);
  return level.energy;
}

const cases = [
  { dq: 800, b: 900, c: 3600 },
  { dq: 1740, b: 725, c: 2900 },
  { dq: 1200, b: 1000, c: 4500 },
];

describe('closed forms for octahedral d3 and d8 (ground 4A2g / 3A2g)', () => {
  // Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984): ν1 = 10Dq,
  // ν2, ν3 = 7.5B + 15Dq ∓ ½√(225B² + 100Dq² − 180DqB) (from memory). Their sum and product are what Underhill &
  // Billing's equations for octahedral Ni(II) state (found, checked in the next test).
  it.each([[3, 4], [8, 3]] as const)('d%i', (d, multiplicity) => {
    for (const { dq, b, c } of cases) {
      const result = computeLevels(d, 'octahedral', { dq, b, c });
      const root = Math.sqrt(225 * b * b + 100 * dq * dq - 180 * dq * b);
      expect(result.groundTerm).toBe(`${multiplicity}A2g`);
      expect(at(result, `${multiplicity}T2g(F)`)).toBeCloseTo(10 * dq, 6);
      expect(at(result, `${multiplicity}T1g(F)`)).toBeCloseTo(7.5 * b + 15 * dq - 0.5 * root, 6);
      expect(at(result, `${multiplicity}T1g(P)`)).toBeCloseTo(7.5 * b + 15 * dq + 0.5 * root, 6);
    }
  });
});

describe('octahedral d8 against Underhill & Billing\'s equations', () => {
  // Underhill & Billing, "Calculations of the Racah parameter B for nickel(II) and cobalt(II) compounds", Nature 210
  // (1966) 834, as quoted in the abstract of "On the Study of Racah Parameter B for Nickel (II) and Cobalt (II)
  // Compounds" (avantipublishers.com/index.php/jatsr/article/view/863): ν2 + ν3 − 30Dq − 15B = 0 and
  // 340Dq² − 18(ν2 + ν3)Dq + ν2ν3 = 0 for octahedral Ni(II), ν2 = 3T1g(F), ν3 = 3T1g(P) (found).
  it('the engine\'s ν2 and ν3 satisfy both', () => {
    for (const { dq, b, c } of cases) {
      const result = computeLevels(8, 'octahedral', { dq, b, c });
      const nu2 = at(result, '3T1g(F)');
      const nu3 = at(result, '3T1g(P)');
      expect(nu2 + nu3 - 30 * dq - 15 * b).toBeCloseTo(0, 6);
      expect((340 * dq * dq - 18 * (nu2 + nu3) * dq + nu2 * nu3) / (nu2 * nu3)).toBeCloseTo(0, 10);
    }
  });
});

describe('closed forms for octahedral d2 and high-spin d7 (ground 3T1g(F) / 4T1g(F))', () => {
  // Lever (1984) (from memory), derived from the T1g(F)/T1g(P) matrix [[−6Dq, 4Dq], [4Dq, 15B]]:
  // R = √(225B² + 100Dq² + 180DqB); ν(T2g) = 5Dq − 7.5B + ½R, ν(A2g) = 15Dq − 7.5B + ½R, ν(T1g(P)) = R.
  it.each([[2, 3], [7, 4]] as const)('d%i', (d, multiplicity) => {
    // d7 is high-spin only below its crossover (Dq/B ≈ 2.2): keep to Dq/B < 2.
    for (const { dq, b, c } of cases.filter((p) => p.dq / p.b < 2)) {
      const result = computeLevels(d, 'octahedral', { dq, b, c });
      const r = Math.sqrt(225 * b * b + 100 * dq * dq + 180 * dq * b);
      expect(result.groundTerm).toBe(`${multiplicity}T1g`);
      expect(result.levels[0]!.label).toBe(`${multiplicity}T1g(F)`);
      expect(at(result, `${multiplicity}T2g(F)`)).toBeCloseTo(5 * dq - 7.5 * b + 0.5 * r, 6);
      expect(at(result, `${multiplicity}A2g(F)`)).toBeCloseTo(15 * dq - 7.5 * b + 0.5 * r, 6);
      expect(at(result, `${multiplicity}T1g(P)`)).toBeCloseTo(r, 6);
    }
  });
});

describe('d1 and d9: one transition at 10Dq', () => {
  // common practice (one d electron or one hole)
  it.each([
    [1, 'octahedral', '2T2g', '2Eg(D)'],
    [9, 'octahedral', '2Eg', '2T2g(D)'],
    [1, 'tetrahedral', '2E', '2T2(D)'],
    [9, 'tetrahedral', '2T2', '2E(D)'],
  ] as const)('d%i %s', (d, geometry: Geometry, ground, excited) => {
    const result = computeLevels(d, geometry, { dq: 1300, b: 900, c: 3600 });
    expect(result.levels).toHaveLength(2);
    expect(result.groundTerm).toBe(ground);
    expect(result.levels[1]!.label).toBe(excited);
    expect(result.levels[1]!.energy).toBeCloseTo(13000, 7);
    expect(result.unpairedElectrons).toBe(1);
  });
});

describe('hole formalism: tetrahedral d^n = octahedral d^(10−n)', () => {
  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i', (d) => {
    for (const params of cases) {
      const tet = computeLevels(d, 'tetrahedral', params);
      const oct = computeLevels(10 - d, 'octahedral', params);
      expect(tet.levels.length).toBe(oct.levels.length);
      tet.levels.forEach((level, i) => {
        const partner = oct.levels[i]!;
        expect(level.energy).toBeCloseTo(partner.energy, 6);
        expect(`${level.term}g`).toBe(partner.term);
        expect(level.parent).toBe(partner.parent);
        expect(level.label.replace('(', 'g(')).toBe(partner.label);
      });
    }
  });
});
