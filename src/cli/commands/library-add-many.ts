/**
 * `library add FILE FILE...` (many files in one process); library.ts is the
 * rest of `fieldgap library`. Its library helpers arrive as an argument, so
 * this file imports library.ts for types only (no import cycle at run time).
 */
import { basename } from 'node:path';
import { FieldgapError, invalidArgument } from '../../errors.js';
import type { AnalyzeOptions } from '../../analysis.js';
import type { AnalysisRecord, NewAnalysis } from '../../library/types.js';
import type { Library } from '../../library/library.js';
import type { SpectrumLister } from '../../library/spectra-to-store.js';
import { analysisOptionsFrom } from '../analysis-options.js';
import type { CliIo } from '../command.js';
import { readInputFile } from '../files.js';
import { savedText } from './library-text.js';
import type { AddValues, DetailValues, LibraryFlags } from './library.js';

/** The library command's own helpers that `library add FILES...` uses. */
export interface AddManyHelpers {
  withLibrary: <T>(flags: LibraryFlags, io: CliIo, fn: (library: Library) => T | Promise<T>) => Promise<T>;
  detailsFrom: (values: DetailValues, file: string) => Omit<NewAnalysis, 'fileName' | 'content' | 'options' | 'result'>;
  fillFromFormula: (formula: string | undefined, options: AnalyzeOptions, details: { ion?: string; ligands?: string[] }, io: CliIo) => void;
}

/** Files saved a transaction by `library add FILES...`. */
const ADD_BATCH = 50;

/**
 * `library add FILE FILE...`: every file in one process, into one open
 * library, each its own record (sample named after its file). The analyses
 * run on the batch pool (every core); records are saved in batches of up to
 * ADD_BATCH files, one transaction each, and printed in the order of the
 * files once their batch is committed (nothing is acknowledged before it is
 * on disk). A file that cannot be read or analysed is reported on
 * stderr and the others go on (exit 1); with --json the saved records are
 * printed as one JSON array, each as it is saved.
 */
export async function addMany(files: string[], values: AddValues, io: CliIo, helpers: AddManyHelpers): Promise<number> {
  const { withLibrary, detailsFrom, fillFromFormula } = helpers;
  if (values.sample !== undefined) throw invalidArgument('--sample', `--sample names one file's record; ${files.length} files were given (each is named after its file)`);
  if (values.corrections !== undefined) throw invalidArgument('--corrections', `--corrections belong to one spectrum; ${files.length} files were given`);
  const options = analysisOptionsFrom(values);
  fillFromFormula(values.formula, options, {}, io);
  const [{ createBatchRunner }, { runInOrder }, { resultOf }, spectraRule] = await Promise.all([
    import('../batch-pool.js'), import('../batch-run.js'), import('../batch-analyze.js'), import('../../library/spectra-to-store.js'),
  ]);
  const { spectraToStore, optionsOfSpectrum, sampleOfSpectrum, labelOfSpectrum, pathNamesOnlySpectrum } = spectraRule;
  let failed = 0;
  let saved = 0;
  const filesSaved = new Set<string>();
  let severalSpectra = false;
  await withLibrary(values, io, async (library) => {
    const runner = await createBatchRunner(files.length);
    try {
      if (values.json) io.stdout('[');
      // Read on this thread (the library keeps the bytes), analysed on the pool, each spectrum of the file its own record (the rule of spectra-to-store.ts); a read error is the file's outcome.
      const analyse = async (file: string) => {
        try {
          const content = readInputFile(file, io.cwd);
          const fileOptions = { ...options, fileName: basename(file) };
          // The file's analysis on the pool lists its spectra (result.spectrum.columns), so a file with one costs one analysis
          // and no parse here; only when it failed is the file parsed here to learn its spectra.
          const first = await runner.analyze({ content, options: fileOptions });
          const lister: SpectrumLister = 'result' in first
            ? () => first.result.spectrum.columns ?? []
            : async (bytes, listOptions) => (await import('../../analysis.js')).listSpectra(bytes, listOptions);
          const spectra = await spectraToStore(content, basename(file), fileOptions, lister);
          if (spectra.length === 1) return { content, parts: [{ spectrum: spectra[0]!, options: fileOptions, outcome: first }] };
          const parts = await Promise.all(spectra.map(async (spectrum) => {
            const spectrumOptions = optionsOfSpectrum(fileOptions, spectrum);
            return { spectrum, options: spectrumOptions, outcome: await runner.analyze({ content, options: spectrumOptions }) };
          }));
          return { content, parts };
        } catch (error) {
          return { error };
        }
      };
      // Saved a batch at a time: one transaction (one fsync) per batch, and each file's line printed only once its batch is committed.
      const pending: { file: string; label: string; record?: NewAnalysis; error?: FieldgapError }[] = [];
      let since = Date.now();
      const report = (file: string, label: string, outcome: AnalysisRecord | FieldgapError) => {
        if (outcome instanceof FieldgapError) {
          failed++;
          const where = outcome.path && outcome.path !== file && !pathNamesOnlySpectrum(outcome.path, basename(file)) ? `${outcome.path}: ` : '';
          io.stderr(`fieldgap library: ${label}: not saved: ${where}${outcome.message}\n`);
          return;
        }
        if (values.json) io.stdout(`${saved > 0 ? ',' : ''}\n  ${JSON.stringify(outcome, null, 2).replaceAll('\n', '\n  ')}`);
        else io.stdout(savedText(outcome));
        saved++;
        filesSaved.add(file);
      };
      const flush = async () => {
        const batch = pending.splice(0);
        since = Date.now();
        const records = batch.flatMap((p) => (p.record ? [p.record] : []));
        const outcomes = records.length > 0 ? await library.addMany(records) : [];
        let next = 0;
        for (const p of batch) report(p.file, p.label, p.record ? outcomes[next++]! : p.error!);
      };
      await runInOrder(files, analyse, async (done, file) => {
        if ('error' in done) {
          if (!(done.error instanceof FieldgapError)) throw done.error;
          pending.push({ file, label: file, error: done.error });
        } else {
          if (done.parts.length > 1) severalSpectra = true;
          for (const part of done.parts) {
            const label = part.spectrum.column === undefined ? file : labelOfSpectrum(file, part.spectrum);
            try {
              const details = detailsFrom(values, file);
              fillFromFormula(values.formula, {}, details, { ...io, stderr: () => {} });
              details.sample = sampleOfSpectrum(details.sample, part.spectrum);
              pending.push({ file, label, record: { ...details, fileName: basename(file), content: done.content, options: part.options, result: resultOf(part.outcome) } });
            } catch (error) {
              if (!(error instanceof FieldgapError)) throw error;
              pending.push({ file, label, error });
            }
          }
        }
        // A batch is written when it is full, or after a second, so a slow folder still shows progress.
        if (pending.length >= ADD_BATCH || Date.now() - since >= 1000) await flush();
      }, runner.threads * 4);
      await flush();
      if (values.json) io.stdout(saved > 0 ? '\n]\n' : ']\n');
    } finally {
      await runner.close();
    }
  });
  if (!values.json) {
    // A file with several spectra is several records: then the records are counted too.
    const records = severalSpectra ? ` (${saved} ${saved === 1 ? 'record' : 'records'}: one per spectrum of a file)` : '';
    io.stdout(`${filesSaved.size} of ${files.length} files saved${records}${failed ? `, ${failed} ${severalSpectra ? 'not saved' : 'failed'}` : ''}.\n`);
  }
  return failed > 0 ? 1 : 0;
}

