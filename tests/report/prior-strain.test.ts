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
  it('visible-only [CoCl4]2- read as 4T2 + 4T1(F): the 100 % is marked IMPLAUSIBLE beside it', () => {
    const result = analyzeSpectrum(read('audit3', 'cocl4-visible.csv'), { fileName: 'cocl4-visible.csv', ion: 'Co2+', geometry: 'tetrahedral', concentration: 0.002 });
    const text = formatAnalysisReport('cocl4', result);
    expect(text).toMatch(/^ {2}assignment {2}probability .*\n {2}priors {6}IMPLAUSIBLE: .*β = 0\.15 is implausibly small/m);
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
  it('the same two maxima given to `fit`: the line follows the probability', () => {
    const text = fitReport(fitBands({ ion: 'Co2+', geometry: 'tetrahedral', bands: '14695,15966:e=342' }));
    expect(text).toMatch(/^Probability of this assignment: .*\nIMPLAUSIBLE: the chosen assignment's parameters break their priors/m);
  });

  it('a published-looking band set of [Ni(H2O)6]2+ gets no such line', () => {
    expect(fitReport(fitBands({ ion: 'Ni2+', geometry: 'octahedral', bands: '8500,13800,25300' }))).not.toMatch(/IMPLAUSIBLE/);
  });
});
