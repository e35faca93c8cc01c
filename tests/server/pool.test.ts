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
import { makeTestApp, type TestApp } from './helpers.js';

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
    const one = createWorkerPool({ threads: 1 });
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
    const one = createWorkerPool({ threads: 1, abandonGraceMs: graceMs });
    try {
      await one.run(LEVELS); // the worker is up
      const running = new AbortController();
      const first = one.run(HEAVY, { signal: running.signal }).catch((e: unknown) => e);
      await new Promise((r) => setTimeout(r, 20));
      running.abort();
      expect(await first).toBeInstanceOf(RequestAbortedError);
      // Either queued behind the abandoned diagram, or on the replacement worker.
      expect((await one.run(LEVELS) as { d: number }).d).toBe(2);
      expect(one.workersStopped()).toBe(stopped);
    } finally {
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
  let t: TestApp;
  beforeAll(() => {
    t = makeTestApp({ pool: 'workers', requestTimeoutMs: 8000 });
  });
  afterAll(async () => {
    await t.dispose();
  });

  it('keeps answering the health check while heavy diagrams occupy every worker', async () => {
    await request(t.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200); // workers started
    let heavyDone = 0;
    const heavy = [1, 2].map(() =>
      request(t.app)
        .get(HEAVY_QUERY)
        .then((res) => {
          heavyDone++;
          return res.status;
        }),
    );
    await new Promise((r) => setTimeout(r, 50));
    const started = performance.now();
    await request(t.app).get('/api/v1/health').expect(200);
    const ms = performance.now() - started;
    const doneWhenHealthAnswered = heavyDone;
    const statuses = await Promise.all(heavy);
    // Loose bound: the point is that the health check does not wait for the diagrams.
    expect(ms).toBeLessThan(1000);
    expect(doneWhenHealthAnswered).toBe(0);
    expect(statuses).toEqual([200, 200]);
  });

  it('lets the work of a client that hung up run to its end on the same worker, and logs 499', async () => {
    const patient = createWorkerPool({ threads: 1, abandonGraceMs: 60_000 });
    const a = makeTestApp({ pool: patient });
    const server = a.app.listen(0, '127.0.0.1');
    try {
      await new Promise((r) => server.once('listening', r));
      const { port } = server.address() as AddressInfo;
      await request(a.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200); // the worker is up
      const hangUp = httpRequest({ host: '127.0.0.1', port, path: HEAVY_QUERY });
      hangUp.on('error', () => {});
      hangUp.end();
      await new Promise((r) => setTimeout(r, 50));
      hangUp.destroy();
      for (let i = 0; i < 100 && !a.logs.some((l) => l['status'] === 499); i++) await new Promise((r) => setTimeout(r, 20));
      expect(a.logs.find((l) => l['status'] === 499)).toMatchObject({ url: HEAVY_QUERY, aborted: true });
      // Queued behind the abandoned diagram on the one worker, which was not stopped.
      await request(a.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200);
      const health = await request(a.app).get('/api/v1/health').expect(200);
      expect(health.body.pool).toEqual({ mode: 'workers', workersStopped: 0 });
    } finally {
      server.close();
      await a.dispose();
      await patient.close();
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
