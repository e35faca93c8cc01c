import type { AnalyzeOptions, AnalyzeResult } from '../../analysis.js';
import { FieldgapError, invalidArgument } from '../../errors.js';
import { ANALYSIS_OPTIONS, analysisOptionsFrom } from '../analysis-options.js';
import { csvSink, jsonSink, openOutputStream, tableSink, type RowSink } from '../batch-output.js';
import { createBatchRunner, inThreadRunner } from '../batch-pool.js';
import { runInOrder } from '../batch-run.js';
import { CSV_COLUMNS, analyzeItem, itemsOf, rowsOfItems, type BatchFileTask } from '../batch-rows.js';
import type { Command } from '../command.js';
import { expandInputPaths } from '../files.js';
import { splitJsonOption } from '../json-flag.js';
import { numberOption, parseCommandArgs } from '../options.js';
import { inputsApartFromOutputs, type OutputFile } from '../output-guard.js';
import { createProgress } from '../progress.js';
import { formatAnalysisReport, formatAnalysisWithoutFit } from './analyze-report.js';
import { NoLigandFieldFit, type AnalysisWithoutFit } from '../../analysis-no-fit.js';
import { csvLine } from '../../report/csv.js';

const USAGE = `Usage: fieldgap analyze FILES-or-FOLDERS... (--ion ION | --d N) [options]

Finds the bands of each UV-vis-NIR spectrum, separates d-d from charge-transfer
bands, and fits 10Dq, Racah B and C to the d-d bands.

  --ion ION           metal ion: Cr3+, Cr(III), Co2+ ...
  --d N               d-electron count 1-9 (instead of --ion; then no beta)
  --geometry G        octahedral (default) or tetrahedral (also Oh, Td)
  --conc M            concentration, mol/L (bands get epsilon, L mol-1 cm-1)
  --path CM           path length, cm (default 1)
  --x-unit U          x unit when the file does not say: nm, cm-1, eV, um
  --column N|NAME     which y column of a multi-column file (default: the first;
                      in a batch run, every column)
  --c-over-b R        fix C/B (default: the free ion's C0/B0, else 4.5)
  --c C               fix Racah C, cm-1
  --free-c            fit C as well (needs three d-d bands)
  --no-step-correction  leave detector change-over steps in the data (by
                      default a step is corrected only on overwhelming
                      evidence, and listed with its size)
  --formula F         the complex, e.g. "[Co(H2O)6]2+": ligand priors for the
                      assignment (10Dq, beta); the ion and a geometry guess when
                      --ion and --geometry are not given
  --ligands L         ligands for the priors, e.g. H2O or "NH3,Cl"
  --json              print the full result as JSON (one file), or all results
  --out FILE.json     write all results as JSON to FILE.json (batch); the old
                      spelling --json FILE.json still works (deprecated)
  --threads N         worker threads for a batch (default: one per core;
                      1: none). Rows are printed as files finish, in order.
  --csv FILE          write the one-row-per-spectrum summary to FILE (batch):
                      one number per cell, energies in cm-1, each
                      uncertainty (1 sigma) in its own column

A folder contributes every spectrum file inside it (.csv .txt .tsv .dat .asc
.prn .jdx .dx .jcamp). Files are read, never changed. Exit code: 0 all went
well; 1 some spectra in a batch failed (their rows say why); 2 bad input;
3 one spectrum analysed, its bands printed, but no ligand-field fit (a d0
or d10 ion, or only charge-transfer bands).`;

/** Exit code of a one-spectrum run whose bands were found but gave nothing to fit (see USAGE). */
const EXIT_NO_FIT = 3;

/** Options of a run on many files. */
const BATCH_OPTIONS = { threads: { type: 'string' } } as const;

const OPTIONS = {
  ...BATCH_OPTIONS,
  ...ANALYSIS_OPTIONS,
  formula: { type: 'string' },
  ligands: { type: 'string' },
  csv: { type: 'string' },
  out: { type: 'string' },
  curves: { type: 'boolean' },
  'no-step-correction': { type: 'boolean' },
} as const;

