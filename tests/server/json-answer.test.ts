/**
 * GET /levels, GET /diagram and POST /fit answer with JSON text made where the
 * task ran (RunOptions.asJson, server/pool.ts): a worker hands the event loop
 * one string instead of a result to clone and serialise again. The answer
 * must be what res.json of the result gives: the same bytes and headers,
 * from the worker pool, the in-process pool, and a pool that ignores asJson.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fitLigandField } from '../../src/fit/index.js';
import { computeLevels, levelsDocument } from '../../src/ligand-field/index.js';
import { createInProcessPool, type ComputePool } from '../../server/pool.js';
import { dispatchTask, type Task } from '../../server/tasks.js';
import { makeTestApp, type TestApp } from './helpers.js';

const FIT = { ion: 'Cr3+', geometry: 'octahedral', bands: [17_400, { position: 24_500, uncertainty: 300 }] } as const;

/** A pool (as a caller may pass one) that answers with the result object, whatever asJson says. */
function objectPool(): ComputePool {
  const inner = createInProcessPool();
  return { ...inner, run: async (task: Task) => (dispatchTask(task) as { value: unknown }).value };
}

const apps: Record<string, TestApp> = {};
beforeAll(() => {
  apps['workers'] = makeTestApp({ pool: 'workers' });
  apps['in-process'] = makeTestApp();
  apps['object answers'] = makeTestApp({ pool: objectPool() });
});
afterAll(async () => {
  await Promise.all(Object.values(apps).map((t) => t.dispose()));
});

describe('JSON answers of the compute routes', () => {
  for (const name of ['workers', 'in-process', 'object answers']) {
    it(`POST /fit (${name}) sends JSON.stringify of the fit, as res.json would`, async () => {
      const res = await request(apps[name]!.app).post('/api/v1/fit').send(FIT).expect(200);
      expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
      expect(res.text).toBe(JSON.stringify(fitLigandField({ ion: 'Cr3+', geometry: 'octahedral', bands: [17_400, { position: 24_500, uncertainty: 300 }] })));
      expect(res.headers['etag']).toMatch(/^W\/"/);
    });

    it(`GET /levels (${name}) sends the levels document's JSON`, async () => {
      const res = await request(apps[name]!.app).get('/api/v1/levels?d=3&dq=1740&b=725&c=2900').expect(200);
      expect(res.headers['content-type']).toBe('application/json; charset=utf-8');
      expect(res.text).toBe(JSON.stringify(levelsDocument(computeLevels(3, 'octahedral', { dq: 1740, b: 725, c: 2900 }))));
    });

    it(`POST /fit (${name}) still answers a bad body with the error, not JSON text of it`, async () => {
      const res = await request(apps[name]!.app).post('/api/v1/fit').send({ ion: 'Cr3+', bands: [] }).expect(400);
      expect(res.body.error.path).toMatch(/bands/);
    });
  }
});
