import type { Ranking, RankedEntry } from '../series/index.js';
import type { SeriesReport } from './series.js';

/**
 * Which part of the per-analysis lists a series report holds. With `all`
 * every list is whole (the report as it always was). Otherwise each list
 * of analyses (the two rankings' entries, overlaps and skipped, the
 * analyses left out, each factor's fFrom and hFrom, the notes of analyses
 * that give no f) holds its items offset+1 … offset+limit, and each
 * ranking's `series` joins the entries shown; the counts here and
 * `count` say how long the whole lists are. What is per ligand (`ligands`,
 * `ligandSeries`, the factors' values) is always complete.
 */
export interface SeriesPage {
  all: boolean;
  offset: number;
  /** null with `all`. */
  limit: number | null;
  /** Entries of the whole spectrochemical ranking (= `count`). */
  total: number;
  nephelauxeticTotal: number;
  nephelauxeticSkippedTotal: number;
  skippedTotal: number;
  /** Analyses that give no f (one note each). */
  noFactorTotal: number;
}

/** Default page size of a series' per-analysis lists. */
export const SERIES_PAGE_SIZE = 50;

/** The note that ends each analysis that gives no f (src/series/factors.ts). */
const NO_F = ': gives no f';

/** Whether a factor note is the note of one analysis that gives no f. */
export function isNoFactorNote(note: string): boolean {
  return note.startsWith('analyses[') && note.endsWith(NO_F);
}

/** The note that stands for the notes of analyses not on the page. */
export function moreNoFactorNote(more: number): string {
  return `${more} more ${more === 1 ? 'analysis gives' : 'analyses give'} no f (--all lists every one)`;
}

/** A whole report's page: what the database path gives directly, made here by cutting the lists (the reference for it, and the path of series held in memory). */
export function pageOfSeries(full: SeriesReport, offset: number, limit: number): SeriesReport {
  const cut = <T>(list: readonly T[]) => list.slice(offset, offset + limit);
  const noF = full.factors?.notes.filter(isNoFactorNote) ?? [];
  const shownNoF = cut(noF);
  const factorNotes = full.factors === null ? [] : [
    ...shownNoF,
    ...(noF.length > shownNoF.length ? [moreNoFactorNote(noF.length - shownNoF.length)] : []),
    ...full.factors.notes.filter((n) => !isNoFactorNote(n)),
  ];
  const factors = full.factors === null ? null : {
    ...full.factors,
    factors: full.factors.factors.map((f) => ({ ...f, fFrom: cut(f.fFrom), ...(f.hFrom !== undefined && { hFrom: cut(f.hFrom) }) })),
    notes: factorNotes,
  };
  return {
    ...full,
    spectrochemical: pageOfRanking(full.spectrochemical, offset, limit),
    nephelauxetic: pageOfRanking(full.nephelauxetic, offset, limit),
    factors,
    skipped: cut(full.skipped),
    notes: factors === null ? full.notes : factorNotes,
    page: {
      all: false, offset, limit, total: full.spectrochemical.entries.length, nephelauxeticTotal: full.nephelauxetic.entries.length,
      nephelauxeticSkippedTotal: full.nephelauxetic.skipped.length, skippedTotal: full.skipped.length, noFactorTotal: noF.length,
    },
  };
}

function pageOfRanking(ranking: Ranking, offset: number, limit: number): Ranking {
  const entries = ranking.entries.slice(offset, offset + limit);
  return {
    ...ranking,
    entries,
    overlaps: ranking.overlaps.filter((o) => o.lower > offset && o.lower <= offset + limit),
    series: seriesLine(entries),
    skipped: ranking.skipped.slice(offset, offset + limit),
  };
}

/** The entries' labels joined as a ranking's `series` is: "~" after an entry that overlaps the next. */
export function seriesLine(entries: readonly RankedEntry[]): string {
  let line = '';
  for (let i = 0; i < entries.length; i++) {
    const e = entries[i] as RankedEntry;
    line += i === 0 ? e.ligandLabel : `${(entries[i - 1] as RankedEntry).overlapsNext ? ' ~ ' : ' < '}${e.ligandLabel}`;
  }
  return line;
}

/** "showing 1–50 of 100 000 (--all for every analysis)", or undefined when the whole list is shown. */
export function pageLine(page: SeriesPage, shown: number, total: number, what: string): string | undefined {
  if (page.all || (page.offset === 0 && shown === total)) return undefined;
  const group = (n: number) => n.toLocaleString('en-US').replace(/,/g, ' ');
  const range = shown === 0 ? `none` : `${group(page.offset + 1)}–${group(page.offset + shown)}`;
  return `showing ${range} of ${group(total)} ${what}; --all for every analysis, --offset N for the next`;
}
