/**
 * One file of an `analyze` batch, from its path to the finished text of its
 * rows: the summary table's cells, the --csv summary's cells and, when asked
 * for, its entry of the JSON results. Whatever runs it (the main thread for a
 * small batch, a worker thread of batch-pool.ts for a large one) hands back
 * only these strings, so no analysis result outlives its file.
 */
import { analyzeSpectrum, listSpectra, type AnalyzeOptions, type AnalyzeResult } from '../analysis.js';
import { FieldgapError, isFieldgapError } from '../errors.js';
import { readInputFile } from './files.js';
import { formatPlusMinus } from '../report/plus-minus.js';
import { spinStateWords } from '../report/spin-state-wording.js';
import { RESULTS_CSV_COLUMNS, resultsCsvRow, resultsWarningsCell, type ResultsCsvRow } from '../report/results-csv.js';

/** The --csv summary's columns: the results table of src/report/results-csv.ts. */
export const CSV_COLUMNS = RESULTS_CSV_COLUMNS;

export type CsvRow = ResultsCsvRow;

/** One line of the summary table, as text cells. */
export interface SummaryRow {
  file: string;
  ion: string;
  tenDq: string;
  b: string;
  beta: string;
  spinState: string;
  rms: string;
  warnings: string;
}

/** One spectrum of a batch: a file, or one column of a multi-column file. */
export interface Item {
  file: string;
  column: number | string | undefined;
  label: string;
  /** The file's bytes when listing its columns already read them (read once, shared by its columns). */
  content?: Uint8Array;
}

export interface Outcome {
  item: Item;
  result?: AnalyzeResult;
  error?: { code: string; message: string; path: string };
}

/** A finished row of a batch: plain strings and numbers, cheap to pass between threads. */
export interface BatchRow {
  summary: SummaryRow;
  csv: CsvRow;
  /** The row's entry of `{ "results": [...] }`, indented as it sits there; only when JSON is asked for. */
  json?: string;
  failed: boolean;
}

/** What one file of a batch needs; plain data, so it can be sent to a worker thread. */
export interface BatchFileTask {
  file: string;
  cwd: string;
  options: AnalyzeOptions;
  /** One item per column of a multi-column file (batch runs without --column). */
  expandColumns: boolean;
  /** Whether to serialise each outcome for the JSON results. */
  json: boolean;
}

/**
 * A file is one item; in a batch with no --column, a multi-column file is one
 * item per column. A file that cannot even be listed stays one item, so its
 * error shows in its row.
 */
export function itemsOf(file: string, options: AnalyzeOptions, cwd: string, expandColumns: boolean): Item[] {
  if (options.column !== undefined || !expandColumns) return [{ file, column: options.column, label: file }];
  try {
    return columnItems(file, readInputFile(file, cwd), options);
  } catch (error) {
    // A file that cannot be read or parsed is one failed row (analyzeItem reports why); anything else is a bug and surfaces.
    if (!isFieldgapError(error)) throw error;
    return [{ file, column: undefined, label: file }];
  }
}

/** A file's bytes as items: one, or one per column when it holds several spectra (throws when it cannot be parsed). */
function columnItems(file: string, content: Uint8Array, options: AnalyzeOptions): Item[] {
  const spectra = listSpectra(content, { fileName: file, ...(options.xUnit && { xUnit: options.xUnit }) });
  if (spectra.length <= 1) return [{ file, column: undefined, label: file, content }];
  return spectra.map((s) => ({ file, column: s.column, label: `${file}#${s.column} (${s.name})`, content }));
}

/** Analyses one item; a single-item run lets its error through (exit 2), a batch keeps it in the row. */
export function analyzeItem(item: Item, options: AnalyzeOptions, cwd: string, single: boolean): Outcome {
  try {
    const content = item.content ?? readInputFile(item.file, cwd);
    const result = analyzeSpectrum(content, { ...options, fileName: item.file, ...(item.column !== undefined && { column: item.column }) });
    return { item, result };
  } catch (error) {
    if (single) {
      if (isFieldgapError(error) && !error.path.startsWith(item.file)) {
        throw new FieldgapError(error.code, `${error.path ? `${error.path}: ` : ''}${error.message}`, item.file);
      }
      throw error;
    }
    const e = isFieldgapError(error) ? error : new FieldgapError('internal', error instanceof Error ? error.message : String(error));
    return { item, error: { code: e.code, message: e.message, path: e.path } };
  }
}

