/**
 * The 10Dq prior of a low-spin solution (likelihood.ts): Jørgensen's f·g
 * underestimates the low-spin cyanide complexes, so above the range a
 * low-spin solution has a wide tail and the cyanide's own bands decide.
 */
import { describe, expect, it } from 'vitest';
import { fitBands } from '../../src/fit/index.js';
import { LIKELIHOOD } from '../../src/fit/likelihood.js';
import { tenDqPriorDeviance, type PriorSettings } from '../../src/fit/penalties.js';

const priors: PriorSettings = { b0: 1058, cOverB: 3.69, tenDqExpected: null, tenDqRange: [5950, 14875], betaExpected: null, ligandNote: null };

describe('10Dq prior of low-spin solutions', () => {
  it('is the same inside and below the range, wider above it only for a low-spin solution', () => {
    for (const tenDq of [4000, 6000, 10000, 14000]) {
      expect(tenDqPriorDeviance(tenDq / 10, priors, true)).toBeCloseTo(tenDqPriorDeviance(tenDq / 10, priors, false), 12);
    }
    const high = tenDqPriorDeviance(3300, priors, false);
    const low = tenDqPriorDeviance(3300, priors, true);
    expect(low).toBeLessThan(high);
    // Slow reference: (ln(33 000 / 14 875) / σ)².
    expect(low).toBeCloseTo((Math.log(33000 / 14875) / LIKELIHOOD.tenDqSigmaLowSpinHigh) ** 2, 9);
    expect(high).toBeCloseTo((Math.log(33000 / 14875) / LIKELIHOOD.tenDqSigma) ** 2, 9);
  });

  it('reads the two bands of [Fe(CN)6]4- as 1T1g and 1T2g with 10Dq near 33 800 cm-1', () => {
    // Bands 31 000 and 37 000 cm-1, 10Dq ≈ 33 800 (Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from
    // memory). With C/B fixed at the free ion's the fit lands within 5 %; before the low-spin tail it chose
    // 1T2g, 1Eg at 10Dq ≈ 20 000 with β ≈ 1.
    const fit = fitBands({ ion: 'Fe2+', bands: [31000, 37000] });
    expect(fit.spinState).toBe('low-spin');
    expect(fit.assignments.map((a) => a.label)).toEqual(['1T1g(I)', '1T2g(I)']);
    expect(Math.abs(fit.tenDq - 33800) / 33800).toBeLessThan(0.05);
  });
});
