import { parseFormula } from '../chemistry/formula.js';
import { FieldgapError } from '../errors.js';
import { type FactorFit, type LigandShare, type RankOptions, type Ranking, type SeriesAnalysis } from '../series/index.js';
import { ligandLabels } from '../series/rank.js';
import { validateSeriesAnalyses } from '../series/validate.js';
import type { Library } from './library.js';
import type { AnalysisDetails, SeriesFit } from './types.js';
import { seriesFromColumns } from './series-from-columns.js';
import { seriesReportOfChecked } from './series-report.js';
import { canonicalIon } from './validate.js';

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
  factors: FactorFit | null;
  /** Analyses left out before ranking (no fit, ligands unknown), with why. */
  skipped: SeriesSkip[];
  notes: string[];
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

/**
 * The series of every analysis of `ion` in the library: the records read as
 * columns (library.seriesColumns) and ranked by seriesFromColumns, which gives
 * buildSeries's report without an object per record on the way; when it
 * cannot (a value buildSeries refuses, so its error names the analysis),
 * buildSeries itself over the records read one by one.
 */
export async function librarySeries(library: Library, ion: string, options: RankOptions = {}): Promise<SeriesReport> {
  const label = canonicalIon(ion);
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
