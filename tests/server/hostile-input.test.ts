/**
 * Requests that would cost far more than their size: deep JSON, numbers at
 * the ends of the double range, ten thousand bands, a huge declared body.
 * Each must be answered with a clear 4xx before any computation starts: the
 * pool here records every task it is given, so "refused at once" is checked
 * by what ran, not by a clock.
 */
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_FIT_BANDS } from '../../src/fit/band-count.js';
import { createInProcessPool, type ComputePool } from '../../server/pool.js';
import type { Task } from '../../server/tasks.js';
import { jsonDeeperThan, MAX_JSON_DEPTH } from '../../server/json-depth.js';
import { describeValue } from '../../server/errors.js';
import { makeTestApp, type TestApp } from './helpers.js';

const ran: Task[] = [];
function recordingPool(): ComputePool {
  const real = createInProcessPool();
  return { ...real, run: (task, options) => (ran.push(task), real.run(task, options)) };
}

let t: TestApp;
beforeAll(() => {
  t = makeTestApp({ pool: recordingPool() });
});
afterAll(async () => {
  await t.dispose();
});

function expectNoInternals(body: unknown): void {
  const text = JSON.stringify(body);
  expect(text).not.toMatch(/\bat \S+ \(|node_modules|\/work\/|\.ts:\d+|RangeError|stack/);
}

describe('deeply nested JSON', () => {
  const deepArray = (n: number) => `${'['.repeat(n)}${']'.repeat(n)}`;
  const deepObject = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`;

  it('answers 400 on every JSON route, for depths from 4 000 to 100 000', async () => {
    for (const n of [4_000, 100_000]) {
      for (const [method, path] of [['post', '/api/v1/fit'], ['post', '/api/v1/predict'], ['patch', '/api/v1/analyses/1']] as const) {
        for (const body of [deepArray(n), `{"ion":"Cr3+","bands":[17000,24000],"d":${deepObject(n)}}`]) {
          ran.length = 0;
          const res = await request(t.app)[method](path).type('application/json').send(body);
          expect(res.status, `${method} ${path} depth ${n}`).toBe(400);
          expect(res.body.error).toMatchObject({ code: 'invalid-argument', path: 'body' });
          expect(res.body.error.message).toContain(`${MAX_JSON_DEPTH} levels`);
          expectNoInternals(res.body);
          expect(ran).toEqual([]);
        }
      }
    }
    expect(t.logs.some((l) => l['msg'] === 'internal error')).toBe(false);
  });

  it('measures depth without recursion, and describes values without walking into them', () => {
    expect(jsonDeeperThan(JSON.parse(deepArray(1_000_000)), MAX_JSON_DEPTH)).toBe(true);
    // body 1, bands 2, a band 3, its flags 4.
    expect(jsonDeeperThan({ bands: [{ position: 1, flags: ['sh'] }] }, 4)).toBe(false);
    expect(jsonDeeperThan({ bands: [{ position: 1, flags: ['sh'] }] }, 3)).toBe(true);
    expect(describeValue(JSON.parse(deepArray(1_000_000)))).toBe('an array of 1 item');
    expect(describeValue('x'.repeat(100))).toMatch(/^"x+\.\.\.$/);
  });
});

describe('numbers at the ends of the range', () => {
  it.each([
    '/api/v1/levels?d=3&dq=1700&b=1e-150&c=2800',
    '/api/v1/levels?d=3&dq=1700&b=700&c=1e-150&cOverB=',
    '/api/v1/levels?d=3&dq=1e300&b=700&c=2800',
    '/api/v1/levels?d=3&dq=1700&b=1e300&c=2800',
    '/api/v1/levels?d=3&dq=1700&b=700&c=1e300',
    '/api/v1/levels?d=3&dq=1700&b=700&cOverB=1e300',
    '/api/v1/diagram?d=5&maxDqOverB=1e-300',
    '/api/v1/diagram?d=5&cOverB=1e300',
  ])('%s answers 400 naming the field, without computing', async (url) => {
    ran.length = 0;
    const res = await request(t.app).get(url);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid-argument');
    expect(res.body.error.message.startsWith(`${res.body.error.path}:`)).toBe(true);
    expectNoInternals(res.body);
    expect(ran).toEqual([]);
  });

  it('answers 400 for a fit with extreme positions or C, never 500', async () => {
    for (const body of [
      { ion: 'Cr3+', bands: [1e-300, 24600] },
      { ion: 'Cr3+', bands: [17400, 1e300] },
      { ion: 'Cr3+', bands: [17400, 24600], c: 1e300 },
    ]) {
      const res = await request(t.app).post('/api/v1/fit').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expectNoInternals(res.body);
    }
    // Meaningless but harmless: computed (or refused by the fit), never a server error.
    const tiny = await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands: [17400, 24600], cOverB: 1e-300 });
    expect(tiny.status).toBeLessThan(500);
  });

  it('answers 400 for an analysis with a concentration or path length no cuvette has', async () => {
    for (const [query, path] of [['conc=1e-300', 'conc'], ['conc=1e300', 'conc'], ['path=1e-300', 'path'], ['path=1e300', 'path'], ['c=1e300', 'c']]) {
      ran.length = 0;
      const res = await request(t.app).post(`/api/v1/analyze?ion=Cr3%2B&${query}`).type('text/csv').send('nm,A\n400,0.1\n500,0.2\n');
      expect(res.status, query).toBe(400);
      expect(res.body.error.path).toBe(path);
      expect(ran).toEqual([]);
    }
  });

  it('still computes at the edges of the accepted ranges', async () => {
    for (const url of ['/api/v1/levels?d=5&dq=10000&b=10&c=0', '/api/v1/levels?d=5&dq=0&b=5000&c=50000', '/api/v1/diagram?d=5&maxDqOverB=0.1&steps=10']) {
      await request(t.app).get(url).expect(200);
    }
  });
});

describe('band count', () => {
  it('refuses ten thousand bands at once, with the cap in the message', async () => {
    ran.length = 0;
    const bands = Array.from({ length: 10_000 }, (_, i) => 9000 + i);
    const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands }).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid-argument', path: 'bands' });
    expect(res.body.error.message).toContain(`at most ${MAX_FIT_BANDS} bands`);
    expect(res.body.error.message).toContain('10000 items');
    expect(ran).toEqual([]);
  });

  it('accepts the largest allowed list', async () => {
    ran.length = 0;
    const bands = [8000, 8900, 14000, 15000, 17400, 21000, 23000, 24600, 27000, 29000].slice(0, MAX_FIT_BANDS);
    const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands });
    expect(res.status).not.toBe(500);
    expect(ran).toHaveLength(1);
  });
});

describe('an oversized declared Content-Length', () => {
  it('is answered 413 before the body is sent, and the connection closed', async () => {
    const server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      const { port } = server.address() as AddressInfo;
      for (const path of ['/api/v1/analyze?ion=Cr3%2B', '/api/v1/fit']) {
        const answer = await new Promise<{ status: number; body: string; connection: string | undefined }>((resolve, reject) => {
          const req = httpRequest({
            host: '127.0.0.1',
            port,
            path,
            method: 'POST',
            headers: { 'content-type': path.endsWith('fit') ? 'application/json' : 'text/csv', 'content-length': String(10 * 1024 ** 3) },
          });
          req.on('response', (res) => {
            let body = '';
            res.on('data', (chunk: Buffer) => (body += chunk.toString()));
            res.on('end', () => resolve({ status: res.statusCode ?? 0, body, connection: res.headers.connection }));
          });
          req.on('error', reject);
          // Headers only: the body never comes. The answer must not wait for it.
          req.flushHeaders();
        });
        expect(answer.status).toBe(413);
        expect(answer.connection).toBe('close');
        expect(JSON.parse(answer.body).error.code).toBe('too-large');
      }
    } finally {
      server.close();
      server.closeAllConnections();
    }
  });
});
