/**
 * 10Dq of low-spin complexes of ions whose g comes from a high-spin aqua ion
 * (src/predict/low-spin-g.ts): the audit found [Fe(CN)6]4- at 14 450 ± 1 430
 * cm-1 against about 33 800.
 */
import { describe, expect, it } from 'vitest';
import { predictComplex } from '../../src/series/predict.js';
import { lowSpinAdjustment, LOW_SPIN_G, UNKNOWN_LOW_SPIN_SCATTER } from '../../src/predict/low-spin-g.js';

/** How many standard deviations the prediction lies from a published value. */
function zScore(formula: string, published: number): number {
  const p = predictComplex(formula);
  return Math.abs(p.tenDq.value - published) / p.tenDq.uncertainty!;
}

describe('low-spin 10Dq estimates', () => {
  it('hexacyanoferrates: the published 10Dq within one σ, spin state low-spin', () => {
    // NOT an independent check: each ion's low-spin g is derived from these very complexes (low-spin-g.ts).
    // What it checks: the ± is honest and the old 12 σ miss is gone.
    expect(zScore('[Fe(CN)6]4-', 33800)).toBeLessThan(1); // Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from memory
    expect(zScore('[Fe(CN)6]3-', 34950)).toBeLessThan(1); // Dq = 3 495 cm-1, "Bindungsverhältnisse in Prussiaten" (abstract, scilit.net), looked up
    expect(predictComplex('[Fe(CN)6]4-').spinState.value).toBe('low-spin');
    expect(predictComplex('[Fe(CN)6]3-').spinState.value).toBe('low-spin');
    expect(predictComplex('[Fe(CN)6]4-').warnings.some((w) => /low-spin g/.test(w))).toBe(true);
  });

  it('f·g with the high-spin g would have missed by many σ (why the change was needed)', () => {
    // The same complex with the tabulated high-spin g given as the user's g: the adjustment is skipped.
    const p = predictComplex('[Fe(CN)6]4-', { g: 8500 }); // Jørgensen's g(Fe2+), src/chemistry/jorgensen.ts
    expect(Math.abs(p.tenDq.value - 33800) / p.tenDq.uncertainty!).toBeGreaterThan(5); // Lever (1984), from memory
  });

  it('leaves ions whose g is already low-spin, and high-spin complexes, alone', () => {
    // [Co(CN)6]3-: g(Co3+) is that of the low-spin hexaaqua Co(III): f·g = 1.7 × 18 200 (Jørgensen's table).
    expect(predictComplex('[Co(CN)6]3-').tenDq.value).toBeCloseTo(1.7 * 18200, 0);
    // [Fe(H2O)6]2+ is high-spin: f·g = 8 500 unchanged (Jørgensen's table).
    expect(predictComplex('[Fe(H2O)6]2+').tenDq.value).toBeCloseTo(8500, 0);
    expect(lowSpinAdjustment('Fe2+', 'octahedral', 'high-spin', false)).toBeNull();
    expect(lowSpinAdjustment('Co3+', 'octahedral', 'low-spin', false)).toBeNull();
    expect(lowSpinAdjustment('Fe2+', 'octahedral', 'low-spin', true)).toBeNull();
  });

  it('widens the ± where no low-spin g is known, keeping the spin state', () => {
    const p = predictComplex('[Co(CN)6]4-');
    expect(p.spinState.value).toBe('low-spin');
    expect(p.tenDq.uncertainty! / p.tenDq.value).toBeGreaterThanOrEqual(UNKNOWN_LOW_SPIN_SCATTER);
    expect(p.warnings.some((w) => /widened/.test(w))).toBe(true);
  });

  it('marks every low-spin g as an estimate with its source', () => {
    for (const [ion, g] of LOW_SPIN_G) {
      expect(g.kind, ion).toBe('estimate');
      expect(g.source).toMatch(/low-spin g = 10Dq of/);
      expect(g.sigma / g.value).toBeCloseTo(0.2, 6);
    }
  });
});
