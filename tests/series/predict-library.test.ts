import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createApp, type FieldgapApp } from '../../server/app.js';
import { openLibrary } from '../../src/library/library.js';
import { handBuiltRecord } from '../storage/helpers/records.js';
import { captureLogger } from '../server/helpers.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * `predict --library` and POST /api/v1/predict with "library": the ligand
 * factors fitted from the user's own analyses win over Jørgensen's tables.
 * The records are hand-built; their numbers are made up for the test and
 * checked only for being carried through (f = 10Dq / g), not as chemistry.
 */
let dir: string;
beforeEach(async () => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-predict-library-'));
  const library = await openLibrary(join(dir, 'lib'));
  await library.add(handBuiltRecord({ sample: 'cr-en', formula: '[Cr(en)3]Cl3', ligands: ['en'] }, 22_620));
  await library.add(handBuiltRecord({ sample: 'cr-aqua', formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_400));
  await library.close();
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(['predict', ...args], { cwd: dir });
}

describe('fieldgap predict --library', () => {
  it('uses f fitted from the library: f(en) = 22620 / g(Cr3+)', async () => {
    const { code, out, err } = await cli('[Cr(en)3]3+', '--library', '--data', 'lib', '--json');
    expect(err).toBe('');
    expect(code).toBe(0);
    const doc = JSON.parse(out);
    expect(doc.ligands[0].f).toBeCloseTo(22_620 / 17_400, 9); // g(Cr3+) = 17400: Jørgensen (1971), pp. 347–348
    expect(doc.ligands[0].fFactor.kind).toBe('user');
    expect(doc.ligands[0].fFactor.source).toMatch(/fitted from your library \(1 analysis of Cr3\+/);
    expect(doc.tenDq.value).toBeCloseTo(22_620, 6);
    const plain = JSON.parse((await cli('[Cr(en)3]3+', '--json')).out);
    expect(plain.ligands[0].f).toBe(1.28); // Jørgensen (1971), pp. 347–348
  });

  it('--f still wins over the library; an ion the library lacks falls back to the tables with a note', async () => {
    const own = JSON.parse((await cli('[Cr(en)3]3+', '--library', '--data', 'lib', '--f', 'en=1.2', '--json')).out);
    expect(own.ligands[0].f).toBe(1.2);
    const none = await cli('[Co(en)3]3+', '--library', '--data', 'lib');
    expect(none.code).toBe(0);
    expect(none.err).toMatch(/the library has no fitted ligand factors for Co3\+; Jørgensen's tables used/);
  });
});

describe('POST /api/v1/predict with the library', () => {
  let app: FieldgapApp;
  beforeEach(() => {
    app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir: join(dir, 'lib') });
  });
  afterEach(async () => {
    await app.close();
  });

  it('"library": true takes the fitted factors; the answer says so', async () => {
    const res = await request(app).post('/api/v1/predict').send({ formula: '[Cr(en)3]3+', library: true }).expect(200);
    expect(res.body.ligands[0].f).toBeCloseTo(22_620 / 17_400, 9);
    expect(res.body.warnings.join(' ')).toMatch(/fitted from the library's analyses of Cr3\+ used/);
    const tables = await request(app).post('/api/v1/predict').send({ formula: '[Cr(en)3]3+' }).expect(200);
    expect(tables.body.ligands[0].f).toBe(1.28); // Jørgensen (1971), pp. 347–348
  });

  it('answers the spin decision, the occupation and square planar', async () => {
    const res = await request(app).post('/api/v1/predict').send({ formula: '[Ni(CN)4]2-' }).expect(200);
    expect(res.body).toMatchObject({ d: 8, geometry: { value: 'square-planar' }, unpairedElectrons: { value: 0 } }); // common practice
    expect(res.body.spinDecision).toMatchObject({ state: 'low-spin', decidedBy: 'rule' });
    expect(res.body.occupation.sets).toHaveLength(4);
    const override = await request(app).post('/api/v1/predict').send({ formula: '[NiCl4]2-', geometry: 'square-planar' }).expect(200);
    expect(override.body.geometry).toMatchObject({ value: 'square-planar', method: 'given by the user' });
    const bad = await request(app).post('/api/v1/predict').send({ formula: '[NiCl4]2-', library: 'yes' }).expect(400);
    expect(bad.body.error.path).toBe('library');
  });
});
