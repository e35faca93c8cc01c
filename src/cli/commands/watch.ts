import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import type { AnalyzeOptions } from '../../analysis.js';
import { FieldgapError, invalidArgument, isFieldgapError } from '../../errors.js';
import { labelOfSpectrum, optionsOfSpectrum, sampleOfSpectrum, spectraToStore, type SpectrumToStore } from '../../library/spectra-to-store.js';
import type { Library } from '../../library/library.js';
import type { FitSummary } from '../../library/types.js';
import type { CliIo, Command } from '../command.js';
import { ANALYSIS_OPTIONS, ANALYSIS_USAGE, analysisOptionsFrom } from '../analysis-options.js';
import { SPECTRUM_EXTENSIONS } from '../files.js';
import { numberOption, parseCommandArgs } from '../options.js';
import { checkCliOption, formulaField, ligandsField } from '../../analysis-option-schema.js';
import { fillFromFormula, fitLine, type LibraryFlags } from './library.js';

/**
 * `fieldgap watch DIR`: an instrument's export folder, watched. Each new
 * spectrum file is analysed once it is complete (its size and time unchanged
 * over --settle polls), stored in the library (this machine's, or a service's
 * with --into), and summed up in one line. The files are only ever read.
 * Restarting resumes without duplicates: a file whose content (SHA-256) is
 * already in the library is not stored again. A file that cannot be analysed
 * is reported once, and again only if its content changes.
 *
 * Polling rather than fs.watch: the folder may be a network share, where
 * change events are unreliable; one stat per file per poll is cheap.
 */

const USAGE = `Usage: fieldgap watch DIR --ion ION [analysis options] [--formula F] [--ligands L]
                     [--into URL [--token T]] [--data DIR | --database URL]

Analyses each new spectrum file that appears in DIR (an instrument's export
folder) once it is complete, stores it in the results library with its
original, and prints one line per file. Files are never changed, moved or
deleted. Restarting resumes without storing a file twice (by content hash).
Stops on Ctrl-C or SIGTERM.

  --into URL      store in a fieldgap service (http://host:5177) instead of this
                  machine's library; the service analyses the file
  --token T       access token for --into (default $FIELDGAP_TOKEN)
  --formula F     complex formula stored with each record; gives the ion, the
                  ligands and a geometry guess when not given
  --ligands L     ligands, comma-separated
  --interval MS   how often the folder is looked at (default 1000)
  --settle N      polls a file must stay unchanged before it is read (default 2)
  --once          one pass over the files there now (taken as complete), then exit
  --data DIR, --database URL   the library (see fieldgap library --help)

${ANALYSIS_USAGE}

Energies are in cm-1.`;

/** One spectrum of a file (the shared rule's type, src/library/spectra-to-store.ts). */
export type WatchedSpectrum = SpectrumToStore;

/** Where analysed files go: this machine's library, or a service. */
export interface Sink {
  /**
   * The records whose original has this SHA-256, each by the column it
   * analysed (its options.column; null when it names none: a file's only or
   * first spectrum).
   */
  stored(sha256: string): Promise<Array<number | string | null>>;
  save(file: string, content: Uint8Array, spectrum: WatchedSpectrum): Promise<{ id: number; summary: FitSummary }>;
  close(): Promise<void>;
}

/** Whether `spectrum` is among the `stored` columns of its file (a record without a column is the file's first spectrum). */
function alreadyStored(spectrum: WatchedSpectrum, stored: ReadonlyArray<number | string | null>, first: WatchedSpectrum | undefined): boolean {
  if (spectrum.column === undefined) return stored.length > 0;
  return stored.some((c) => (c === null ? spectrum.column === first?.column : String(c) === String(spectrum.column)));
}

interface Tracked {
  size: number;
  mtimeMs: number;
  /** Polls the file has stayed the same. */
  stable: number;
  /** The content last handled (stored, found stored, or failed), by hash. */
  handled: string | null;
  /** Handled, and unchanged since: not read again. */
  done: boolean;
}

