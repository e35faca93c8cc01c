import type { Ion } from '../chemistry/ions.js';
import { isFieldgapError } from '../errors.js';
import type { FactorFit, RankOptions, SeriesAnalysis } from '../series/index.js';
import { fitCheckedLigandFactors } from '../series/factors.js';
import { rankCheckedByNephelauxetic, rankCheckedByTenDq } from '../series/rank.js';
import type { SeriesFactorFit, SeriesReport, SeriesSkip } from './series.js';
import { ligandMeansOfAnalyses, ligandSummaries } from './series-ligands.js';
import { isNoFactorNote } from './series-page.js';

/**
 * The report of analyses already checked (their shared ion from the check):
 * Jørgensen's factors where they can be fitted (else a note saying why) and
 * both rankings. One tail for the row-by-row path and the column path
 * (series-from-columns.ts).
 */
export function seriesReportOfChecked(
  ion: string,
  analyses: readonly SeriesAnalysis[],
  labels: readonly string[],
  shared: Ion | undefined,
  skipped: SeriesSkip[],
  options: RankOptions,
): SeriesReport {
  const notes: string[] = [];
  let factors: FactorFit | null = null;
  try {
    factors = fitCheckedLigandFactors(analyses, shared, { ion });
    notes.push(...factors.notes);
  } catch (error) {
    if (!isFieldgapError(error) || error.code !== 'invalid-argument') throw error;
    notes.push(`ligand factors not fitted: ${error.message}`);
  }
  const spectrochemical = rankCheckedByTenDq(analyses, labels, options);
  const nephelauxetic = rankCheckedByNephelauxetic(analyses, labels, options);
  const counted = factors === null ? null : withCounts(factors);
  return {
    ion,
    count: analyses.length,
    spectrochemical,
    nephelauxetic,
    factors: counted,
    skipped,
    notes,
    ...ligandSummaries(ligandMeansOfAnalyses(analyses, labels), counted, options.criterion ?? 'one-sigma'),
    page: {
      all: true, offset: 0, limit: null, total: spectrochemical.entries.length, nephelauxeticTotal: nephelauxetic.entries.length,
      nephelauxeticSkippedTotal: nephelauxetic.skipped.length, skippedTotal: skipped.length, noFactorTotal: counted?.notes.filter(isNoFactorNote).length ?? 0,
    },
  };
}

/** The fit with each factor's count of analyses (the length of its whole fFrom and hFrom). */
function withCounts(fit: FactorFit): SeriesFactorFit {
  return { ...fit, factors: fit.factors.map((f) => ({ ...f, fCount: f.fFrom.length, ...(f.hFrom !== undefined && { hCount: f.hFrom.length }) })) };
}
