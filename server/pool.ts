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
import { dispatchTask, rebuildError, type Outcome, type Task, type WorkerRequest } from './tasks.js';

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
  /**
   * Workers stopped so far because their task ran over its time limit, its
   * client left more than the grace time ago, or the thread died; each one is
   * replaced by a cold worker. For the health answer.
   */
  workersStopped(): number;
}

export interface WorkerPoolOptions {
  /** Worker threads; default: the number of cores (os.availableParallelism()). */
  threads?: number;
  /** Tasks that may wait for a free worker before new ones are refused (503); default 512. */
  maxQueue?: number;
  /**
   * How long a task whose client left may still run before its worker is
   * stopped, ms; default 1000. Stopping a worker costs a cold restart (module
   * load, JIT) that slows every request for about a second, far more than
   * letting a typical analysis (~10 ms) finish unheard.
   */
  abandonGraceMs?: number;
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
  const { threads = availableParallelism(), maxQueue = 512, abandonGraceMs = 1000 } = options;
  const { filename, execArgv } = resolveWorkerFile();
  const piscina = new Piscina({
    filename,
    execArgv,
    minThreads: threads,
    maxThreads: threads,
    maxQueue,
    idleTimeout: 60_000,
  });
  let stopped = 0;
  let closing = false;
  piscina.on('workerDestroy', () => {
    if (!closing) stopped++;
  });
  return {
    mode: 'workers',
    workersStopped: () => stopped,
    async run(task, { timeoutMs = 0, signal: cancel } = {}) {
      if (cancel?.aborted) throw new RequestAbortedError();
      if (piscina.queueSize >= maxQueue) throw new ServiceBusyError();
      const abandoned = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
      // Aborting piscina's signal drops a queued task, or stops the worker that runs it.
      const stop = new AbortController();
      const timer = timeoutMs > 0 ? setTimeout(() => stop.abort(), timeoutMs) : undefined;
      let grace: NodeJS.Timeout | undefined;
      let onCancel: (() => void) | undefined;
      const request: WorkerRequest = { task, abandoned };
      const work = piscina.run(request, { signal: stop.signal }) as Promise<Outcome>;
      // The client left: answer at once; a queued task is dropped by the worker
      // when it reaches it, a running one is stopped only if it outlasts the grace time.
      const left = new Promise<never>((_resolve, reject) => {
        onCancel = () => {
          Atomics.store(abandoned, 0, 1);
          grace = setTimeout(() => stop.abort(), abandonGraceMs);
          reject(new RequestAbortedError());
        };
        cancel?.addEventListener('abort', onCancel, { once: true });
      });
      const settled = work.finally(() => {
        clearTimeout(timer);
        clearTimeout(grace);
        if (onCancel) cancel?.removeEventListener('abort', onCancel);
      });
      // Once the client has left, nobody reads the task's outcome.
      settled.catch(() => {});
      let outcome: Outcome;
      try {
        outcome = await Promise.race([settled, left]);
      } catch (error) {
        if (cancel?.aborted) throw new RequestAbortedError();
        if (stop.signal.aborted) throw timeoutError(timeoutMs);
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
      closing = true;
      await piscina.close();
    },
  };
}

/** Runs tasks on the calling thread: for tests and tiny deployments (no time limit). */
export function createInProcessPool(): ComputePool {
  return {
    mode: 'in-process',
    workersStopped: () => 0,
    async run(task) {
      return settle(dispatchTask(task));
    },
    async close() {},
  };
}