export const watchCommand: Command = {
  name: 'watch',
  summary: 'analyse and store each new spectrum file in an instrument folder',
  usage: USAGE,
  async run(argv, io) {
    const { values, positionals } = parseCommandArgs(
      argv,
      {
        ...ANALYSIS_OPTIONS,
        formula: { type: 'string' },
        ligands: { type: 'string' },
        into: { type: 'string' },
        token: { type: 'string' },
        interval: { type: 'string' },
        settle: { type: 'string' },
        once: { type: 'boolean' },
        data: { type: 'string' },
        database: { type: 'string' },
      },
      true,
    );
    if (positionals.length !== 1) throw invalidArgument('DIR', positionals.length === 0 ? 'DIR is required: the folder to watch' : 'one folder expected');
    const dir = resolve(io.cwd, positionals[0]!);
    try {
      if (!statSync(dir).isDirectory()) throw new Error('not a folder');
    } catch {
      throw new FieldgapError('not-found', 'no such folder', positionals[0]!);
    }
    const options = analysisOptionsFrom(values);
    const details: { formula?: string; ligands?: string[] } = {};
    // Checked as the REST fields formula and ligands are (src/analysis-option-schema.ts), before any file is read.
    if (values.formula !== undefined) details.formula = checkCliOption(formulaField, values.formula, 'formula');
    if (values.ligands !== undefined) {
      details.ligands = (checkCliOption(ligandsField, values.ligands, 'ligands') as string).split(',').map((l) => l.trim()).filter((l) => l !== '');
    }
    fillFromFormula(values.formula, options, details, io);
    if (options.ion === undefined && options.d === undefined) throw invalidArgument('--ion', '--ion is required: the metal ion of the spectra in the folder');
    if (values.into !== undefined && (values.data !== undefined || values.database !== undefined)) {
      throw invalidArgument('--into', '--into stores in a service; --data and --database name a local library: give one');
    }
    const interval = numberOption('interval', values.interval, { min: 50, max: 3_600_000, integer: true }) ?? 1000;
    const settle = numberOption('settle', values.settle, { min: 1, max: 100, integer: true }) ?? 2;
    const sink = values.into !== undefined
      ? remoteSink(values.into, values.token ?? io.env['FIELDGAP_TOKEN'], options, details)
      : await localSink({ data: values.data, database: values.database }, io, options, details);

    // Loaded here, not at the top: every fieldgap command loads this file, and the pipeline is heavy.
    const { listSpectra: list } = await import('../../analysis.js');
    const stop = new AbortController();
    const onSignal = () => stop.abort();
    process.once('SIGINT', onSignal);
    process.once('SIGTERM', onSignal);
    try {
      io.stdout(values.once ? `reading ${positionals[0]} once\n` : `watching ${positionals[0]} (every ${interval} ms; Ctrl-C to stop)\n`);
      await watchFolder(dir, sink, io, {
        interval, settle: values.once ? 0 : settle, once: values.once === true, signal: stop.signal,
        spectra: (content, name) => spectraToStore(content, name, options, list),
      });
    } finally {
      process.off('SIGINT', onSignal);
      process.off('SIGTERM', onSignal);
      await sink.close();
    }
    return 0;
  },
};

