import { describe, expect, it } from 'vitest';
import { fitLigandField } from '../../src/fit/index.js';
import { goodnessOfFitOf, goodnessWarnings } from '../../src/fit/goodness-of-fit.js';
import { fitReport } from '../../src/cli/commands/fit.js';

describe('goodness of fit: the probability is relative, this check is not (issue 13)', () => {
  it('two bands 10 cm-1 apart for Ni(II) are no exact fit: poor, warned, β flagged', () => {
    // Nonsense input (the audit's case): ν1 and ν2 of octahedral d8 cannot lie 10 cm-1 apart at any B ≥ 0.15·B0.
    const r = fitLigandField({ ion: 'Ni2+', bands: [25300, 25310] });
    expect(r.status).not.toBe('exact');
    expect(r.message).toMatch(/not exact/);
    expect(r.goodnessOfFit.verdict).toBe('poor');
    expect(r.goodnessOfFit.degreesOfFreedom).toBe(0);
    expect(r.goodnessOfFit.pValue).toBeLessThan(0.01);
    expect(r.goodnessOfFit.betaPhysical).toBe(false);
    expect(r.warnings.some((w) => /poorly fitted/.test(w) && /relative to the other assignments/.test(w))).toBe(true);
    const text = fitReport(r);
    expect(text).toMatch(/Goodness of fit: POOR/);
    expect(text).not.toMatch(/Fit: exact/);
  });

  it('a textbook Cr(III) pair is exact and good', () => {
    // [Cr(H2O)6]3+ ν1 17 400, ν2 24 600 cm-1: common practice
    const r = fitLigandField({ ion: 'Cr3+', bands: [17400, 24600] });
    expect(r.status).toBe('exact');
    expect(r.goodnessOfFit.verdict).toBe('good');
    expect(r.goodnessOfFit.betaPhysical).toBe(true);
    expect(r.warnings.some((w) => /poorly fitted/.test(w))).toBe(false);
  });

  it('three Ni(II) aqua bands fit well with one degree of freedom', () => {
    // [Ni(H2O)6]2+ 8 500, 13 800, 25 300 cm-1: common practice
    const r = fitLigandField({ ion: 'Ni2+', bands: [8500, 13800, 25300] });
    expect(r.goodnessOfFit.degreesOfFreedom).toBe(1);
    expect(r.goodnessOfFit.verdict).toBe('good');
  });

  it('judges χ² against max(1, m − p) degrees of freedom at 1 %', () => {
    // χ² tail values from the chi-square distribution (common practice; any statistics table).
    expect(goodnessOfFitOf(6.0, 3, 2, 0.8).verdict).toBe('good'); // p(χ²₁ ≥ 6.0) ≈ 0.014
    expect(goodnessOfFitOf(7.0, 3, 2, 0.8).verdict).toBe('poor'); // ≈ 0.008
    expect(goodnessOfFitOf(7.0, 2, 2, 0.8).verdict).toBe('poor'); // ≈ 0.008
    expect(goodnessOfFitOf(7.0, 4, 2, 0.8).verdict).toBe('good'); // χ²₂: ≈ 0.030
    expect(goodnessOfFitOf(1, 3, 2, 0.2).betaPhysical).toBe(false);
    expect(goodnessOfFitOf(1, 3, 2, 1.15).betaPhysical).toBe(false);
    expect(goodnessOfFitOf(1, 3, 2, null).betaPhysical).toBeNull();
    expect(goodnessOfFitOf(Number.NaN, 3, 2, 0.8).verdict).toBe('poor');
  });

  it('AUDIT3 finding 9: 0 degrees of freedom and χ² clearly above 0 is no solution, not "good"', () => {
    // An exactly determined fit that reproduces the bands leaves χ² ≈ 0 (2 bands, 2 parameters).
    expect(goodnessOfFitOf(0.0, 2, 2, 0.8).verdict).toBe('good');
    expect(goodnessOfFitOf(0.5, 2, 2, 0.8).verdict).toBe('good');
    const g = goodnessOfFitOf(2.9, 2, 2, 0.8); // the audit's χ²; p(χ²₁ ≥ 2.9) ≈ 0.09 would have passed
    expect(g.pValue).toBeGreaterThan(0.01);
    expect(g.verdict).toBe('poor');
    expect(g.reason).toMatch(/no parameters reproduce the 2 bands/);
    expect(goodnessOfFitOf(2.9, 3, 2, 0.8).verdict).toBe('good'); // one degree of freedom: the p-value judges
    expect(goodnessOfFitOf(0.0, 2, 2, 0.8).reason).toBeNull();
  });

  it('AUDIT3 finding 9: never "good" when β is not physical', () => {
    const g = goodnessOfFitOf(0.5, 3, 2, 0.15);
    expect(g.pValue).toBeGreaterThan(0.01);
    expect(g.betaPhysical).toBe(false);
    expect(g.verdict).toBe('poor');
    expect(g.reason).toMatch(/β = 0\.15 .*not physical/);
    // The warnings name β, not a χ² misfit that is not there.
    const warnings = goodnessWarnings(g, 0.9, 0.15, 100);
    expect(warnings.some((w) => /poorly fitted/.test(w))).toBe(false);
    expect(warnings.some((w) => /β = 0\.15 lies outside/.test(w))).toBe(true);
  });

  it('AUDIT3 finding 9, end to end: an exactly determined fit that reproduces nothing is printed POOR with the reason', () => {
    const r = fitLigandField({ ion: 'Ni2+', bands: [25300, 25310] });
    expect(r.goodnessOfFit.degreesOfFreedom).toBe(0);
    expect(r.goodnessOfFit.reason).toMatch(/no parameters reproduce the 2 bands/);
    expect(fitReport(r)).toMatch(/Goodness of fit: POOR: .*no parameters reproduce the 2 bands/);
  });
});
