/**
 * Listening and stopping: the real HTTP server on a free loopback port,
 * graceful close with a request in flight, a clear error for a busy port,
 * and SIGTERM on a real process.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { startServer, type RunningServer } from '../../server/main.js';
import { captureLogger } from './helpers.js';

const silent = pino({ level: 'silent' });
let dataDir: string;
beforeAll(() => {
  dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-main-test-'));
});
afterAll(() => {
  rmSync(dataDir, { recursive: true, force: true });
});

describe('startServer', () => {
  it('listens on loopback by default and stops gracefully, finishing a request in flight', async () => {
    const running: RunningServer = await startServer({ port: 0, logger: silent, staticDir: false, dataDir });
    expect(running.url).toBe(`http://127.0.0.1:${running.port}/`);
    const health = await fetch(`${running.url}api/v1/health`);
    expect(health.status).toBe(200);
    const inFlight = fetch(`${running.url}api/v1/diagram?d=5&maxDqOverB=20&steps=2000`);
    await new Promise((r) => setTimeout(r, 50));
    const closed = running.close();
    const res = await inFlight;
    expect(res.status).toBe(200);
    await closed;
    await expect(fetch(`${running.url}api/v1/health`)).rejects.toThrow();
  });

  it('logs a request whose client left as 499 and drops its work', async () => {
    const { logger, logs } = captureLogger();
    const running = await startServer({ port: 0, logger, staticDir: false, dataDir });
    try {
      await expect(fetch(`${running.url}api/v1/diagram?d=5&maxDqOverB=20&steps=2000`, { signal: AbortSignal.timeout(100) })).rejects.toThrow();
      for (let i = 0; i < 100 && !logs.some((l) => l['aborted'] === true); i++) await new Promise((r) => setTimeout(r, 20));
      expect(logs.find((l) => l['aborted'] === true)).toMatchObject({ method: 'GET', status: 499 });
      expect(logs.some((l) => l['msg'] === 'internal error')).toBe(false);
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
    const child = spawn(process.execPath, ['--import', 'tsx', main, '--port', '0', '--data', dataDir], {
      env: { ...process.env, FIELDGAP_LOG_LEVEL: 'info' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    const url = await new Promise<string>((resolveUrl, rejectUrl) => {
      const timer = setTimeout(() => rejectUrl(new Error(`no URL printed; stderr: ${stderr}`)), 20_000);
      child.stdout.on('data', (chunk: Buffer) => {
        stdout += chunk.toString();
        const match = /serving on (http:\/\/127\.0\.0\.1:\d+\/)/.exec(stdout);
        if (match) {
          clearTimeout(timer);
          resolveUrl(match[1]!);
        }
      });
    });
    const res = await fetch(`${url}api/v1/health`);
    expect(res.status).toBe(200);
    const exit = new Promise<number | null>((resolveExit) => child.on('exit', (code) => resolveExit(code)));
    child.kill('SIGTERM');
    expect(await exit).toBe(0);
    expect(stderr).toContain('SIGTERM');
    expect(stderr).toContain('stopped');
    // One JSON log line per request, with the fields the brief names.
    const line = stdout
      .split('\n')
      .filter((l) => l.startsWith('{'))
      .map((l) => JSON.parse(l) as Record<string, unknown>)
      .find((l) => l['url'] === '/api/v1/health');
    expect(line).toMatchObject({ method: 'GET', status: 200 });
    expect(typeof line?.['ms']).toBe('number');
  });
});
