import type { AnalyzeOptions, AnalyzeResult } from '../analysis.js';
import { FieldgapError, invalidArgument, isFieldgapError, type ErrorCode } from '../errors.js';
import type { Library } from './library-api.js';
import { SPECTRUM_FAILURES, labelOfSpectrum, pathNamesOnlySpectrum, optionsOfSpectrum, sampleOfSpectrum, spectraToStore, type SpectrumLister, type SpectrumToStore } from './spectra-to-store.js';
import type { AnalysisDetails, AnalysisRecord } from './types.js';

/**
 * One spectrum file into the library: `library add FILE` and POST
 * /api/v1/analyses (the page's "Save to library") both call this. Every
 * spectrum of the file becomes its own record (the rule of
 * spectra-to-store.ts, which `watch` follows too), each with the original
 * file byte for byte; a file with one spectrum is one record, as it always
 * was, and its failure is the call's.
 *
 * Of a file with several spectra, the records that could be analysed are
 * saved together (one addMany: one transaction) and each that could not is
 * listed in `notSaved` with its reason; when none could, the first reason is
 * thrown, as for a one-spectrum file. Only a spectrum's own failures are
 * listed (its data, its fit); a busy service, a time limit or the library
 * failing stops the whole file.
 */

/** A spectrum of the file that was not saved, and why. */
export interface NotSavedSpectrum {
  /** The column in the file (1-based data column, as --column counts). */
  column: number | null;
  columnName: string | null;
  error: { code: ErrorCode; message: string; path: string };
}

/** What one file gave: its records (in the file's column order) and the spectra that were not saved. */
export interface StoredFile {
  records: AnalysisRecord[];
  /** The spectrum of each record (same order). */
  recordSpectra: SpectrumToStore[];
  notSaved: NotSavedSpectrum[];
  /** How many spectra the file holds (1 for a file whose column the options chose). */
  spectra: number;
}

export interface StoreFileInput {
  content: Uint8Array;
  /** The stored original's name. */
  fileName: string;
  /**
   * How messages name the upload ("cr.csv", "request body"): the analysis
   * runs with it as its fileName, so an error names what the user sent,
   * while the record keeps `options` as given. Default: options.fileName.
   */
  label?: string;
  /** The analysis options stored with each record; a record of one of several spectra adds its column. */
  options: AnalyzeOptions;
  /** The details of every record; `sample` gets ": <column name>" for one of several spectra. */
  details: AnalysisDetails;
  library: Library;
  /** The pipeline (in-process for the CLI, on the pool for the service). */
  analyze: (content: Uint8Array, options: AnalyzeOptions) => AnalyzeResult | Promise<AnalyzeResult>;
  list: SpectrumLister;
  /** What the caller calls the corrections and the column options, for the error ("--corrections" or "corrections"). */
  names: { corrections: string; column: string };
}

export async function storeFileSpectra(input: StoreFileInput): Promise<StoredFile> {
  const { content, fileName, options, details, library, list, names } = input;
  const label = input.label ?? options.fileName ?? fileName;
  const analyze = (o: AnalyzeOptions) => input.analyze(content, { ...o, fileName: label });
  const spectra = await spectraToStore(content, label, options, list);
  if (spectra.length === 1) {
    const result = await analyze(options);
    return { records: [await library.add({ ...details, fileName, content, options, result })], recordSpectra: [spectra[0]!], notSaved: [], spectra: 1 };
  }
  if (options.corrections !== undefined) {
    throw invalidArgument(
      names.corrections,
      `${names.corrections}: corrections belong to one spectrum, and ${label} holds ${spectra.length} (columns ${spectra.map((s) => s.column).join(', ')}): choose one with ${names.column}`,
    );
  }
  const ready: Array<{ spectrum: SpectrumToStore; options: AnalyzeOptions; result: AnalyzeResult }> = [];
  const notSaved: Array<NotSavedSpectrum & { thrown: FieldgapError }> = [];
  for (const spectrum of spectra) {
    const spectrumOptions = optionsOfSpectrum(options, spectrum);
    try {
      ready.push({ spectrum, options: spectrumOptions, result: await analyze(spectrumOptions) });
    } catch (error) {
      if (!isFieldgapError(error) || !SPECTRUM_FAILURES.includes(error.code)) throw error;
      notSaved.push({ ...notSavedOf(spectrum, error), thrown: error });
    }
  }
  if (ready.length === 0) throw notSaved[0]!.thrown;
  const outcomes = await library.addMany(ready.map((r) => ({ ...details, sample: sampleOfSpectrum(details.sample, r.spectrum), fileName, content, options: r.options, result: r.result })));
  const records: AnalysisRecord[] = [];
  const recordSpectra: SpectrumToStore[] = [];
  outcomes.forEach((outcome, i) => {
    if (outcome instanceof FieldgapError) notSaved.push({ ...notSavedOf(ready[i]!.spectrum, outcome), thrown: outcome });
    else {
      records.push(outcome);
      recordSpectra.push(ready[i]!.spectrum);
    }
  });
  if (records.length === 0) throw notSaved[0]!.thrown;
  notSaved.sort((a, b) => (a.column ?? 0) - (b.column ?? 0));
  return { records, recordSpectra, notSaved: notSaved.map(({ thrown: _thrown, ...rest }) => rest), spectra: spectra.length };
}

/** One record of a file's records, as `records` lists them in the JSON answer. */
export interface FileRecordEntry {
  id: number;
  sample: string;
  column: number | null;
  columnName: string | null;
}

/**
 * The fields a file's answer adds to its first record (POST
 * /api/v1/analyses, `library add FILE --json`): every record the file gave,
 * and the spectra not saved. The record's own fields stay as they were.
 */
export function fileRecordsFields(stored: StoredFile): { records: FileRecordEntry[]; notSaved: NotSavedSpectrum[] } {
  return {
    records: stored.records.map((r, i) => ({ id: r.id, sample: r.sample, column: stored.recordSpectra[i]?.column ?? null, columnName: stored.recordSpectra[i]?.name ?? null })),
    notSaved: stored.notSaved,
  };
}

function notSavedOf(spectrum: SpectrumToStore, error: FieldgapError): NotSavedSpectrum {
  return { column: spectrum.column ?? null, columnName: spectrum.name ?? null, error: { code: error.code, message: error.message, path: error.path } };
}

/** "mix.csv#3 (en): not saved: …", one line per spectrum left out (for the CLI's stderr). */
export function notSavedLines(fileName: string, notSaved: readonly NotSavedSpectrum[]): string[] {
  return notSaved.map((n) => {
    const where = n.error.path && !pathNamesOnlySpectrum(n.error.path, fileName) ? `${n.error.path}: ` : '';
    const spectrum: SpectrumToStore = n.column === null ? {} : { column: n.column, ...(n.columnName !== null && { name: n.columnName }) };
    return `${labelOfSpectrum(fileName, spectrum)}: not saved: ${where}${n.error.message}`;
  });
}
