import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { createApp, type FieldgapApp } from '../../server/app.js';
import { createInProcessPool, type ComputePool } from '../../server/pool.js';
import type { Library } from '../../src/library/library.js';
import { forEachEngine, freshLibrary, type TestLibrary } from '../storage/helpers/engines.js';
import { handBuiltRecord } from '../storage/helpers/records.js';
import { captureLogger } from './helpers.js';
import { savedRecordOf } from '../helpers/saved-file.js';

let where: TestLibrary;
let app: FieldgapApp;
let calls: { content: Buffer; options: Record<string, unknown> }[];

/**
 * A stand-in for the pipeline: it answers the hand-built result of the
 * storage tests (numbers made up) with 10Dq raised by each call, and keeps
 * what it was given, so the tests check what the routes send and store.
 */
async function standInAnalyze(content: Buffer, options: object): Promise<never> {
  calls.push({ content, options: options as Record<string, unknown> });
  if ((options as { ion?: string }).ion === 'Zn2+') throw new FieldgapError('unexplained', 'Zn2+ is d10: no d-d bands', 'ion');
  return handBuiltRecord({}, 17_000 + calls.length).result as never;
}

/** The app's pool, with analyze tasks answered by the stand-in. */
function standInPool(): ComputePool {
  const real = createInProcessPool();
  return {
    ...real,
    run: async (task, options) =>
      task.kind === 'analyze' ? standInAnalyze(Buffer.from(task.input.content as Uint8Array), task.input.options) : real.run(task, options),
  };
}

function makeApp(): FieldgapApp {
  const library = where.location.engine === 'sqlite' ? { dataDir: where.location.dataDir } : { database: where.location.url };
  return createApp({ pool: standInPool(), logger: captureLogger().logger, staticDir: false, ...library, maxBodyBytes: 4096 });
}

/** A second connection to the app's library, to look behind the routes. */
async function withLibrary<T>(fn: (library: Library) => Promise<T>): Promise<T> {
  const library = await where.open();
  try {
    return await fn(library);
  } finally {
    await library.close();
  }
}