/** Polls `dir` until `signal` aborts (or once), handing each complete, new file to `sink`. */
export async function watchFolder(
  dir: string,
  sink: Sink,
  io: Pick<CliIo, 'stdout' | 'stderr'>,
  { interval, settle, once, signal, spectra = () => [{}] }: {
    interval: number; settle: number; once: boolean; signal: AbortSignal;
    /** The spectra of a file, each stored as its own record; default: the file is one. */
    spectra?: (content: Uint8Array, fileName: string) => WatchedSpectrum[] | Promise<WatchedSpectrum[]>;
  },
): Promise<void> {
  const tracked = new Map<string, Tracked>();
  while (!signal.aborted) {
    let names: string[];
    try {
      names = readdirSync(dir).filter((n) => !n.startsWith('.') && SPECTRUM_EXTENSIONS.includes(extname(n).toLowerCase())).sort();
    } catch (error) {
      io.stderr(`watch: cannot read the folder (${(error as NodeJS.ErrnoException).code ?? 'error'}); trying again\n`);
      names = [];
    }
    const already: string[] = [];
    for (const name of names) {
      if (signal.aborted) break;
      const path = join(dir, name);
      let stats;
      try {
        stats = statSync(path);
      } catch {
        tracked.delete(name); // gone between readdir and stat
        continue;
      }
      if (!stats.isFile()) continue;
      const known = tracked.get(name);
      if (!known || known.size !== stats.size || known.mtimeMs !== stats.mtimeMs) {
        tracked.set(name, { size: stats.size, mtimeMs: stats.mtimeMs, stable: 0, handled: known?.handled ?? null, done: false });
        if (settle > 0) continue;
      }
      const entry = tracked.get(name)!;
      if (entry.done) continue;
      if (entry.stable < settle) {
        entry.stable += 1;
        if (entry.stable < settle) continue;
      }
      if (stats.size === 0) continue;
      const content = readFileSync(path);
      if (content.length !== stats.size) {
        entry.stable = 0; // still being written after all
        continue;
      }
      const sha = createHash('sha256').update(content).digest('hex');
      entry.done = true;
      if (entry.handled === sha) continue;
      entry.handled = sha;
      // Every spectrum of the file is its own record (as analyze and series read them); none is left out unsaid.
      const parts = await spectra(content, name);
      let stored: Array<number | string | null> | undefined;
      for (const spectrum of parts) {
        const label = labelOfSpectrum(name, spectrum);
        try {
          stored ??= await sink.stored(sha);
          if (alreadyStored(spectrum, stored, parts[0])) {
            already.push(label);
            continue;
          }
          const saved = await sink.save(name, content, spectrum);
          io.stdout(`${label}: saved #${saved.id}   ${fitLine(saved.summary)}\n`);
        } catch (error) {
          const message = isFieldgapError(error) ? `${error.path && error.path !== name ? `${error.path}: ` : ''}${error.message}` : (error as Error).message;
          io.stdout(`${label}: not stored: ${message.replace(/[\r\n]+/g, ' ')}\n`);
          // A library or service that is away is tried again on the next poll (the spectra stored by then are skipped); a file that cannot be analysed is not.
          if (isFieldgapError(error) && (error.code === 'storage-unavailable' || error.code === 'timeout')) {
            entry.handled = null;
            entry.done = false;
            break;
          }
        }
      }
    }
    if (already.length > 0) {
      const shown = already.length > 5 ? `${already.slice(0, 5).join(', ')} and ${already.length - 5} more` : already.join(', ');
      io.stdout(`${already.length} ${already.length === 1 ? 'file' : 'files'} already in the library: ${shown}\n`);
    }
    if (once) return;
    await pause(interval, signal);
  }
}

/**
 * Waits `ms`, or until `signal` aborts. The abort listener is removed when the
 * timer fires: a watcher polls for days, and one listener left per poll grows
 * without bound (and trips node's MaxListenersExceeded warning after ten).
 */
export function pause(ms: number, signal: AbortSignal): Promise<void> {
  return new Promise<void>((resolveWait) => {
    if (signal.aborted) return resolveWait();
    const onAbort = () => {
      clearTimeout(timer);
      resolveWait();
    };
    const timer = setTimeout(() => {
      signal.removeEventListener('abort', onAbort);
      resolveWait();
    }, ms);
    signal.addEventListener('abort', onAbort, { once: true });
  });
}

