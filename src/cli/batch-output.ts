/**
 * The outputs of an `analyze` batch, written row by row as files finish (in
 * the order of the file list), so a batch of any size holds only the rows in
 * flight: the summary table on stdout, the --csv summary, and the JSON
 * results on stdout or in the --json file. The CSV and JSON texts are byte
 * for byte what writing all rows at the end would give.
 */
import { closeSync, openSync, writeSync } from 'node:fs';
import { resolve } from 'node:path';
import { FieldgapError } from '../errors.js';
import type { BatchRow, SummaryRow } from './batch-rows.js';
import { csvLine } from '../report/csv.js';
import { RESULTS_CSV_COLUMNS, RESULTS_CSV_END, RESULTS_CSV_NEWLINE, resultsCsvLine } from '../report/results-csv.js';
import { cellWidth, textTableLine } from '../report/text-table.js';

/** Something rows are written to, one after the other. */
export interface RowSink {
  row(row: BatchRow): void;
  /** Writes the closing text (if any) and releases the file. */
  end(): void;
}

const TABLE_HEAD: SummaryRow = {
  file: 'file', ion: 'ion', tenDq: '10Dq / cm-1', b: 'B / cm-1', beta: 'beta', spinState: 'spin state', rms: 'rms / cm-1', warnings: 'warnings',
};
const TABLE_KEYS = Object.keys(TABLE_HEAD) as (keyof SummaryRow)[];

/**
 * Column widths fixed before the first row, since rows are printed as they
 * come: the file column as wide as the longest path listed, the others as
 * wide as their heading or their usual widest value ("Cr3+", "17000 ± 120",
 * "680 ± 41", "one possible"). A longer value widens its own line only.
 */
export function tableWidths(labels: readonly string[]): number[] {
  const usual: Partial<Record<keyof SummaryRow, number>> = { ion: 4, tenDq: 11, b: 8, spinState: 12 };
  let file = TABLE_HEAD.file.length;
  for (const label of labels) file = Math.max(file, cellWidth(label));
  return TABLE_KEYS.map((k) => (k === 'file' ? file : Math.max(TABLE_HEAD[k].length, usual[k] ?? 0)));
}

/**
 * One row of the summary table (long warnings cut to 70 characters). A file
 * label wider than its column (a multi-column file's "path#2 (name)", known
 * only once the file is read) stands on a line of its own, so the values
 * below it stay under their headings.
 */
export function tableLine(row: SummaryRow, widths: readonly number[]): string {
  const cells = { ...row, warnings: row.warnings.length > 70 ? `${row.warnings.slice(0, 69)}…` : row.warnings };
  const own = cellWidth(cells.file) > widths[0]! ? `${cells.file}\n` : '';
  if (own !== '') cells.file = '';
  return `${own}${textTableLine(TABLE_KEYS.map((k) => cells[k]), widths)}\n`;
}

/** The summary table, its heading first. */
export function tableSink(write: (text: string) => void, labels: readonly string[]): RowSink {
  const widths = tableWidths(labels);
  write(tableLine(TABLE_HEAD, widths));
  return { row: (row) => write(tableLine(row.summary, widths)), end() {} };
}

/**
 * The --csv summary (src/report/results-csv.ts) written row by row: the
 * heading, then each row after a CRLF, and a final LF. The one CSV writer
 * quotes field by field, so row by row gives the bytes of the whole.
 */
export function csvSink(write: (text: string) => void): RowSink {
  write(csvLine(RESULTS_CSV_COLUMNS));
  return {
    row: (row) => write(`${RESULTS_CSV_NEWLINE}${resultsCsvLine(row.csv)}`),
    end: () => write(RESULTS_CSV_END),
  };
}

/** `JSON.stringify({ results: [...] }, null, 2)` and a final LF, one entry at a time. */
export function jsonSink(write: (text: string) => void): RowSink {
  let first = true;
  write('{\n  "results": [');
  return {
    row(row) {
      write(`${first ? '\n' : ',\n'}${row.json ?? ''}`);
      first = false;
    },
    end: () => write(first ? ']\n}\n' : '\n  ]\n}\n'),
  };
}

function writeError(option: string, path: string, error: unknown): FieldgapError {
  const code = (error as NodeJS.ErrnoException).code;
  const why = code === 'EACCES' || code === 'EPERM' ? 'permission denied' : code === 'ENOSPC' ? 'the disk is full' : `cannot be written (${code ?? 'unknown error'})`;
  return new FieldgapError(code === 'EACCES' || code === 'EPERM' ? 'permission-denied' : 'invalid-argument', `${path}: ${why}`, option);
}

/**
 * A file opened (created or emptied) for a batch output, written through as
 * rows come; errors name the option, as writeOutputFile's do.
 */
export function openOutputStream(output: { option: string; path: string }, cwd: string): { write: (text: string) => void; close: () => void } {
  let fd: number;
  try {
    fd = openSync(resolve(cwd, output.path), 'w');
  } catch (error) {
    throw writeError(output.option, output.path, error);
  }
  return {
    write(text) {
      try {
        writeSync(fd, text);
      } catch (error) {
        throw writeError(output.option, output.path, error);
      }
    },
    close: () => closeSync(fd),
  };
}
