import { parseFormula } from '../chemistry/formula.js';
import { FieldgapError } from '../errors.js';
import { type FactorFit, type LigandFactor, type LigandShare, type RankOptions, type Ranking, type SeriesAnalysis } from '../series/index.js';
import type { LigandSeries, LigandSummary } from './series-ligands.js';
import { ligandLabels } from '../series/rank.js';
import { validateSeriesAnalyses } from '../series/validate.js';
import type { Library } from './library.js';
import type { AnalysisDetails, SeriesFit } from './types.js';
import { seriesFromColumns } from './series-from-columns.js';
import { seriesReportOfChecked } from './series-report.js';
import { canonicalIon } from './validate.js';
import { pageNumber } from './input-checks.js';
import { pageOfSeries, SERIES_PAGE_SIZE, type SeriesPage } from './series-page.js';
import { pagedLibrarySeries } from './series-paged.js';

/** What one stored (or freshly made) analysis contributes to a series. */
export interface SeriesSource extends Pick<AnalysisDetails, 'sample' | 'formula' | 'ligands' | 'ion'> {
  /** The library id, or the file name for an analysis not stored. */
  id: string;
  summary: SeriesFit;
}

export interface SeriesSkip {
  id: string;
  sample: string;
  reason: string;
}

/**
 * A ligand series of one metal ion: src/series's two rankings of the
 * analyses (by 10Dq, and by 1 − β; weakest first, neighbours within their
 * uncertainties flagged) and Jørgensen's f and h fitted per ligand.
 * Energies in cm-1, uncertainties one standard deviation.
 */
export interface SeriesReport {
  ion: string;
  /** How many analyses entered the rankings. */
  count: number;
  spectrochemical: Ranking;
  nephelauxetic: Ranking;
  /** null when the factors cannot be fitted for this ion (the reason is in `notes`). */
  factors: SeriesFactorFit | null;
  /** Analyses left out before ranking (no fit, ligands unknown), with why. */
  skipped: SeriesSkip[];
  notes: string[];
  /** One row per ligand: analyses, mean 10Dq and β with σ, places in the two series, f and h. Always complete. */
  ligands: LigandSummary[];
  /** The two series of ligands, one line each. */
  ligandSeries: LigandSeries;
  /** Which part of the per-analysis lists this report holds (series-page.ts). */
  page: SeriesPage;
}

/** The factor fit with how many analyses gave each f and h (fFrom and hFrom may be a page of them). */
export interface SeriesFactorFit extends Omit<FactorFit, 'factors'> {
  factors: (LigandFactor & { fCount: number; hCount?: number })[];
}

/**
 * The series input for one analysis, or the reason it cannot take part.
 * Ligands with their numbers come from the formula when fieldgap reads it;
 * otherwise a record with one ligand counts as homoleptic in it, and a
 * record with several ligands but no readable formula is left out (their
 * proportions are unknown).
 */
export function seriesAnalysisOf(source: SeriesSource, readFormula: (formula: string | undefined) => LigandShare[] | undefined = formulaShares): SeriesAnalysis | string {
  const s = source.summary;
  if (s.tenDq === null || !(s.tenDq > 0)) return 'no fitted 10Dq';
  const analysis: SeriesAnalysis = { id: source.id, sample: source.sample, tenDq: s.tenDq };
  if (source.ion !== undefined) analysis.ion = source.ion;
  if (s.tenDqSd !== null) analysis.tenDqUncertainty = s.tenDqSd;
  if (s.beta !== null && s.beta > 0 && s.beta <= 1.2) analysis.beta = s.beta;
  if (s.betaSd !== null && analysis.beta !== undefined) analysis.betaUncertainty = s.betaSd;
  if (s.b !== null) analysis.b = s.b;
  const shares = readFormula(source.formula);
  if (shares) analysis.ligands = shares;
  else if (source.ligands?.length === 1) analysis.ligand = source.ligands[0]!;
  else if (!source.ligands?.length) return 'no ligand given (set its ligands or a formula fieldgap reads)';
  else return `several ligands (${source.ligands.join(', ')}) but no formula that gives their numbers`;
  return analysis;
}

function formulaShares(formula: string | undefined): LigandShare[] | undefined {
  if (formula === undefined) return undefined;
  try {
    const parsed = parseFormula(formula);
    return parsed.ligands.length > 0 ? parsed.ligands.map((l) => ({ ligand: l.key, count: l.count })) : undefined;
  } catch {
    return undefined;
  }
}

