/**
 * The plain JSON shapes the results library takes and returns. Nothing here
 * holds a class or a Buffer, except the original file, which only travels
 * through `add` and `getOriginal`.
 *
 * Energies (tenDq, b, c and their uncertainties) are cm-1, temperature is
 * kelvin, dates are ISO 8601 (timestamps in UTC with milliseconds,
 * measurement dates as YYYY-MM-DD).
 */

import type { AnalyzeOptions, AnalyzeResult } from '../analysis.js';

/**
 * The analysis options and result are stored as the JSON the pipeline takes
 * and returns: the core's AnalyzeOptions and AnalyzeResult (src/analysis.ts),
 * read back as those types. A record saved by an older fieldgap may lack a
 * field added since; the readers that must cope say so (summary.ts).
 */
export type StoredOptions = AnalyzeOptions;
export type StoredResult = AnalyzeResult;

/** What a chemist says about the sample; only `sample` is required. */
export interface AnalysisDetails {
  /** The sample name shown in lists, e.g. "CrCl3 in water, batch 2". */
  sample: string;
  /** The complex formula as written by the user, e.g. "[Cr(H2O)6]Cl3". */
  formula?: string;
  /**
   * The metal ion as its canonical label ("Cr(III)" is stored as "Cr3+").
   * When not given, taken from the fit or the options.
   */
  ion?: string;
  /** The ligands, in the user's spelling, e.g. ["H2O"]; a homoleptic complex has one. */
  ligands?: string[];
  solvent?: string;
  /** Kelvin. */
  temperature?: number;
  /** Date of the measurement, YYYY-MM-DD. */
  measuredOn?: string;
  note?: string;
}

/** Everything `add` needs: the details, the original file and one analysis of it. */
export interface NewAnalysis extends AnalysisDetails {
  /** The user's file name (base name only is kept), e.g. "cr-water.csv". */
  fileName: string;
  /** The original file, stored byte for byte. */
  content: Uint8Array;
  options: StoredOptions;
  result: StoredResult;
  /** The fieldgap version that made `result`; defaults to this package's version. */
  toolVersion?: string;
}

/**
 * The numbers of one fit that lists, search, export and series need, read
 * from `result.fit` when the analysis is stored. null when the analysis has
 * no fit or the fit lacks that number.
 */
export interface FitSummary {
  tenDq: number | null;
  tenDqSd: number | null;
  b: number | null;
  bSd: number | null;
  c: number | null;
  beta: number | null;
  /** Standard deviation of beta: sd(B) / free-ion B. */
  betaSd: number | null;
  spinState: string | null;
  rmsResidual: number | null;
  status: string | null;
}

/** Where the stored original came from; its bytes come from `getOriginal`. */
export interface OriginalInfo {
  fileName: string;
  /** Lower-case hex SHA-256 of the bytes. */
  sha256: string;
  /** Bytes. */
  size: number;
}

export interface OriginalFile extends OriginalInfo {
  bytes: Buffer;
}

/** One analysis of the stored original. Refits add revisions; none is ever overwritten. */
export interface RevisionInfo {
  /** 1 for the analysis made when the record was added, then 2, 3, ... per refit. */
  revision: number;
  createdAt: string;
  toolVersion: string;
  options: StoredOptions;
  summary: FitSummary;
}

/** A row of a list: the details and the current fit summary, without the full result. */
export interface AnalysisSummary extends AnalysisDetails {
  id: number;
  createdAt: string;
  /** When the details were last edited or the record last refitted. */
  updatedAt: string;
  original: OriginalInfo;
  /** The current (latest) revision number. */
  revision: number;
  toolVersion: string;
  summary: FitSummary;
  /** The user who added the record and their group, where users exist; absent for a record of the single-user mode. */
  owner?: string;
  group?: string;
}

/** The fit numbers a ligand series reads (src/library/series.ts), cm-1 and β as in FitSummary. */
export type SeriesFit = Pick<FitSummary, 'tenDq' | 'tenDqSd' | 'b' | 'beta' | 'betaSd'>;

/** What a ligand series needs of one record, and no more: a narrow row for libraries of 100 000 records. */
export interface FitRow extends Pick<AnalysisDetails, 'sample' | 'formula' | 'ligands' | 'ion'> {
  id: number;
  summary: SeriesFit;
}

/**
 * What a ligand series reads of every record of one ion, column by column
 * (index i of each array is one record), newest first: the shape the
 * engines return in one aggregated row (library.seriesColumns), read by
 * src/library/series-columns.ts. `ligands` is each record's stored JSON text
 * (a few distinct texts repeat over thousands of records); energies in cm-1.
 */
export interface SeriesColumns {
  id: number[];
  sample: string[];
  formula: (string | null)[];
  ligands: string[];
  tenDq: (number | null)[];
  tenDqSd: (number | null)[];
  beta: (number | null)[];
  betaSd: (number | null)[];
}

/** A full record: the summary plus the current options and result, and the revision history. */
export interface AnalysisRecord extends AnalysisSummary {
  options: StoredOptions;
  result: StoredResult;
  /** Every revision, oldest first; the last is the current one. */
  revisions: RevisionInfo[];
}

/**
 * A change to a record. A details field given as null is cleared (`sample`
 * cannot be). `options` and `result` come together: they add a new revision
 * (a refit) and leave the earlier ones in the history.
 */
export interface AnalysisPatch {
  sample?: string;
  formula?: string | null;
  ion?: string | null;
  ligands?: string[] | null;
  solvent?: string | null;
  temperature?: number | null;
  measuredOn?: string | null;
  note?: string | null;
  options?: StoredOptions;
  result?: StoredResult;
  toolVersion?: string;
}

export interface ListOptions {
  /** Words that must each occur (case-insensitive) in the sample, formula, ion, ligands, solvent or note. */
  query?: string;
  /** Only this ion, in any spelling src/chemistry reads: "Cr3+", "Cr(III)", "cr 3+". */
  ion?: string;
  /** Only records whose original has this SHA-256 (lower-case hex). */
  sha256?: string;
  /** Page size, 1 to 1000; default 50. */
  limit?: number;
  /** Rows to skip, default 0. */
  offset?: number;
}

export interface ListPage {
  /** Newest first (last added first). */
  analyses: AnalysisSummary[];
  /** How many records match, over all pages. */
  total: number;
  limit: number;
  offset: number;
}
