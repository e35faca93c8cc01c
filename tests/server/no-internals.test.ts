/**
 * No answer of the service carries a stack trace, an internal message or a
 * server path, whatever the request: a sweep of malformed and hostile
 * requests over every route, each checked for frames ("at f (file:1:2)"),
 * absolute paths and the names of internal errors.
 */
import { tmpdir } from 'node:os';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './helpers.js';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

const INTERNALS = [/\bat \S+ \(/, /\s+at \S+:\d+:\d+/, /node_modules/, /\/(work|home|tmp|usr|root)\//, /\.ts:\d+/, /RangeError|TypeError|ReferenceError|SyntaxError: Unexpected end/, /sqlite/i];
const BOMB = '##TITLE=b\n##JCAMP-DX=4.24\n##XYDATA=(X++(Y..Y))\n1 1s99999999\n##END=\n';

type Req = (a: TestApp['app']) => request.Test;
const CASES: Array<[string, Req]> = [
  ['broken JSON', (a) => request(a).post('/api/v1/fit').type('application/json').send('{"ion": "Cr3+", "bands": [1,')],
  ['JSON of the wrong type', (a) => request(a).post('/api/v1/fit').type('application/json').send('"just a string"')],
  ['deep JSON', (a) => request(a).post('/api/v1/predict').type('application/json').send('['.repeat(50_000) + ']'.repeat(50_000))],
  ['wrong content type', (a) => request(a).post('/api/v1/fit').type('application/xml').send('<x/>')],
  ['bad percent-encoding', (a) => request(a).get('/api/v1/analyses/%E0%A4%A')],
  ['an id too large', (a) => request(a).get('/api/v1/analyses/99999999999999999999999')],
  ['an unknown route', (a) => request(a).get('/api/v1/../../etc/passwd')],
  ['a DUP bomb', (a) => request(a).post('/api/v1/analyze?ion=Cr3%2B').type('chemical/x-jcamp-dx').send(BOMB)],
  ['binary garbage as a spectrum', (a) => request(a).post('/api/v1/analyze?ion=Cr3%2B').type('application/octet-stream').send(Buffer.from([0, 255, 1, 254, 0, 0, 7]))],
  ['a multipart body without its boundary', (a) => request(a).post('/api/v1/analyze').set('content-type', 'multipart/form-data').send('--x\r\nContent-Disposition: form-data; name="spectrum"\r\n\r\n1,2\r\n')],
  ['a truncated multipart body', (a) => request(a).post('/api/v1/analyses').set('content-type', 'multipart/form-data; boundary=x').send('--x\r\nContent-Disposition: form-data; name="spectrum"; filename="a.csv"\r\n\r\n1,2')],
  ['a patch of the wrong shape', (a) => request(a).patch('/api/v1/analyses/1').send({ sample: { nested: [1, 2, 3] } })],
  ['extreme levels', (a) => request(a).get('/api/v1/levels?d=3&dq=1e308&b=1e-308&c=1e308')],
  ['a refit of nothing', (a) => request(a).post('/api/v1/analyses/12345/refit?ion=Zz9%2B')],
  ['a foreign Host', (a) => request(a).get('/api/v1/health').set('Host', 'evil.example')],
  ['a foreign Origin', (a) => request(a).delete('/api/v1/analyses/1').set('Origin', 'http://evil.example')],
];

describe('no internals in any answer', () => {
  it.each(CASES)('%s', async (_what, send) => {
    const res = await send(t.app);
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    const text = res.text;
    for (const pattern of INTERNALS) expect(text).not.toMatch(pattern);
    expect(text).not.toContain(tmpdir());
    expect(JSON.parse(text)).toMatchObject({ error: { code: expect.any(String), message: expect.any(String), path: expect.any(String) } });
  });

  it('logged no internal error for any of them', () => {
    expect(t.logs.filter((l) => l['msg'] === 'internal error')).toEqual([]);
  });
});