/** The row's last cell: the warnings, or why the spectrum failed. */
function warningsCell({ result, error }: Outcome): string {
  return resultsWarningsCell(result ? { warnings: result.warnings } : { warnings: [], error: error! });
}

export function summaryRow(outcome: Outcome): SummaryRow {
  const { item, result } = outcome;
  if (!result) return { file: item.label, ion: '', tenDq: '', b: '', beta: '', spinState: '', rms: '', warnings: warningsCell(outcome) };
  const f = result.fit;
  const pm = (v: number | null, u: number | null | undefined) => (v === null ? '' : formatPlusMinus(v, u));
  return {
    file: item.label,
    ion: f.ion ?? `d${f.d}`,
    tenDq: pm(f.tenDq, f.uncertainty.tenDq),
    b: pm(f.b, f.uncertainty.b),
    beta: f.beta === null ? '' : f.beta.toFixed(2),
    // The table is read by people: the page's words for 'no-choice' (the --csv summary keeps the value itself).
    spinState: f.spinState === 'no-choice' ? spinStateWords(f.spinState) : f.spinState,
    rms: f.rmsResidual.toFixed(0),
    warnings: warningsCell(outcome),
  };
}

/**
 * The summary as a spreadsheet reads it: one number per cell (energies in
 * cm-1, each uncertainty in a column of its own), empty cells where a value
 * is undetermined or the spectrum failed.
 */
export function csvRow(outcome: Outcome): CsvRow {
  const { item, result, error } = outcome;
  return resultsCsvRow(result ? { label: item.label, fit: result.fit, warnings: result.warnings } : { label: item.label, fit: null, warnings: [], error: error! });
}

export function outcomeJson({ item, result, error }: Outcome) {
  return { file: item.file, ...(item.column !== undefined && { column: item.column }), ...(result ?? {}), ...(error && { error }) };
}

/**
 * An outcome as it sits inside `JSON.stringify({ results: [...] }, null, 2)`:
 * the same text indented by two levels (4 spaces). JSON.stringify escapes
 * line breaks inside strings, so every "\n" in its output is between tokens.
 */
export function outcomeJsonEntry(outcome: Outcome): string {
  return `    ${JSON.stringify(outcomeJson(outcome), null, 2).replaceAll('\n', '\n    ')}`;
}

/** A finished row from an outcome. */
function rowOf(outcome: Outcome, json: boolean): BatchRow {
  return {
    summary: summaryRow(outcome),
    csv: csvRow(outcome),
    ...(json && { json: outcomeJsonEntry(outcome) }),
    failed: outcome.error !== undefined,
  };
}

/** The finished rows of some items of a batch (never throws: a failure is its row). */
export function rowsOfItems(items: readonly Item[], options: AnalyzeOptions, cwd: string, json: boolean): BatchRow[] {
  return items.map((item) => rowOf(analyzeItem(item, options, cwd, false), json));
}

/**
 * The finished rows of one file of a batch (never throws: a failure is its
 * row); the same rows as rowsOfItems(itemsOf(...)). The usual file holds one
 * spectrum, so it is analysed as it stands, its text parsed once; only when
 * the analysis shows several spectra (result.spectrum.columns), or fails, is
 * the file listed and, if it holds several, analysed column by column.
 */
export function analyzeBatchFile(task: BatchFileTask): BatchRow[] {
  const { file, options, cwd, expandColumns, json } = task;
  if (options.column !== undefined || !expandColumns) return rowsOfItems(itemsOf(file, options, cwd, expandColumns), options, cwd, json);
  let content: Uint8Array;
  try {
    content = readInputFile(file, cwd);
  } catch (error) {
    if (!isFieldgapError(error)) throw error;
    return rowsOfItems([{ file, column: undefined, label: file }], options, cwd, json);
  }
  const whole: Item = { file, column: undefined, label: file, content };
  const outcome = analyzeItem(whole, options, cwd, false);
  if (outcome.result !== undefined && outcome.result.spectrum.columns === undefined) return [rowOf(outcome, json)];
  let items: Item[];
  try {
    items = columnItems(file, content, options);
  } catch (error) {
    if (!isFieldgapError(error)) throw error;
    items = [whole];
  }
  return items.length === 1 && outcome.result === undefined ? [rowOf(outcome, json)] : rowsOfItems(items, options, cwd, json);
}
