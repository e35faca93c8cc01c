/**
 * gsdCachedWeights (src/spectrum/gsd-cached-weights.ts) against ml-gsd 14's
 * gsd, used as reference: the same peaks, every field (ids aside: both draw
 * random ones), on the very inputs the pipeline gives it for 20 corpus
 * spectra, and on cases it hands to ml-gsd unchanged.
 */
import { gsd, type GSDOptions, type GSDPeak } from 'ml-gsd';
import { describe, expect, it, vi } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { FieldgapError } from '../../src/errors.js';
import { caseSpectrum, corpusCases } from '../accuracy/cases.js';
import { caseOptions } from '../accuracy/run-corpus.js';

const recorded = vi.hoisted(() => [] as Array<{ x: Float64Array; y: Float64Array; options: GSDOptions | undefined }>);

// Records every call band finding makes, then runs the real function.
vi.mock('../../src/spectrum/gsd-cached-weights.js', async (importOriginal) => {
  const actual = await importOriginal<typeof import('../../src/spectrum/gsd-cached-weights.js')>();
  return {
    gsdCachedWeights: (data: { x: Float64Array; y: Float64Array }, options?: GSDOptions) => {
      recorded.push({ x: data.x.slice(), y: data.y.slice(), options: structuredClone(options) });
      return actual.gsdCachedWeights(data, options);
    },
  };
});

const withoutIds = (peaks: GSDPeak[]) => peaks.map(({ id: _id, ...rest }) => rest);

describe('gsdCachedWeights', () => {
  it('finds the same peaks as ml-gsd on every call band finding makes for 20 corpus spectra', async () => {
    const cases = corpusCases().filter((_c, i) => i % 4 === 0).slice(0, 20);
    expect(cases).toHaveLength(20);
    for (const c of cases) {
      try {
        analyzeSpectrum(caseSpectrum(c).csv, caseOptions(c));
      } catch (error) {
        if (!(error instanceof FieldgapError)) throw error;
      }
    }
    expect(recorded.length).toBeGreaterThanOrEqual(20);
    const { gsdCachedWeights } = await vi.importActual<typeof import('../../src/spectrum/gsd-cached-weights.js')>('../../src/spectrum/gsd-cached-weights.js');
    let peaks = 0;
    for (const call of [...recorded]) {
      const ours = gsdCachedWeights({ x: call.x, y: call.y }, call.options);
      const library = gsd({ x: call.x, y: call.y }, call.options);
      expect(withoutIds(ours)).toEqual(withoutIds(library));
      peaks += library.length;
    }
    expect(peaks).toBeGreaterThan(20);
  });

  it('hands other cases to ml-gsd: non-uniform x, no noise level, the first-derivative algorithm', async () => {
    const { gsdCachedWeights } = await vi.importActual<typeof import('../../src/spectrum/gsd-cached-weights.js')>('../../src/spectrum/gsd-cached-weights.js');
    const x = Float64Array.from({ length: 300 }, (_, i) => 10_000 + 20 * i + (i > 150 ? 15 * (i - 150) : 0));
    const y = Float64Array.from(x, (v) => Math.exp(-(((v - 13_000) / 800) ** 2)) + 0.4 * Math.exp(-(((v - 16_000) / 500) ** 2)));
    const uniform = Float64Array.from({ length: 300 }, (_, i) => 10_000 + 20 * i);
    for (const [xs, options] of [
      [x, { noiseLevel: 0.01, smoothY: true, sgOptions: { windowSize: 11, polynomial: 3 } }],
      [uniform, { smoothY: true }],
      [uniform, { noiseLevel: 0.01, peakDetectionAlgorithm: 'first' }],
    ] as Array<[Float64Array, GSDOptions]>) {
      const library = withoutIds(gsd({ x: xs, y }, options));
      expect(library.length).toBeGreaterThan(0);
      expect(withoutIds(gsdCachedWeights({ x: xs, y }, options))).toEqual(library);
    }
  });

  it('refuses decreasing x as ml-gsd does', async () => {
    const { gsdCachedWeights } = await vi.importActual<typeof import('../../src/spectrum/gsd-cached-weights.js')>('../../src/spectrum/gsd-cached-weights.js');
    const x = Float64Array.from({ length: 20 }, (_, i) => 100 - i);
    expect(() => gsdCachedWeights({ x, y: new Float64Array(20) }, { noiseLevel: 0 })).toThrow(/monotone increasing/);
  });
});
