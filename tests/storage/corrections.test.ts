import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { analyzeSpectrum, type AnalyzeResult } from '../../src/analysis.js';
import { checkCorrections } from '../../src/analysis-corrections.js';
import type { FitResult } from '../../src/fit/types.js';
import type { AnalysisRecord } from '../../src/library/types.js';
import { correctionsFor, defaultDetails, editableBandsFromCorrections, editableBandsFromResult, fitRequestFor, shownFit, type AnalysisEntry } from '../../web/state.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { servicePerTest } from './helpers/service.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * What the page shows after "Saved" is what the library stored: the page's
 * own rules (web/state.ts: the band list it sends to POST /fit, the
 * alternative it shows) against the record the service stores from the same
 * corrections. The demo spectra are an invented scenario; the checks here are
 * consistency between the page, the service and the library, not numbers
 * from outside.
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const AQUA = join(ROOT, 'spectra-demo', 'cr-aqua.csv');

/** The numbers and labels a user reads off a fit. */
interface FitLike {
  tenDq: number; b: number | null; c: number | null; beta: number | null; rmsResidual: number | null; spinState: string; groundTerm: string;
  cOverB: number | null; unpairedElectrons: number; spinOnlyMoment: number; assignments: readonly { observed: number; calculated: number; label?: string }[];
}

function shown(fit: FitLike) {
  return {
    tenDq: fit.tenDq, b: fit.b, c: fit.c, beta: fit.beta, rms: fit.rmsResidual, spinState: fit.spinState, groundTerm: fit.groundTerm,
    cOverB: fit.cOverB, unpaired: fit.unpairedElectrons, moment: fit.spinOnlyMoment,
    assignments: fit.assignments.map((a) => [a.observed, a.calculated, a.label]),
  };
}

function pageEntry(result: AnalyzeResult): AnalysisEntry {
  return {
    key: 'a1', fileName: 'cr-aqua.csv', file: null, details: { ...defaultDetails(), ion: 'Cr3+' }, status: 'done', result, error: null,
    fit: result.fit, originalFit: result.fit, bands: editableBandsFromResult(result.bands), cOverB: null, freeC: false, shownAlternative: null, libraryId: null,
  } as AnalysisEntry;
}

