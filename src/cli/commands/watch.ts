import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import type { AnalyzeOptions } from '../../analysis.js';
import { FieldgapError, invalidArgument, isFieldgapError } from '../../errors.js';
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

/** Where analysed files go: this machine's library, or a service. */
interface Sink {
  /** The id of a record whose original has this SHA-256, or null. */
  find(sha256: string): Promise<number | null>;
  save(file: string, content: Uint8Array): Promise<{ id: number; summary: FitSummary }>;
  close(): Promise<void>;
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

    const stop = new AbortController();
    const onSignal = () => stop.abort();
    process.once('SIGINT', onSignal);
    process.once('SIGTERM', onSignal);
    try {
      io.stdout(values.once ? `reading ${positionals[0]} once\n` : `watching ${positionals[0]} (every ${interval} ms; Ctrl-C to stop)\n`);
      await watchFolder(dir, sink, io, { interval, settle: values.once ? 0 : settle, once: values.once === true, signal: stop.signal });
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
  { interval, settle, once, signal }: { interval: number; settle: number; once: boolean; signal: AbortSignal },
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
    let alreadyStored = 0;
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
      try {
        const existing = await sink.find(sha);
        if (existing !== null) {
          alreadyStored += 1;
          continue;
        }
        const saved = await sink.save(name, content);
        io.stdout(`${name}: saved #${saved.id}   ${fitLine(saved.summary)}\n`);
      } catch (error) {
        const message = isFieldgapError(error) ? `${error.path && error.path !== name ? `${error.path}: ` : ''}${error.message}` : (error as Error).message;
        io.stdout(`${name}: not stored: ${message.replace(/[\r\n]+/g, ' ')}\n`);
        // A library or service that is away is tried again on the next poll; a file that cannot be analysed is not.
        if (isFieldgapError(error) && (error.code === 'storage-unavailable' || error.code === 'timeout')) {
          entry.handled = null;
          entry.done = false;
        }
      }
    }
    if (alreadyStored > 0) io.stdout(`${alreadyStored} file${alreadyStored === 1 ? '' : 's'} already in the library\n`);
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
    find: async (sha256) => (await library.list({ sha256, limit: 1 })).analyses[0]?.id ?? null,
    save: async (file, content) => {
      const fileOptions = { ...options, fileName: basename(file) };
      const result = analyzeSpectrum(content, fileOptions);
      const saved = await library.add({ ...details, sample: basename(file, extname(file)), fileName: basename(file), content, options: fileOptions, result });
      return { id: saved.id, summary: saved.summary };
    },
    close: () => library.close(),
  };
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
    find: async (sha256) => {
      const page = (await call(`analyses?${new URLSearchParams({ sha256, limit: '1' }).toString()}`, { method: 'GET' })) as { analyses: { id: number }[] };
      return page.analyses[0]?.id ?? null;
    },
    save: async (file, content) => {
      const query = new URLSearchParams(fields);
      query.set('fileName', basename(file));
      query.set('sample', basename(file, extname(file)));
      const saved = (await call(`analyses?${query.toString()}`, {
        method: 'POST', body: new Uint8Array(content), headers: { 'Content-Type': 'application/octet-stream' },
      })) as { id: number; summary: FitSummary };
      return { id: saved.id, summary: saved.summary };
    },
    close: async () => undefined,
  };
}
