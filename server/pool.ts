/**
 * Where the service's computations run. The default is a piscina pool of
 * worker threads, one per core, so a long analysis never blocks the event
 * loop (the health check and other requests keep answering). Tests may use
 * the in-process runner instead: same dispatch, no threads, no time limit.
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import { FieldgapError, isFieldgapError } from '../src/errors.js';
import { RequestAbortedError, ServiceBusyError, TaskBugError } from './errors.js';
import { dispatchTask, rebuildError, type Outcome, type Task } from './tasks.js';

export interface RunOptions {
  /** Time limit for this task in ms (0 or absent: none). */
  timeoutMs?: number;
  /** Aborted when nobody waits for the answer any more (the client left): the task is dropped or stopped. */
  signal?: AbortSignal;
}

/** Runs tasks somewhere and answers with their JSON result, or throws a FieldgapError. */
export interface ComputePool {
  run(task: Task, options?: RunOptions): Promise<unknown>;
  /** Finishes the tasks already accepted, then stops the workers. */
  close(): Promise<void>;
  /** "workers" or "in-process", for the health answer and the logs. */
  readonly mode: 'workers' | 'in-process';
}

export interface WorkerPoolOptions {
  /** Worker threads; default: the number of cores (os.availableParallelism()). */
  threads?: number;
  /** Tasks that may wait for a free worker before new ones are refused (503); default 512. */
  maxQueue?: number;
}

function settle(outcome: Outcome): unknown {
  if (outcome.ok) return outcome.value;
  throw rebuildError(outcome);
}

function timeoutError(timeoutMs: number): FieldgapError {
  return new FieldgapError(
    'timeout',
    `the computation took longer than the server's limit of ${timeoutMs} ms and was stopped; try a smaller spectrum or fewer steps`,
  );
}

/**
 * The worker module next to this file: worker.js when running compiled
 * (dist/server), worker.ts when running from source (vitest, tsx), in which
 * case the worker needs tsx's loader too.
 */
export function resolveWorkerFile(): { filename: string; execArgv: string[] } {
  const compiled = new URL('./worker.js', import.meta.url);
  if (existsSync(fileURLToPath(compiled))) return { filename: compiled.href, execArgv: [] };
  const source = new URL('./worker.ts', import.meta.url);
  return { filename: source.href, execArgv: ['--import', 'tsx'] };
}

/** A pool of worker threads running server/worker. */
export function createWorkerPool(options: WorkerPoolOptions = {}): ComputePool {
  const { threads = availableParallelism(), maxQueue = 512 } = options;
  const { filename, execArgv } = resolveWorkerFile();
  const piscina = new Piscina({
    filename,
    execArgv,
    minThreads: threads,
    maxThreads: threads,
    maxQueue,
    idleTimeout: 60_000,
  });
  return {
    mode: 'workers',
    async run(task, { timeoutMs = 0, signal: cancel } = {}) {
      if (cancel?.aborted) throw new RequestAbortedError();
      if (piscina.queueSize >= maxQueue) throw new ServiceBusyError();
      const timeout = timeoutMs > 0 ? AbortSignal.timeout(timeoutMs) : undefined;
      const signal = timeout && cancel ? AbortSignal.any([timeout, cancel]) : (timeout ?? cancel);
      let outcome: Outcome;
      try {
        outcome = (await piscina.run(task, signal ? { signal } : {})) as Outcome;
      } catch (error) {
        if (cancel?.aborted) throw new RequestAbortedError();
        if (timeout?.aborted) throw timeoutError(timeoutMs);
        if (error instanceof Error && /queue is at limit|workers are busy/i.test(error.message)) {
          throw new ServiceBusyError();
        }
        if (isFieldgapError(error)) throw error;
        // A worker that died (out of memory, a crash in native code) is a bug.
        const message = error instanceof Error ? error.message : String(error);
        throw new TaskBugError(message, error instanceof Error && error.stack ? error.stack : message);
      }
      return settle(outcome);
    },
    async close() {
      await piscina.close();
    },
  };
}

/** Runs tasks on the calling thread: for tests and tiny deployments (no time limit). */
export function createInProcessPool(): ComputePool {
  return {
    mode: 'in-process',
    async run(task) {
      return settle(dispatchTask(task));
    },
    async close() {},
  };
}