export const analyzeCommand: Command = {
  name: 'analyze',
  summary: 'find, deconvolve and assign the bands of spectrum files; fit 10Dq, B, C',
  usage: USAGE,
  async run(argv, io) {
    const json = splitJsonOption(argv);
    const { values, positionals } = parseCommandArgs(json.argv, OPTIONS, true);
    if (positionals.length === 0) throw new FieldgapError('invalid-argument', 'give at least one spectrum file or folder', 'FILES');
    const options = analysisOptions(values);
    const threads = numberOption('threads', values.threads, { min: 1, max: 1024, integer: true });
    const csvOutput: OutputFile | undefined = values.csv === undefined ? undefined : { option: '--csv', path: values.csv, firstLine: csvLine(CSV_COLUMNS) };
    if (json.jsonFile !== undefined) {
      if (values.out !== undefined) throw invalidArgument('--out', 'give the JSON output file once: --out FILE (--json FILE is its old spelling)');
      io.stderr('note: --json FILE is deprecated; write --out FILE (--json alone prints JSON)\n');
    }
    const jsonPath = values.out ?? json.jsonFile;
    const jsonOutput: OutputFile | undefined = jsonPath === undefined ? undefined : { option: values.out !== undefined ? '--out' : '--json', path: jsonPath };
    const outputs = [csvOutput, jsonOutput].filter((o) => o !== undefined);
    const files = inputsApartFromOutputs(expandInputPaths(positionals, io.cwd), outputs, io.cwd);
    const expand = files.length > 1 || values.column === undefined;

    const onlyFile = files.length === 1 ? itemsOf(files[0]!, options, io.cwd, expand) : undefined;
    if (onlyFile !== undefined && outputs.length === 0) {
      const items = onlyFile;
      if (items.length === 1) {
        const item = items[0]!;
        let result: ReturnType<typeof analyzeItem>;
        try {
          result = analyzeItem(item, options, io.cwd, true);
        } catch (error) {
          if (!(error instanceof NoLigandFieldFit)) throw error;
          // Bands found, nothing to fit (a d0 ion): the table and the reason, and exit code 3.
          const found = error.found as AnalysisWithoutFit<AnalyzeResult['spectrum']>;
          io.stdout(json.jsonFlag
            ? `${JSON.stringify({ ...found, fit: null, noFit: { code: error.code, message: error.message, path: error.path } }, null, 2)}\n`
            : formatAnalysisWithoutFit(item.label, found, error.message));
          return EXIT_NO_FIT;
        }
        io.stdout(json.jsonFlag ? `${JSON.stringify(result.result, null, 2)}\n` : formatAnalysisReport(item.label, result.result!));
        return 0;
      }
    }

    // Rows are written as files finish, in list order; no more than a window of results is held at a time.
    const progress = createProgress(files.length, io.isTty, io.stderr);
    const runner = onlyFile !== undefined ? inThreadRunner() : await createBatchRunner(files.length, threads, threads !== undefined);
    const wantJson = jsonOutput !== undefined || json.jsonFlag;
    const opened: Array<{ close: () => void }> = [];
    let count = 0;
    let failed = 0;
    try {
      const sinks: RowSink[] = [];
      for (const [output, sink] of [[csvOutput, csvSink], [jsonOutput, jsonSink]] as const) {
        if (output === undefined) continue;
        const file = openOutputStream(output, io.cwd);
        opened.push(file);
        sinks.push(sink(file.write));
      }
      // The bar shares the terminal with the table: cleared before rows are printed, redrawn by the next tick.
      const stdout = (text: string) => {
        progress.done();
        io.stdout(text);
      };
      sinks.push(json.jsonFlag ? jsonSink(stdout) : tableSink(stdout, files));
      const task = (file: string): BatchFileTask => ({ file, cwd: io.cwd, options, expandColumns: expand, json: wantJson });
      const rowsOf = (file: string) => (onlyFile !== undefined ? Promise.resolve(rowsOfItems(onlyFile, options, io.cwd, wantJson)) : runner.run(task(file)));
      await runInOrder(files, rowsOf, (rows, file) => {
        for (const row of rows) {
          for (const sink of sinks) sink.row(row);
          count++;
          if (row.failed) failed++;
        }
        progress.tick(file);
      }, runner.threads * 4);
      for (const sink of sinks) sink.end();
    } finally {
      progress.done();
      for (const file of opened) file.close();
      await runner.close();
    }
    if (!json.jsonFlag) {
      const wrote = outputs.map((o) => ` Wrote ${o.path}.`).join('');
      io.stdout(`\n${count - failed} of ${count} spectra analysed${failed ? `, ${failed} failed` : ''}.${wrote}\n`);
    }
    return failed > 0 ? 1 : 0;
  },
};

function analysisOptions(values: Parameters<typeof analysisOptionsFrom>[0] & { curves?: boolean; 'no-step-correction'?: boolean; formula?: string; ligands?: string }): AnalyzeOptions {
  const options = analysisOptionsFrom(values);
  if (values.formula !== undefined) options.formula = values.formula;
  if (values.ligands !== undefined) options.ligands = values.ligands;
  if (options.ion === undefined && options.d === undefined && options.formula === undefined) {
    throw new FieldgapError('invalid-argument', '--ion is required (or --d N): the metal ion, e.g. --ion Cr3+', '--ion');
  }
  if (values.curves) options.curves = true;
  if (values['no-step-correction']) options.stepCorrection = false;
  return options;
}
