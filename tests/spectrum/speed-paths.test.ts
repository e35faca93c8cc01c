/**
 * The speed paths of the analysis change no result: 20 corpus spectra go
 * through analyzeSpectrum twice, once as shipped and once with each speed
 * path swapped back for the plain code it replaced (the reference), and
 * every number of the two results agrees to 1e-9 relative. This compares
 * fieldgap with itself, not with the outside world; the outside checks of
 * the pieces are in savitzky-golay.test.ts and gsd-cached-weights.test.ts.
 *
 * Speed paths and their references:
 * - gsdCachedWeights (cached Savitzky–Golay weights) ← ml-gsd's gsd;
 * - jacobianNormalProducts (blocked sums) ← one pass per pair of columns
 *   (tests/reference/band-model.ts);
 * - reusedBandModelWork (work arrays kept between fits) ← fresh arrays for
 *   each fit (bandModelWork).
 */
import { describe, expect, it, vi } from 'vitest';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';
import { caseOptions } from '../accuracy/run-corpus.js';

type Analyze = (typeof import('../../src/analysis.js'))['analyzeSpectrum'];

const GSD = '../../src/spectrum/gsd-cached-weights.js';
const PRODUCTS = '../../src/spectrum/jacobian-normal-products.js';
const WORK = '../../src/spectrum/band-model-work-reuse.js';

/** analyzeSpectrum from a fresh module graph: with the speed paths, or with their references. */
async function pipeline(reference: boolean): Promise<Analyze> {
  vi.resetModules();
  if (reference) {
    vi.doMock(GSD, async () => ({ gsdCachedWeights: (await import('ml-gsd')).gsd }));
    vi.doMock(PRODUCTS, async () => ({ jacobianNormalProducts: (await import('../reference/band-model.js')).referencePairwiseProducts }));
    vi.doMock(WORK, async () => ({ reusedBandModelWork: (await import('../../src/spectrum/band-model.js')).bandModelWork }));
  } else {
    for (const path of [GSD, PRODUCTS, WORK]) vi.doUnmock(path);
  }
  return (await import('../../src/analysis.js')).analyzeSpectrum;
}

/** Every number in `a` and `b` at the same place, as "path: a vs b" lines where they differ by more than `relative`. */
function differences(a: unknown, b: unknown, relative: number, path = ''): string[] {
  if (typeof a === 'number' && typeof b === 'number') {
    if (Number.isNaN(a) && Number.isNaN(b)) return [];
    const scale = Math.max(Math.abs(a), Math.abs(b));
    return a === b || Math.abs(a - b) <= relative * scale ? [] : [`${path}: ${a} vs ${b}`];
  }
  if (a !== null && b !== null && typeof a === 'object' && typeof b === 'object') {
    const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
    return [...keys].flatMap((k) => differences((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], relative, `${path}.${k}`));
  }
  return Object.is(a, b) ? [] : [`${path}: ${JSON.stringify(a)} vs ${JSON.stringify(b)}`];
}

function outcome(analyze: Analyze, csv: string, options: Parameters<Analyze>[1]): unknown {
  try {
    return analyze(csv, options);
  } catch (error) {
    return { failed: error instanceof Error ? `${error.name}: ${error.message}` : String(error) };
  }
}

describe('speed paths against the code they replaced', () => {
  it('give the same analysis of 20 corpus spectra, every number to 1e-9 relative', async () => {
    const cases = corpusCases().filter((_c, i) => i % 4 === 0).slice(0, 20);
    expect(cases).toHaveLength(20);
    const inputs = cases.map((c) => ({ csv: caseSpectrum(c).csv, options: caseOptions(c) }));
    const fast = await pipeline(false);
    const shipped = inputs.map(({ csv, options }) => outcome(fast, csv, options));
    const slow = await pipeline(true);
    const reference = inputs.map(({ csv, options }) => outcome(slow, csv, options));
    // The two module graphs really differ (a mock that did not take would compare a path with itself).
    expect(fast).not.toBe(slow);
    let bands = 0;
    for (let i = 0; i < cases.length; i++) {
      expect(differences(shipped[i], reference[i], 1e-9), cases[i]!.id).toEqual([]);
      bands += (shipped[i] as { bands?: unknown[] }).bands?.length ?? 0;
    }
    expect(bands).toBeGreaterThan(20);
  }, 300_000); // a bound, not a speed check: 40 full analyses, which take minutes on a loaded machine
});
