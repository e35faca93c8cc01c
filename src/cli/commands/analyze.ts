import Papa from 'papaparse';
import { analyzeSpectrum, listSpectra, type AnalyzeOptions, type AnalyzeResult } from '../../analysis.js';
import { FieldgapError, isFieldgapError } from '../../errors.js';
import { ANALYSIS_OPTIONS, analysisOptionsFrom } from '../analysis-options.js';
import type { Command, CliIo } from '../command.js';
import { expandInputPaths, readInputFile } from '../files.js';
import { splitJsonOption } from '../json-flag.js';
import { parseCommandArgs } from '../options.js';
import { inputsApartFromOutputs, writeOutputFile, type OutputFile } from '../output-guard.js';
import { createProgress } from '../progress.js';
import { formatAnalysisReport } from './analyze-report.js';

const USAGE = `Usage: fieldgap analyze FILES-or-FOLDERS... (--ion ION | --d N) [options]

Finds the bands of each UV-vis-NIR spectrum, separates d-d from charge-transfer
bands, and fits 10Dq, Racah B and C to the d-d bands.

  --ion ION           metal ion: Cr3+, Cr(III), Co2+ ...
  --d N               d-electron count 1-9 (instead of --ion; then no beta)
  --geometry G        octahedral (default) or tetrahedral
  --conc M            concentration, mol/L (bands get epsilon, L mol-1 cm-1)
  --path CM           path length, cm (default 1)
  --x-unit U          x unit when the file does not say: nm, cm-1, eV, um
  --column N|NAME     which y column of a multi-column file (default: the first;
                      in a batch run, every column)
  --c-over-b R        fix C/B (default: the free ion's C0/B0, else 4.5)
  --c C               fix Racah C, cm-1
  --free-c            fit C as well (needs three d-d bands)
  --formula F         the complex, e.g. "[Co(H2O)6]2+": ligand priors for the
                      assignment (10Dq, beta); the ion and a geometry guess when
                      --ion and --geometry are not given
  --ligands L         ligands for the priors, e.g. H2O or "NH3,Cl"
  --json              print the full result as JSON (one file), or all results
  --json FILE.json    write all results to FILE.json (batch)
  --csv FILE          write the one-row-per-spectrum summary to FILE (batch):
                      one number per cell, energies in cm-1, each
                      uncertainty (1 sigma) in its own column

A folder contributes every spectrum file inside it (.csv .txt .tsv .dat .asc
.prn .jdx .dx .jcamp). Files are read, never changed. Exit code: 0 all went
well; 1 some spectra in a batch failed (their rows say why); 2 bad input.`;

const OPTIONS = {
  ...ANALYSIS_OPTIONS,
  formula: { type: 'string' },
  ligands: { type: 'string' },
  csv: { type: 'string' },
  curves: { type: 'boolean' },
} as const;

/** The --csv summary's columns, in order (its header line also marks the file as ours). */
const CSV_COLUMNS = ['file', 'ion', 'tenDq', 'tenDqSd', 'b', 'bSd', 'beta', 'spinState', 'rms', 'warnings'] as const;

/** One spectrum of a batch: a file, or one column of a multi-column file. */
interface Item {
  file: string;
  column: number | string | undefined;
  label: string;
  /** The file's bytes when listing its columns already read them (read once, shared by its columns). */
  content?: Uint8Array;
}

interface Outcome {
  item: Item;
  result?: AnalyzeResult;
  error?: { code: string; message: string; path: string };
}

export const analyzeCommand: Command = {
  name: 'analyze',
  summary: 'find, deconvolve and assign the bands of spectrum files; fit 10Dq, B, C',
  usage: USAGE,
  async run(argv, io) {
    const json = splitJsonOption(argv);
    const { values, positionals } = parseCommandArgs(json.argv, OPTIONS, true);
    if (positionals.length === 0) throw new FieldgapError('invalid-argument', 'give at least one spectrum file or folder', 'FILES');
    const options = analysisOptions(values);
    const csvOutput: OutputFile | undefined = values.csv === undefined ? undefined : { option: '--csv', path: values.csv, firstLine: CSV_COLUMNS.join(',') };
    const jsonOutput: OutputFile | undefined = json.jsonFile === undefined ? undefined : { option: '--json', path: json.jsonFile };
    const outputs = [csvOutput, jsonOutput].filter((o) => o !== undefined);
    const files = inputsApartFromOutputs(expandInputPaths(positionals, io.cwd), outputs, io.cwd);
    const expand = files.length > 1 || values.column === undefined;

    const onlyFile = files.length === 1 ? itemsOf(files[0]!, options, io, expand) : undefined;
    if (onlyFile !== undefined && outputs.length === 0) {
      const items = onlyFile;
      if (items.length === 1) {
        const item = items[0]!;
        const result = analyzeItem(item, options, io, true);
        io.stdout(json.jsonFlag ? `${JSON.stringify(result.result, null, 2)}\n` : formatAnalysisReport(item.label, result.result!));
        return 0;
      }
    }

    // File by file, so each file is read once and no more than one file's bytes are held at a time.
    const progress = createProgress(files.length, io.isTty, io.stderr);
    const outcomes: Outcome[] = [];
    for (const file of files) {
      progress.tick(file);
      for (const item of onlyFile ?? itemsOf(file, options, io, expand)) outcomes.push(analyzeItem(item, options, io, false));
    }
    progress.done();

    const rows = outcomes.map(summaryRow);
    if (csvOutput !== undefined) {
      writeOutputFile(csvOutput, `${Papa.unparse(outcomes.map(csvRow), { columns: [...CSV_COLUMNS] })}\n`, io.cwd);
    }
    const resultsJson = jsonOutput !== undefined || json.jsonFlag ? `${JSON.stringify({ results: outcomes.map(outcomeJson) }, null, 2)}\n` : '';
    if (jsonOutput !== undefined) writeOutputFile(jsonOutput, resultsJson, io.cwd);
    if (json.jsonFlag) io.stdout(resultsJson);
    else io.stdout(summaryTable(rows));
    const failed = outcomes.filter((o) => o.error).length;
    if (!json.jsonFlag) {
      const wrote = outputs.map((o) => ` Wrote ${o.path}.`).join('');
      io.stdout(`\n${outcomes.length - failed} of ${outcomes.length} spectra analysed${failed ? `, ${failed} failed` : ''}.${wrote}\n`);
    }
    return failed > 0 ? 1 : 0;
  },
};

