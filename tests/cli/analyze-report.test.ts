import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { formatAnalysisReport } from '../../src/cli/commands/analyze-report.js';

/**
 * The text report of `fieldgap analyze` as a chemist reads it (found in the
 * audit): no "undefined" where a parameter is not determined, the spin-state
 * sentence in words, and β with its ±. The spectra are the synthesized
 * visible-only fixtures (fixtures/spectra/real-like/README.md); nothing here
 * checks a number against the outside world, only what the report prints
 * beside the fit's own values.
 */
const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../../fixtures/spectra/real-like/${name}`, import.meta.url)));

describe('formatAnalysisReport', () => {
  it('d9 with one band: B, C and β are "not determined", with no "C/B fixed at undefined"', () => {
    const result = analyzeSpectrum(fixture('cu-aqua-visible.csv'), { fileName: 'cu-aqua-visible.csv', ion: 'Cu2+' });
    expect(result.fit.c).toBeNull();
    const text = formatAnalysisReport('cu', result);
    expect(text).not.toMatch(/undefined|null|NaN/);
    expect(text).toMatch(/^ {2}C {11}not determined$/m);
  });

  it('says the spin state in words and gives β with its uncertainty', () => {
    const result = analyzeSpectrum(fixture('ni-aqua-visible.csv'), { fileName: 'ni-aqua-visible.csv', ion: 'Ni2+' });
    const fit = result.fit;
    expect(fit.betaSd).not.toBeNull();
    const text = formatAnalysisReport('ni', result);
    expect(text).not.toContain('no-choice');
    expect(text).toContain('no high/low-spin choice for d8 octahedral');
    expect(text).toContain(`beta        ${fit.beta!.toFixed(3)} ± ${fit.betaSd!.toFixed(3)} (B0 = ${fit.freeIonB} cm-1)`);
    expect(text).toContain(`(C/B fixed at ${fit.cOverB!.toFixed(2)})`);
  });
});