forEachEngine('the library routes', (engine) => {
beforeEach(async () => {
  where = await freshLibrary(engine);
  calls = [];
  app = makeApp();
});
afterEach(async () => {
  await app.close();
  await where.dispose();
});

const CSV = 'nm,absorbance\n400,0.1\n575,0.2\n700,0.05\n';

function upload() {
  return request(app)
    .post('/api/v1/analyses')
    .query({ ion: 'Cr(III)', geometry: 'octahedral', conc: '0.01', sample: 'chrome alum', ligands: 'H2O, SO4', temperature: '295', note: 'first try' })
    .type('text/csv')
    .send(CSV);
}

describe('POST /api/v1/analyses', () => {
  it('analyses a raw body and answers 201 with the saved record', async () => {
    const res = await upload().expect(201);
    expect(res.headers['location']).toBe(`/api/v1/analyses/${res.body.id}`);
    expect(res.body).toMatchObject({ id: 1, sample: 'chrome alum', ion: 'Cr3+', ligands: ['H2O', 'SO4'], temperature: 295, note: 'first try', revision: 1 });
    expect(res.body.result.fit.tenDq).toBe(17_001);
    expect(res.body.original).toEqual({ fileName: 'spectrum.csv', size: CSV.length, sha256: createHash('sha256').update(CSV).digest('hex') });
    // The pipeline names the raw body as the user sent it (its errors say "request body"); the record keeps the stored name.
    expect(calls[0]!.options).toEqual({ ion: 'Cr(III)', geometry: 'octahedral', concentration: 0.01, fileName: 'request body' });
    expect(res.body.options.fileName).toBe('spectrum.csv');
    expect(calls[0]!.content.toString()).toBe(CSV);
  });

  it('takes a multipart upload, naming the sample after the file', async () => {
    const res = await request(app)
      .post('/api/v1/analyses')
      .field('ion', 'Ni2+')
      .field('formula', '[Ni(NH3)6]Cl2')
      .attach('spectrum', Buffer.from(CSV), 'ni-ammine.csv')
      .expect(201);
    expect(res.body).toMatchObject({ sample: 'ni-ammine', formula: '[Ni(NH3)6]Cl2', ion: 'Ni2+', original: { fileName: 'ni-ammine.csv' } });
  });

  it('rejects bad fields before analysing, and saves nothing when the analysis fails', async () => {
    const bad = await request(app).post('/api/v1/analyses?ion=Cr3%2B&measuredOn=yesterday').type('text/csv').send(CSV).expect(400);
    expect(bad.body.error).toMatchObject({ code: 'invalid-argument', path: 'measuredOn' });
    expect((await request(app).post('/api/v1/analyses?colour=red').type('text/csv').send(CSV).expect(400)).body.error.path).toBe('colour');
    expect((await request(app).post('/api/v1/analyses?temperature=hot').type('text/csv').send(CSV).expect(400)).body.error.path).toBe('temperature');
    expect(calls).toHaveLength(0);
    expect((await request(app).post('/api/v1/analyses?ion=Zn2%2B').type('text/csv').send(CSV).expect(422)).body.error.code).toBe('unexplained');
    expect((await request(app).post('/api/v1/analyses').type('text/csv').send('x'.repeat(5000)).expect(413)).body.error.code).toBe('too-large');
    expect(await withLibrary(async (library) => (await library.list()).total)).toBe(0);
  });
});

describe('reading, changing and deleting records', () => {
  it('lists newest first with sample names and no results, and searches', async () => {
    await upload().expect(201);
    await request(app).post('/api/v1/analyses?ion=Ni2%2B&sample=nickel').type('text/csv').send(CSV).expect(201);
    const res = await request(app).get('/api/v1/analyses').expect(200);
    expect(res.body.analyses.map((a: { sample: string }) => a.sample)).toEqual(['nickel', 'chrome alum']);
    expect(res.body.total).toBe(2);
    expect(res.body.analyses[0].result).toBeUndefined();
    expect((await request(app).get('/api/v1/analyses?query=alum').expect(200)).body.analyses).toHaveLength(1);
    expect((await request(app).get('/api/v1/analyses?ion=Ni(II)&limit=1').expect(200)).body).toMatchObject({ total: 1, limit: 1 });
    expect((await request(app).get('/api/v1/analyses?limit=0').expect(400)).body.error.path).toBe('limit');
  });

  it('gives one record and its original byte for byte with its SHA-256', async () => {
    const bytes = Buffer.from([0x23, 0x20, 0xff, 0x00, 0x0a, 0x34, 0x30, 0x30]);
    const { body: saved } = await request(app).post('/api/v1/analyses?ion=Cr3%2B&fileName=raw.jdx').type('application/octet-stream').send(bytes).expect(201);
    expect((await request(app).get(`/api/v1/analyses/${saved.id}`).expect(200)).body).toEqual(savedRecordOf(saved));
    const res = await request(app).get(`/api/v1/analyses/${saved.id}/original`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    }).expect(200);
    expect(Buffer.compare(res.body as Buffer, bytes)).toBe(0);
    expect(res.headers['content-type']).toBe('chemical/x-jcamp-dx');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?raw\.jdx"?$/);
    expect(res.headers['repr-digest']).toBe(`sha-256=:${createHash('sha256').update(bytes).digest('base64')}:`);
  });

  it('answers 404 for a missing record and 400 for a bad id', async () => {
    expect((await request(app).get('/api/v1/analyses/7').expect(404)).body.error).toMatchObject({ code: 'not-found', path: 'id' });
    expect((await request(app).get('/api/v1/analyses/7/original').expect(404)).body.error.code).toBe('not-found');
    expect((await request(app).delete('/api/v1/analyses/7').expect(404)).body.error.code).toBe('not-found');
    expect((await request(app).get('/api/v1/analyses/abc').expect(400)).body.error.path).toBe('id');
  });

  it('changes details with PATCH, clearing a field given as null', async () => {
    const { body: saved } = await upload().expect(201);
    const res = await request(app).patch(`/api/v1/analyses/${saved.id}`).send({ note: null, solvent: 'water', ligands: ['H2O'] }).expect(200);
    expect(res.body).toMatchObject({ solvent: 'water', ligands: ['H2O'], revision: 1 });
    expect(res.body.note).toBeUndefined();
    expect((await request(app).patch(`/api/v1/analyses/${saved.id}`).send({ sample: null }).expect(400)).body.error.path).toBe('sample');
  });

  it('deletes with 204', async () => {
    const { body: saved } = await upload().expect(201);
    await request(app).delete(`/api/v1/analyses/${saved.id}`).expect(204);
    await request(app).get(`/api/v1/analyses/${saved.id}`).expect(404);
  });

  it('refits on the stored original with changed options, keeping the history', async () => {
    const { body: saved } = await upload().expect(201);
    const res = await request(app).post(`/api/v1/analyses/${saved.id}/refit`).send({ cOverB: 4.5, freeC: false }).expect(200);
    expect(res.body.revision).toBe(2);
    expect(res.body.revisions.map((r: { summary: { tenDq: number } }) => r.summary.tenDq)).toEqual([17_001, 17_002]);
    expect(calls[1]!.content.toString()).toBe(CSV);
    expect(calls[1]!.options).toEqual({ ion: 'Cr(III)', geometry: 'octahedral', concentration: 0.01, fileName: 'spectrum.csv', cOverB: 4.5, freeC: false });
    expect((await request(app).post(`/api/v1/analyses/${saved.id}/refit?cOverB=5`).expect(200)).body.options.cOverB).toBe(5);
    expect((await request(app).post(`/api/v1/analyses/${saved.id}/refit`).send({ cOverB: -1 }).expect(400)).body.error.path).toBe('cOverB');
  });
});

describe('persistence across a restart', () => {
  it('a new app on the same data folder sees the record', async () => {
    const { body: saved } = await upload().expect(201);
    await app.close();
    app = makeApp();
    expect((await request(app).get(`/api/v1/analyses/${saved.id}`).expect(200)).body).toEqual(savedRecordOf(saved));
  });
});
});