function analysisOptions(values: Parameters<typeof analysisOptionsFrom>[0] & { curves?: boolean; formula?: string; ligands?: string }): AnalyzeOptions {
  const options = analysisOptionsFrom(values);
  if (values.formula !== undefined) options.formula = values.formula;
  if (values.ligands !== undefined) options.ligands = values.ligands;
  if (options.ion === undefined && options.d === undefined && options.formula === undefined) {
    throw new FieldgapError('invalid-argument', '--ion is required (or --d N): the metal ion, e.g. --ion Cr3+', '--ion');
  }
  if (values.curves) options.curves = true;
  return options;
}

/**
 * A file is one item; in a batch with no --column, a multi-column file is one
 * item per column. A file that cannot even be listed stays one item, so its
 * error shows in its row.
 */
function itemsOf(file: string, options: AnalyzeOptions, io: CliIo, expandColumns: boolean): Item[] {
  if (options.column !== undefined || !expandColumns) return [{ file, column: options.column, label: file }];
  try {
    const content = readInputFile(file, io.cwd);
    const spectra = listSpectra(content, { fileName: file, ...(options.xUnit && { xUnit: options.xUnit }) });
    if (spectra.length <= 1) return [{ file, column: undefined, label: file, content }];
    return spectra.map((s) => ({ file, column: s.column, label: `${file}#${s.column} (${s.name})`, content }));
  } catch {
    return [{ file, column: undefined, label: file }];
  }
}

/** Analyses one item; a single-item run lets its error through (exit 2), a batch keeps it in the row. */
function analyzeItem(item: Item, options: AnalyzeOptions, io: CliIo, single: boolean): Outcome {
  try {
    const content = item.content ?? readInputFile(item.file, io.cwd);
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

interface SummaryRow {
  file: string;
  ion: string;
  tenDq: string;
  b: string;
  beta: string;
  spinState: string;
  rms: string;
  warnings: string;
}

/** The row's last cell: the warnings, or why the spectrum failed. */
function warningsCell({ result, error }: Outcome): string {
  return result ? result.warnings.join('; ') : `FAILED: ${error!.path ? `${error!.path}: ` : ''}${error!.message}`;
}

function summaryRow(outcome: Outcome): SummaryRow {
  const { item, result } = outcome;
  if (!result) return { file: item.label, ion: '', tenDq: '', b: '', beta: '', spinState: '', rms: '', warnings: warningsCell(outcome) };
  const f = result.fit;
  const pm = (v: number | null, u: number | null | undefined, digits = 0) => (v === null ? '' : u ? `${v.toFixed(digits)} ± ${u.toFixed(digits)}` : v.toFixed(digits));
  return {
    file: item.label,
    ion: f.ion ?? `d${f.d}`,
    tenDq: pm(f.tenDq, f.uncertainty.tenDq),
    b: pm(f.b, f.uncertainty.b),
    beta: f.beta === null ? '' : f.beta.toFixed(2),
    spinState: f.spinState,
    rms: f.rmsResidual.toFixed(0),
    warnings: warningsCell(outcome),
  };
}

/**
 * The summary as a spreadsheet reads it: one number per cell (energies in
 * cm-1, each uncertainty in a column of its own), empty cells where a value
 * is undetermined or the spectrum failed.
 */
function csvRow(outcome: Outcome): Record<(typeof CSV_COLUMNS)[number], string | number> {
  const { item, result } = outcome;
  const f = result?.fit;
  const value = (v: number | null | undefined, digits = 1) => (v === null || v === undefined ? '' : Number(v.toFixed(digits)));
  return {
    file: item.label,
    ion: f ? (f.ion ?? `d${f.d}`) : '',
    tenDq: value(f?.tenDq),
    tenDqSd: value(f?.uncertainty.tenDq),
    b: value(f?.b),
    bSd: value(f?.uncertainty.b),
    beta: value(f?.beta, 3),
    spinState: f?.spinState ?? '',
    rms: value(f?.rmsResidual),
    warnings: warningsCell(outcome),
  };
}

function outcomeJson({ item, result, error }: Outcome) {
  return { file: item.file, ...(item.column !== undefined && { column: item.column }), ...(result ?? {}), ...(error && { error }) };
}

function summaryTable(rows: SummaryRow[]): string {
  const head: SummaryRow = { file: 'file', ion: 'ion', tenDq: '10Dq / cm-1', b: 'B / cm-1', beta: 'beta', spinState: 'spin state', rms: 'rms / cm-1', warnings: 'warnings' };
  const keys = Object.keys(head) as (keyof SummaryRow)[];
  const all = [head, ...rows].map((r) => ({ ...r, warnings: r.warnings.length > 70 ? `${r.warnings.slice(0, 69)}…` : r.warnings }));
  const widths = keys.map((k) => Math.max(...all.map((r) => r[k].length)));
  return `${all.map((r) => keys.map((k, i) => r[k].padEnd(widths[i]!)).join('  ').trimEnd()).join('\n')}\n`;
}
