/**
 * The one CSV writer of fieldgap: every CSV the CLI, the service and the page
 * give goes through here. Fields are quoted as RFC 4180 asks (papaparse's
 * unparse: a cell with a comma, quote or line break is quoted, quotes
 * doubled); a text cell a spreadsheet would run as a formula (first
 * character = + - @, tab or carriage return) gets a leading "'" (papaparse's
 * escapeFormulae). Numbers are written as JavaScript prints them (a negative
 * number is a number, not a formula). null and undefined are empty cells.
 */
import Papa from 'papaparse';

export type CsvCell = string | number | boolean | null | undefined;

export interface CsvOptions {
  /** Between rows. Default "\r\n" (RFC 4180). */
  newline?: '\r\n' | '\n';
  /** After the last row. Default: the `newline`. */
  end?: string;
  /** Whether a cell is quoted even when it need not be (column index, cell). Default: only when needed. */
  quote?: (value: CsvCell, column: number) => boolean;
}

/** One row as CSV text, without a line end. */
export function csvLine(cells: readonly CsvCell[], options: Pick<CsvOptions, 'quote'> = {}): string {
  const { quote } = options;
  const config: Papa.UnparseConfig = { header: false, escapeFormulae: true, newline: '\n' };
  if (quote !== undefined) config.quotes = (value: unknown, column: number) => quote(value as CsvCell, column);
  // Papa writes an empty row as "" (no cells): keep it an empty line.
  return cells.length === 0 ? '' : Papa.unparse([cells.map((c) => (c === undefined ? null : c))], config);
}

/** A header row (when given) and the rows, each line ended by `newline`, the last by `end`. */
export function csvText(header: readonly CsvCell[] | null, rows: readonly (readonly CsvCell[])[], options: CsvOptions = {}): string {
  const { newline = '\r\n', end = newline } = options;
  const lines = (header === null ? rows : [header, ...rows]).map((r) => csvLine(r, options));
  return lines.length === 0 ? '' : `${lines.join(newline)}${end}`;
}
