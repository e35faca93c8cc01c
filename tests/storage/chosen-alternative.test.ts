import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { analysisRecordResponse } from '../../server/responses.js';
import { analyzeSpectrum, type AnalyzeResult } from '../../src/analysis.js';
import { fitWithAlternative } from '../../src/analysis-corrections.js';
import type { AnalysisRecord } from '../../src/library/types.js';
import { defaultDetails, editableBandsFromResult, shownFit, type AnalysisEntry } from '../../web/state.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { servicePerTest } from './helpers/service.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * A chosen alternative assignment is a complete, honest fit result: every
 * field the type promises (the stored record passes the response schema),
 * its own rows, and no uncertainty borrowed from the best fit. The demo
 * spectrum is an invented scenario; these are consistency checks between
 * the core, the page, the CLI and the service, not numbers from outside.
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const AQUA = join(ROOT, 'spectra-demo', 'cr-aqua.csv');

forEachEngine('a chosen alternative assignment, stored', (engine) => {
const fresh = libraryPerTest(engine, { open: false });
const service = servicePerTest(fresh);

function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(['library', ...args], { cwd: ROOT, env: { ...fresh.where.env } });
}

describe('a chosen alternative assignment', () => {
  const analysed = analyzeSpectrum(readFileSync(AQUA), { ion: 'Cr3+', fileName: 'cr-aqua.csv' });

  it('has full assignment rows and no uncertainties of the best fit', () => {
    expect(analysed.fit.alternatives.length).toBeGreaterThan(0);
    // the best fit has uncertainties, so clearing them is a change that can be seen
    expect(analysed.fit.betaSd).not.toBeNull();
    const alt = fitWithAlternative(analysed.fit, 0);
    expect(alt.betaSd).toBeNull();
    expect(alt.uncertainty).toEqual({ tenDq: null, dq: null, b: null, c: null });
    expect(alt.correlation).toEqual({ bDq: null, cDq: null, cB: null });
    expect(alt.score).toBe(analysed.fit.alternatives[0]!.score);
    expect(alt.probability).toBe(analysed.fit.alternatives[0]!.probability);
    expect(alt.assignments.length).toBeGreaterThan(0);
    for (const a of alt.assignments) {
      expect(typeof a.parent).toBe('string');
      expect(Array.isArray(a.bands)).toBe(true);
      expect(Array.isArray(a.flags)).toBe(true);
    }
    // each row points at the input band it explains
    for (const a of alt.assignments) for (const i of a.bands) expect(analysed.bands[i]?.position).toBeDefined();
  });

  it('is stored as a record that passes the response schema (REST)', async () => {
    const saved = await request(service.app)
      .post('/api/v1/analyses')
      .query({ ion: 'Cr3+', sample: 'aqua', corrections: JSON.stringify({ alternative: 0 }) })
      .attach('spectrum', readFileSync(AQUA), 'cr-aqua.csv');
    expect(saved.status, JSON.stringify(saved.body)).toBe(201);
    expect(analysisRecordResponse.safeParse(saved.body).error).toBeUndefined();
    expect((saved.body as AnalysisRecord & { result: AnalyzeResult }).result.fit.betaSd).toBeNull();
    const refit = await request(service.app).post(`/api/v1/analyses/${saved.body.id}/refit`).send({}).expect(200);
    expect(analysisRecordResponse.safeParse(refit.body).error).toBeUndefined();
  });

  it('the CLI shows no ± it does not have', async () => {
    const best = await cli('add', AQUA, '--ion', 'Cr3+');
    expect(best.code).toBe(0);
    // the best fit prints its uncertainties: the check below can fail
    expect(best.out).toMatch(/β = [\d.]+ ± [\d.]+/);
    const chosen = await cli('add', AQUA, '--ion', 'Cr3+', '--corrections', '{"alternative":0}');
    expect(chosen.code, chosen.err).toBe(0);
    expect(chosen.out).toMatch(/β = [\d.]+/);
    expect(chosen.out).not.toContain('±');
  });

  it('the page shows the core\'s fitWithAlternative, through the JSON the service sends', () => {
    const result = JSON.parse(JSON.stringify(analysed)) as AnalyzeResult;
    const entry = {
      key: 'a1', fileName: 'cr-aqua.csv', file: null, details: { ...defaultDetails(), ion: 'Cr3+' }, status: 'done', result, error: null,
      fit: result.fit, originalFit: result.fit, bands: editableBandsFromResult(result.bands), cOverB: null, freeC: false, shownAlternative: 0, libraryId: null,
    } as AnalysisEntry;
    const page = shownFit(entry)!;
    const core = fitWithAlternative(analysed.fit, 0);
    // one rule: every field, not only those the page reads today
    expect(page).toEqual(JSON.parse(JSON.stringify(core)));
    expect(page.uncertainty).toEqual({ tenDq: null, dq: null, b: null, c: null });
    expect(page.tenDq).not.toBe(analysed.fit.tenDq);
    entry.shownAlternative = null;
    expect(shownFit(entry)).toBe(result.fit);
  });
});
});
