/**
 * The worker-thread pool: results equal to the in-process ones, errors that
 * cross the thread boundary intact, the time limit, the busy answer, and a
 * health check that keeps answering while heavy work runs.
 */
import { readFileSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { levelsDocument } from '../../src/ligand-field/index.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { FieldgapError } from '../../src/errors.js';
import { RequestAbortedError, ServiceBusyError, TaskBugError } from '../../server/errors.js';
import { createWorkerPool, type ComputePool } from '../../server/pool.js';
import { dispatchTask, type Task } from '../../server/tasks.js';
import runInWorker from '../../server/worker.js';
import { makeTestApp } from './helpers.js';

const HOLD_WORKER = { filename: new URL('./fixtures/hold-worker.ts', import.meta.url).href, execArgv: ['--import', 'tsx'] };

/** A diagram that keeps a worker busy for a while: d5 (252 determinants) at the largest step count. */
const HEAVY: Task = { kind: 'diagram', input: { d: 5, geometry: 'octahedral', cOverB: 4.5, maxDqOverB: 20, steps: 2000 } };
const LEVELS: Task = { kind: 'levels', input: { d: 2, geometry: 'tetrahedral', dq: 400, b: 700, c: 2800 } };
const HEAVY_QUERY = '/api/v1/diagram?d=5&cOverB=4.5&maxDqOverB=20&steps=2000';

async function rejection(promise: Promise<unknown>): Promise<unknown> {
  try {
    await promise;
  } catch (error) {
    return error;
  }
  throw new Error('expected the promise to reject');
}

let pool: ComputePool;
beforeAll(() => {
  pool = createWorkerPool({ threads: 2 });
});
afterAll(async () => {
  await pool.close();
});

describe('worker pool', () => {
  it('computes in a worker exactly what the engine computes here', async () => {
    const input = { d: 4, geometry: 'octahedral' as const, dq: 2100, b: 800, c: 3400 };
    const result = await pool.run({ kind: 'levels', input });
    expect(result).toEqual(JSON.parse(JSON.stringify(levelsDocument(computeLevels(4, 'octahedral', { dq: 2100, b: 800, c: 3400 })))));
  });

  it('analyses an uploaded Buffer in a worker exactly as analyzeSpectrum does here', async () => {
    // The invented demo spectrum of spectra-demo/, as input only.
    const content = readFileSync(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));
    const options = { ion: 'Cr3+', concentration: 0.05, fileName: 'cr-aqua.csv' };
    const result = await pool.run({ kind: 'analyze', input: { content, options } });
    expect(result).toEqual(JSON.parse(JSON.stringify(analyzeSpectrum(content, options))));
  });

  it('rebuilds a FieldgapError from the worker with its code, message and path', async () => {
    const direct = (() => {
      try {
        computeLevels(3, 'octahedral', { dq: -5, b: 700, c: 2800 });
      } catch (error) {
        return error as FieldgapError;
      }
      throw new Error('the engine accepted a negative Dq');
    })();
    const error = await rejection(pool.run({ kind: 'levels', input: { d: 3, geometry: 'octahedral', dq: -5, b: 700, c: 2800 } }));
    expect(error).toBeInstanceOf(FieldgapError);
    expect((error as FieldgapError).toJSON()).toEqual(direct.toJSON());
  });

  it('reports a bug in a task as internal, keeping the details for the log', async () => {
    const error = await rejection(pool.run({ kind: 'nonsense' } as unknown as Task));
    expect(error).toBeInstanceOf(TaskBugError);
    expect((error as TaskBugError).code).toBe('internal');
    expect((error as TaskBugError).detail).toContain('unknown task kind "nonsense"');
  });

  it('stops a task over its time limit with a timeout error, and keeps working after', async () => {
    const error = await rejection(pool.run(HEAVY, { timeoutMs: 30 }));
    expect(error).toBeInstanceOf(FieldgapError);
    expect((error as FieldgapError).code).toBe('timeout');
    expect((error as FieldgapError).message).toContain('30 ms');
    const after = await pool.run({ kind: 'levels', input: { d: 2, geometry: 'tetrahedral', dq: 400, b: 700, c: 2800 } });
    expect((after as { d: number }).d).toBe(2);
  });

  it('answers at once for a task whose client left, and drops it unrun if it was still queued', async () => {
    // One lane, so the levels task queues behind the diagram.
    const one = createWorkerPool({ threads: 1, quickThreads: 0 });
    try {
      const first = one.run(HEAVY);
      const waiting = new AbortController();
      const queued = one.run(LEVELS, { signal: waiting.signal }).catch((e: unknown) => e);
      waiting.abort();
      expect(await queued).toBeInstanceOf(RequestAbortedError);
      await first;
      // The dropped task cost no worker: the same thread answers the next one.
      expect((await one.run(LEVELS) as { d: number }).d).toBe(2);
      expect(one.workersStopped()).toBe(0);
    } finally {
      await one.close();
    }
  });

  it.each([
    { graceMs: 60_000, stopped: 0, what: 'finishes within the grace time on the same worker' },
    { graceMs: 10, stopped: 1, what: 'runs on past the grace time: its worker is stopped and replaced' },
  ])('a running task whose client left $what', async ({ graceMs, stopped }) => {
    // The task holds its worker until released (fixtures/hold-worker.ts): "still running" is an event, not a guess.
    const one = createWorkerPool({ threads: 1, quickThreads: 0, abandonGraceMs: graceMs, worker: HOLD_WORKER });
    const latch = new Int32Array(new SharedArrayBuffer(4));
    const release = () => {
      Atomics.store(latch, 0, 1);
      Atomics.notify(latch, 0);
    };
    try {
      await one.run(LEVELS); // the worker is up
      const running = new AbortController();
      let started: () => void = () => {};
      const startedNow = new Promise<void>((r) => (started = r));
      const first = one.run({ kind: 'hold', input: { latch } } as unknown as Task, { signal: running.signal, onStart: started }).catch((e: unknown) => e);
      await startedNow;
      running.abort();
      expect(await first).toBeInstanceOf(RequestAbortedError);
      // Within the grace time the task is let finish: release it. Past it, the worker is stopped while holding.
      if (stopped === 0) release();
      // Either queued behind the released task, or on the replacement worker.
      expect((await one.run(LEVELS) as { d: number }).d).toBe(2);
      expect(one.workersStopped()).toBe(stopped);
    } finally {
      release();
      await one.close();
    }
  });

  it('has the worker drop, unrun, a task whose flag says nobody waits, and run it otherwise', () => {
    const abandoned = new Int32Array(new SharedArrayBuffer(4));
    expect(runInWorker({ task: LEVELS, abandoned })).toEqual(dispatchTask(LEVELS));
    Atomics.store(abandoned, 0, 1);
    const dropped = runInWorker({ task: { kind: 'nonsense' } as unknown as Task, abandoned });
    expect(dropped).toMatchObject({ ok: false, error: { message: expect.stringMatching(/nobody waits/) } });
  });

  it('refuses work when every worker is busy and the queue is full', async () => {
    const small = createWorkerPool({ threads: 1, maxQueue: 1 });
    try {
      const running = small.run(HEAVY, { timeoutMs: 5000 }).catch((e: unknown) => e);
      const queued = small.run(HEAVY, { timeoutMs: 5000 }).catch((e: unknown) => e);
      const refused = await rejection(small.run(HEAVY, { timeoutMs: 5000 }));
      expect(refused).toBeInstanceOf(ServiceBusyError);
      await Promise.all([running, queued]);
    } finally {
      await small.close();
    }
  });
});

