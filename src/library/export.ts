import { csvText } from '../report/csv.js';
import { resultsCsv, type ResultsCsvInput } from '../report/results-csv.js';
import type { AnalysisRecord, AnalysisSummary } from './types.js';

/**
 * The library as a table for spreadsheets: one row per record, its current
 * revision. Energies in cm-1 rounded to 0.1 cm-1, beta to 0.0001 (the
 * uncertainties are far larger; the full numbers are in the JSON export).
 * Text cells that a spreadsheet would run as a formula (=, +, -, @ first)
 * are escaped with a leading quote.
 */
export const CSV_COLUMNS = [
  'id', 'sample', 'formula', 'ion', 'ligands', 'solvent', 'temperature_K', 'measured_on',
  'tenDq_cm-1', 'tenDq_sd_cm-1', 'B_cm-1', 'B_sd_cm-1', 'C_cm-1', 'beta', 'beta_sd',
  'spin_state', 'rms_cm-1', 'fit_status', 'revision', 'file_name', 'sha256', 'tool_version', 'saved_at',
] as const;

type CsvRow = Record<(typeof CSV_COLUMNS)[number], string | number | null>;

export function libraryCsvRow(record: AnalysisSummary): CsvRow {
  const s = record.summary;
  return {
    id: record.id,
    sample: record.sample,
    formula: record.formula ?? null,
    ion: record.ion ?? null,
    ligands: (record.ligands ?? []).join('; '),
    solvent: record.solvent ?? null,
    temperature_K: record.temperature ?? null,
    measured_on: record.measuredOn ?? null,
    'tenDq_cm-1': round(s.tenDq, 1),
    'tenDq_sd_cm-1': round(s.tenDqSd, 1),
    'B_cm-1': round(s.b, 1),
    'B_sd_cm-1': round(s.bSd, 1),
    'C_cm-1': round(s.c, 1),
    beta: round(s.beta, 4),
    beta_sd: round(s.betaSd, 4),
    spin_state: s.spinState,
    'rms_cm-1': round(s.rmsResidual, 1),
    fit_status: s.status,
    revision: record.revision,
    file_name: record.original.fileName,
    sha256: record.original.sha256,
    tool_version: record.toolVersion,
    saved_at: record.createdAt,
  };
}

/** CSV text (RFC 4180 quoting, CRLF line ends, a header row, every line ended) of the records. */
export function libraryCsv(records: AnalysisSummary[]): string {
  return csvText(CSV_COLUMNS, records.map(csvCells), { newline: '\r\n' });
}

/** What the results table (src/report/results-csv.ts) takes of a stored record: its file name, fit and warnings. */
export function resultsCsvInputOf(record: AnalysisRecord): ResultsCsvInput {
  // A record saved by an older fieldgap may lack the fit or the warnings.
  return { label: record.original.fileName, fit: record.result.fit ?? null, warnings: record.result.warnings ?? [] };
}

/**
 * The records as the results table, the columns of `analyze --csv`: a
 * spectrum stored in the library gives the bytes its batch row gave.
 */
export function libraryResultsCsv(records: readonly AnalysisRecord[]): string {
  return resultsCsv(records.map(resultsCsvInputOf));
}

/**
 * The same CSV as libraryCsv, in pieces: the header line, then the rows of
 * each page as it comes (an export of 100 000 records never holds them all).
 * Joined, the pieces are libraryCsv of all the records.
 */
export async function* libraryCsvChunks(pages: AsyncIterable<AnalysisSummary[]>): AsyncGenerator<string> {
  yield CSV_HEADER;
  for await (const page of pages) {
    if (page.length === 0) continue;
    yield csvText(null, page.map(csvCells), { newline: '\r\n' });
  }
}

/** The header line, with its line end. */
const CSV_HEADER = csvText(CSV_COLUMNS, [], { newline: '\r\n' });

function csvCells(record: AnalysisSummary): (string | number | null)[] {
  const row = libraryCsvRow(record);
  return CSV_COLUMNS.map((c) => row[c]);
}

function round(value: number | null, digits: number): number | null {
  if (value === null) return null;
  const scale = 10 ** digits;
  return Math.round(value * scale) / scale;
}