async function localSink(flags: LibraryFlags, io: CliIo, options: AnalyzeOptions, details: { formula?: string; ligands?: string[] }): Promise<Sink> {
  const [{ resolveLibraryLocation }, { openLibraryAt }, { analyzeSpectrum }] = await Promise.all([
    import('../../library/location.js'),
    import('../../library/library.js'),
    import('../../analysis.js'),
  ]);
  const library: Library = await openLibraryAt(resolveLibraryLocation({ dataFlag: flags.data, databaseFlag: flags.database, env: io.env, cwd: io.cwd }));
  return {
    stored: async (sha256) => {
      const page = await library.list({ sha256, limit: 1000 });
      return Promise.all(page.analyses.map(async (a) => (await library.get(a.id)).options.column ?? null));
    },
    save: async (file, content, spectrum) => {
      const fileOptions = optionsOfSpectrum({ ...options, fileName: basename(file) }, spectrum);
      const result = analyzeSpectrum(content, fileOptions);
      const saved = await library.add({ ...details, sample: sampleName(file, spectrum), fileName: basename(file), content, options: fileOptions, result });
      return { id: saved.id, summary: saved.summary };
    },
    close: () => library.close(),
  };
}

/** The record's sample: the file's name, and for one of several spectra its column's name too (the shared rule). */
function sampleName(file: string, spectrum: WatchedSpectrum): string {
  return sampleOfSpectrum(basename(file, extname(file)), spectrum);
}

/** A fieldgap service at `base` (http://host:port, with or without /api/v1). */
function remoteSink(base: string, token: string | undefined, options: AnalyzeOptions, details: { formula?: string; ligands?: string[] }): Sink {
  let api: URL;
  try {
    api = new URL(base.replace(/\/+$/, '').replace(/\/api\/v1$/, '') + '/api/v1/');
  } catch {
    throw invalidArgument('--into', '--into: expected the service URL, e.g. http://127.0.0.1:5177');
  }
  if (api.protocol !== 'http:' && api.protocol !== 'https:') throw invalidArgument('--into', '--into: expected an http:// or https:// URL');
  const headers: Record<string, string> = { 'X-Requested-With': 'fieldgap-watch' };
  if (token) headers['Authorization'] = `Bearer ${token}`;
  const call = async (path: string, init: RequestInit): Promise<unknown> => {
    let res: Response;
    try {
      res = await fetch(new URL(path, api), { ...init, headers: { ...headers, ...(init.headers as Record<string, string> | undefined) } });
    } catch {
      throw new FieldgapError('storage-unavailable', `the service at ${api.origin} cannot be reached; trying again`, '--into');
    }
    const body = (await res.json().catch(() => null)) as { error?: { code?: string; message?: string; path?: string } } | null;
    if (!res.ok) {
      const code = res.status === 503 || res.status === 504 ? 'storage-unavailable' : 'invalid-argument';
      throw new FieldgapError(code, body?.error?.message ?? `the service answered ${res.status}`, body?.error?.path ?? '');
    }
    return body;
  };
  const fields = new URLSearchParams();
  const o = options as Record<string, unknown>;
  const names: Record<string, string> = { concentration: 'conc', pathLength: 'path' };
  for (const key of ['ion', 'd', 'geometry', 'concentration', 'pathLength', 'xUnit', 'column', 'cOverB', 'c', 'freeC']) {
    if (o[key] !== undefined) fields.set(names[key] ?? key, String(o[key]));
  }
  if (details.formula !== undefined) fields.set('formula', details.formula);
  if (details.ligands !== undefined) fields.set('ligands', details.ligands.join(','));
  return {
    stored: async (sha256) => {
      const page = (await call(`analyses?${new URLSearchParams({ sha256, limit: '1000' }).toString()}`, { method: 'GET' })) as { analyses: { id: number }[] };
      return Promise.all(page.analyses.map(async (a) => ((await call(`analyses/${a.id}`, { method: 'GET' })) as { options?: { column?: number | string } }).options?.column ?? null));
    },
    save: async (file, content, spectrum) => {
      const query = new URLSearchParams(fields);
      query.set('fileName', basename(file));
      query.set('sample', sampleName(file, spectrum));
      if (spectrum.column !== undefined) query.set('column', String(spectrum.column));
      const saved = (await call(`analyses?${query.toString()}`, {
        method: 'POST', body: new Uint8Array(content), headers: { 'Content-Type': 'application/octet-stream' },
      })) as { id: number; summary: FitSummary };
      return { id: saved.id, summary: saved.summary };
    },
    close: async () => undefined,
  };
}
