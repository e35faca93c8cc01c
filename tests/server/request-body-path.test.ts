import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * A spectrum sent as the raw request body has no file name: errors call it
 * "the request body", on /analyze and on /analyses alike, never a name the
 * service made up for storing it ("spectrum.txt", "spectrum.csv"; AUDIT2
 * finding 14). A multipart file keeps its own name.
 */
const readme = readFileSync(new URL('../../README.md', import.meta.url));
const binary = Buffer.from([0, 1, 2, 3, 255, 254, 0, 0, 9, 8]);

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

describe('the error path of a raw-body upload', () => {
  for (const route of ['/api/v1/analyze', '/api/v1/analyses']) {
    it(`${route}: text that is no spectrum, and a binary body, are "request body"`, async () => {
      const text = await request(t.app).post(`${route}?ion=Cr3%2B`).set('Content-Type', 'text/plain').send(readme).expect(400);
      expect(text.body.error.path).toBe('request body');
      const bytes = await request(t.app).post(`${route}?ion=Cr3%2B`).set('Content-Type', 'text/csv').send(binary).expect(415);
      expect(bytes.body.error.path).toBe('request body');
      expect(JSON.stringify([text.body, bytes.body])).not.toMatch(/spectrum\.(txt|csv)|<input>/);
    });

    it(`${route}: a multipart file is named by its own name`, async () => {
      const res = await request(t.app).post(`${route}?ion=Cr3%2B`).attach('spectrum', readme, { filename: 'notes.txt', contentType: 'text/plain' }).expect(400);
      expect(res.body.error.path).toBe('notes.txt');
    });
  }
});
