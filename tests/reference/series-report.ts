import { isFieldgapError } from '../../src/errors.js';
import { seriesAnalysisOf, type SeriesReport, type SeriesSource } from '../../src/library/series.js';
import { canonicalIon } from '../../src/library/validate.js';
import { fitLigandFactors, rankByNephelauxetic, rankByTenDq, type FactorFit, type RankOptions, type SeriesAnalysis } from '../../src/series/index.js';

/**
 * buildSeries checks the analyses once, reads each formula and ligand
 * spelling once and labels each analysis once for both rankings. The slow
 * reference below is buildSeries as it was written first: every source on
 * its own, then the three public functions, each checking and labelling
 * every analysis again. The two must agree exactly (toEqual, not toBeCloseTo).
 */
export function referenceSeries(ionText: string, sources: readonly SeriesSource[], options: RankOptions = {}): unknown {
  const ion = canonicalIon(ionText);
  const analyses: SeriesAnalysis[] = [];
  const skipped: SeriesReport['skipped'] = [];
  for (const source of sources) {
    const made = seriesAnalysisOf(source);
    if (typeof made === 'string') skipped.push({ id: source.id, sample: source.sample, reason: made });
    else analyses.push(made);
  }
  const notes: string[] = [];
  let factors: FactorFit | null = null;
  try {
    factors = fitLigandFactors(analyses, { ion });
    notes.push(...factors.notes);
  } catch (error) {
    if (!isFieldgapError(error) || error.code !== 'invalid-argument') throw error;
    notes.push(`ligand factors not fitted: ${error.message}`);
  }
  return {
    ion, count: analyses.length,
    spectrochemical: rankByTenDq(analyses, options),
    nephelauxetic: rankByNephelauxetic(analyses, options),
    factors, skipped, notes,
  };
}

