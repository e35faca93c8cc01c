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
import { analyzeContent, type AnalyzeContentTask, type ContentOutcome } from './batch-analyze.js';
import { analyzeBatchFile, type BatchFileTask, type BatchRow } from './batch-rows.js';
import type { WorkerTask } from './batch-worker.js';
import { collectEvery } from './worker-gc.js';

export interface BatchRunner {
  /** One file of an `analyze` batch to its finished rows. */
  run(task: BatchFileTask): Promise<BatchRow[]>;
  /** A spectrum's bytes to its analysis (or its error, as data). */
  analyze(task: AnalyzeContentTask): Promise<ContentOutcome>;
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

/**
 * A worker's young generation (where an analysis's short-lived arrays live),
 * MB. V8 grows it with the allocation rate, up to about 48 MB a thread, so
 * without a cap a long batch ends at a higher peak memory than a short one
 * (measured: 136 MB for 100 files, 177 MB for 1 000); at 8 MB, 120 and
 * 130 MB, with the same CPU time (bench/batch.ts). The old generation is
 * kept in check by a collection every few hundred files (worker-gc.ts).
 */
export const WORKER_YOUNG_GENERATION_MB = 8;

/**
 * Files between two full collections on the calling thread, which receives
 * every row: its old generation otherwise fills with dead rows and promises
 * for thousands of files before V8 collects it (measured: the main heap
 * from 12 to 19 MB over 10 000 files). A collection of that heap costs a few
 * ms.
 */
export const MAIN_FILES_PER_COLLECTION = 500;

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
    async analyze(task) {
      return analyzeContent(task);
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
  const piscina = new Piscina<WorkerTask, BatchRow[] | ContentOutcome>({
    filename, execArgv, minThreads: count, maxThreads: count, idleTimeout: 1000,
    resourceLimits: { maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB },
  });
  const afterFile = collectEvery(MAIN_FILES_PER_COLLECTION);
  const settled = <R>(result: R): R => {
    afterFile();
    return result;
  };
  return {
    threads: count,
    run: async (task) => settled((await piscina.run({ rows: task })) as BatchRow[]),
    analyze: async (task) => settled((await piscina.run({ analyze: task })) as ContentOutcome),
    close: () => piscina.close(),
  };
}
