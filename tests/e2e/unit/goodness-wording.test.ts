/**
 * The probability card's words for a poor fit: the core's reason when the
 * answer has one, the p-value otherwise. Inputs are shaped like the core's
 * goodnessOfFit (src/fit/goodness-of-fit.ts), not outside values.
 */
import { describe, expect, it } from 'vitest';
import type { GoodnessOfFit } from '../../../src/fit/goodness-of-fit.js';
import type { Penalty } from '../../../src/fit/types.js';
import { poorFitText, priorStrainNote } from '../../../web/goodness-wording.js';

const base: Omit<GoodnessOfFit, 'verdict' | 'reason'> = { chiSquare: 2.9, degreesOfFreedom: 0, pValue: 0.09, betaPhysical: false };

describe('poor-fit wording on the page', () => {
  it('shows the reason the core gives, not a p-value that reads as acceptable', () => {
    const text = poorFitText({ ...base, verdict: 'poor', reason: 'no parameters reproduce the 2 bands; β = 0.15 lies outside 0.3–1.1, not physical' });
    expect(text).toBe('poorly fitted: no parameters reproduce the 2 bands; β = 0.15 lies outside 0.3–1.1, not physical');
  });
  it('falls back to the p-value for an answer without a reason', () => {
    expect(poorFitText({ ...base, verdict: 'poor', reason: null })).toBe('poorly fitted: χ² p = 0.090');
  });
  it('says nothing for a good fit or none', () => {
    expect(poorFitText({ ...base, verdict: 'good', reason: null })).toBeNull();
    expect(poorFitText(undefined)).toBeNull();
  });
});

describe('implausible priors on the page', () => {
  it('gives the CLI sentence when the prior terms sum above −2 ln 0.001, and nothing below', () => {
    // Penalty rows shaped as the core writes them (src/fit/types.ts); amounts in deviance units.
    const strained: Penalty[] = [
      { rule: 'beta', amount: 12, detail: 'β = 0.15 below 0.35' },
      { rule: 'ten-dq', amount: 5, detail: '10Dq far above the usual range' },
      { rule: 'intensity', amount: 40, detail: 'not a prior' },
    ];
    expect(priorStrainNote({ penalties: strained })).toMatch(/^IMPLAUSIBLE: .*β = 0\.15 below 0\.35; 10Dq far above the usual range; together −2 ln p = 17\.0/);
    expect(priorStrainNote({ penalties: strained.slice(1) })).toBeNull();
    expect(priorStrainNote({})).toBeNull();
  });
});
