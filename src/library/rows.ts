import type { AnalysisDetails, AnalysisSummary, FitSummary, RevisionInfo, StoredOptions } from './types.js';

/**
 * The SQL rows the library reads and their mapping to the JSON records.
 * SQL NULL becomes an absent field in the details (so a record round-trips
 * through JSON unchanged) and null in the fit summary (a number that the fit
 * does not have is shown as such).
 */

/**
 * The columns of one list row: the analysis with its original's name, size
 * and hash, and its latest revision's number, version and fit (copies kept
 * in the analyses row since schema step 5, so a list reads one table).
 */
export const SUMMARY_COLUMNS = `
  a.id, a.created_at, a.updated_at, a.sample, a.formula, a.ion, a.ligands, a.solvent,
  a.temperature, a.measured_on, a.note, a.original_name, a.original_sha256, a.original_size,
  a.revision, a.tool_version, a.ten_dq, a.ten_dq_sd, a.b, a.b_sd, a.c, a.beta, a.beta_sd,
  a.spin_state, a.rms, a.status, a.owner, a.group_name`;

export const SUMMARY_SELECT = `SELECT ${SUMMARY_COLUMNS} FROM analyses a`;

export interface FitColumns {
  ten_dq: number | null;
  ten_dq_sd: number | null;
  b: number | null;
  b_sd: number | null;
  c: number | null;
  beta: number | null;
  beta_sd: number | null;
  spin_state: string | null;
  rms: number | null;
  status: string | null;
}

export interface SummaryRow extends FitColumns {
  id: number;
  created_at: string;
  updated_at: string;
  sample: string;
  formula: string | null;
  ion: string | null;
  ligands: string;
  solvent: string | null;
  temperature: number | null;
  measured_on: string | null;
  note: string | null;
  original_name: string;
  original_sha256: string;
  original_size: number;
  revision: number;
  tool_version: string;
  owner: string | null;
  group_name: string | null;
}

export interface RevisionRow extends FitColumns {
  revision: number;
  created_at: string;
  tool_version: string;
  options: string;
}

export function summaryFromRow(row: SummaryRow): AnalysisSummary {
  const details: AnalysisDetails = { sample: row.sample };
  if (row.formula !== null) details.formula = row.formula;
  if (row.ion !== null) details.ion = row.ion;
  const ligands = JSON.parse(row.ligands) as string[];
  if (ligands.length > 0) details.ligands = ligands;
  if (row.solvent !== null) details.solvent = row.solvent;
  if (row.temperature !== null) details.temperature = row.temperature;
  if (row.measured_on !== null) details.measuredOn = row.measured_on;
  if (row.note !== null) details.note = row.note;
  return {
    id: row.id,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    ...details,
    original: { fileName: row.original_name, sha256: row.original_sha256, size: row.original_size },
    revision: row.revision,
    toolVersion: row.tool_version,
    summary: fitFromColumns(row),
    // Who added it, where users exist (absent in the single-user mode).
    ...(row.owner !== null && { owner: row.owner }),
    ...(row.group_name !== null && { group: row.group_name }),
  };
}

export function revisionFromRow(row: RevisionRow): RevisionInfo {
  return {
    revision: row.revision,
    createdAt: row.created_at,
    toolVersion: row.tool_version,
    options: JSON.parse(row.options) as StoredOptions,
    summary: fitFromColumns(row),
  };
}

export function fitFromColumns(row: FitColumns): FitSummary {
  return {
    tenDq: row.ten_dq,
    tenDqSd: row.ten_dq_sd,
    b: row.b,
    bSd: row.b_sd,
    c: row.c,
    beta: row.beta,
    betaSd: row.beta_sd,
    spinState: row.spin_state,
    rmsResidual: row.rms,
    status: row.status,
  };
}

/** The named parameters of a revision insert, from a summary. */
export function fitParams(s: FitSummary): FitColumns {
  return {
    ten_dq: s.tenDq,
    ten_dq_sd: s.tenDqSd,
    b: s.b,
    b_sd: s.bSd,
    c: s.c,
    beta: s.beta,
    beta_sd: s.betaSd,
    spin_state: s.spinState,
    rms: s.rmsResidual,
    status: s.status,
  };
}

/** A word for SQL LIKE, matched anywhere, with LIKE's wildcards taken literally. */
export function likeWord(word: string): string {
  return `%${word.replace(/[\\%_]/g, (ch) => `\\${ch}`)}%`;
}