/**
 * formulaShares that reads each distinct formula once (a library repeats a
 * few formulas thousands of times); the shares it gives are only read.
 */
export function formulaReader(): (formula: string | undefined) => LigandShare[] | undefined {
  const formulas = new Map<string | undefined, LigandShare[] | undefined>();
  return (formula) => {
    if (formulas.has(formula)) return formulas.get(formula);
    const shares = formulaShares(formula);
    formulas.set(formula, shares);
    return shares;
  };
}

/** Rankings and factors of the given analyses of `ion`. */
export function buildSeries(ionText: string, sources: readonly SeriesSource[], options: RankOptions = {}): SeriesReport {
  const ion = canonicalIon(ionText);
  const analyses: SeriesAnalysis[] = [];
  const skipped: SeriesSkip[] = [];
  const readFormula = formulaReader();
  for (const source of sources) {
    const made = seriesAnalysisOf(source, readFormula);
    if (typeof made === 'string') skipped.push({ id: source.id, sample: source.sample, reason: made });
    else analyses.push(made);
  }
  if (analyses.length === 0) {
    const why =
      sources.length === 0 ? `no analyses of ${ion}`
      : sources.length === 1 ? `the one analysis of ${ion} has no fitted 10Dq or no known ligand (${skipped[0]!.reason})`
      : `none of the ${sources.length} analyses of ${ion} has both a fitted 10Dq and a known ligand`;
    throw new FieldgapError('not-found', `${why}: nothing to rank`, 'ion');
  }
  // Checked once for the factors and both rankings (each would check them again); a bad analysis throws here as it would there.
  const shared = validateSeriesAnalyses(analyses);
  return seriesReportOfChecked(ion, analyses, ligandLabels(analyses), shared, skipped, options);
}

/** How much of a library series to give: a page of its per-analysis lists (default the first SERIES_PAGE_SIZE), or `all`. */
export interface LibrarySeriesOptions extends RankOptions {
  /** Every analysis in every list, as the report always was. Default false. */
  all?: boolean;
  /** Items per list, 1 to 100 000. Default 50. */
  limit?: number;
  /** Items skipped at the start of each list. Default 0. */
  offset?: number;
}

/**
 * The series of every analysis of `ion` in the library. By default a page of
 * the per-analysis lists with every ligand-level figure complete, from the
 * database's aggregates (pagedLibrarySeries): tens of milliseconds at
 * 100 000 records. With `all`, the whole report: the records read as columns
 * (library.seriesColumns) and ranked by seriesFromColumns, which gives
 * buildSeries's report without an object per record on the way. Where a
 * fast path cannot stand for the records (a value buildSeries refuses, so
 * its error names the analysis), buildSeries itself over the records read
 * one by one, cut to the page asked for.
 */
export async function librarySeries(library: Library, ion: string, options: LibrarySeriesOptions = {}): Promise<SeriesReport> {
  const label = canonicalIon(ion);
  const { all = false, limit, offset, ...rank } = options;
  if (all) return wholeLibrarySeries(library, label, rank);
  const size = pageNumber('limit', limit, SERIES_PAGE_SIZE, 1, 100_000);
  const from = pageNumber('offset', offset, 0, 0, Number.MAX_SAFE_INTEGER);
  return (await pagedLibrarySeries(library, label, rank, from, size)) ?? pageOfSeries(await wholeLibrarySeries(library, label, rank), from, size);
}

async function wholeLibrarySeries(library: Library, label: string, options: RankOptions): Promise<SeriesReport> {
  const columns = await library.seriesColumns(label);
  const fast = columns === undefined ? undefined : seriesFromColumns(label, columns, formulaReader(), options);
  return fast ?? buildSeries(label, await librarySources(library, label), options);
}

/** Every record of the ion `label` as buildSeries takes it, newest first. */
export async function librarySources(library: Library, label: string): Promise<SeriesSource[]> {
  return (await library.listFits({ ion: label })).map((r): SeriesSource => {
    const source: SeriesSource = { id: String(r.id), sample: r.sample, summary: r.summary };
    if (r.formula !== undefined) source.formula = r.formula;
    if (r.ligands !== undefined) source.ligands = r.ligands;
    if (r.ion !== undefined) source.ion = r.ion;
    return source;
  });
}
