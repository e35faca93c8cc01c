/**
 * AUDIT3 finding 8: three resolved components of the visible multiplet of
 * tetrahedral Co(II), given as three bands, were refused with no way
 * forward. The refusal now names their centroid (when that reading fits)
 * and the CLI prints the ready command line.
 */
import { describe, expect, it } from 'vitest';
import { fitLigandField } from '../../src/fit/index.js';
import { normalizeBands } from '../../src/fit/bands.js';
import { sortObservations } from '../../src/fit/observations.js';
import { splitBandSuggestion, splitRun } from '../../src/fit/split-suggestion.js';
import { isFieldgapError } from '../../src/errors.js';
import { runCliCaptured } from '../helpers/cli-run.js';

// [CoCl4]2-: 4A2 → 4T1(P) components 14 300 / 15 000 / 16 000 cm-1 (from memory, AUDIT3.md); the multiplet is
// 4T1(P) split by spin–orbit coupling (common practice). 10Dq ≈ 3 100–3 200 (from memory); Jørgensen's
// f(Cl-)·g(Co2+)·4/9 = 0.78 × 9 000 × 4/9 = 3 120 (docs/sources.md JORGENSEN-FG).
const MULTIPLET = [14300, 15000, 16000];

function refusal(bands: number[]): string {
  try {
    fitLigandField({ ion: 'Co2+', geometry: 'tetrahedral', bands });
  } catch (error) {
    if (isFieldgapError(error)) return `${error.code}: ${error.message}`;
    throw error;
  }
  return 'fitted';
}

describe('AUDIT3 finding 8: a refused multiplet names its centroid', () => {
  it('the refusal of the three components suggests one split band at their centroid, which fits', () => {
    const text = refusal(MULTIPLET);
    expect(text).toMatch(/^unexplained: no assignment explains these bands/);
    expect(text).toMatch(/14300, 15000 and 16000 cm-1 the components of one split band/);
    // Unweighted mean of the three (no ε given): 15 100.
    expect(text).toMatch(/centroid, 15100 cm-1/);
    expect(text).toMatch(/--zeta/);
  });

  it('the centroid reads as 4A2 → 4T1(P) with a tetrahedral chloride 10Dq, B at its prior', () => {
    const r = fitLigandField({ ion: 'Co2+', geometry: 'tetrahedral', bands: [15100] });
    expect(r.assignments[0]!.label).toMatch(/^4T1\(P\)/);
    expect(r.tenDq).toBeGreaterThan(2000);
    expect(r.tenDq).toBeLessThan(4500);
    expect(r.undetermined.some((u) => u.parameter === 'b')).toBe(true);
  });

  it('the CLI prints the ready command line, and that command runs', async () => {
    const argv = ['fit', '--ion', 'Co2+', '--geometry', 'tetrahedral', '--bands', MULTIPLET.join(',')];
    const refused = await runCliCaptured(argv);
    expect(refused.code).not.toBe(0);
    const match = /Ready to run: fieldgap (fit --ion Co2\+ --geometry tetrahedral --bands 15100)\b/.exec(refused.err);
    expect(match, refused.err).not.toBeNull();
    const again = await runCliCaptured(match![1]!.split(' '));
    expect(again.code).toBe(0);
    expect(again.out).toMatch(/4A2\(F\) → 4T1\(P\)/);
  });

  it('no suggestion for bands far apart, nor when the centroid reading fails too', () => {
    const far = sortObservations(normalizeBands([9000, 15000, 26000]));
    expect(splitRun(far.primary)).toBeUndefined();
    const close = normalizeBands(MULTIPLET);
    expect(splitRun(sortObservations(close).primary)!.map((o) => o.position)).toEqual(MULTIPLET);
    expect(splitBandSuggestion(close, () => false)).toBeUndefined();
    expect(splitBandSuggestion(close, () => {
      throw new Error('refused');
    })).toBeUndefined();
    expect(splitBandSuggestion(close, () => true)!.bands.map((b) => b.position)).toEqual([15100]);
  });

  it('an intensity-weighted centroid when every component carries an area', () => {
    // Weights 450, 600, 350: (450·14300 + 600·15000 + 350·16000)/1400 = 15 025, rounded to 10 cm-1 (arithmetic).
    const bands = normalizeBands([{ position: 14300, area: 450 }, { position: 15000, area: 600 }, { position: 16000, area: 350 }]);
    expect(splitBandSuggestion(bands, () => true)!.centroid).toBe(15030);
  });
});
