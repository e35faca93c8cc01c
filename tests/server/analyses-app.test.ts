import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { createApp, type FieldgapApp } from '../../server/app.js';
import { captureLogger } from './helpers.js';
import { savedRecordOf } from '../helpers/saved-file.js';

/**
 * The library routes inside the real app (createApp, the pipeline in
 * process) on the invented demo spectra. Checks are consistency with
 * analyzeSpectrum and persistence, never the demo numbers themselves.
 */
const AQUA = fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));

let dataDir: string;
const apps: FieldgapApp[] = [];
function app(): FieldgapApp {
  const made = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir });
  apps.push(made);
  return made;
}
beforeEach(() => {
  dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-analyses-app-'));
});
afterEach(async () => {
  for (const a of apps.splice(0)) await a.close();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('/api/v1/analyses in createApp', () => {
  it('saves what the pipeline gives, and a new app on the same data folder sees it', async () => {
    const first = app();
    const saved = await request(first)
      .post('/api/v1/analyses')
      .field('ion', 'Cr3+')
      .field('conc', '0.05')
      .field('sample', 'aqua extract (invented demo)')
      .field('ligands', 'H2O')
      .attach('spectrum', readFileSync(AQUA), 'cr-aqua.csv')
      .expect(201);
    const options = { ion: 'Cr3+', concentration: 0.05, fileName: 'cr-aqua.csv' };
    expect(saved.body.options).toEqual(options);
    expect(saved.body.result).toEqual(JSON.parse(JSON.stringify(analyzeSpectrum(readFileSync(AQUA), options))));
    await first.close();

    const second = app();
    const list = await request(second).get('/api/v1/analyses').expect(200);
    expect(list.body.analyses.map((a: { id: number; sample: string }) => [a.id, a.sample])).toEqual([[saved.body.id, 'aqua extract (invented demo)']]);
    expect((await request(second).get(`/api/v1/analyses/${saved.body.id}`).expect(200)).body).toEqual(savedRecordOf(saved.body));
    const series = await request(second).get('/api/v1/series?ion=Cr3%2B').expect(200);
    expect(series.body.spectrochemical.entries[0]).toMatchObject({ ligandLabel: 'H2O', value: saved.body.summary.tenDq });
  });

  it('refits through the pool and maps pipeline errors to HTTP', async () => {
    const a = app();
    const saved = await request(a).post('/api/v1/analyses?ion=Cr3%2B').type('text/csv').send(readFileSync(AQUA)).expect(201);
    const refit = await request(a).post(`/api/v1/analyses/${saved.body.id}/refit`).send({ cOverB: 4.2 }).expect(200);
    const options = { ion: 'Cr3+', fileName: 'spectrum.csv', cOverB: 4.2 };
    expect(refit.body.options).toEqual(options);
    expect(refit.body.result).toEqual(JSON.parse(JSON.stringify(analyzeSpectrum(readFileSync(AQUA), options))));
    const bad = await request(a).post('/api/v1/analyses?ion=Cr3%2B').type('text/csv').send('not,a\nspectrum,at all\n');
    expect(bad.status).toBeGreaterThanOrEqual(400);
    expect(bad.status).toBeLessThan(500);
    expect((await request(a).get('/api/v1/analyses').expect(200)).body.total).toBe(1);
  });
});
