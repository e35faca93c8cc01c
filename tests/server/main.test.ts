/**
 * Listening and stopping: the real HTTP server on a free loopback port,
 * graceful close with a request in flight, a clear error for a busy port,
 * and SIGTERM on a real process.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { RequestAbortedError } from '../../server/errors.js';
import { startServer, type RunningServer } from '../../server/main.js';
import type { ComputePool } from '../../server/pool.js';
import { startServeProcess } from '../helpers/serve-process.js';
import { captureLogger } from './helpers.js';

const silent = pino({ level: 'silent' });
let dataDir: string;
beforeAll(() => {
  dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-main-test-'));
});
afterAll(() => {
  rmSync(dataDir, { recursive: true, force: true });
});

/**
 * A pool whose every task waits for the test: `entered` resolves when a task
 * reaches it, `release()` answers it, and an abort of its signal (the client
 * left) rejects it and resolves `dropped`. The tests wait on these events,
 * never on a clock.
 */
function gatePool(): ComputePool & { entered: Promise<void>; dropped: Promise<void>; release(): void } {
  let enter: () => void = () => {};
  let drop: () => void = () => {};
  let answer: () => void = () => {};
  const entered = new Promise<void>((r) => (enter = r));
  const dropped = new Promise<void>((r) => (drop = r));
  const released = new Promise<void>((r) => (answer = r));
  return {
    mode: 'workers',
    workersStopped: () => 0,
    close: async () => {},
    entered,
    dropped,
    release: () => answer(),
    run: (task, { signal } = {}) =>
      new Promise((resolve, reject) => {
        enter();
        signal?.addEventListener('abort', () => {
          drop();
          reject(new RequestAbortedError());
        });
        void released.then(() => resolve({ task: task.kind }));
      }),
  };
}

describe('startServer', () => {
  it('listens on loopback by default and stops gracefully, finishing a request in flight', async () => {
    const pool = gatePool();
    const running: RunningServer = await startServer({ port: 0, logger: silent, staticDir: false, dataDir, pool });
    expect(running.url).toBe(`http://127.0.0.1:${running.port}/`);
    expect(running.token).toBeUndefined();
    const health = await fetch(`${running.url}api/v1/health`);
    expect(health.status).toBe(200);
    const inFlight = fetch(`${running.url}api/v1/diagram?d=5&maxDqOverB=20&steps=2000`);
    await pool.entered;
    const closed = running.close();
    pool.release();
    const res = await inFlight;
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ task: 'diagram' });
    await closed;
    await expect(fetch(`${running.url}api/v1/health`)).rejects.toThrow();
  });

  it('logs a request whose client left as 499 and drops its work', async () => {
    const { logger, logs, waitForLog } = captureLogger();
    const pool = gatePool();
    const running = await startServer({ port: 0, logger, staticDir: false, dataDir, pool });
    try {
      const leaving = new AbortController();
      const request = fetch(`${running.url}api/v1/diagram?d=5&maxDqOverB=20&steps=2000`, { signal: leaving.signal });
      await pool.entered;
      leaving.abort();
      await expect(request).rejects.toThrow();
      await pool.dropped;
      expect(await waitForLog((l) => l['aborted'] === true)).toMatchObject({ method: 'GET', status: 499 });
      expect(logs.some((l) => l['msg'] === 'internal error')).toBe(false);
    } finally {
      await running.close();
    }
  });

  it('beyond loopback, makes a token and refuses requests without it', async () => {
    const running = await startServer({ port: 0, host: '0.0.0.0', logger: silent, staticDir: false, dataDir, pool: 'in-process' });
    try {
      expect(running.token).toMatch(/^[\w-]{40,}$/);
      expect(running.url).not.toContain('0.0.0.0');
      const base = `http://127.0.0.1:${running.port}/api/v1/analyses`;
      expect((await fetch(base)).status).toBe(401);
      expect((await fetch(base, { headers: { authorization: `Bearer ${running.token}` } })).status).toBe(200);
      // Health answers a proxy's check without a token, but only status and reachability (issue 17, audit).
      const health = `http://127.0.0.1:${running.port}/api/v1/health`;
      expect(await (await fetch(health)).json()).toEqual({ status: 'ok', library: { reachable: true } });
    } finally {
      await running.close();
    }
  });

  it('says which option to change when the port is taken', async () => {
    const first = await startServer({ port: 0, logger: silent, staticDir: false, dataDir, pool: 'in-process' });
    try {
      const error = await startServer({ port: first.port, logger: silent, staticDir: false, dataDir, pool: 'in-process' }).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).path).toBe('--port');
      expect((error as FieldgapError).message).toContain(String(first.port));
    } finally {
      await first.close();
    }
  });
});

describe('server/main.ts as a process', () => {
  it('prints its URL, serves, and exits 0 on SIGTERM', async () => {
    const main = fileURLToPath(new URL('../../server/main.ts', import.meta.url));
    // Waits for the URL line, or for the process to end without one (no clock: a slow start is not a failure).
    const serve = await startServeProcess([process.execPath, '--import', 'tsx', main, '--port', '0', '--data', dataDir], {
      env: { ...process.env, FIELDGAP_LOG_LEVEL: 'info' },
    });
    const url = serve.url;
    expect(url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
    const res = await fetch(`${url}api/v1/health`);
    expect(res.status).toBe(200);
    expect(await serve.stop()).toBe(0);
    expect(serve.stderr).toContain('SIGTERM');
    expect(serve.stderr).toContain('stopped');
    // One JSON log line per request, with the fields the brief names.
    const line = serve.stdout
      .split('\n')
      .filter((l) => l.startsWith('{'))
      .map((l) => JSON.parse(l) as Record<string, unknown>)
      .find((l) => l['url'] === '/api/v1/health');
    expect(line).toMatchObject({ method: 'GET', status: 200 });
    expect(typeof line?.['ms']).toBe('number');
  });
});
