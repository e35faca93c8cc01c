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
import { isQuickTask } from './task-cost.js';
import { dispatchTask, rebuildError, TASK_FLAG, type Outcome, type Task, type WorkerRequest } from './tasks.js';

export interface RunOptions {
  /** Time limit of this task's running time in ms, counted from when a worker starts it (0 or absent: none). */
  timeoutMs?: number;
  /** Aborted when nobody waits for the answer any more (the client left): the task is dropped or stopped. */
  signal?: AbortSignal;
  /** Called when a worker starts the task (after its wait in the queue). */
  onStart?: () => void;
  /**
   * Answer with the result's JSON text instead of the result. The text is
   * made where the task ran, so a worker's answer crosses to the event loop
   * as one string, not an object graph cloned field by field and serialised
   * again there (JSON.stringify of a fit result is ~5.7 kB of numbers): the
   * event loop's CPU per POST /fit fell by about a tenth (bench/service-fit.ts).
   */
  asJson?: boolean;
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

/** The timers the pool arms; a test may pass its own to run the clock by hand. */
export interface PoolClock {
  setTimeout(callback: () => void, ms: number): unknown;
  clearTimeout(handle: unknown): void;
}

const SYSTEM_CLOCK: PoolClock = {
  setTimeout: (callback, ms) => setTimeout(callback, ms),
  clearTimeout: (handle) => clearTimeout(handle as NodeJS.Timeout | undefined),
};

export interface WorkerPoolOptions {
  /** Worker threads for the general lane; default: the number of cores (os.availableParallelism()). */
  threads?: number;
  /**
   * Tasks that may wait for a general worker before new ones are refused
   * (503 with Retry-After); default 16 per thread (room for 16 clients
   * sending at once). With the time limit it bounds how long an accepted task
   * can wait.
   */
  maxQueue?: number;
  /**
   * Worker threads of the quick lane, which runs only tasks isQuick accepts
   * (levels, small diagrams, short fits), so they never wait behind long
   * analyses; default 1; 0: one lane for everything.
   */
  quickThreads?: number;
  /** Tasks that may wait for a quick worker; default 64. */
  quickMaxQueue?: number;
  /** Which tasks are quick; default isQuickTask (server/task-cost.ts). */
  isQuick?: (task: Task) => boolean;
  /**
   * How long a task whose client left may still run before its worker is
   * stopped, ms; default 1000. Stopping a worker costs a cold restart (module
   * load, JIT) that slows every request for about a second, far more than
   * letting a typical analysis (~10 ms) finish unheard.
   */
  abandonGraceMs?: number;
  /** The worker module; default server/worker (see resolveWorkerFile). For tests. */
  worker?: { filename: string; execArgv: string[] };
  /** Timers for the time limit and the grace time; default the system's. For tests. */
  clock?: PoolClock;
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

type WaitAsync = (array: Int32Array, index: number, value: number) => { async: false; value: string } | { async: true; value: Promise<string> };
// In the ES2024 library; the project compiles against ES2023 (Node 20 has it).
const waitAsync = (Atomics as unknown as { waitAsync: WaitAsync }).waitAsync;

interface Lane {
  run(task: Task, options: RunOptions): Promise<unknown>;
  /** Tasks accepted and not yet settled (running or queued). */
  inFlight(): number;
  stopped(): number;
  close(): Promise<void>;
}

/** One piscina pool with its own queue bound: runs a task, with the time limit armed when a worker starts it. */
function createLane(threads: number, maxQueue: number, abandonGraceMs: number, worker: { filename: string; execArgv: string[] }, clock: PoolClock): Lane {
  const piscina = new Piscina({
    filename: worker.filename,
    execArgv: worker.execArgv,
    minThreads: threads,
    maxThreads: threads,
    maxQueue,
    idleTimeout: 60_000,
  });
  let stopped = 0;
  let closing = false;
  let inFlight = 0;
  piscina.on('workerDestroy', () => {
    if (!closing) stopped++;
  });
  return {
    stopped: () => stopped,
    inFlight: () => inFlight,
    async close() {
      closing = true;
      await piscina.close();
    },
    async run(task, { timeoutMs = 0, signal: cancel, onStart, asJson = false }) {
      if (cancel?.aborted) throw new RequestAbortedError();
      if (piscina.queueSize >= maxQueue) throw new ServiceBusyError();
      const flags = new Int32Array(new SharedArrayBuffer(2 * Int32Array.BYTES_PER_ELEMENT));
      // Aborting piscina's signal drops a queued task, or stops the worker that runs it.
      const stop = new AbortController();
      let timer: unknown;
      let grace: unknown;
      let timedOut = false;
      let done = false;
      let onCancel: (() => void) | undefined;
      // The time limit counts running time: armed when the worker says it started (never for a task dropped unrun).
      const arm = () => {
        if (done) return;
        onStart?.();
        if (timeoutMs > 0) {
          timer = clock.setTimeout(() => {
            timedOut = true;
            stop.abort();
          }, timeoutMs);
        }
      };
      const started = waitAsync(flags, TASK_FLAG.STARTED, 0);
      if (started.async) void started.value.then(arm);
      else arm();
      const request: WorkerRequest = { task, abandoned: flags, ...(asJson && { json: true }) };
      inFlight++;
      const work = (piscina.run(request, { signal: stop.signal }) as Promise<Outcome>).finally(() => inFlight--);
      // The client left: answer at once; a queued task is dropped by the worker
      // when it reaches it, a running one is stopped only if it outlasts the grace time.
      const left = new Promise<never>((_resolve, reject) => {
        onCancel = () => {
          Atomics.store(flags, TASK_FLAG.ABANDONED, 1);
          grace = clock.setTimeout(() => stop.abort(), abandonGraceMs);
          reject(new RequestAbortedError());
        };
        cancel?.addEventListener('abort', onCancel, { once: true });
      });
      const settled = work.finally(() => {
        done = true;
        clock.clearTimeout(timer);
        clock.clearTimeout(grace);
        if (onCancel) cancel?.removeEventListener('abort', onCancel);
        // Wake the pending wait of a task that never started, so nothing is left waiting.
        if (Atomics.compareExchange(flags, TASK_FLAG.STARTED, 0, 2) === 0) Atomics.notify(flags, TASK_FLAG.STARTED);
      });
      // Once the client has left, nobody reads the task's outcome.
      settled.catch(() => {});
      let outcome: Outcome;
      try {
        outcome = await Promise.race([settled, left]);
      } catch (error) {
        if (cancel?.aborted) throw new RequestAbortedError();
        if (timedOut) throw timeoutError(timeoutMs);
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
  };
}

/**
 * Worker threads running server/worker: a general lane, and a quick lane
 * for the tasks isQuick accepts when every general worker is taken. Each
 * lane has its own bounded queue.
 */
export function createWorkerPool(options: WorkerPoolOptions = {}): ComputePool {
  const {
    threads = availableParallelism(),
    maxQueue = 16 * threads,
    quickThreads = 1,
    quickMaxQueue = 64,
    isQuick = isQuickTask,
    abandonGraceMs = 1000,
    worker = resolveWorkerFile(),
    clock = SYSTEM_CLOCK,
  } = options;
  const general = createLane(threads, maxQueue, abandonGraceMs, worker, clock);
  const quick = quickThreads > 0 ? createLane(quickThreads, quickMaxQueue, abandonGraceMs, worker, clock) : undefined;
  return {
    mode: 'workers',
    workersStopped: () => general.stopped() + (quick?.stopped() ?? 0),
    run(task, runOptions = {}) {
      // A quick task takes a free general worker when there is one (throughput), else its own lane (never behind long work).
      const lane = quick !== undefined && isQuick(task) && general.inFlight() >= threads ? quick : general;
      return lane.run(task, runOptions);
    },
    async close() {
      await Promise.all([general.close(), quick?.close()]);
    },
  };
}

/** Runs tasks on the calling thread: for tests and tiny deployments (no time limit). */
export function createInProcessPool(): ComputePool {
  return {
    mode: 'in-process',
    workersStopped: () => 0,
    async run(task, { onStart, asJson = false } = {}) {
      onStart?.();
      return settle(dispatchTask(task, asJson));
    },
    async close() {},
  };
}
