import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { cli } from '../analysis/helpers.js';
import { captureLogger } from './helpers.js';

/** Issue 18 item 4: one set of option names and one rule for C, on the CLI and over REST. Invented demo spectrum. */
const AQUA = fileURLToPath(new URL('../../spectra-demo/cr-aqua.csv', import.meta.url));
const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-names-'));
const app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir });
afterAll(async () => {
  await app.close();
  rmSync(dataDir, { recursive: true, force: true });
});

describe('analysis option names', () => {
  it('REST refuses two ways of fixing C, as the CLI does', async () => {
    const res = await request(app).post('/api/v1/analyze?ion=Cr3%2B&cOverB=4.5&c=3000').type('text/csv').send(readFileSync(AQUA)).expect(400);
    expect(res.body.error).toMatchObject({ code: 'invalid-argument', path: 'cOverB' });
    const out = await cli(['analyze', AQUA, '--ion', 'Cr3+', '--c-over-b', '4.5', '--c', '3000']);
    expect(out.code).toBe(2);
    expect(out.stderr).toMatch(/--c-over-b/);
  });
});
