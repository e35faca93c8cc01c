import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { analysisRecordResponse } from '../../server/responses.js';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * Issue 18 item 2: a stored analysis is described fully, its options too
 * (the core's AnalyzeOptions, no bare object), and a real record's every
 * options field is one the document describes. The demo spectrum is
 * invented; no number here is a check value.
 */
const AQUA = fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));

interface Schema { $ref?: string; properties?: Record<string, Schema>; anyOf?: Schema[]; allOf?: Schema[]; items?: Schema }
let t: TestApp | undefined;
afterEach(async () => {
  await t?.dispose();
  t = undefined;
});

describe('stored options in the OpenAPI document', () => {
  it('list every analysis option by its stored name, and a real record uses only those', async () => {
    t = makeTestApp();
    const { app } = t;
    const doc = (await request(app).get('/api/v1/openapi.json').expect(200)).body as { components: { schemas: Record<string, Schema> } };
    const resolve = (s: Schema): Schema => (s.$ref ? resolve(doc.components.schemas[s.$ref.split('/').pop()!]!) : s.allOf?.length === 1 ? resolve(s.allOf[0]!) : s);
    const record = resolve(doc.components.schemas['AnalysisRecord']!);
    const options = resolve(record.properties!['options']!);
    const described = Object.keys(options.properties ?? {});
    expect(described).toEqual(expect.arrayContaining(['ion', 'd', 'geometry', 'concentration', 'pathLength', 'xUnit', 'column', 'cOverB', 'c', 'freeC', 'corrections', 'formula', 'ligands']));
    const revision = resolve(resolve(record.properties!['revisions']!).items!);
    expect(Object.keys(resolve(revision.properties!['options']!).properties ?? {})).toEqual(described);

    // Corrected bands here; a chosen alternative is checked against the schema in tests/storage/chosen-alternative.test.ts.
    const corrections = encodeURIComponent(JSON.stringify({ bands: [{ position: 17_400 }, { position: 24_500, uncertainty: 80 }] }));
    const saved = await request(app)
      .post(`/api/v1/analyses?ion=Cr3%2B&sample=demo&conc=0.05&path=1&xUnit=nm&cOverB=4.2&corrections=${corrections}`)
      .type('text/csv')
      .send(readFileSync(AQUA));
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(analysisRecordResponse.safeParse(saved.body).error).toBeUndefined();
    expect(Object.keys(saved.body.options).filter((k) => !described.includes(k))).toEqual([]);
    expect(saved.body.options).toMatchObject({ concentration: 0.05, cOverB: 4.2 });
    // The schema is not a bare object: a wrong type in a described field is refused.
    const wrong = { ...saved.body, options: { ...saved.body.options, concentration: 'a lot' } };
    expect(analysisRecordResponse.safeParse(wrong).success).toBe(false);
  });
});
