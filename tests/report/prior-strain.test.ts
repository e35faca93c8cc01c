/**
 * AUDIT3 finding 2: a reading whose parameters break their own priors shows
 * "100 %" when every other reading is worse. The reports say so beside the
 * probability (src/report/prior-strain.ts). Nothing here checks a number
 * against the outside world: the spectra are synthesized
 * (fixtures/spectra/real-like/audit3/README.md) and the checks are on what
 * the report prints beside the fit's own penalties.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { formatAnalysisReport } from '../../src/cli/commands/analyze-report.js';
import { fitReport } from '../../src/cli/commands/fit.js';
import { fitBands } from '../../src/fit/index.js';
import type { Penalty } from '../../src/fit/types.js';
import { PRIOR_STRAIN_DEVIANCE, priorStrainOf, priorStrainText } from '../../src/report/prior-strain.js';

const REAL_LIKE = join(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like');
const read = (...path: string[]) => readFileSync(join(REAL_LIKE, ...path), 'utf8');
const penalty = (rule: Penalty['rule'], amount: number, detail: string = rule): Penalty => ({ rule, amount, detail });

describe('priorStrainOf', () => {
  it('is the threshold −2 ln 0.001', () => {
    expect(PRIOR_STRAIN_DEVIANCE).toBeCloseTo(13.8155, 4);
  });

  it('sums the parameter priors only, and is null at or below the threshold', () => {
    expect(priorStrainOf([penalty('beta', 7), penalty('ten-dq', 6.8)])).toBeNull();
    const strain = priorStrainOf([penalty('beta', 7), penalty('ten-dq', 7), penalty('assignments', 30), penalty('intensity', 30), penalty('skipped-transition', 30)]);
    expect(strain?.deviance).toBe(14);
    expect(strain?.terms.map((t) => t.rule)).toEqual(['beta', 'ten-dq']);
    expect(priorStrainOf(undefined)).toBeNull();
  });

  it('names the terms that matter, largest first, and leaves out the small ones', () => {
    const text = priorStrainText(priorStrainOf([penalty('beta', 1.5, 'small one'), penalty('ten-dq', 20, 'big one'), penalty('ligands', 5, 'middle one')])!);
    expect(text).toMatch(/big one; middle one; together −2 ln p = 26\.5/);
    expect(text).not.toMatch(/small one/);
  });
});

describe('the analyze report', () => {
  it('a visible-only Ni(II) spectrum declared tetrahedral: the probability is marked IMPLAUSIBLE beside it', () => {
    // The visible [CoCl4]2- case that first showed this (AUDIT3 finding 2) is now read right (one split 4T1(P) band); a
    // wrong geometry still forces a reading far outside the ion's range, and the report must say so.
    const result = analyzeSpectrum(read('ni-aqua-visible.csv'), { fileName: 'ni-aqua-visible.csv', ion: 'Ni2+', geometry: 'tetrahedral' });
    const text = formatAnalysisReport('ni-aqua-visible', result);
    expect(text).toMatch(/^ {2}assignment {2}probability .*\n {2}priors {6}IMPLAUSIBLE: .*is outside 2707–6767 cm-1, the range this ion shows/m);
  });

  it('the visible [CoCl4]2- multiplet, now one split 4T1(P) band with B at its prior, gets no such line', () => {
    const result = analyzeSpectrum(read('audit3', 'cocl4-visible.csv'), { fileName: 'cocl4-visible.csv', ion: 'Co2+', geometry: 'tetrahedral', concentration: 0.002 });
    expect(formatAnalysisReport('cocl4', result)).not.toMatch(/IMPLAUSIBLE/);
  });

  it.each([
    ['ni-aqua-visible.csv', 'Ni2+'],
    ['co-aqua-visible.csv', 'Co2+'],
    ['cu-aqua-visible.csv', 'Cu2+'],
  ])('a plausible reading (%s) gets no such line', (file, ion) => {
    const text = formatAnalysisReport(file, analyzeSpectrum(read(file), { fileName: file, ion }));
    expect(text).not.toMatch(/IMPLAUSIBLE|priors {6}/);
  });
});

describe('the fit report', () => {
  it('octahedral-looking bands given to `fit` as tetrahedral Ni(II): the line follows the probability', () => {
    const text = fitReport(fitBands({ ion: 'Ni2+', geometry: 'tetrahedral', bands: '17400,24600' }));
    expect(text).toMatch(/^Probability of this assignment: .*\nIMPLAUSIBLE: the chosen assignment's parameters break their priors/m);
  });

  it('a published-looking band set of [Ni(H2O)6]2+ gets no such line', () => {
    expect(fitReport(fitBands({ ion: 'Ni2+', geometry: 'octahedral', bands: '8500,13800,25300' }))).not.toMatch(/IMPLAUSIBLE/);
  });
});
