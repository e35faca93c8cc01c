import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * A request with several bad fields names every one of them (AUDIT2
 * finding 12: "conc: must be > 0, got -0.1 (and 1 more problem)" left the
 * user to guess the other): in the message, and in the body as `problems`,
 * each with its field.
 */
// The invented demo scenario's spectrum, as upload content only.
const aqua = readFileSync(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

describe('several problems in one request', () => {
  it('GET /levels: every bad field, each with its path', async () => {
    const res = await request(t.app).get('/api/v1/levels?d=6&dq=abc&b=-3').expect(400);
    const error = res.body.error as { code: string; message: string; path: string; problems: Array<{ path: string; message: string }> };
    expect(error.code).toBe('invalid-argument');
    expect(error.message).not.toContain('more problem');
    const paths = error.problems.map((p) => p.path);
    expect(paths).toContain('dq');
    expect(paths).toContain('b');
    for (const p of error.problems) {
      expect(p.message.startsWith(`${p.path}:`)).toBe(true);
      expect(error.message).toContain(p.message);
    }
    expect(error.path).toBe(paths[0]);
  });

  it('POST /analyze with two bad options names both', async () => {
    const res = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B&conc=-0.1&path=x').set('Content-Type', 'text/csv').send(aqua).expect(400);
    expect(res.body.error.message).toMatch(/conc: must be > 0, got -0\.1/);
    expect(res.body.error.message).toMatch(/path: /);
    expect(res.body.error.problems.map((p: { path: string }) => p.path)).toEqual(['conc', 'path']);
  });

  it('one problem (zod\'s two on one field count once): the body is as before, without `problems`', async () => {
    const res = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B&conc=-0.1').set('Content-Type', 'text/csv').send(aqua).expect(400);
    expect(res.body.error.message).toBe('conc: must be > 0, got -0.1');
    expect(Object.keys(res.body.error).sort()).toEqual(['code', 'message', 'path']);
  });
});