forEachEngine('corrections in the library', (engine) => {
const fresh = libraryPerTest(engine, { open: false });
const service = servicePerTest(fresh);

function save(corrections: object | null) {
  const req = request(service.app).post('/api/v1/analyses').query({ ion: 'Cr3+', sample: 'aqua', ...(corrections && { corrections: JSON.stringify(corrections) }) });
  return req.attach('spectrum', readFileSync(AQUA), 'cr-aqua.csv');
}

describe('corrections stored with the record equal what the page shows', () => {
  it('a band removed and one reclassified: the stored fit is the page\'s POST /fit answer', async () => {
    const analysed = (await request(service.app).post('/api/v1/analyze?ion=Cr3%2B').attach('spectrum', readFileSync(AQUA), 'cr-aqua.csv').expect(200)).body as AnalyzeResult;
    const entry = pageEntry(analysed);
    // The user drops the spin-forbidden band and marks the highest band as a shoulder.
    entry.bands[0]!.included = false;
    entry.bands[2]!.shoulder = true;
    const pageFit = (await request(service.app).post('/api/v1/fit').send(fitRequestFor(entry)).expect(200)).body as FitResult;
    entry.fit = pageFit;
    const corrections = correctionsFor(entry);
    expect(corrections?.bands).toHaveLength(2);

    const saved = (await save(corrections).expect(201)).body as AnalysisRecord & { result: AnalyzeResult };
    expect(shown(saved.result.fit)).toEqual(shown(shownFit(entry)!));
    expect(saved.summary.tenDq).toBe(pageFit.tenDq);
    // stored as the core checks them (the same fields; an empty flag list left out)
    expect(saved.options).toMatchObject({ corrections: checkCorrections(corrections) });
    expect(saved.result.corrections).toEqual(checkCorrections(corrections));
    // the found bands are kept as found: a correction changes the fit, never the spectrum (assignedKind is the fit's reading of a band, so it goes with the fit)
    const found = (bands: AnalyzeResult['bands']) => bands.map(({ assignedKind: _fitsReading, ...band }) => band);
    expect(found(saved.result.bands)).toEqual(found(analysed.bands));
    // what was stored is what is read back
    expect((await request(service.app).get(`/api/v1/analyses/${saved.id}`).expect(200)).body.result.fit).toEqual(saved.result.fit);
    // and the page, reopening the record, shows the bands the stored fit was made from
    const reopened = pageEntry(saved.result);
    reopened.bands = editableBandsFromCorrections(saved.result.bands, checkCorrections(corrections).bands as never);
    expect(reopened.bands.map((b) => b.included)).toEqual(entry.bands.map((b) => b.included));
    expect(fitRequestFor(reopened).bands).toEqual(fitRequestFor(entry).bands);
  });

  it('the chosen alternative assignment: the stored fit is the page\'s shownFit', async () => {
    const analysed = analyzeSpectrum(readFileSync(AQUA), { ion: 'Cr3+', fileName: 'cr-aqua.csv' });
    expect(analysed.fit.alternatives.length).toBeGreaterThan(0);
    const entry = pageEntry(JSON.parse(JSON.stringify(analysed)) as AnalyzeResult);
    entry.shownAlternative = 0;
    const saved = (await save(correctionsFor(entry)).expect(201)).body as AnalysisRecord & { result: AnalyzeResult };
    expect(shown(saved.result.fit)).toEqual(shown(shownFit(entry)!));
    expect(saved.summary.tenDq).toBe(analysed.fit.alternatives[0]!.tenDq);
    expect(saved.summary.tenDq).not.toBe(analysed.fit.tenDq);
  });

  it('is reproducible: a refit changing nothing gives the same fit; corrections: null takes them back', async () => {
    const saved = (await save({ alternative: 1 }).expect(201)).body as AnalysisRecord & { result: AnalyzeResult };
    const again = (await request(service.app).post(`/api/v1/analyses/${saved.id}/refit`).send({}).expect(200)).body as AnalysisRecord & { result: AnalyzeResult; changes: unknown[] };
    expect(again.result.fit).toEqual(saved.result.fit);
    expect(again.changes).toEqual([]);
    const back = (await request(service.app).post(`/api/v1/analyses/${saved.id}/refit`).send({ corrections: null }).expect(200)).body as AnalysisRecord & { result: AnalyzeResult; changes: { what: string }[] };
    expect(back.options).not.toHaveProperty('corrections');
    expect(back.result.fit).toEqual(JSON.parse(JSON.stringify(analyzeSpectrum(readFileSync(AQUA), { ion: 'Cr3+', fileName: 'cr-aqua.csv' }).fit)));
    expect(back.changes.length).toBeGreaterThan(0);
  });

  it('refuses bad corrections before analysing, naming the field', async () => {
    const bad = await save({ bands: [{ position: 'x' }] }).expect(400);
    expect(bad.body.error.path).toMatch(/^corrections\.bands\[0\]/);
    expect((await save({ alternative: 9 }).expect(400)).body.error.path).toBe('corrections.alternative');
    expect((await save({ colour: 1 }).expect(400)).body.error.path).toBe('corrections.colour');
    expect((await request(service.app).get('/api/v1/analyses').expect(200)).body.total).toBe(0);
  });
});

describe('library refit options are reversible, and every change in the assignment is shown', () => {
  function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
    return runCliCaptured(['library', ...args], { cwd: ROOT, env: { ...fresh.where.env } });
  }

  it('--free-c, then --c-over-b 4.5 takes it back; --reset c-over-b returns to the first analysis', async () => {
    const first = JSON.parse((await cli('add', AQUA, '--ion', 'Cr3+', '--json')).out) as AnalysisRecord;
    const free = await cli('refit', String(first.id), '--free-c');
    expect(free.code).toBe(0);
    expect(free.out).toContain('  C: ratio → free\n');
    const ratio = await cli('refit', String(first.id), '--c-over-b', '4.5', '--json');
    expect(ratio.code).toBe(0);
    const fixed = JSON.parse(ratio.out) as AnalysisRecord & { changes: { what: string; before: string; after: string }[] };
    expect(fixed.options).toEqual({ ion: 'Cr3+', fileName: 'cr-aqua.csv', cOverB: 4.5 });
    expect(fixed.changes).toContainEqual({ what: 'cMode', before: 'free', after: 'ratio' });
    const back = await cli('refit', String(first.id), '--reset', 'c-over-b', '--json');
    const restored = JSON.parse(back.out) as AnalysisRecord;
    expect(restored.options).toEqual(first.options);
    expect(restored.result).toEqual(first.result);
    expect(restored.revisions.map((r) => r.revision)).toEqual([1, 2, 3, 4]);
    // each change of a band's assignment gets its own line
    const text = await cli('refit', String(first.id), '--free-c');
    const lines = text.out.split('\n').filter((l) => /^ {2}band \d+ cm-1: /.test(l));
    const revisions = (JSON.parse((await cli('show', String(first.id), '--json')).out) as AnalysisRecord).revisions;
    expect(revisions).toHaveLength(5);
    expect(lines.length).toBeGreaterThan(0);
    expect((await cli('refit', String(first.id), '--reset', 'colour')).err).toMatch(/--reset: "colour" is not a stored option/);
  });
});
});
