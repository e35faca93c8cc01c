import type { SeriesReport } from '../../../src/library/series.js';

/** The report's fields as they were before the ligand summary and paging were added (what the reference makes). */
export function oldFields(report: SeriesReport): unknown {
  const { ion, count, spectrochemical, nephelauxetic, factors, skipped, notes } = report;
  const oldFactors = factors === null ? null : { ...factors, factors: factors.factors.map(({ fCount: _f, hCount: _h, ...rest }) => rest) };
  return { ion, count, spectrochemical, nephelauxetic, factors: oldFactors, skipped, notes };
}

