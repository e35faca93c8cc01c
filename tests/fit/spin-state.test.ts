import { describe, expect, it } from 'vitest';
import { scanBranches } from '../../src/fit/enumerate.js';
import { fitBands } from '../../src/fit/index.js';
import { cachedLevelScan } from '../../src/fit/scan.js';

describe('spin-state choice', () => {
  it('octahedral d1–d3 and d8–d9 have one ground level along the whole scan; d4–d7 have two', () => {
    // common practice: only octahedral d4–d7 can be high- or low-spin
    for (let d = 1; d <= 9; d++) {
      const branches = scanBranches(cachedLevelScan(d, 'octahedral', 4.5));
      expect(branches.length, `d${d}`).toBe(d >= 4 && d <= 7 ? 2 : 1);
    }
  });

  it('reports no-choice for octahedral d1–d3 and d8–d9 fits', () => {
    // common practice
    expect(fitBands({ d: 1, bands: [20300] }).spinState).toBe('no-choice');
    expect(fitBands({ d: 3, bands: [17400, 24600] }).spinState).toBe('no-choice');
    expect(fitBands({ d: 8, bands: [8500, 13800, 25300] }).spinState).toBe('no-choice');
    expect(fitBands({ d: 9, bands: [12500] }).crossover).toBeNull();
  });

  it('keeps only self-consistent solutions: the assumed ground level is the ground level at the result', () => {
    const r = fitBands({ ion: 'Co3+', bands: [21050, 29550] });
    expect(r.groundTerm).toBe('1A1g');
    expect(r.crossover!.fittedDqOverB).toBeGreaterThan(r.crossover!.dqOverB);
    for (const alt of r.alternatives) {
      if (alt.spinState === 'high-spin') expect(alt.groundTerm).toBe('5T2g');
    }
  });

  it('warns near the spin crossover and says how far it is', () => {
    // A low-spin d6 ion built just above the crossover (about 5% in Dq/B): its 1T1g and 1T2g bands.
    const r = fitBands({ d: 6, bands: [10398, 17077], cOverB: 4.5 }); // engine levels at Dq/B = 1.05 × crossover, B = 600
    expect(r.spinState).toBe('low-spin');
    expect(r.crossover).not.toBeNull();
    expect(Math.abs(r.crossover!.percent)).toBeLessThan(10);
    expect(r.crossover!.near).toBe(true);
    expect(r.warnings.some((w) => w.startsWith('near spin crossover'))).toBe(true);
  });

  it('takes a Jahn–Teller pair of high-spin d6 as one transition and says B is not determinable', () => {
    // from memory: [Fe(H2O)6]2+ shows 5T2g → 5Eg split into ~8 300 and ~10 400 cm-1 (Lever, 1984)
    const r = fitBands({ ion: 'Fe2+', bands: [8300, 10400] });
    expect(r.spinState).toBe('high-spin');
    expect(r.tenDq).toBeCloseTo(9350, 0);
    expect(r.b).toBeNull();
    // The Jahn–Teller reading is a warning since AUDIT3 finding 5 (shown with the analysis, not only in notes).
    expect(r.warnings.some((n) => /read as one Jahn–Teller-split transition at their mean/.test(n))).toBe(true);
    expect(r.assignments[0]!.bands).toEqual([0, 1]);
  });
});
