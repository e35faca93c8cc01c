/**
 * AUDIT3 finding 1, second part: Jørgensen's g table has no V3+, so
 * `fit --formula "[V(H2O)6]3+"` had no 10Dq prior and called the two
 * readings of a visible-only pair "equally good". The formula-only
 * prediction's aqua-ion estimate of g (src/predict/factor-table.ts, marked
 * as an estimate) now feeds the fit's ligand prior with its wider σ, and the
 * result says so. Rough trend estimates (Pd2+) are not used.
 */
import { describe, expect, it } from 'vitest';
import { fitLigandField } from '../../src/fit/index.js';
import { resolveFitSettings } from '../../src/fit/settings.js';

// [V(H2O)6]3+ bands 17 800 and 25 300 in a 380–780 nm window (from memory, AUDIT3.md): 3T2g and 3T1g(P),
// 10Dq ≈ 18 600–19 000 (from memory). The two-band pair has an exact second reading (3T1g(P), 3A2g) at 10Dq ≈ 13 100.
const WINDOW = { min: 1e7 / 780, max: 1e7 / 380 };

describe('a ligand prior from an estimated g (AUDIT3 finding 1)', () => {
  it('V3+ with water: the prior is the estimate, its σ wider than 15 %, and the notes say it is an estimate', () => {
    const s = resolveFitSettings({ ion: 'V3+', formula: '[V(H2O)6]3+', bands: [17800, 25300] });
    expect(s.priors.tenDqExpected).toBeCloseTo(18600, 0); // f(H2O) = 1 × g estimate 18 600 (factor-table.ts)
    expect(s.priors.tenDqSigma).toBeGreaterThan(0.15);
    expect(s.priors.ligandNote).toMatch(/g\(V3\+\) = 18600 ± 1500 cm-1 is an estimate/);
    expect(s.notes.some((n) => /10Dq prior from the ligands 18600 cm-1 .*estimate/.test(n))).toBe(true);
  });

  it('the formula now tells the two readings apart: 3T2g at the lower band, 10Dq near 19 000', () => {
    const r = fitLigandField({ ion: 'V3+', formula: '[V(H2O)6]3+', bands: [17800, 25300], window: WINDOW });
    expect(r.assignments.map((a) => a.label.replace(/\(.*/, ''))).toEqual(['3T2g', '3T1g']);
    expect(r.tenDq).toBeGreaterThan(18000);
    expect(r.tenDq).toBeLessThan(20000);
    expect(r.probability).toBeGreaterThan(0.75);
  });

  it('a published g keeps the usual σ; a rough trend estimate gives no ligand prior', () => {
    const cr = resolveFitSettings({ ion: 'Cr3+', formula: '[Cr(H2O)6]3+', bands: [17400, 24600] });
    expect(cr.priors.tenDqExpected).not.toBeNull();
    expect(cr.priors.tenDqSigma).toBeUndefined();
    // Pd2+ has only "estimate: 4d M2+ like Ru2+" in factor-table.ts: no prior from it.
    const pd = resolveFitSettings({ ion: 'Pd2+', ligands: 'NH3', bands: [20000, 25000] });
    expect(pd.priors.tenDqExpected).toBeNull();
  });
});
