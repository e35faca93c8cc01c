import { copyFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RESULTS_CSV_COLUMNS } from '../../src/report/results-csv.js';
import { resultsTableCsv } from '../../web/export-results.js';
import { defaultDetails, editableBandsFromResult, nextKey, type AnalysisEntry } from '../../web/state.js';
import { analyzeQuery } from '../../web/api.js';
import type { AnalyzeResult } from '../../web/types.js';
import { makeTestApp, type TestApp } from '../server/helpers.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * Issue 18's done-when: the same spectra give byte-identical CSV from the CLI
 * batch (`analyze --csv`), the library export (`library export --columns
 * results`) and the page (its results download, fed by the service's answer
 * as the page takes it). A consistency check between the three interfaces:
 * the numbers are the pipeline's own, not check values. The spectra are the
 * invented demo scenario and the real-like fixtures (a CT tail, a window
 * that cuts a band: warnings in the last column).
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const SPECTRA = [
  { file: 'cr-aqua.csv', from: join(ROOT, 'spectra-demo', 'cr-aqua.csv'), ion: 'Cr3+' },
  { file: 'cr-ammine.jdx', from: join(ROOT, 'spectra-demo', 'cr-ammine.jdx'), ion: 'Cr3+' },
  { file: 'ni-aqua-visible.csv', from: join(ROOT, 'fixtures', 'spectra', 'real-like', 'ni-aqua-visible.csv'), ion: 'Ni2+' },
  { file: 'co-aqua-visible.csv', from: join(ROOT, 'fixtures', 'spectra', 'real-like', 'co-aqua-visible.csv'), ion: 'Co2+' },
];

let dir: string;
let service: TestApp;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-same-csv-'));
  for (const s of SPECTRA) copyFileSync(s.from, join(dir, s.file));
  service = makeTestApp();
});
afterAll(async () => {
  await service.dispose();
  rmSync(dir, { recursive: true, force: true });
});

function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(args, { cwd: dir, env: { FIELDGAP_DATA: join(dir, 'library') } });
}

/** The page's entry once the service has answered, as web/main.ts fills it. */
function pageEntry(file: string, ion: string, result: AnalyzeResult): AnalysisEntry {
  return {
    key: nextKey(), fileName: file, file: null, details: { ...defaultDetails(), ion }, status: 'done', result, error: null,
    fit: result.fit, originalFit: result.fit, bands: editableBandsFromResult(result.bands),
    cOverB: null, freeC: false, shownAlternative: null, libraryId: null,
  };
}

describe('one results CSV from the CLI batch, the library export and the page', () => {
  it('is byte for byte the same for the same spectra', async () => {
    // The CLI batch: one --ion per batch, so one batch per ion, rows joined in order below.
    const batches: string[] = [];
    for (const ion of [...new Set(SPECTRA.map((s) => s.ion))]) {
      const files = SPECTRA.filter((s) => s.ion === ion).map((s) => s.file);
      const out = `batch-${ion}.csv`;
      const run = await cli('analyze', ...files, '--ion', ion, '--csv', out);
      expect(run.code, run.err).toBe(0);
      batches.push(readFileSync(join(dir, out), 'utf8'));
    }
    const [header, ...restOfFirst] = batches[0]!.trimEnd().split('\r\n');
    const batchRows = [...restOfFirst, ...batches.slice(1).flatMap((b) => b.trimEnd().split('\r\n').slice(1))];
    expect(header).toBe(RESULTS_CSV_COLUMNS.join(','));
    const batch = `${[header, ...batchRows].join('\r\n')}\n`;
    expect(batchRows).toHaveLength(SPECTRA.length);
    expect(batch).toMatch(/ni-aqua-visible\.csv,Ni2\+,\d/);

    // The library: stored newest first, so added in reverse to list in the batch's order.
    for (const s of [...SPECTRA].reverse()) {
      const add = await cli('library', 'add', s.file, '--ion', s.ion);
      expect(add.code, add.err).toBe(0);
    }
    const exported = await cli('library', 'export', '--columns', 'results');
    expect(exported.code, exported.err).toBe(0);

    // The page: the service's answer to the page's own request, then its download.
    const entries: AnalysisEntry[] = [];
    for (const s of SPECTRA) {
      const query = analyzeQuery({ ...defaultDetails(), ion: s.ion });
      const res = await request(service.app).post(`/api/v1/analyze?${query.toString()}`).attach('spectrum', readFileSync(join(dir, s.file)), { filename: s.file }).expect(200);
      entries.push(pageEntry(s.file, s.ion, res.body as AnalyzeResult));
    }
    const page = resultsTableCsv(entries);

    expect(exported.out).toBe(batch);
    expect(page).toBe(batch);
  });

  it('the export refuses --columns with --json and an unknown column set', async () => {
    const both = await cli('library', 'export', '--json', 'x.json', '--columns', 'results');
    expect(both.code).toBe(2);
    expect(both.err).toContain('--columns');
    const unknown = await cli('library', 'export', '--columns', 'everything');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toContain('--columns');
  });
});
