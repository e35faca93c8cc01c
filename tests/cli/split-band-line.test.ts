/**
 * AUDIT3 finding 5: the analyze text report says when several bands were
 * read as one transition at their centroid (src/fit does so for the split
 * band of a one-transition ion), and names the strongest maximum, since the
 * ± of 10Dq is the centroid's and not that of the choice between the two
 * conventions. The spectra are synthesized (fixtures/spectra/real-like/); the
 * checks are on the report against the fit's own values, not outside values.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { formatAnalysisReport, splitBandLines } from '../../src/cli/commands/analyze-report.js';

const REAL_LIKE = join(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like');
const analyze = (path: string, ion: string) => analyzeSpectrum(readFileSync(join(REAL_LIKE, path), 'utf8'), { fileName: path, ion });

describe('splitBandLines', () => {
  it('[Ti(H2O)6]3+ shoulder and maximum: one line with both positions, the centroid the fit used and the strongest maximum', () => {
    const result = analyze('audit3/ti-aqua-visible.csv', 'Ti3+');
    const pair = result.fit.assignments.find((a) => a.bands.length === 2);
    expect(pair).toBeDefined();
    const [low, high] = pair!.bands.map((i) => Math.round(result.bands[i]!.position)).sort((a, b) => a - b);
    const strongest = pair!.bands.map((i) => result.bands[i]!).reduce((x, y) => (y.height > x.height ? y : x));
    const lines = splitBandLines(result);
    expect(lines).toEqual([
      `  one band    ${low} + ${high} cm-1 read as one transition (${pair!.label}) at their centroid ${Math.round(pair!.observed)} cm-1: `
      + `split components (Jahn–Teller or spin–orbit); the strongest maximum is at ${Math.round(strongest.position)} cm-1, and the ± above does not cover that choice`,
    ]);
    expect(formatAnalysisReport('ti', result)).toContain(lines[0]);
    // The centroid lies between the components, and the strongest maximum is the upper one (the shoulder is the weaker).
    expect(pair!.observed).toBeGreaterThan(low!);
    expect(pair!.observed).toBeLessThan(high!);
    expect(Math.round(strongest.position)).toBe(high);
  });

  it('one band per transition (aqueous Cu(II)): no such line', () => {
    const result = analyze('cu-aqua-visible.csv', 'Cu2+');
    expect(result.fit.assignments.every((a) => a.bands.length === 1)).toBe(true);
    expect(splitBandLines(result)).toEqual([]);
    expect(formatAnalysisReport('cu', result)).not.toMatch(/one band {4}/);
  });
});
