/**
 * POST /api/v1/fit beyond the cubic field: `symmetry`, `zeta`, `freeZeta`
 * (the names of the CLI's `fit --symmetry`, `--zeta`, `--free-zeta`), issue 15
 * item 5. The answer is the tetragonal fit of src/fit-tetragonal, the same
 * JSON as `fieldgap fit --symmetry tetragonal --json`; without those fields
 * the cubic fit answers as before.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CliIo } from '../../src/cli/command.js';
import { runCli } from '../../src/cli/main.js';
import { FieldgapError } from '../../src/errors.js';
import { fitTetragonal } from '../../src/fit-tetragonal/index.js';
import { createWorkerPool } from '../../server/pool.js';
import { errorResponse, fitResponse } from '../../server/responses.js';
import { tetragonalFitResponse } from '../../server/responses-tetragonal.js';
import { makeTestApp, type TestApp } from './helpers.js';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

async function cliJson(argv: string[]): Promise<unknown> {
  let out = '';
  const io: CliIo = { stdout: (text) => (out += text), stderr: () => undefined, isTty: false, cwd: process.cwd(), env: {} };
  expect(await runCli(argv, io)).toBe(0);
  return JSON.parse(out);
}

// Polarized crystal spectrum of bisethylenediamine copper(II) thiosulfate, Proc. Indian Acad. Sci. (Chem. Sci.) 88(3),
// 143–147, https://www.ias.ac.in/describe/article/jcsc/088/03/0143-0147: bands at 14.30, 15.60 and 19.10 kK (the
// source and the axis conversion are set out in tests/fit-tetragonal/published.test.ts).
const CU_BANDS = [14300, 15600, 19100];

describe('POST /api/v1/fit with symmetry "tetragonal"', () => {
  it('fits Dq, Ds, Dt of the published Cu(II) band set, each band with its D4h level and octahedral parent', async () => {
    const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', symmetry: 'tetragonal', bands: CU_BANDS }).expect(200);
    const body = tetragonalFitResponse.parse(res.body);
    // The published assignment (same source) read through the one-electron convention (common practice, closed forms,
    // not the engine): b1g − b2g = 10Dq, b1g − a1g = 4Ds + 5Dt, b1g − eg = 10Dq + 3Ds − 5Dt.
    const [toA1g, toB2g, toEg] = CU_BANDS as [number, number, number];
    const ds = (toA1g + toEg - toB2g) / 7;
    expect(body.dq).toBeCloseTo(toB2g / 10, 6);
    expect(body.ds).toBeCloseTo(ds, 6);
    expect(body.dt).toBeCloseTo((toA1g - 4 * ds) / 5, 6);
    expect(body.status).toBe('exact');
    expect(body.groundTerm).toBe('2B1g');
    expect(body.assignments.map((a) => [a.observed, a.term, a.parent])).toEqual([
      [14300, '2A1g', '2Eg(D)'],
      [15600, '2B2g', '2T2g(D)'],
      [19100, '2Eg', '2T2g(D)'],
    ]);
    // Uncertainties beside the values: the bands' default σ carried through, positive for all three.
    for (const key of ['dq', 'ds', 'dt'] as const) expect(body.uncertainty[key]).toBeGreaterThan(0);
    // 15 600 and 19 100 are the two components of one octahedral 2T2g band.
    expect(body.components).toEqual([expect.objectContaining({ parent: '2T2g(D)', bands: [15600, 19100] })]);
  });

  it('answers exactly what `fieldgap fit --symmetry tetragonal --json` prints for the same input', async () => {
    const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', symmetry: 'tetragonal', bands: CU_BANDS }).expect(200);
    const printed = await cliJson(['fit', '--ion', 'Cu2+', '--symmetry', 'tetragonal', '--bands', CU_BANDS.join(','), '--json']);
    expect(res.body).toEqual(printed);
  });

  it('takes band objects with uncertainties and a fixed C/B, and says which combination two bands of Cr(III) fix', async () => {
    // Invented positions (no check value): what matters is that the σ and C/B reach the fit and the answer names what is undetermined.
    const body = { ion: 'Cr3+', symmetry: 'tetragonal', cOverB: 4, bands: [{ position: 17400, uncertainty: 100 }, { position: 24600, uncertainty: 100 }] };
    const res = await request(t.app).post('/api/v1/fit').send(body).expect(200);
    const fit = tetragonalFitResponse.parse(res.body);
    expect(fit.cOverB).toBe(4);
    expect(fit.status).toBe('underdetermined');
    // Two bands, four free parameters (Dq, Ds, Dt, B): two combinations fixed, named in the answer.
    expect(fit.determined).toHaveLength(2);
    expect(fit.undetermined.length).toBeGreaterThan(0);
    const printed = await cliJson(['fit', '--ion', 'Cr3+', '--symmetry', 'tetragonal', '--c-over-b', '4', '--bands', '17400±100,24600±100', '--json']);
    expect(res.body).toEqual(printed);
  });

  it('takes zeta ("free-ion" or cm-1) and freeZeta as the CLI does', async () => {
    const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', symmetry: 'tetragonal', zeta: 'free-ion', bands: CU_BANDS }).expect(200);
    const fit = tetragonalFitResponse.parse(res.body);
    expect(fit.zetaMode).toBe('free-ion');
    expect(fit.zeta).toBe(fit.freeIonZeta);
    const printed = await cliJson(['fit', '--ion', 'Cu2+', '--symmetry', 'tetragonal', '--zeta', 'free-ion', '--bands', CU_BANDS.join(','), '--json']);
    expect(res.body).toEqual(printed);
    const fixed = tetragonalFitResponse.parse((await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', symmetry: 'tetragonal', zeta: 500, bands: CU_BANDS }).expect(200)).body);
    expect([fixed.zeta, fixed.zetaMode]).toEqual([500, 'fixed']);
  });

  it('leaves the cubic fit as it was without these fields, and with symmetry "cubic"', async () => {
    const plain = await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands: [17400, 24600] }).expect(200);
    const cubic = await request(t.app).post('/api/v1/fit').send({ ion: 'Cr3+', symmetry: 'cubic', bands: [17400, 24600] }).expect(200);
    expect(cubic.body).toEqual(plain.body);
    const fit = fitResponse.parse(plain.body);
    expect(typeof fit.beta).toBe('number');
    expect(plain.body).not.toHaveProperty('ds');
  });

  it('answers 400 naming the field for a bad symmetry or zeta, and for a cubic-only field with the tetragonal fit', async () => {
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ symmetry: 'trigonal' }, 'symmetry'],
      [{ symmetry: 'tetragonal', zeta: -5 }, 'zeta'],
      [{ symmetry: 'tetragonal', zeta: 'lots' }, 'zeta'],
      [{ symmetry: 'tetragonal', freeZeta: 'yes' }, 'freeZeta'],
      [{ symmetry: 'tetragonal', trees: 'free' }, 'trees'],
      [{ symmetry: 'tetragonal', freeC: true }, 'freeC'],
      [{ symmetry: 'tetragonal', c: 4000 }, 'c'],
      [{ symmetry: 'tetragonal', window: { min: 12800, max: 26300 } }, 'window'],
      [{ zeta: 400, ligands: 'H2O' }, 'ligands'],
      [{ freeZeta: true, formula: '[Cu(H2O)6]2+' }, 'formula'],
    ];
    for (const [extra, path] of cases) {
      const res = await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', bands: CU_BANDS, ...extra }).expect(400);
      expect(errorResponse.parse(res.body).error, JSON.stringify(extra)).toMatchObject({ code: 'invalid-argument', path });
    }
    // freeC: false is the default the page sends with every fit: harmless.
    await request(t.app).post('/api/v1/fit').send({ ion: 'Cu2+', symmetry: 'tetragonal', freeC: false, bands: CU_BANDS }).expect(200);
  });

  it('answers the core\'s own error, with its field, for bands the tetragonal model cannot explain', async () => {
    // d1 has three spin-allowed tetragonal components from the ground level at most (b2g → eg, b1g, a1g): five bands cannot be placed.
    const res = await request(t.app).post('/api/v1/fit').send({ d: 1, symmetry: 'tetragonal', bands: [10000, 15000, 20000, 25000, 30000] });
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(errorResponse.parse(res.body).error.path).toBe('bands');
  });

  it('is documented: the request fields and both answers in the OpenAPI document', async () => {
    const doc = (await request(t.app).get('/api/v1/openapi.json').expect(200)).body as {
      paths: Record<string, Record<string, { requestBody: { content: Record<string, { schema: { properties: Record<string, unknown> } }> }; responses: Record<string, { content: Record<string, { schema: { oneOf: Array<{ $ref: string }> } }> }> }>>;
      components: { schemas: Record<string, { properties?: Record<string, unknown> }> };
    };
    const post = doc.paths['/api/v1/fit']!['post']!;
    expect(Object.keys(post.requestBody.content['application/json']!.schema.properties)).toEqual(expect.arrayContaining(['symmetry', 'zeta', 'freeZeta']));
    expect(post.responses['200']!.content['application/json']!.schema.oneOf.map((s) => s.$ref)).toEqual(['#/components/schemas/FitResult', '#/components/schemas/TetragonalFitResult']);
    expect(Object.keys(doc.components.schemas['TetragonalFitResult']!.properties ?? {})).toEqual(expect.arrayContaining(['ds', 'dt', 'zeta', 'uncertainty', 'components']));
  });
});

describe('the tetragonal fit on a worker thread', () => {
  it('computes there exactly what fitTetragonal computes here, and brings its errors back with their field', async () => {
    const pool = createWorkerPool({ threads: 1 });
    try {
      const input = { ion: 'Cu2+', geometry: 'octahedral' as const, symmetry: 'tetragonal' as const, bands: CU_BANDS };
      expect(await pool.run({ kind: 'fit-tetragonal', input })).toEqual(JSON.parse(JSON.stringify(fitTetragonal(input))));
      const bad = { d: 1, symmetry: 'tetragonal' as const, bands: [10000, 15000, 20000, 25000, 30000] };
      const error = await pool.run({ kind: 'fit-tetragonal', input: bad }).then(() => null, (e: unknown) => e);
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).path).toBe('bands');
    } finally {
      await pool.close();
    }
  }, 60_000);
});
