/**
 * Where the files of an `analyze` batch are analysed: a piscina pool of
 * worker threads (one per core) for a large batch, or the calling thread for
 * a small one, where starting threads would cost more than it saves. Both
 * answer with a file's finished rows (batch-rows.ts).
 *
 * The CLI's own pool, not the service's (server/pool.ts): src/cli and server/
 * do not import each other, and a batch needs none of the service's time
 * limits or hang-up handling.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { analyzeBatchFile, type BatchFileTask, type BatchRow } from './batch-rows.js';

export interface BatchRunner {
  run(task: BatchFileTask): Promise<BatchRow[]>;
  close(): Promise<void>;
  /** Threads analysing (1: the calling thread). */
  readonly threads: number;
}

/**
 * Files below which a batch runs on the calling thread: a worker's start-up
 * (loading the analysis code, warming its caches) costs about as much as
 * analysing a handful of files.
 */
export const MIN_FILES_FOR_WORKERS = 8;

/** The default thread count: every core. */
export function defaultThreads(): number {
  return availableParallelism();
}

/**
 * The worker module next to this file: batch-worker.js when running compiled
 * or bundled (dist/cli, dist/src/cli), batch-worker.ts when running from
 * source (vitest, tsx), in which case the worker needs tsx's loader too.
 */
function workerFile(): { filename: string; execArgv: string[] } {
  const compiled = new URL('./batch-worker.js', import.meta.url);
  if (existsSync(fileURLToPath(compiled))) return { filename: compiled.href, execArgv: [] };
  return { filename: new URL('./batch-worker.ts', import.meta.url).href, execArgv: ['--import', 'tsx'] };
}

/** The calling thread as a runner. */
export function inThreadRunner(): BatchRunner {
  return {
    threads: 1,
    async run(task) {
      return analyzeBatchFile(task);
    },
    async close() {},
  };
}

/**
 * A runner for `files` files on up to `threads` threads (default: every
 * core): worker threads when that makes at least two and the batch is large
 * enough (or `threads` was asked for explicitly), else the calling thread.
 */
export async function createBatchRunner(files: number, threads?: number, explicit = false): Promise<BatchRunner> {
  const count = Math.max(1, Math.min(threads ?? defaultThreads(), files));
  if (count < 2 || (files < MIN_FILES_FOR_WORKERS && !explicit)) return inThreadRunner();
  // Loaded here, not at start-up: only a large batch needs it.
  const { Piscina } = await import('piscina');
  const { filename, execArgv } = workerFile();
  const piscina = new Piscina<BatchFileTask, BatchRow[]>({ filename, execArgv, minThreads: count, maxThreads: count, idleTimeout: 1000 });
  return {
    threads: count,
    run: (task) => piscina.run(task),
    close: () => piscina.close(),
  };
}
