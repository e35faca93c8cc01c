/**
 * The results table of analyses, one row per spectrum: the CSV that
 * `analyze --csv` writes for a batch, that `library export --csv FILE
 * --columns results` writes for stored analyses, and that the page's
 * "results CSV" download gives. One function makes every row, so the same
 * spectrum gives the same bytes from all three.
 *
 * One number per cell: energies in cm-1 to 0.1 cm-1, beta to 0.001, each
 * uncertainty (one standard deviation) in a column of its own; empty cells
 * where a value is undetermined or the spectrum failed. spinState is the
 * value itself ('high-spin', 'low-spin', 'no-choice'). Rows are separated by
 * CRLF, the text ends with one LF (as the batch CSV always has).
 */
import type { FitResult } from '../fit/types.js';
import { csvLine } from './csv.js';

/** The columns, in order (the header line also marks the file as fieldgap's). */
export const RESULTS_CSV_COLUMNS = ['file', 'ion', 'tenDq', 'tenDqSd', 'b', 'bSd', 'beta', 'spinState', 'rms', 'warnings'] as const;

export type ResultsCsvRow = Record<(typeof RESULTS_CSV_COLUMNS)[number], string | number>;

/** Between rows. */
export const RESULTS_CSV_NEWLINE = '\r\n';
/** After the last row. */
export const RESULTS_CSV_END = '\n';

/** The fields of a fit the table shows (the page's fit may lack `ion` or `rmsResidual`: an older service's answer). */
export type ResultsCsvFit = Pick<FitResult, 'd' | 'tenDq' | 'b' | 'beta' | 'spinState'> & {
  ion?: string | null;
  rmsResidual: number | null;
  uncertainty: Pick<FitResult['uncertainty'], 'tenDq' | 'b'>;
};

/** What one row is made from: the analysis's fit, or why it failed. */
export interface ResultsCsvInput {
  /** The file as named in the batch (a multi-column file's column: "path#2 (name)"). */
  label: string;
  fit: ResultsCsvFit | null;
  /** The analysis's warnings (spectrum and "fit: " ones), in order. */
  warnings: readonly string[];
  /** Why the spectrum failed, when it did (then `fit` is null). */
  error?: { path: string; message: string };
}

/** The row's last cell: the warnings, or why the spectrum failed. */
export function resultsWarningsCell(input: Pick<ResultsCsvInput, 'warnings' | 'error'>): string {
  const { error } = input;
  return error ? `FAILED: ${error.path ? `${error.path}: ` : ''}${error.message}` : input.warnings.join('; ');
}

function value(v: number | null | undefined, digits = 1): number | '' {
  return v === null || v === undefined || !Number.isFinite(v) ? '' : Number(v.toFixed(digits));
}

export function resultsCsvRow(input: ResultsCsvInput): ResultsCsvRow {
  const f = input.error ? null : input.fit;
  return {
    file: input.label,
    ion: f ? (f.ion ?? `d${f.d}`) : '',
    tenDq: value(f?.tenDq),
    tenDqSd: value(f?.uncertainty.tenDq),
    b: value(f?.b),
    bSd: value(f?.uncertainty.b),
    beta: value(f?.beta, 3),
    spinState: f?.spinState ?? '',
    rms: value(f?.rmsResidual),
    warnings: resultsWarningsCell(input),
  };
}

/** One row as a CSV line (no line end). */
export function resultsCsvLine(row: ResultsCsvRow): string {
  return csvLine(RESULTS_CSV_COLUMNS.map((c) => row[c]));
}

/** The whole table: the header line, each row after a CRLF, a final LF. */
export function resultsCsv(inputs: readonly ResultsCsvInput[]): string {
  const lines = [csvLine(RESULTS_CSV_COLUMNS), ...inputs.map((i) => resultsCsvLine(resultsCsvRow(i)))];
  return `${lines.join(RESULTS_CSV_NEWLINE)}${RESULTS_CSV_END}`;
}
