/**
 * The pool's scheduling, driven by events the test controls: "slow" tasks
 * hold their worker until released (fixtures/hold-worker.ts) and the time
 * limit runs on a hand-driven clock, so nothing here depends on the
 * machine's speed. Checked: a cheap request is answered while two slow ones
 * run; the time limit counts running time, not time in the queue; a full
 * queue is answered 503 with Retry-After.
 */
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { ServiceBusyError } from '../../server/errors.js';
import { createWorkerPool, type PoolClock, type WorkerPoolOptions } from '../../server/pool.js';
import { isQuickTask } from '../../server/task-cost.js';
import type { Task } from '../../server/tasks.js';
import { makeTestApp } from './helpers.js';

const HOLD_WORKER = { filename: new URL('./fixtures/hold-worker.ts', import.meta.url).href, execArgv: ['--import', 'tsx'] };
const LEVELS: Task = { kind: 'levels', input: { d: 2, geometry: 'tetrahedral', dq: 400, b: 700, c: 2800 } };

/** A task that holds a worker until release() (see fixtures/hold-worker.ts). */
function holdTask(): { task: Task; release: () => void } {
  const latch = new Int32Array(new SharedArrayBuffer(4));
  return {
    task: { kind: 'hold', input: { latch } } as unknown as Task,
    release: () => {
      Atomics.store(latch, 0, 1);
      Atomics.notify(latch, 0);
    },
  };
}

/** A clock the test runs by hand: timers fire only when fire() is called. */
function manualClock(): PoolClock & { fire(): void; pending(): number[]; armed: number[] } {
  const timers = new Map<number, { callback: () => void; ms: number }>();
  let next = 1;
  const armed: number[] = [];
  return {
    armed,
    setTimeout(callback, ms) {
      armed.push(ms);
      timers.set(next, { callback, ms });
      return next++;
    },
    clearTimeout(handle) {
      timers.delete(handle as number);
    },
    fire() {
      for (const [id, timer] of [...timers]) {
        timers.delete(id);
        timer.callback();
      }
    },
    pending: () => [...timers.values()].map((t) => t.ms),
  };
}

function pool(options: WorkerPoolOptions) {
  return createWorkerPool({ worker: HOLD_WORKER, ...options });
}

/** Runs a hold task and resolves `started` when a worker has it. */
function startHold(p: ReturnType<typeof pool>, options: { timeoutMs?: number } = {}) {
  const hold = holdTask();
  let markStarted: () => void = () => {};
  const started = new Promise<void>((resolve) => (markStarted = resolve));
  const result = p.run(hold.task, { ...options, onStart: markStarted }).then(
    (value) => ({ ok: true as const, value }),
    (error: unknown) => ({ ok: false as const, error }),
  );
  return { ...hold, started, result };
}

