import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { analysisRecordResponse, listPageResponse } from '../../server/responses.js';
import { fitBands } from '../../src/fit/index.js';
import { makeTestApp, type TestApp } from './helpers.js';

/**
 * The documented answer shapes (issue 18 item 2): the library's answers are
 * described field by field in the OpenAPI document (no bare object), real
 * answers parse with those schemas, and β's uncertainty comes from the core.
 * The demo spectrum is invented; no number here is checked against the outside world.
 */
const AQUA = fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));

let t: TestApp | undefined;
afterEach(async () => {
  await t?.dispose();
  t = undefined;
});

describe('library answers', () => {
  it('are described field by field in the OpenAPI document and real answers parse with those schemas', async () => {
    t = makeTestApp();
    const { app } = t;
    const doc = (await request(app).get('/api/v1/openapi.json').expect(200)).body as {
      paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: { $ref?: string; type?: string } }> }> }>>;
      components: { schemas: Record<string, { properties?: Record<string, unknown> }> };
    };
    const got = doc.paths['/api/v1/analyses/{id}']!['get']!.responses['200']!.content!['application/json']!.schema;
    expect(got.$ref).toBe('#/components/schemas/AnalysisRecord');
    const record = doc.components.schemas['AnalysisRecord']!;
    expect(Object.keys(record.properties ?? {})).toEqual(expect.arrayContaining(['id', 'sample', 'summary', 'result', 'revisions', 'options']));
    expect(Object.keys(doc.components.schemas['FitResult']!.properties ?? {})).toEqual(expect.arrayContaining(['betaSd', 'correlation', 'penalties', 'crossover', 'notes']));

    const saved = await request(app).post('/api/v1/analyses?ion=Cr3%2B&sample=demo').type('text/csv').send(readFileSync(AQUA)).expect(201);
    expect(analysisRecordResponse.safeParse(saved.body).error).toBeUndefined();
    const list = await request(app).get('/api/v1/analyses').expect(200);
    expect(listPageResponse.safeParse(list.body).error).toBeUndefined();
    // The library's summary carries the fit's own betaSd, not a second computation.
    expect(saved.body.summary.betaSd).toBe(saved.body.result.fit.betaSd);
  });
});

describe('FitResult.betaSd', () => {
  it('is sd(B)/B0, and null without a free-ion B0', () => {
    // Inputs only, no check value: band maxima near those usually quoted for [Cr(H2O)6]3+ (common practice).
    const fit = fitBands({ ion: 'Cr3+', bands: [17_400, 24_600, 37_800] });
    expect(fit.uncertainty.b).not.toBeNull();
    expect(fit.freeIonB).not.toBeNull();
    // Slow reference: the propagation written out.
    expect(fit.betaSd).toBeCloseTo(fit.uncertainty.b! / fit.freeIonB!, 12);
    const noIon = fitBands({ d: 3, bands: [17_400, 24_600, 37_800] });
    expect(noIon.beta).toBeNull();
    expect(noIon.betaSd).toBeNull();
  });
});
