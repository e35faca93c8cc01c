import type { Ion } from '../chemistry/ions.js';
import { isFieldgapError } from '../errors.js';
import type { FactorFit, RankOptions, SeriesAnalysis } from '../series/index.js';
import { fitCheckedLigandFactors } from '../series/factors.js';
import { rankCheckedByNephelauxetic, rankCheckedByTenDq } from '../series/rank.js';
import type { SeriesReport, SeriesSkip } from './series.js';

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
  return {
    ion,
    count: analyses.length,
    spectrochemical: rankCheckedByTenDq(analyses, labels, options),
    nephelauxetic: rankCheckedByNephelauxetic(analyses, labels, options),
    factors,
    skipped,
    notes,
  };
}
