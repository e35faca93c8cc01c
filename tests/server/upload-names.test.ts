/**
 * Uploaded file names are decoded as UTF-8, as browsers send them: a name
 * with an en dash, Greek letters or accents comes back as written in
 * the stored record, not as latin1 mojibake.
 */
import { readFileSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from './helpers.js';

// The invented demo scenario's spectrum, as upload content only.
const aqua = readFileSync(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));
const NAME = 'Cr–aqua μ-β Müller.csv';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

describe('uploaded file names', () => {
  it('are read as UTF-8 and stored as written', async () => {
    const saved = await request(t.app).post('/api/v1/analyses?ion=Cr3%2B&conc=0.05').attach('spectrum', aqua, { filename: NAME, contentType: 'text/csv' }).expect(201);
    const record = await request(t.app).get(`/api/v1/analyses/${saved.body.id}`).expect(200);
    expect(record.body.original.fileName).toBe(NAME);
  });
});