describe('pool lanes', () => {
  it('answers a cheap request, over HTTP too, while two slow ones hold every general worker', async () => {
    const p = pool({ threads: 2, quickThreads: 1 });
    const t = makeTestApp({ pool: p });
    const slow = [startHold(p), startHold(p)];
    try {
      await Promise.all(slow.map((s) => s.started));
      let slowDone = 0;
      for (const s of slow) void s.result.then(() => slowDone++);
      expect(((await p.run(LEVELS)) as { d: number }).d).toBe(2);
      const res = await request(t.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200);
      expect(res.body.d).toBe(3);
      await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands: [17400, 24600] }).expect(200);
      // Both slow tasks were still holding their workers when the cheap answers came.
      expect(slowDone).toBe(0);
    } finally {
      for (const s of slow) s.release();
      await Promise.all(slow.map((s) => s.result));
      await t.dispose();
      await p.close();
    }
    for (const s of slow) expect(await s.result).toEqual({ ok: true, value: 'released' });
  });

  it('lets quick tasks use a free general worker, and their own lane only when the general ones are taken', async () => {
    // Every task counts as quick here: the first takes the idle general worker, the second the quick lane; both start.
    const p = pool({ threads: 1, quickThreads: 1, isQuick: () => true });
    const first = startHold(p);
    const second = startHold(p);
    try {
      await Promise.all([first.started, second.started]);
    } finally {
      first.release();
      second.release();
      await Promise.all([first.result, second.result]);
      await p.close();
    }
    expect(await first.result).toEqual({ ok: true, value: 'released' });
  });

  it('sends levels, small diagrams and short fits to the quick lane, analyses and long work to the general one', () => {
    expect(isQuickTask(LEVELS)).toBe(true);
    expect(isQuickTask({ kind: 'diagram', input: { d: 5, geometry: 'octahedral', cOverB: 4.5, maxDqOverB: 4, steps: 200 } })).toBe(true);
    expect(isQuickTask({ kind: 'diagram', input: { d: 5, geometry: 'octahedral', cOverB: 4.5, maxDqOverB: 20, steps: 2000 } })).toBe(false);
    expect(isQuickTask({ kind: 'fit', input: { ion: 'Cr3+', bands: [17400, 24600] } })).toBe(true);
    expect(isQuickTask({ kind: 'fit', input: { ion: 'Co2+', bands: [8000, 9000, 16000, 17000, 19500] } })).toBe(false);
    expect(isQuickTask({ kind: 'analyze', input: { content: 'x', options: {} } })).toBe(false);
  });

  it('counts running time only: a task waiting in the queue has no timer; one running over its limit is stopped', async () => {
    const clock = manualClock();
    const p = pool({ threads: 1, quickThreads: 0, clock });
    const first = startHold(p);
    try {
      await first.started;
      let queuedStarted = false;
      const queued = p.run(LEVELS, { timeoutMs: 100, onStart: () => (queuedStarted = true) });
      // However long it waits, the queued task has no timer running: firing the clock changes nothing.
      expect(clock.pending()).toEqual([]);
      clock.fire();
      expect(queuedStarted).toBe(false);
      first.release();
      expect(((await queued) as { d: number }).d).toBe(2);
      expect(queuedStarted).toBe(true);
      expect(clock.armed).toEqual([100]);
      expect(clock.pending()).toEqual([]);

      // A running task over its limit: stopped with the timeout error, its worker replaced.
      const over = startHold(p, { timeoutMs: 250 });
      await over.started;
      expect(clock.pending()).toEqual([250]);
      clock.fire();
      const outcome = await over.result;
      over.release();
      expect(outcome.ok).toBe(false);
      const error = (outcome as { error: unknown }).error;
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).message).toMatch(/limit of 250 ms/);
      expect(p.workersStopped()).toBe(1);
      expect(((await p.run(LEVELS)) as { d: number }).d).toBe(2);
    } finally {
      first.release();
      await first.result;
      await p.close();
    }
  });

  it('refuses work beyond the queue bound at once: ServiceBusyError, 503 with Retry-After over HTTP', async () => {
    const p = pool({ threads: 1, maxQueue: 1, quickThreads: 1 });
    const t = makeTestApp({ pool: p });
    const running = startHold(p);
    const waiting = holdTask();
    const queued = p.run(waiting.task).catch((e: unknown) => e);
    try {
      await running.started;
      const refused = await p.run(holdTask().task).catch((e: unknown) => e);
      expect(refused).toBeInstanceOf(ServiceBusyError);
      const res = await request(t.app).get('/api/v1/diagram?d=5&cOverB=4.5&maxDqOverB=20&steps=2000').expect(503);
      expect(res.headers['retry-after']).toMatch(/^\d+$/);
      expect(res.body.error.message).toMatch(/busy/);
      // The quick lane still answers.
      await request(t.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(200);
    } finally {
      running.release();
      waiting.release();
      await Promise.all([running.result, queued]);
      await t.dispose();
      await p.close();
    }
  });
});
