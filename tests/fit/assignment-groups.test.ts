import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { fitLigandField } from '../../src/fit/index.js';
import { fitReport } from '../../src/cli/commands/fit.js';
import { fitWithAlternative } from '../../src/analysis-corrections.js';

describe('the probability of the spin-allowed assignment and parameters (issue 13)', () => {
  it('a sharp Cr(III) band read as 2Eg or 2T1g does not make the parameters uncertain', () => {
    // [Cr(H2O)6]3+ ν1 ≈ 17 400, ν2 ≈ 24 600 cm-1 with the sharp 2Eg/2T1g(G) feature near 14 450: common practice.
    const r = fitLigandField({ ion: 'Cr3+', bands: '14449:sf,17447,24626' });
    const twins = r.alternatives.filter((a) => a.inChosenGroup);
    expect(twins.length).toBeGreaterThan(0);
    for (const a of twins) {
      // Same spin-allowed rows, the spin-forbidden label may differ.
      expect(a.assignments.filter((x) => x.spinAllowed).map((x) => `${x.observed}:${x.label}`))
        .toEqual(r.assignments.filter((x) => x.spinAllowed).map((x) => `${x.observed}:${x.label}`));
    }
    const sum = r.probability + twins.reduce((s, a) => s + a.probability, 0);
    expect(r.assignmentGroup.probability).toBeCloseTo(sum, 3);
    expect(r.assignmentGroup.probability).toBeGreaterThan(0.95);
    expect(r.assignmentGroup.members).toBe(1 + twins.length);
    expect(r.assignmentGroup.spinAllowed.map((x) => x.label)).toEqual(['4T2g(F)', '4T1g(F)']);
    expect(r.assignmentGroup.tenDqRange[0]).toBeLessThanOrEqual(r.tenDq);
    expect(r.assignmentGroup.tenDqRange[1]).toBeGreaterThanOrEqual(r.tenDq);
    expect(fitReport(r)).toMatch(/Probability of the spin-allowed assignment and parameters: 100/);
  });

  it('the demo Cr(III) aqua spectrum gives no "not certain" warning', () => {
    // Invented demo spectrum (spectra-demo/, labelled as such): checks the wording only, no outside number.
    const text = readFileSync(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url), 'utf8');
    const result = analyzeSpectrum(text, { fileName: 'cr-aqua.csv', ion: 'Cr3+' });
    const fit = result.fit!;
    expect(fit.assignmentGroup.probability).toBeGreaterThan(0.9);
    expect([...result.warnings, ...fit.warnings].some((w) => /not certain/.test(w))).toBe(false);
  });

  it('keeps different spin-allowed assignments apart', () => {
    // Co(II) aqua 8 100 and 19 400 cm-1 (common practice): 4T2g/4T1g(P) against other readings with other 10Dq.
    const r = fitLigandField({ ion: 'Co2+', bands: [8100, 19400] });
    expect(r.alternatives.length).toBeGreaterThan(0);
    for (const a of r.alternatives) {
      if (Math.abs(a.tenDq - r.tenDq) > 0.05 * r.tenDq) expect(a.inChosenGroup).toBe(false);
    }
    const inGroup = r.alternatives.filter((a) => a.inChosenGroup).reduce((s, a) => s + a.probability, 0);
    expect(r.assignmentGroup.probability).toBeCloseTo(r.probability + inGroup, 3);
  });

  it('a spin state different from the chosen one is never in its group', () => {
    // Co(II) octahedral with two bands: the high- and low-spin readings compete; common practice.
    const r = fitLigandField({ ion: 'Co2+', bands: [8100, 19400] });
    for (const a of r.alternatives) if (a.spinState !== r.spinState) expect(a.inChosenGroup).toBe(false);
    expect(r.assignmentGroup.probability).toBeLessThanOrEqual((r.spinStateProbabilities[r.spinState] ?? 1) + 1e-3);
  });

  it('an alternative chosen by the user carries its own group and goodness of fit, not the winner\'s', () => {
    // Co(II) aqua 8 100 and 19 400 cm-1: common practice.
    const r = fitLigandField({ ion: 'Co2+', bands: [8100, 19400] });
    const k = r.alternatives.findIndex((a) => !a.inChosenGroup);
    expect(k).toBeGreaterThanOrEqual(0);
    const alt = fitWithAlternative(r, k);
    expect(alt.assignmentGroup.probability).toBeCloseTo(r.alternatives[k]!.probability, 6);
    expect(alt.assignmentGroup.members).toBe(1);
    expect(alt.goodnessOfFit.chiSquare).toBeCloseTo(r.alternatives[k]!.chiSquare, 6);
  });
});
