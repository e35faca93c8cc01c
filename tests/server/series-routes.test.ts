import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createApp, type FieldgapApp } from '../../server/app.js';
import type { Library } from '../../src/library/library.js';
import { forEachEngine, freshLibrary, type TestLibrary } from '../storage/helpers/engines.js';
import { handBuiltRecord } from '../storage/helpers/records.js';
import { captureLogger } from './helpers.js';

let where: TestLibrary;
let library: Library;
let app: FieldgapApp;

forEachEngine('GET /api/v1/series', (engine) => {
// The app reads the library through its own connection; the tests add records through a second one.
beforeEach(async () => {
  where = await freshLibrary(engine);
  library = await where.open();
  const location = where.location.engine === 'sqlite' ? { dataDir: where.location.dataDir } : { database: where.location.url };
  app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, ...location });
});
afterEach(async () => {
  await app.close();
  await library.close();
  await where.dispose();
});

  it('ranks the stored analyses of the ion', async () => {
    // hand-built records; the numbers are made up for the test
    await library.add(handBuiltRecord({ sample: 'en', formula: '[Cr(en)3]Cl3', ligands: ['en'] }, 21_900));
    await library.add(handBuiltRecord({ sample: 'aqua', formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_400));
    const res = await request(app).get('/api/v1/series').query({ ion: 'Cr3+' }).expect(200);
    expect(res.body).toMatchObject({ ion: 'Cr3+', count: 2, skipped: [] });
    expect(res.body.spectrochemical.series).toBe('H2O < en');
    expect(res.body.spectrochemical.entries.map((e: { id: string }) => e.id)).toEqual(['2', '1']);
    expect(res.body.nephelauxetic.entries).toHaveLength(2);
    expect(res.body.factors.factors.map((f: { ligand: string }) => f.ligand).sort()).toEqual(['H2O', 'en']);
  });

  it('pages the per-analysis lists (limit, offset, total) and gives every analysis with all=true', async () => {
    // hand-built records; the numbers are made up for the test
    for (let i = 0; i < 5; i++) await library.add(handBuiltRecord({ sample: `aqua ${i}`, formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_000 + 100 * i));
    const page = (await request(app).get('/api/v1/series').query({ ion: 'Cr3+', limit: '2', offset: '1' }).expect(200)).body;
    expect(page.spectrochemical.entries.map((e: { position: number }) => e.position)).toEqual([2, 3]);
    expect(page.page).toMatchObject({ all: false, offset: 1, limit: 2, total: 5 });
    expect(page.ligands).toMatchObject([{ ligand: 'H2O', count: 5, spectrochemicalPosition: 1 }]);
    expect(page.factors.factors[0]).toMatchObject({ ligand: 'H2O', fCount: 5, fFrom: [1, 2] });
    const all = (await request(app).get('/api/v1/series').query({ ion: 'Cr3+', all: 'true' }).expect(200)).body;
    expect(all.spectrochemical.entries).toHaveLength(5);
    expect(all.page).toMatchObject({ all: true, limit: null });
    expect((await request(app).get('/api/v1/series').query({ ion: 'Cr3+', limit: '0' }).expect(400)).body.error.path).toBe('limit');
    expect((await request(app).get('/api/v1/series').query({ ion: 'Cr3+', offset: 'x' }).expect(400)).body.error.path).toBe('offset');
  });

  it('answers 404 when the library has none, 400 for a bad or missing ion', async () => {
    const none = await request(app).get('/api/v1/series?ion=Cr3%2B').expect(404);
    expect(none.body.error).toMatchObject({ code: 'not-found', path: 'ion' });
    expect((await request(app).get('/api/v1/series?ion=Zz9').expect(400)).body.error.path).toBe('ion');
    expect((await request(app).get('/api/v1/series').expect(400)).body.error.path).toBe('ion');
    expect((await request(app).get('/api/v1/series?ion=Cr3%2B&criterion=3').expect(400)).body.error.path).toBe('criterion');
  });
});

describe('POST /api/v1/predict', () => {
beforeEach(async () => {
  where = await freshLibrary('sqlite');
  app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir: (where.location as { dataDir: string }).dataDir });
});
afterEach(async () => {
  await app.close();
  await where.dispose();
});

  it('answers predictComplex for the formula', async () => {
    const res = await request(app).post('/api/v1/predict').send({ formula: '[Cr(H2O)6]Cl3' }).expect(200);
    expect(res.body).toMatchObject({ ion: 'Cr3+', d: 3, estimate: true, geometry: { value: 'octahedral' } });
    expect(res.body.tenDq.value).toBeGreaterThan(0);
  });

  it('names what is wrong', async () => {
    expect((await request(app).post('/api/v1/predict').send({}).expect(400)).body.error.path).toBe('formula');
    expect((await request(app).post('/api/v1/predict').send({ formula: '[Cr(H2O)6', extra: 1 }).expect(400)).body.error.code).toBeDefined();
    expect((await request(app).post('/api/v1/predict').send({ formula: '[Cr(H2O)6' }).expect(400)).body.error).toMatchObject({ code: 'parse-error', path: 'formula' });
  });
});
