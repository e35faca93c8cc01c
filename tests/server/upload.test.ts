/**
 * POST /api/v1/analyze: the spectrum as a multipart upload or a raw body,
 * options as query or form fields, and every way an upload can be wrong.
 * The spectra are the invented demo files of spectra-demo/ and the parser
 * fixtures; results are compared with analyzeSpectrum called directly.
 */
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum, type AnalyzeOptions } from '../../src/analysis.js';
import { analyzeResponse, errorResponse } from '../../server/responses.js';
import { makeTestApp, type TestApp } from './helpers.js';

const demo = (name: string) => readFileSync(new URL(`../../spectra-demo/${name}`, import.meta.url));
const aqua = demo('cr-aqua.csv');
const json = (value: unknown) => JSON.parse(JSON.stringify(value)) as unknown;
const direct = (content: Buffer, options: AnalyzeOptions) => json(analyzeSpectrum(content, options));

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

describe('POST /api/v1/analyze: happy paths', () => {
  it('takes a raw CSV body with options in the query, as analyzeSpectrum does', async () => {
    const res = await request(t.app)
      .post('/api/v1/analyze?ion=Cr3%2B&conc=0.05&path=1')
      .set('content-type', 'text/csv')
      .send(aqua)
      .expect(200);
    expect(res.body).toEqual(direct(aqua, { ion: 'Cr3+', concentration: 0.05, pathLength: 1, fileName: 'request body' }));
    analyzeResponse.parse(res.body);
  });
  it('takes a multipart upload with options as form fields, keeping the file name', async () => {
    const res = await request(t.app)
      .post('/api/v1/analyze')
      .field('ion', 'Cr3+')
      .field('conc', '0.05')
      .field('curves', 'true')
      .attach('spectrum', aqua, { filename: 'cr-aqua.csv', contentType: 'text/csv' })
      .expect(200);
    expect(res.body).toEqual(direct(aqua, { ion: 'Cr3+', concentration: 0.05, curves: true, fileName: 'cr-aqua.csv' }));
    expect(res.body.curves.grid.length).toBeGreaterThan(0);
  });
  it('reads JCAMP-DX sent as chemical/x-jcamp-dx', async () => {
    const jdx = demo('cr-ammine.jdx');
    const res = await request(t.app)
      .post('/api/v1/analyze?d=3&geometry=octahedral')
      .set('content-type', 'chemical/x-jcamp-dx')
      .send(jdx)
      .expect(200);
    expect(res.body).toEqual(direct(jdx, { d: 3, geometry: 'octahedral', fileName: 'request body' }));
  });
});

describe('POST /api/v1/analyze: errors', () => {
  it('400 for a file that is not a spectrum, with the position in the named file', async () => {
    const res = await request(t.app)
      .post('/api/v1/analyze?ion=Cr3%2B')
      .attach('spectrum', Buffer.from('hello\nworld\n'), { filename: 'notes.csv', contentType: 'text/csv' })
      .expect(400);
    const { error } = errorResponse.parse(res.body);
    expect(error.code).toBe('parse-error');
    expect(error.path).toContain('notes.csv');
  });
  it('400 naming the field for a bad option, a missing metal, or a missing spectrum', async () => {
    const junk = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B&conc=abc').set('content-type', 'text/csv').send(aqua).expect(400);
    expect(junk.body.error).toMatchObject({ code: 'invalid-argument', path: 'conc' });
    const unknown = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B&concentration=0.1').set('content-type', 'text/csv').send(aqua).expect(400);
    expect(unknown.body.error.path).toBe('concentration');
    const noMetal = await request(t.app).post('/api/v1/analyze').set('content-type', 'text/csv').send(aqua).expect(400);
    expect(noMetal.body.error.path).toBe('ion');
    const nothing = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').expect(400);
    expect(nothing.body.error.path).toBe('spectrum');
    const wrongField = await request(t.app)
      .post('/api/v1/analyze?ion=Cr3%2B')
      .attach('file', aqua, { filename: 'cr-aqua.csv' })
      .expect(400);
    expect(wrongField.body.error).toMatchObject({ code: 'invalid-argument', path: 'file' });
    const empty = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').attach('spectrum', Buffer.alloc(0), { filename: 'e.csv' }).expect(400);
    expect(empty.body.error.path).toBe('spectrum');
  });
  it('413 for an upload over the limit, raw or multipart', async () => {
    const small = makeTestApp({ maxBodyBytes: 4096 });
    try {
      const raw = await request(small.app).post('/api/v1/analyze?ion=Cr3%2B').set('content-type', 'text/csv').send(aqua).expect(413);
      expect(raw.body.error).toMatchObject({ code: 'too-large', path: 'body' });
      expect(raw.body.error.message).toContain('4096 bytes');
      const form = await request(small.app).post('/api/v1/analyze?ion=Cr3%2B').attach('spectrum', aqua, { filename: 'cr-aqua.csv' }).expect(413);
      expect(form.body.error).toMatchObject({ code: 'too-large', path: 'spectrum' });
    } finally {
      await small.dispose();
    }
  });
  it('415 for a content type that is not a spectrum upload', async () => {
    const asJson = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').send({ spectrum: [1, 2, 3] }).expect(415);
    expect(asJson.body.error).toMatchObject({ code: 'unsupported-format', path: 'Content-Type' });
    await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').set('content-type', 'image/png').send(Buffer.from([0x89, 0x50])).expect(415);
  });
  it('422 when the bands found fit no model of the ion given', async () => {
    const res = await request(t.app).post('/api/v1/analyze?d=1').set('content-type', 'text/csv').send(aqua).expect(422);
    expect(res.body.error.code).toBe('unexplained');
  });
});

describe('POST /api/v1/analyze: the name errors give the upload (AUDIT2 finding 14)', () => {
  it('a raw body is "request body", never a name the user did not give', async () => {
    const text = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').set('content-type', 'text/plain').send('no numbers here\njust words\n').expect(400);
    expect(text.body.error.path).toBe('request body');
    const binary = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').set('content-type', 'text/plain').send(Buffer.from([0, 1, 2, 255, 254, 0, 0, 9, 9])).expect(415);
    expect(binary.body.error.path).toBe('request body');
    expect(JSON.stringify([text.body, binary.body])).not.toMatch(/spectrum\.txt|<input>/);
  });
  it('a multipart upload is named by its file name', async () => {
    const res = await request(t.app).post('/api/v1/analyze?ion=Cr3%2B').attach('spectrum', Buffer.from('no numbers here\n'), { filename: 'mine.csv', contentType: 'text/csv' }).expect(400);
    expect(res.body.error.path).toBe('mine.csv');
  });
});
