import { stableOrderOfValues } from './stable-order.js';
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
  const items = newItems(analyses.length);
  analyses.forEach((a, index) => addItem(items, index, a.tenDq, a.tenDqUncertainty ?? 0));
  return rank('spectrochemical', '10Dq / cm-1', analyses, items, [], labels, options);
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
  const items = newItems(analyses.length);
  const skipped: Ranking['skipped'] = [];
  analyses.forEach((a, index) => {
    if (a.beta === undefined) skipped.push({ index, sample: a.sample, reason: 'no beta given' });
    else addItem(items, index, 1 - a.beta, a.betaUncertainty ?? 0);
  });
  return rank('nephelauxetic', '1 - beta', analyses, items, skipped, labels, options);
}

/** Each analysis's ligand label ("NH3", "NH3×5 Cl"), in the order given. */
export function ligandLabels(analyses: readonly SeriesAnalysis[]): string[] {
  return analyses.map((a, index) => ligandLabel(ligandShares(a, `analyses[${index}]`)));
}

/**
 * The analyses a ranking orders, as columns (item k: analysis index[k], its
 * value and uncertainty), in the order given: no object per analysis before
 * the entries themselves, which a series of 100 000 analyses feels.
 */
interface Items {
  count: number;
  index: Uint32Array;
  value: Float64Array;
  uncertainty: Float64Array;
}

function newItems(capacity: number): Items {
  return { count: 0, index: new Uint32Array(capacity), value: new Float64Array(capacity), uncertainty: new Float64Array(capacity) };
}

function addItem(items: Items, index: number, value: number, uncertainty: number): void {
  items.index[items.count] = index;
  items.value[items.count] = value;
  items.uncertainty[items.count] = uncertainty;
  items.count += 1;
}

/** True when two values are not resolved: |Δ| < k·sqrt(σ1² + σ2²) (k = 1 or 2), or equal. */
export function valuesOverlap(v1: number, s1: number, v2: number, s2: number, criterion: OverlapCriterion = 'one-sigma'): boolean {
  const k = criterion === 'two-sigma' ? 2 : 1;
  const diff = Math.abs(v2 - v1);
  return diff === 0 || diff < k * Math.hypot(s1, s2);
}

function rank(kind: Ranking['kind'], quantity: string, analyses: readonly SeriesAnalysis[], items: Items, skipped: Ranking['skipped'], labels: readonly string[], options: RankOptions): Ranking {
  const { criterion = 'one-sigma' } = options;
  const { count, index, value, uncertainty } = items;
  // By value; equal values keep the order given (what a stable sort of the items would do).
  const sorted = stableOrderOfValues(value, count);
  const overlaps: Overlap[] = [];
  const entries: RankedEntry[] = new Array<RankedEntry>(count);
  for (let i = 0; i < count; i++) {
    const k = sorted[i] as number;
    const v = value[k] as number;
    const u = uncertainty[k] as number;
    const a = analyses[index[k] as number] as SeriesAnalysis;
    let overlapsNext = false;
    if (i + 1 < count) {
      const next = sorted[i + 1] as number;
      overlapsNext = valuesOverlap(v, u, value[next] as number, uncertainty[next] as number, criterion);
      if (overlapsNext) {
        overlaps.push({ lower: i + 1, upper: i + 2, difference: (value[next] as number) - v, combinedUncertainty: Math.hypot(u, uncertainty[next] as number) });
      }
    }
    const entry: RankedEntry = {
      position: i + 1,
      index: index[k] as number,
      sample: a.sample,
      ligandLabel: labels[index[k] as number]!,
      value: v,
      uncertainty: u,
      overlapsNext,
    };
    if (a.id !== undefined) entry.id = a.id;
    entries[i] = entry;
  }
  // Appended piece by piece (V8 joins the pieces once, when the text is read): half the time of map and join at 100 000 entries.
  let series = '';
  for (let i = 0; i < count; i++) {
    const e = entries[i] as RankedEntry;
    series += i === 0 ? e.ligandLabel : `${(entries[i - 1] as RankedEntry).overlapsNext ? ' ~ ' : ' < '}${e.ligandLabel}`;
  }
  return { kind, quantity, criterion, entries, overlaps, series, skipped };
}
