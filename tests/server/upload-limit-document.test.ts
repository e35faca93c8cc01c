/**
 * The upload limit a page or program reads before it sends a file: the
 * OpenAPI document's info['x-fieldgap-limits'] states the limit this app
 * enforces (one source: the app's options), and a body one byte over it is
 * refused while one at it is analysed.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './helpers.js';

/** A small limit, so the files here stay small; the default (10 MiB) is checked in the second app. */
const LIMIT = 4096;

let small: TestApp;
let plain: TestApp;
beforeAll(() => {
  small = makeTestApp({ maxBodyBytes: LIMIT });
  plain = makeTestApp();
});
afterAll(async () => {
  await small.dispose();
  await plain.dispose();
});

interface Limits {
  maxUploadBytes: number;
  maxJsonBytes: number;
  requestTimeoutMs: number;
}

async function documentedLimits(t: TestApp): Promise<Limits> {
  const res = await request(t.app).get('/api/v1/openapi.json').expect(200);
  return (res.body as { info: { 'x-fieldgap-limits': Limits } }).info['x-fieldgap-limits'];
}

/** A CSV of exactly `bytes` bytes: a header, then rows, padded with a comment line. */
function csvOfSize(bytes: number): Buffer {
  const rows = ['nm,absorbance'];
  for (let nm = 380; nm <= 780; nm += 5) rows.push(`${nm},${(0.1 + 0.05 * Math.sin(nm / 40)).toFixed(2)}`);
  const body = `${rows.join('\n')}\n`;
  const pad = bytes - body.length - 2;
  if (pad < 0) throw new Error('csvOfSize: too small');
  return Buffer.from(`#${' '.repeat(pad)}\n${body}`);
}

describe('the documented upload limit', () => {
  it('is the default 10 MiB, JSON 1 MiB and 10 s without options', async () => {
    expect(await documentedLimits(plain)).toEqual({ maxUploadBytes: 10 * 1024 * 1024, maxJsonBytes: 1024 * 1024, requestTimeoutMs: 10_000 });
  });
  it('follows maxBodyBytes, and the service enforces exactly that number', async () => {
    const { maxUploadBytes } = await documentedLimits(small);
    expect(maxUploadBytes).toBe(LIMIT);
    const at = csvOfSize(maxUploadBytes);
    const over = csvOfSize(maxUploadBytes + 1);
    expect(at.length).toBe(LIMIT);
    await request(small.app).post('/api/v1/analyze?d=3').attach('spectrum', at, 'at-limit.csv').expect((res) => expect(res.status).not.toBe(413));
    const refused = await request(small.app).post('/api/v1/analyze?d=3').attach('spectrum', over, 'over-limit.csv').expect(413);
    expect((refused.body as { error: { code: string } }).error.code).toBe('too-large');
  });
});
