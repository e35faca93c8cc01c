import type { OverlapCriterion, Overlap, RankedEntry, Ranking, SeriesAnalysis } from './types.js';
import { ligandLabel, ligandShares, validateSeriesAnalyses } from './validate.js';

export interface RankOptions {
  /**
   * When two neighbours count as not resolved: 'one-sigma' (default) when
   * |Δ| < sqrt(σ1² + σ2²), 'two-sigma' when |Δ| < 2·sqrt(σ1² + σ2²).
   * Missing uncertainties count as 0, so such neighbours overlap only if equal.
   */
  criterion?: OverlapCriterion;
}

/**
 * The spectrochemical order of a series: analyses of one metal ion sorted by
 * 10Dq, smallest first (as the series is written, I- < Br- < ... < CN-),
 * with neighbours that are not resolved within their uncertainties flagged.
 */
export function rankByTenDq(analyses: readonly SeriesAnalysis[], options: RankOptions = {}): Ranking {
  validateSeriesAnalyses(analyses);
  return rankCheckedByTenDq(analyses, ligandLabels(analyses), options);
}

/**
 * rankByTenDq of analyses that validateSeriesAnalyses has passed, with their
 * labels (ligandLabels): one check and one label per analysis when a caller
 * makes both rankings of thousands of analyses.
 */
export function rankCheckedByTenDq(analyses: readonly SeriesAnalysis[], labels: readonly string[], options: RankOptions = {}): Ranking {
  const items = analyses.map((a, index) => ({ a, index, value: a.tenDq, uncertainty: a.tenDqUncertainty ?? 0 }));
  return rank('spectrochemical', '10Dq / cm-1', items, [], labels, options);
}

/**
 * The nephelauxetic order: analyses sorted by 1 − β, smallest first (least
 * nephelauxetic, F- end, first; larger 1 − β is more nephelauxetic).
 * Analyses without β are left out and listed in `skipped`.
 */
export function rankByNephelauxetic(analyses: readonly SeriesAnalysis[], options: RankOptions = {}): Ranking {
  validateSeriesAnalyses(analyses);
  return rankCheckedByNephelauxetic(analyses, ligandLabels(analyses), options);
}

/** rankByNephelauxetic of analyses that validateSeriesAnalyses has passed, with their labels (ligandLabels). */
export function rankCheckedByNephelauxetic(analyses: readonly SeriesAnalysis[], labels: readonly string[], options: RankOptions = {}): Ranking {
  const items: Item[] = [];
  const skipped: Ranking['skipped'] = [];
  analyses.forEach((a, index) => {
    if (a.beta === undefined) skipped.push({ index, sample: a.sample, reason: 'no beta given' });
    else items.push({ a, index, value: 1 - a.beta, uncertainty: a.betaUncertainty ?? 0 });
  });
  return rank('nephelauxetic', '1 - beta', items, skipped, labels, options);
}

/** Each analysis's ligand label ("NH3", "NH3×5 Cl"), in the order given. */
export function ligandLabels(analyses: readonly SeriesAnalysis[]): string[] {
  return analyses.map((a, index) => ligandLabel(ligandShares(a, `analyses[${index}]`)));
}

interface Item {
  a: SeriesAnalysis;
  index: number;
  value: number;
  uncertainty: number;
}

/** True when two values are not resolved: |Δ| < k·sqrt(σ1² + σ2²) (k = 1 or 2), or equal. */
export function valuesOverlap(v1: number, s1: number, v2: number, s2: number, criterion: OverlapCriterion = 'one-sigma'): boolean {
  const k = criterion === 'two-sigma' ? 2 : 1;
  const diff = Math.abs(v2 - v1);
  return diff === 0 || diff < k * Math.hypot(s1, s2);
}

function rank(kind: Ranking['kind'], quantity: string, items: Item[], skipped: Ranking['skipped'], labels: readonly string[], options: RankOptions): Ranking {
  const { criterion = 'one-sigma' } = options;
  // Stable sort: equal values keep the order the user gave.
  const sorted = [...items].sort((x, y) => x.value - y.value);
  const overlaps: Overlap[] = [];
  const entries: RankedEntry[] = sorted.map((item, i) => {
    const next = sorted[i + 1];
    const overlapsNext = next !== undefined && valuesOverlap(item.value, item.uncertainty, next.value, next.uncertainty, criterion);
    if (overlapsNext && next) {
      overlaps.push({ lower: i + 1, upper: i + 2, difference: next.value - item.value, combinedUncertainty: Math.hypot(item.uncertainty, next.uncertainty) });
    }
    const entry: RankedEntry = {
      position: i + 1,
      index: item.index,
      sample: item.a.sample,
      ligandLabel: labels[item.index]!,
      value: item.value,
      uncertainty: item.uncertainty,
      overlapsNext,
    };
    if (item.a.id !== undefined) entry.id = item.a.id;
    return entry;
  });
  const series = entries.map((e, i) => (i === 0 ? e.ligandLabel : `${entries[i - 1]?.overlapsNext ? ' ~ ' : ' < '}${e.ligandLabel}`)).join('');
  return { kind, quantity, criterion, entries, overlaps, series, skipped };
}
