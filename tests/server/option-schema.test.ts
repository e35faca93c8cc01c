import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { analyzeFields } from '../../server/schemas.js';
import { ANALYSIS_OPTION_NAMES } from '../../src/analysis-option-names.js';
import { ANALYSIS_OPTION_FIELDS, analyzeOptionsFromRest } from '../../src/analysis-option-schema.js';
import { ANALYSIS_OPTIONS } from '../../src/cli/analysis-options.js';
import { cli } from '../analysis/helpers.js';
import { captureLogger } from './helpers.js';

/**
 * Issue 18 item 4: one schema of analysis options (src/analysis-option-schema.ts)
 * behind the CLI parser and the REST fields: the same names and the same
 * ranges. The demo spectrum is invented; the ranges are the schema's own.
 */
const AQUA = fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));
const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-schema-'));
const app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir });
afterAll(async () => {
  await app.close();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('one analysis options schema', () => {
  it('the REST fields are the schema under the REST names, every named CLI option among them', () => {
    const rest = Object.keys(analyzeFields.shape);
    for (const [key, names] of Object.entries(ANALYSIS_OPTION_NAMES)) {
      expect(Object.keys(ANALYSIS_OPTION_FIELDS)).toContain(key);
      expect(rest).toContain(names.rest);
      expect(Object.keys(ANALYSIS_OPTIONS)).toContain(names.cli);
    }
    expect(analyzeOptionsFromRest({ conc: 0.05, path: 0.5, xUnit: 'nm', freeC: true })).toEqual({ concentration: 0.05, pathLength: 0.5, xUnit: 'nm', freeC: true });
  });

  it.each([
    ['conc', '50', 'concentration'],
    ['path', '1000', 'pathLength'],
    ['c-over-b', '25', 'cOverB'],
  ] as const)('the CLI and REST refuse --%s %s alike', async (cliName, value, key) => {
    const restName = ANALYSIS_OPTION_NAMES[key].rest;
    const res = await request(app).post(`/api/v1/analyze?ion=Cr3%2B&${restName}=${value}`).type('text/csv').send(readFileSync(AQUA)).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid-argument', path: restName });
    const out = await cli(['analyze', AQUA, '--ion', 'Cr3+', `--${cliName}`, value]);
    expect(out.code).toBe(2);
    expect(out.stderr).toContain(`--${cliName}`);
  });

  it('both take a value inside the range', async () => {
    await request(app).post('/api/v1/analyze?ion=Cr3%2B&conc=0.05&path=1').type('text/csv').send(readFileSync(AQUA)).expect(200);
    const out = await cli(['analyze', AQUA, '--ion', 'Cr3+', '--conc', '0.05', '--path', '1', '--json']);
    expect(out.code, out.stderr).toBe(0);
  });
});
