import { describe, expect, it } from 'vitest';
import { assignmentSpreadOf, combinedUncertainty, spreadFromRange } from '../../src/fit/assignment-spread.js';
import { fitLigandField } from '../../src/fit/index.js';
import { fitReport } from '../../src/cli/commands/fit.js';
import { fitWithAlternative } from '../../src/analysis-corrections.js';
import { summarizeResult } from '../../src/library/summary.js';

describe('the rule: combined ± = √(σ_fit² + Δ²) (src/fit/assignment-spread.ts)', () => {
  it('Δ is the largest distance from the value to an end of the range', () => {
    expect(spreadFromRange(7198, [7198, 8411])).toBe(1213);
    expect(spreadFromRange(8000, [7500, 8100])).toBe(500);
    expect(spreadFromRange(8000, [8000, 8000])).toBe(0);
  });

  it('adds in quadrature, and leaves a missing σ missing', () => {
    expect(combinedUncertainty(3, 4)).toBe(5);
    expect(combinedUncertainty(529, 0)).toBe(529);
    expect(combinedUncertainty(null, 300)).toBeNull();
  });

  it('a group of one widens nothing', () => {
    const { spread, combined } = assignmentSpreadOf({ tenDqRange: [17400, 17400], bRange: [725, 725] }, { tenDq: 17400, b: 725 }, { tenDq: 50, b: 10 });
    expect(spread.widened).toBe(false);
    expect(combined).toEqual({ tenDq: 50, b: 10 });
  });

  it('B not determined: no B spread, the 10Dq one still counts', () => {
    const { spread, combined } = assignmentSpreadOf({ tenDqRange: [12000, 12400], bRange: null }, { tenDq: 12000, b: null }, { tenDq: 300, b: null });
    expect(spread.spread).toEqual({ tenDq: 400, b: null });
    expect(combined).toEqual({ tenDq: 500, b: null });
    expect(spread.widened).toBe(true);
  });
});

describe('a fit whose weak-band labellings move 10Dq further than its σ says so (issue 13)', () => {
  // The seven quartet maxima of [Mn(H2O)6]2+ as tests/accuracy/published-sets.ts lists them (from memory, see there).
  // No outside number is checked here: the test checks that the reported ± covers the fit's own alternatives.
  const r = fitLigandField({ ion: 'Mn2+', bands: '18900,23100,24950,25300,27950,29700,32400', freeC: true });

  it('the ± reaches every member of the assignment group', () => {
    const group = r.assignmentGroup;
    expect(group.members).toBeGreaterThan(1);
    const sd = r.uncertainty.tenDq!;
    expect(r.tenDq - sd).toBeLessThanOrEqual(group.tenDqRange[0] + 0.5);
    expect(r.tenDq + sd).toBeGreaterThanOrEqual(group.tenDqRange[1] - 0.5);
    // … and it is the fit's σ combined with the spread, not the fit's σ alone.
    const fitSd = r.assignmentSpread.fitUncertainty.tenDq!;
    expect(sd).toBeGreaterThan(fitSd);
    expect(sd).toBeCloseTo(Math.hypot(fitSd, r.assignmentSpread.spread.tenDq), 0);
    expect(r.assignmentSpread.widened).toBe(true);
    expect(r.dq).toBeCloseTo(r.tenDq / 10, 1);
    expect(r.uncertainty.dq).toBeCloseTo(sd / 10, 1);
  });

  it('B and β widen with it', () => {
    const [lo, hi] = r.assignmentSpread.bRange!;
    const sd = r.uncertainty.b!;
    expect(r.b! - sd).toBeLessThanOrEqual(lo + 0.5);
    expect(r.b! + sd).toBeGreaterThanOrEqual(hi - 0.5);
    expect(r.betaSd).toBeCloseTo(sd / r.freeIonB!, 3);
  });

  it('the text report prints the range and the fit-alone σ, and the rule', () => {
    const text = fitReport(r);
    expect(text).toMatch(/Uncertainty from the weak-band labellings: 10Dq \d+–\d+ cm-1 \(fit alone ± \d+\)/);
    expect(text).toMatch(/√\(σ_fit² \+ Δ²\)/);
    expect(r.assignmentSpread.rule).toMatch(/√\(σ_fit² \+ Δ²\)/);
  });

  it('the library (and so `series`) stores the combined ±', () => {
    const summary = summarizeResult({ fit: r } as Parameters<typeof summarizeResult>[0]);
    expect(summary.tenDqSd).toBe(r.uncertainty.tenDq);
    expect(summary.tenDqSd!).toBeGreaterThan(r.assignmentSpread.fitUncertainty.tenDq!);
  });

  it('an alternative chosen by the user carries no widened ±', () => {
    const index = r.alternatives.findIndex((a) => a.inChosenGroup);
    expect(index).toBeGreaterThanOrEqual(0);
    const alt = fitWithAlternative(r, index);
    expect(alt.assignmentSpread.widened).toBe(false);
    expect(alt.assignmentSpread.tenDqRange).toEqual(r.assignmentGroup.tenDqRange);
  });
});

describe('a fit with one labelling keeps the fit σ', () => {
  it('[Cr(H2O)6]3+ two bands: ± unchanged', () => {
    // Band maxima 17 400 and 24 600 cm-1 ([Cr(H2O)6]3+, tests/accuracy/published-sets.ts, Jørgensen's g found there).
    const r = fitLigandField({ ion: 'Cr3+', bands: '17400,24600' });
    expect(r.assignmentSpread.spread.tenDq).toBe(0);
    expect(r.assignmentSpread.widened).toBe(false);
    expect(r.uncertainty.tenDq).toBe(r.assignmentSpread.fitUncertainty.tenDq);
    expect(fitReport(r)).not.toMatch(/Uncertainty from the weak-band labellings/);
  });
});
