import { describe, expect, it } from 'vitest';
import { buildSeries, seriesAnalysisOf, type SeriesSource } from '../../src/library/series.js';
import { combine, fitLigandFactors } from '../../src/series/index.js';
import { referenceFactorSamples } from '../reference/ligand-factor-samples.js';
import { referenceSeries } from '../reference/series-report.js';
import { oldFields } from './helpers/old-fields.js';
import { SERIES_FORMULAS, SERIES_LIGAND_LISTS } from '../helpers/series-spellings.js';
import { seededLcg } from '../reference/seeded-random.js';

// Spellings of a real library: formulas fieldgap reads (mixed, chelating), one it does not,
// ligand names in several spellings, one ligand nobody tabulates, records without a fit or ligands.
function sources(count: number, seed: number): SeriesSource[] {
  const next = seededLcg(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(next() * list.length)]!;
  return Array.from({ length: count }, (_v, i): SeriesSource => {
    const hasFit = next() > 0.05;
    const beta = next() > 0.1 ? 0.55 + 0.4 * next() : null;
    const source: SeriesSource = {
      id: String(count - i),
      sample: `sample ${i}`,
      ion: pick(['Cr3+', 'Cr(III)', 'cr 3+']),
      summary: {
        // rounded to 0.1 cm-1 as fits often are, so equal values and exact overlaps occur
        tenDq: hasFit ? Math.round(150_000 + 100_000 * next()) / 10 : null,
        tenDqSd: next() > 0.2 ? Math.round(2_000 * next()) / 10 : null,
        b: hasFit ? 500 + 300 * next() : null,
        beta,
        betaSd: beta !== null && next() > 0.3 ? 0.03 * next() : null,
      },
    };
    const formula = pick(SERIES_FORMULAS);
    if (formula !== undefined) source.formula = formula;
    const ligands = pick(SERIES_LIGAND_LISTS);
    if (ligands.length > 0) source.ligands = ligands;
    return source;
  });
}

describe('fitLigandFactors, one plan per set of ligands, against the per-analysis reference', () => {
  it.each([1, 2, 3])('gives the same samples, means and notes for 3 000 varied analyses (seed %i)', (seed) => {
    const analyses = sources(3_000, seed).flatMap((s) => {
      const made = seriesAnalysisOf(s);
      return typeof made === 'string' ? [] : [made];
    });
    const fast = fitLigandFactors(analyses, { ion: 'Cr3+' });
    const slow = referenceFactorSamples(analyses, fast.g, fast.k);
    expect(fast.notes.slice(0, slow.notes.length)).toEqual(slow.notes);
    expect(fast.factors.map((f) => f.ligand)).toEqual([...slow.f.keys()]);
    for (const factor of fast.factors) {
      const fs = slow.f.get(factor.ligand)!;
      expect(factor.fFrom).toEqual(fs.map((s) => s.index));
      expect({ value: factor.f, sigma: factor.fUncertainty }).toEqual(combine(fs));
      const hs = slow.h.get(factor.ligand);
      if (hs) {
        expect(factor.hFrom).toEqual(hs.map((s) => s.index));
        expect({ value: factor.h, sigma: factor.hUncertainty }).toEqual(combine(hs));
      } else {
        expect(factor.h).toBeUndefined();
      }
    }
  });
});

describe('buildSeries, checked once, against the reference that checks everything thrice', () => {
  it.each([1, 2, 3])('gives the same report for 3 000 varied analyses (seed %i)', (seed) => {
    const given = sources(3_000, seed);
    for (const criterion of ['one-sigma', 'two-sigma'] as const) {
      expect(oldFields(buildSeries('Cr3+', given, { criterion }))).toEqual(referenceSeries('Cr3+', given, { criterion }));
    }
  });

  it('throws the same error for an analysis that fails the checks', () => {
    const given = sources(50, 7);
    given[10] = { id: 'bad', sample: 'bad sd', ligands: ['H2O'], summary: { tenDq: 17_000, tenDqSd: -5, b: null, beta: null, betaSd: null } };
    const error = (fn: () => unknown) => {
      try {
        fn();
      } catch (e) {
        return e;
      }
      throw new Error('expected a throw');
    };
    expect(error(() => buildSeries('Cr3+', given))).toEqual(error(() => referenceSeries('Cr3+', given)));
    expect(error(() => buildSeries('Cr3+', given))).toMatchObject({ code: 'invalid-argument', path: 'analyses[10].tenDqUncertainty' });
  });

  it('gives the same notes when the factors cannot be fitted (an ion without a tabulated g)', () => {
    const given = sources(40, 11).map((s) => ({ ...s, ion: 'Ti3+' }));
    const fast = buildSeries('Ti3+', given);
    expect(oldFields(fast)).toEqual(referenceSeries('Ti3+', given));
  });
});
