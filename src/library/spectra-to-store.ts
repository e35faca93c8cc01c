import type { AnalyzeOptions, listSpectra } from '../analysis.js';
import { isFieldgapError, type ErrorCode } from '../errors.js';

/**
 * Which records one spectrum file becomes in the library: one per spectrum
 * it holds, as `analyze` and `series` read it. The one rule of
 * `library add`, `watch` and POST /api/v1/analyses (and so of the page's
 * "Save to library"): every y column of a multi-column file is its own
 * record, each keeping the whole original file byte for byte and its column
 * in its options (so a refit reads that column again); a file with one
 * spectrum, or one whose column the options already chose, is one record
 * exactly as before.
 */

/** The error codes that are one spectrum's (or file's) own failure, not the service's or the library's (busy, time limit, storage). */
export const SPECTRUM_FAILURES: readonly ErrorCode[] = ['invalid-argument', 'parse-error', 'unsupported-format', 'unexplained'];

/** One spectrum of a file: `column` undefined for a file's only spectrum (or the one the options' column chose). */
export interface SpectrumToStore {
  column?: number;
  /** The column's name, for a file that holds several. */
  name?: string;
}

/**
 * The lister of a file's spectra (src/analysis.ts listSpectra, or the
 * service's, which parses on its worker pool), passed in so that loading
 * this file does not load the pipeline.
 */
export type SpectrumLister = (
  content: Uint8Array, options: Parameters<typeof listSpectra>[1],
) => ReturnType<typeof listSpectra> | Promise<ReturnType<typeof listSpectra>>;

/**
 * The spectra of a file to store, one record each: every y column of a
 * multi-column file, unless `options.column` chose one. A file that cannot
 * be parsed is one item: its analysis says why (with the file's own error).
 */
export async function spectraToStore(
  content: Uint8Array, fileName: string, options: Pick<AnalyzeOptions, 'column' | 'xUnit'>, list: SpectrumLister,
): Promise<SpectrumToStore[]> {
  if (options.column !== undefined) return [{}];
  try {
    const spectra = await list(content, { fileName, ...(options.xUnit !== undefined && { xUnit: options.xUnit }) });
    return spectra.length <= 1 ? [{}] : spectra.map((s) => ({ column: s.column, name: s.name }));
  } catch (error) {
    if (!isFieldgapError(error) || !SPECTRUM_FAILURES.includes(error.code)) throw error;
    return [{}];
  }
}

/** A record's sample: the given one, and for one of several spectra its column's name too ("cr-series: en", as series names them). */
export function sampleOfSpectrum(sample: string, spectrum: SpectrumToStore): string {
  return spectrum.column === undefined ? sample : `${sample}: ${spectrum.name ?? `column ${spectrum.column}`}`;
}

/** The analysis options of one spectrum of the file: the file's, with its column when it is one of several. */
export function optionsOfSpectrum<T extends Pick<AnalyzeOptions, 'column'>>(options: T, spectrum: SpectrumToStore): T {
  return spectrum.column === undefined ? options : { ...options, column: spectrum.column };
}

/** How messages name one spectrum of a file: "mix.csv", or "mix.csv#3 (en)" for one of several. */
export function labelOfSpectrum(fileName: string, spectrum: SpectrumToStore): string {
  return spectrum.column === undefined ? fileName : `${fileName}#${spectrum.column}${spectrum.name ? ` (${spectrum.name})` : ''}`;
}

/** Whether an error's path names no more than the file or one of its spectra ("mix.csv", "mix.csv#3"): then a line that names the spectrum need not repeat it. */
export function pathNamesOnlySpectrum(path: string, fileName: string): boolean {
  return path === fileName || (path.startsWith(`${fileName}#`) && /^\d+$/.test(path.slice(fileName.length + 1)));
}

/** "1 record", "3 records (one per spectrum)": how many records one file gave. */
export function recordCountText(count: number, spectra: number): string {
  return `${count} ${count === 1 ? 'record' : 'records'}${spectra > 1 ? ` (one per spectrum; the file holds ${spectra})` : ''}`;
}
