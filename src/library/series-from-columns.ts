import { parseIon } from '../chemistry/ions.js';
import { isFieldgapError } from '../errors.js';
import type { LigandShare, RankOptions, SeriesAnalysis } from '../series/index.js';
import { ligandLabel, ligandShares } from '../series/validate.js';
import type { SeriesReport, SeriesSkip } from './series.js';
import { seriesReportOfChecked } from './series-report.js';
import type { SeriesColumns } from './types.js';

/**
 * buildSeries of a library's records given as columns (library.seriesColumns),
 * for libraries of 100 000 records: the same report, value for value
 * (tests/library/series-columns.test.ts compares the two on seeded libraries
 * of both engines). What buildSeries works out per record but depends only on
 * the record's formula and ligands (the ligands read from the formula, their
 * check, the label) is worked out once per distinct pair; the per-record
 * checks of validateSeriesAnalyses are the few comparisons of numbers left.
 *
 * `ion` is the canonical label the records were selected by (so each has it).
 * Returns undefined when buildSeries would throw (no analysis to rank, a
 * value that fails the checks): the caller then calls buildSeries, whose
 * error names the analysis at fault.
 */
export function seriesFromColumns(
  ion: string,
  columns: SeriesColumns,
  readFormula: (formula: string | undefined) => LigandShare[] | undefined,
  options: RankOptions = {},
): SeriesReport | undefined {
  const kinds = new Map<string, Kind | undefined>();
  const kindOf = (formula: string | null, ligandsText: string): Kind | undefined => {
    const key = `${formula ?? '\u0000'}\u0001${ligandsText}`;
    if (kinds.has(key)) return kinds.get(key);
    const kind = makeKind(formula, ligandsText, readFormula);
    kinds.set(key, kind);
    return kind;
  };
  const { id, sample, formula, ligands, tenDq, tenDqSd, beta, betaSd } = columns;
  const analyses: SeriesAnalysis[] = [];
  const labels: string[] = [];
  const skipped: SeriesSkip[] = [];
  for (let i = 0; i < id.length; i++) {
    const t = tenDq[i] ?? null;
    const name = sample[i] as string;
    // The order of seriesAnalysisOf: no 10Dq first, then the ligands.
    if (t === null || !(t > 0)) {
      skipped.push({ id: String(id[i]), sample: name, reason: 'no fitted 10Dq' });
      continue;
    }
    const kind = kindOf(formula[i] ?? null, ligands[i] as string);
    if (kind === undefined) return undefined;
    if (kind.skip !== undefined) {
      skipped.push({ id: String(id[i]), sample: name, reason: kind.skip });
      continue;
    }
    // validateSeriesAnalyses's checks of the numbers and the sample (its ligand checks are the kind's).
    if (name.trim() === '' || !Number.isFinite(t)) return undefined;
    const analysis: SeriesAnalysis = { id: String(id[i]), sample: name, tenDq: t, ion };
    const sd = tenDqSd[i] ?? null;
    if (sd !== null) {
      if (!(Number.isFinite(sd) && sd >= 0)) return undefined;
      analysis.tenDqUncertainty = sd;
    }
    const b = beta[i] ?? null;
    if (b !== null && b > 0 && b <= 1.2) {
      analysis.beta = b;
      const bSd = betaSd[i] ?? null;
      if (bSd !== null) {
        if (!(Number.isFinite(bSd) && bSd >= 0)) return undefined;
        analysis.betaUncertainty = bSd;
      }
    }
    if (kind.shares !== undefined) analysis.ligands = kind.shares;
    else analysis.ligand = kind.ligand as string;
    analyses.push(analysis);
    labels.push(kind.label);
  }
  if (analyses.length === 0) return undefined;
  const shared = parseIon(ion, { path: 'analyses[0].ion' });
  return seriesReportOfChecked(ion, analyses, labels, shared, skipped, options);
}

/** What a record's formula and ligands give a series: its ligands and label, or why it is left out. */
export interface Kind {
  shares?: LigandShare[];
  ligand?: string;
  label: string;
  /** The ligands with canonical keys (ligandShares), for the factor fit; empty for a kind left out. */
  canonical: LigandShare[];
  skip?: string;
}

/** seriesAnalysisOf's ligand rule and validateSeriesAnalyses's ligand check, for one formula and ligands text; undefined when the check fails. */
export function makeKind(formula: string | null, ligandsText: string, readFormula: (formula: string | undefined) => LigandShare[] | undefined): Kind | undefined {
  const shares = readFormula(formula ?? undefined);
  let probe: SeriesAnalysis;
  if (shares) {
    probe = { sample: 'x', tenDq: 1, ligands: shares };
  } else {
    const list = JSON.parse(ligandsText) as unknown;
    if (!Array.isArray(list)) return undefined;
    if (list.length === 1) probe = { sample: 'x', tenDq: 1, ligand: list[0] as string };
    else if (list.length === 0) return { label: '', canonical: [], skip: 'no ligand given (set its ligands or a formula fieldgap reads)' };
    else return { label: '', canonical: [], skip: `several ligands (${list.join(', ')}) but no formula that gives their numbers` };
  }
  try {
    const canonical = ligandShares(probe, 'analyses');
    const label = ligandLabel(canonical);
    return shares ? { shares, label, canonical } : { ligand: probe.ligand as string, label, canonical };
  } catch (error) {
    if (isFieldgapError(error)) return undefined;
    throw error;
  }
}
