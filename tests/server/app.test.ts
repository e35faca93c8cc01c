import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { readFileSync } from 'node:fs';
import { computeLevels, diagramDocument, levelsDocument } from '../../src/ligand-field/index.js';
import { FieldgapError } from '../../src/errors.js';
import { createInProcessPool, type ComputePool } from '../../server/pool.js';
import { fitBands } from '../../src/fit/index.js';
import { diagramResponse, errorResponse, fitResponse, healthResponse, levelsResponse } from '../../server/responses.js';
import { fitBody } from '../../server/schemas.js';
import { makeTestApp, type TestApp } from './helpers.js';

const packageJson = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(async () => {
  await t.dispose();
});

describe('GET /api/v1/health', () => {
  it('answers ok with the package version', async () => {
    const res = await request(t.app).get('/api/v1/health').expect(200).expect('content-type', /json/);
    const body = healthResponse.parse(res.body);
    expect(body.version).toBe(packageJson.version);
    expect(body.uptime).toBeGreaterThanOrEqual(0);
    expect(body.pool).toEqual({ mode: t.app.pool.mode, workersStopped: 0 });
  });
  it('sends the security headers: a self-only CSP, nosniff, no x-powered-by', async () => {
    const res = await request(t.app).get('/api/v1/health');
    const csp = String(res.headers['content-security-policy']);
    for (const directive of ['default-src', 'script-src', 'style-src', 'font-src', 'img-src', 'connect-src']) {
      expect(csp).toContain(`${directive} 'self'`);
    }
    expect(csp).not.toMatch(/unsafe-inline|unsafe-eval|https?:/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
  it('writes one log line per request with method, url, status and ms', async () => {
    const before = t.logs.length;
    await request(t.app).get('/api/v1/health?probe=1');
    const lines = t.logs.slice(before).filter((l) => l['url'] === '/api/v1/health?probe=1');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({ method: 'GET', status: 200 });
    expect(typeof lines[0]!['ms']).toBe('number');
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('is an OpenAPI 3.1 document built from the request schemas', async () => {
    const res = await request(t.app).get('/api/v1/openapi.json').expect(200);
    const doc = res.body as {
      openapi: string;
      paths: Record<string, Record<string, { parameters?: { name: string; required: boolean }[]; requestBody?: { content: Record<string, { schema: unknown }> } }>>;
    };
    expect(doc.openapi).toBe('3.1.0');
    // The documented limits are the ones this app enforces (defaults: 10 MiB uploads, 1 MiB JSON, 10 s).
    const info = (res.body as { info: { description: string } }).info.description;
    expect(info).toContain('10 MiB');
    expect(info).toContain('1 MiB');
    expect(info).toContain('10000 ms');
    const documented = ['/api/v1/health', '/api/v1/levels', '/api/v1/diagram', '/api/v1/fit', '/api/v1/analyze', '/api/v1/analyses', '/api/v1/analyses/{id}', '/api/v1/series', '/api/v1/predict'];
    for (const path of documented) {
      expect(Object.keys(doc.paths)).toContain(path);
    }
    const levels = doc.paths['/api/v1/levels']!['get']!.parameters!;
    expect(levels.map((p) => p.name).sort()).toEqual(['b', 'c', 'cOverB', 'd', 'dq', 'ds', 'dt', 'geometry', 'zeta']);
    expect(levels.find((p) => p.name === 'dq')!.required).toBe(true);
    expect(levels.find((p) => p.name === 'c')!.required).toBe(false);
    // The same schema that validates the fit body, not a copy.
    const { $schema: _dialect, ...fitSchema } = z.toJSONSchema(fitBody, { io: 'input' });
    expect(doc.paths['/api/v1/fit']!['post']!.requestBody!.content['application/json']!.schema).toEqual(fitSchema);
    // Every $ref points at a schema that is there; every operation has an id and a success answer.
    const refs = JSON.stringify(doc).match(/"\$ref":"[^"]+"/g) ?? [];
    const schemas = (res.body as { components: { schemas: Record<string, unknown> } }).components.schemas;
    for (const ref of refs) expect(Object.keys(schemas)).toContain(ref.replace(/^.*\/schemas\//, '').replace(/"$/, ''));
    for (const item of Object.values(doc.paths)) {
      for (const op of Object.values(item) as { operationId?: string; responses?: Record<string, unknown> }[]) {
        expect(op.operationId).toBeTruthy();
        expect(Object.keys(op.responses ?? {}).some((code) => /^2\d\d$/.test(code))).toBe(true);
      }
    }
    const analyze = doc.paths['/api/v1/analyze']!['post']!;
    expect(Object.keys(analyze.requestBody!.content)).toEqual(
      expect.arrayContaining(['multipart/form-data', 'text/csv', 'chemical/x-jcamp-dx']),
    );
  });
});

describe('GET /api/v1/levels', () => {
  it('answers what `levels --json` prints for the same parameters', async () => {
    const res = await request(t.app).get('/api/v1/levels').query({ d: 3, geometry: 'octahedral', dq: 1740, b: 720, c: 2900 }).expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(levelsDocument(computeLevels(3, 'octahedral', { dq: 1740, b: 720, c: 2900 })))));
    levelsResponse.parse(res.body);
  });
  it('takes C as cOverB·B when cOverB is given instead of c, as the CLI does', async () => {
    const res = await request(t.app).get('/api/v1/levels?d=8&geometry=tetrahedral&dq=400&b=800&cOverB=4.5').expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(levelsDocument(computeLevels(8, 'tetrahedral', { dq: 400, b: 800, c: 3600 })))));
    const neither = await request(t.app).get('/api/v1/levels?d=8&dq=400&b=800').expect(400);
    expect(neither.body.error.path).toBe('c');
  });
  it('rejects junk with the field and the value', async () => {
    const res = await request(t.app).get('/api/v1/levels?d=3&dq=abc&b=700&c=2800').expect(400);
    expect(errorResponse.parse(res.body).error).toEqual({ code: 'invalid-argument', path: 'dq', message: 'dq: expected number, got "abc"' });
    const missing = await request(t.app).get('/api/v1/levels?d=3&b=700&c=2800').expect(400);
    expect(missing.body.error.path).toBe('dq');
    const repeated = await request(t.app).get('/api/v1/levels?d=3&d=4&dq=1&b=700&c=2800').expect(400);
    expect(repeated.body.error.path).toBe('d');
  });
});

describe('GET /api/v1/diagram', () => {
  it('answers what the engine computes', async () => {
    const res = await request(t.app).get('/api/v1/diagram').query({ d: 6, cOverB: 4.8, maxDqOverB: 3, steps: 30 }).expect(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(diagramDocument(6, 'octahedral', { cOverB: 4.8, maxDqOverB: 3, steps: 30 }))));
    expect(res.body.crossoverDqOverB).toBeCloseTo(2.0, 1);
    const diagram = diagramResponse.parse(res.body);
    expect(diagram.dqOverB).toHaveLength(31);
  });
  it('refuses more steps than the documented limit, naming the field', async () => {
    const res = await request(t.app).get('/api/v1/diagram?d=6&steps=1000000').expect(400);
    expect(res.body.error.path).toBe('steps');
  });
});

describe('POST /api/v1/fit', () => {
  const json = (value: unknown) => JSON.parse(JSON.stringify(value)) as unknown;

  it('answers what fitBands computes for the same input', async () => {
    const body = { ion: 'Cr3+', geometry: 'octahedral', bands: [17400, { position: 24500, uncertainty: 300 }] } as const;
    const res = await request(t.app).post('/api/v1/fit').send(body).expect(200);
    expect(res.body).toEqual(
      json(fitBands({ ion: 'Cr3+', geometry: 'octahedral', bands: [17400, { position: 24500, uncertainty: 300 }] })),
    );
    fitResponse.parse(res.body);
  });
  it('passes flags and the C options through', async () => {
    const body = { d: 8, bands: [8500, { position: 13800, flags: ['shoulder'] }, 25300, { position: 40000, flags: ['ct'] }], cOverB: 4.2 };
    const res = await request(t.app).post('/api/v1/fit').send(body).expect(200);
    expect(res.body).toEqual(
      json(fitBands({ d: 8, bands: [8500, { position: 13800, flags: ['shoulder'] }, 25300, { position: 40000, flags: ['ct'] }], cOverB: 4.2 })),
    );
  });
  it('passes trees through and answers alpha with its uncertainty', async () => {
    const body = { ion: 'Fe3+', bands: [12600, 18500, 24300, 25200, 27000], freeC: true, trees: 'free' } as const; // invented list: a pass-through check
    const res = await request(t.app).post('/api/v1/fit').send(body).expect(200);
    expect(res.body).toEqual(json(fitBands({ ion: 'Fe3+', bands: [12600, 18500, 24300, 25200, 27000], freeC: true, trees: 'free' })));
    expect(typeof fitResponse.parse(res.body).alpha).toBe('number');
    await request(t.app).post('/api/v1/fit').send({ ...body, trees: 'lots' }).expect(400);
  });
  it('answers 422 when no model explains the bands', async () => {
    const res = await request(t.app).post('/api/v1/fit').send({ d: 1, bands: [20000, 40000, 60000] }).expect(422);
    expect(errorResponse.parse(res.body).error.code).toBe('unexplained');
  });
  it('answers 400 naming the field, for the schema and for the core', async () => {
    const schema = await request(t.app).post('/api/v1/fit').send({ d: 3, bands: [17400, { position: 'x' }] }).expect(400);
    expect(schema.body.error).toMatchObject({ code: 'invalid-argument', path: 'bands[1].position' });
    const unknown = await request(t.app).post('/api/v1/fit').send({ d: 3, bands: [17400], colour: 'green' }).expect(400);
    expect(unknown.body.error.path).toBe('colour');
    const core = await request(t.app).post('/api/v1/fit').send({ ion: 'Xx9+', bands: [17400] }).expect(400);
    expect(core.body.error.path).toBe('ion');
  });
  it('answers 400 for a body that is not JSON, and 415 for another content type', async () => {
    const broken = await request(t.app).post('/api/v1/fit').set('content-type', 'application/json').send('{"d": 3,').expect(400);
    expect(broken.body.error).toMatchObject({ code: 'parse-error', path: 'body' });
    const text = await request(t.app).post('/api/v1/fit').set('content-type', 'text/plain').send('d=3').expect(415);
    expect(text.body.error).toMatchObject({ code: 'unsupported-format', path: 'Content-Type' });
  });
  it('answers 413 for a JSON body over the limit', async () => {
    const small = makeTestApp({ maxJsonBytes: 2000 });
    try {
      const bands = Array.from({ length: 400 }, (_, i) => 10000 + i);
      const res = await request(small.app).post('/api/v1/fit').send({ d: 3, bands }).expect(413);
      expect(res.body.error).toMatchObject({ code: 'too-large', path: 'body' });
      expect(res.body.error.message).toContain('2000 bytes');
    } finally {
      await small.dispose();
    }
  });
});

describe('unknown routes and bugs', () => {
  it('answers 404 in the error format', async () => {
    const res = await request(t.app).get('/api/v1/nothing-here').expect(404);
    expect(errorResponse.parse(res.body).error).toMatchObject({ code: 'not-found', path: '/api/v1/nothing-here' });
    await request(t.app).delete('/api/v1/levels').expect(404);
  });
  it('answers 400, not 500, for a path that is not valid percent-encoding', async () => {
    const res = await request(t.app).get('/api/v1/analyses/%E0%A4').expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid-argument', path: 'request' });
  });
  it('answers a bug with 500 and a generic message, and logs the stack', async () => {
    const broken: ComputePool = {
      ...createInProcessPool(),
      run: async () => {
        throw new TypeError("Cannot read properties of undefined (reading 'secretInternalField')");
      },
    };
    const b = makeTestApp({ pool: broken });
    try {
      const res = await request(b.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(500);
      const body = errorResponse.parse(res.body);
      expect(body.error.code).toBe('internal');
      expect(res.text).not.toContain('secretInternalField');
      expect(res.text).not.toMatch(/\bat .*\.(ts|js):\d+/);
      const logged = b.logs.find((l) => l['msg'] === 'internal error');
      expect(String(logged?.['err'])).toContain('secretInternalField');
      expect(String(logged?.['err'])).toMatch(/at .*:\d+/);
    } finally {
      await b.dispose();
    }
  });
  it('passes a FieldgapError from the core through with its code and path', async () => {
    const picky: ComputePool = {
      ...createInProcessPool(),
      run: async () => {
        throw new FieldgapError('not-found', 'no analysis with id 42', 'id');
      },
    };
    const p = makeTestApp({ pool: picky });
    try {
      const res = await request(p.app).get('/api/v1/levels?d=3&dq=1700&b=700&c=2800').expect(404);
      expect(res.body).toEqual({ error: { code: 'not-found', message: 'no analysis with id 42', path: 'id' } });
    } finally {
      await p.dispose();
    }
  });
});

describe('the web page', () => {
  it('serves the page folder at / and nothing outside it', async () => {
    const { mkdtempSync, writeFileSync, mkdirSync, rmSync } = await import('node:fs');
    const { join } = await import('node:path');
    const { tmpdir } = await import('node:os');
    const root = mkdtempSync(join(tmpdir(), 'fieldgap-static-'));
    const page = join(root, 'public');
    mkdirSync(page);
    writeFileSync(join(page, 'index.html'), '<!doctype html><title>page</title>');
    writeFileSync(join(page, '.env'), 'SECRET=1');
    writeFileSync(join(root, 'outside.txt'), 'outside');
    const s = makeTestApp({ staticDir: page });
    try {
      const index = await request(s.app).get('/').expect(200).expect('content-type', /html/);
      expect(index.text).toContain('<title>page</title>');
      expect(String(index.headers['content-security-policy'])).toContain("script-src 'self'");
      await request(s.app).get('/.env').expect(404);
      await request(s.app).get('/..%2foutside.txt').expect((res) => expect(res.status).toBeGreaterThanOrEqual(400));
      const traversal = await request(s.app).get('/%2e%2e/outside.txt');
      expect(traversal.status).toBe(404);
      expect(traversal.text).not.toBe('outside');
      // The API still wins over the static folder.
      await request(s.app).get('/api/v1/health').expect(200);
    } finally {
      await s.dispose();
      rmSync(root, { recursive: true, force: true });
    }
  });
});

describe('the results library', () => {
  it('mounts the series routes of the library in the data folder', async () => {
    // An empty library has nothing to rank: the library's own 404, not the app's "no such endpoint".
    const res = await request(t.app).get('/api/v1/series').query({ ion: 'Cr3+' }).expect(404);
    expect(res.body.error).toMatchObject({ code: 'not-found', path: 'ion' });
    const bad = await request(t.app).get('/api/v1/series').expect(400);
    expect(bad.body.error.path).toBe('ion');
    const predict = await request(t.app).post('/api/v1/predict').send({ formula: '[Cr(H2O)6]3+' }).expect(200);
    expect(typeof predict.body).toBe('object');
  });
  it('mounts the analyses routes: save an analysis, list it, fetch it, delete it', async () => {
    // The invented demo spectrum of spectra-demo/, as input only.
    const aqua = readFileSync(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));
    const saved = await request(t.app)
      .post('/api/v1/analyses?ion=Cr3%2B&conc=0.05')
      .attach('spectrum', aqua, { filename: 'cr-aqua.csv', contentType: 'text/csv' })
      .expect(201);
    const id = String(saved.body.id);
    const list = await request(t.app).get('/api/v1/analyses').expect(200);
    expect(list.body.analyses.map((a: { id: unknown }) => String(a.id))).toContain(id);
    await request(t.app).get(`/api/v1/analyses/${id}`).expect(200);
    await request(t.app).delete(`/api/v1/analyses/${id}`).expect(204);
    const gone = await request(t.app).get(`/api/v1/analyses/${id}`).expect(404);
    expect(gone.body.error.code).toBe('not-found');
  });
});