describe('the service with workers', () => {
  it('keeps answering the health check while slow tasks occupy every worker', async () => {
    // Two tasks that hold both workers until released (fixtures/hold-worker.ts): no clock, no race with their speed.
    const busy = createWorkerPool({ threads: 2, quickThreads: 0, worker: HOLD_WORKER });
    const h = makeTestApp({ pool: busy });
    const latches = [0, 1].map(() => new Int32Array(new SharedArrayBuffer(4)));
    const starts: Promise<void>[] = [];
    const slow = latches.map((latch) => {
      let started: () => void = () => {};
      starts.push(new Promise<void>((r) => (started = r)));
      return busy.run({ kind: 'hold', input: { latch } } as unknown as Task, { onStart: started });
    });
    let slowDone = 0;
    for (const s of slow) void s.then(() => slowDone++);
    try {
      await Promise.all(starts);
      await request(h.app).get('/api/v1/health').expect(200);
      expect(slowDone).toBe(0);
    } finally {
      for (const latch of latches) {
        Atomics.store(latch, 0, 1);
        Atomics.notify(latch, 0);
      }
      expect(await Promise.all(slow)).toEqual(['released', 'released']);
      await h.dispose();
      await busy.close();
    }
  });

  it('lets the work of a client that hung up run to its end on the same worker, and logs 499', async () => {
    // One lane, so the later levels request queues behind the abandoned diagram on the same worker.
    const inner = createWorkerPool({ threads: 1, quickThreads: 0, abandonGraceMs: 60_000 });
    let diagramStarted: () => void = () => {};
    const started = new Promise<void>((r) => (diagramStarted = r));
    const patient: ComputePool = {
      ...inner,
      mode: inner.mode,
      workersStopped: () => inner.workersStopped(),
      run: (task, options = {}) =>
        inner.run(task, { ...options, onStart: () => (task.kind === 'diagram' ? diagramStarted() : options.onStart?.()) }),
    };
    const a = makeTestApp({ pool: patient });
    const server = a.app.listen(0, '127.0.0.1');
    try {
      await new Promise((r) => server.once('listening', r));
      const { port } = server.address() as AddressInfo;
      await request(a.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200); // the worker is up
      const hangUp = httpRequest({ host: '127.0.0.1', port, path: HEAVY_QUERY });
      hangUp.on('error', () => {});
      hangUp.end();
      await started;
      hangUp.destroy();
      expect(await a.waitForLog((l) => l['status'] === 499)).toMatchObject({ url: HEAVY_QUERY, aborted: true });
      // Queued behind the abandoned diagram on the one worker, which was not stopped.
      await request(a.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200);
      const health = await request(a.app).get('/api/v1/health').expect(200);
      expect(health.body.pool).toEqual({ mode: 'workers', workersStopped: 0 });
    } finally {
      server.close();
      await a.dispose();
      await inner.close();
    }
  });

  it('answers 504 with a clear message when a computation runs over the limit', async () => {
    const quick = makeTestApp({ pool: 'workers', requestTimeoutMs: 30 });
    try {
      const res = await request(quick.app).get(HEAVY_QUERY).expect(504);
      expect(res.body.error.code).toBe('timeout');
      expect(res.body.error.message).toMatch(/limit of 30 ms/);
    } finally {
      await quick.dispose();
    }
  });
});
