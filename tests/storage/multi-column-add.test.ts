import { createHash } from 'node:crypto';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { savedFileResponse } from '../../server/responses.js';
import { analyzeSpectrum } from '../../src/analysis.js';
import { runCliCaptured } from '../helpers/cli-run.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { servicePerTest } from './helpers/service.js';

/**
 * A file with several spectra (x and several y columns) is as many records
 * in the library, whichever way it arrives: `library add FILE`, POST
 * /api/v1/analyses (the page's "Save to library") and `watch` (its own
 * suite, watch.test.ts) follow one rule (src/library/spectra-to-store.ts).
 * Each record keeps the whole original byte for byte and its column, and
 * its fit is that column's, as `analyze --column N` gives it.
 *
 * No number here is an outside check value: the fits are compared with the
 * project's own pipeline run on each column (analyzeSpectrum), which is the
 * point (the record of column 2 holds column 2's analysis, not column 1's).
 */

const ROOT = new URL('../../', import.meta.url).pathname;
// spectra-demo/cr-series.csv: the invented demo scenario, three y columns (en, urea, NCS); upload content only.
const SERIES = readFileSync(join(ROOT, 'spectra-demo', 'cr-series.csv'));
const NAMES = ['Cr-en absorbance', 'Cr-urea absorbance', 'Cr-NCS absorbance'];
/**
 * The same export with its last column a solvent blank (absorbance 0.00
 * everywhere, as an instrument writes a blank beside its samples): that
 * spectrum has no band to fit, so it alone is not saved.
 */
const WITH_BLANK = Buffer.from(
  SERIES.toString('utf8')
    .split('\n')
    .map((line) => (/^\d/.test(line) ? line.replace(/,[^,]*$/, ',0.00') : line.replace('Cr-NCS absorbance', 'blank')))
    .join('\n'),
);

const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Each column's own analysis, as `analyze --column N` makes it. */
const columnTenDq = [1, 2, 3].map((column) => analyzeSpectrum(SERIES, { ion: 'Cr3+', concentration: 0.05, column, fileName: 'cr-series.csv' }).fit.tenDq);

forEachEngine('a multi-column file in the library', (engine) => {
  const fresh = libraryPerTest(engine);
  const service = servicePerTest(fresh);

  async function storedRecords() {
    const library = fresh.library;
    const page = await library.list({ limit: 100 });
    return Promise.all(page.analyses.map((a) => library.get(a.id)));
  }

  async function expectThreeColumnRecords() {
    const records = (await storedRecords()).sort((a, b) => Number(a.options.column) - Number(b.options.column));
    expect(records.map((r) => r.options.column)).toEqual([1, 2, 3]);
    expect(records.map((r) => r.sample)).toEqual(NAMES.map((n) => `cr-series: ${n}`));
    // Each record's fit is its own column's (three different spectra, three different fits).
    expect(records.map((r) => r.summary.tenDq)).toEqual(columnTenDq);
    expect(new Set(columnTenDq).size).toBe(3);
    for (const record of records) {
      expect(record.original.fileName).toBe('cr-series.csv');
      expect(record.original.sha256).toBe(sha(SERIES));
      expect(Buffer.from((await fresh.library.getOriginal(record.id)).bytes).equals(SERIES)).toBe(true);
    }
    return records;
  }

  describe('library add FILE', () => {
    const cli = (...args: string[]) => runCliCaptured(['library', ...args], { cwd: ROOT, env: { ...fresh.where.env } });

    it('saves one record per column, each named after its column, and says how many', { timeout: 120_000 }, async () => {
      const { code, out, err } = await cli('add', 'spectra-demo/cr-series.csv', '--ion', 'Cr3+', '--conc', '0.05');
      expect(err).toBe('');
      expect(code).toBe(0);
      expect(out.match(/^saved #\d+ /gm)).toHaveLength(3);
      expect(out).toContain('cr-series.csv: 3 records (one per spectrum; the file holds 3)\n');
      await expectThreeColumnRecords();
    });

    it('--json: the first record, with every record of the file listed', { timeout: 120_000 }, async () => {
      const { code, out } = await cli('add', 'spectra-demo/cr-series.csv', '--ion', 'Cr3+', '--conc', '0.05', '--json');
      expect(code).toBe(0);
      const json = JSON.parse(out) as { id: number; records: Array<{ id: number; column: number; columnName: string }>; notSaved: unknown[] };
      expect(json.records.map((r) => [r.column, r.columnName])).toEqual(NAMES.map((n, i) => [i + 1, n]));
      expect(json.id).toBe(json.records[0]!.id);
      expect(json.notSaved).toEqual([]);
      await expectThreeColumnRecords();
    });

    it('several files: each spectrum of each file is a record, and the summary counts records', { timeout: 300_000 }, async () => {
      const { code, out, err } = await cli('add', 'spectra-demo/cr-aqua.csv', 'spectra-demo/cr-series.csv', '--ion', 'Cr3+', '--conc', '0.05');
      expect(err).toBe('');
      expect(code).toBe(0);
      expect(out.match(/^saved #\d+ "[^"]*"/gm)).toEqual(['saved #1 "cr-aqua"', ...NAMES.map((n, i) => `saved #${i + 2} "cr-series: ${n}"`)]);
      expect(out).toMatch(/\n2 of 2 files saved \(4 records: one per spectrum of a file\)\.\n$/);
      const records = await storedRecords();
      const series = records.filter((r) => r.original.fileName === 'cr-series.csv').sort((a, b) => Number(a.options.column) - Number(b.options.column));
      expect(series.map((r) => [r.options.column, r.summary.tenDq])).toEqual(columnTenDq.map((t, i) => [i + 1, t]));
      expect(records.find((r) => r.original.fileName === 'cr-aqua.csv')!.options.column).toBeUndefined();
    });

    it('several files: a blank column is named on stderr, the rest saved, exit 1', { timeout: 300_000 }, async () => {
      const file = join(fresh.where.dir, 'with-blank.csv');
      writeFileSync(file, WITH_BLANK);
      const { code, out, err } = await cli('add', 'spectra-demo/cr-aqua.csv', file, '--ion', 'Cr3+', '--conc', '0.05');
      expect(code).toBe(1);
      expect(err).toMatch(/^fieldgap library: .*with-blank\.csv#3 \(blank\): not saved: no d–d bands to fit/m);
      expect(out).toMatch(/\n2 of 2 files saved \(3 records: one per spectrum of a file\), 1 not saved\.\n$/);
      expect((await storedRecords()).length).toBe(3);
    });

    it('--column N stores that column alone, as before', { timeout: 120_000 }, async () => {
      const { code, out } = await cli('add', 'spectra-demo/cr-series.csv', '--ion', 'Cr3+', '--conc', '0.05', '--column', '2');
      expect(code).toBe(0);
      expect(out.match(/^saved #\d+ /gm)).toHaveLength(1);
      expect(out).not.toContain('records');
      const records = await storedRecords();
      expect(records.map((r) => [r.options.column, r.summary.tenDq])).toEqual([[2, columnTenDq[1]]]);
    });

    it('a column that cannot be fitted is named on stderr, the others are saved, exit 1', { timeout: 120_000 }, async () => {
      const file = join(fresh.where.dir, 'with-blank.csv');
      writeFileSync(file, WITH_BLANK);
      const { code, out, err } = await cli('add', file, '--ion', 'Cr3+', '--conc', '0.05');
      expect(code).toBe(1);
      expect(out.match(/^saved #\d+ /gm)).toHaveLength(2);
      expect(out).toContain('with-blank.csv: 2 records (one per spectrum; the file holds 3), 1 not saved\n');
      expect(err).toMatch(/^fieldgap library: with-blank\.csv#3 \(blank\): not saved: no d–d bands to fit/m);
      const records = await storedRecords();
      expect(records.map((r) => r.options.column).sort()).toEqual([1, 2]);
      expect(readFileSync(file).equals(WITH_BLANK)).toBe(true); // the user's file untouched
    });

    it('refuses --corrections for a file of several spectra, naming --column', async () => {
      const { code, err } = await cli('add', 'spectra-demo/cr-series.csv', '--ion', 'Cr3+', '--corrections', '{"alternative":0}');
      expect(code).toBe(2);
      expect(err).toMatch(/--corrections.*cr-series\.csv holds 3 \(columns 1, 2, 3\): choose one with --column/);
      expect(await storedRecords()).toEqual([]);
    });
  });

  describe('POST /api/v1/analyses', () => {
    it('saves one record per column; the answer is the first record with `records` listing all', { timeout: 120_000 }, async () => {
      const res = await request(service.app)
        .post('/api/v1/analyses?ion=Cr3%2B&conc=0.05')
        .attach('spectrum', SERIES, { filename: 'cr-series.csv', contentType: 'text/csv' })
        .expect(201);
      const body = res.body as { id: number; options: { column?: number }; records: Array<{ id: number; sample: string; column: number }>; notSaved: unknown[] };
      expect(body.records.map((r) => [r.column, r.sample])).toEqual(NAMES.map((n, i) => [i + 1, `cr-series: ${n}`]));
      expect(body.id).toBe(body.records[0]!.id);
      expect(body.options.column).toBe(1);
      expect(savedFileResponse.safeParse(res.body).error).toBeUndefined(); // the documented answer (OpenAPI SavedFile)
      expect(res.headers['location']).toBe(`/api/v1/analyses/${body.id}`);
      const records = await expectThreeColumnRecords();
      // A refit reads its own column again.
      const refit = await request(service.app).post(`/api/v1/analyses/${records[1]!.id}/refit`).expect(200);
      expect(refit.body.summary.tenDq).toBe(columnTenDq[1]);
    });

    it('the same for a raw body', { timeout: 120_000 }, async () => {
      const res = await request(service.app).post('/api/v1/analyses?ion=Cr3%2B&conc=0.05&fileName=cr-series.csv').set('Content-Type', 'text/csv').send(SERIES).expect(201);
      expect((res.body as { records: unknown[] }).records).toHaveLength(3);
      await expectThreeColumnRecords();
    });

    it('lists a column that cannot be fitted in notSaved and saves the others', { timeout: 120_000 }, async () => {
      const res = await request(service.app)
        .post('/api/v1/analyses?ion=Cr3%2B&conc=0.05')
        .attach('spectrum', WITH_BLANK, { filename: 'with-blank.csv', contentType: 'text/csv' })
        .expect(201);
      const body = res.body as { records: Array<{ column: number }>; notSaved: Array<{ column: number; columnName: string; error: { code: string; message: string; path: string } }> };
      expect(savedFileResponse.safeParse(res.body).error).toBeUndefined();
      expect(body.records.map((r) => r.column)).toEqual([1, 2]);
      expect(body.notSaved).toHaveLength(1);
      expect(body.notSaved[0]).toMatchObject({ column: 3, columnName: 'blank', error: { code: 'unexplained', path: 'with-blank.csv#3' } });
      expect((await storedRecords()).map((r) => r.options.column).sort()).toEqual([1, 2]);
    });

    it('a column chosen by the client is one record, as before', { timeout: 120_000 }, async () => {
      const res = await request(service.app)
        .post('/api/v1/analyses?ion=Cr3%2B&conc=0.05&column=3')
        .attach('spectrum', SERIES, { filename: 'cr-series.csv', contentType: 'text/csv' })
        .expect(201);
      expect((res.body as { records: unknown[] }).records).toHaveLength(1);
      expect((await storedRecords()).map((r) => [r.options.column, r.summary.tenDq])).toEqual([[3, columnTenDq[2]]]);
    });

    it('refuses corrections for a file of several spectra, naming the column field', async () => {
      const res = await request(service.app)
        .post('/api/v1/analyses?ion=Cr3%2B')
        .field('corrections', '{"alternative":0}')
        .attach('spectrum', SERIES, { filename: 'cr-series.csv', contentType: 'text/csv' })
        .expect(400);
      expect(res.body.error.path).toBe('corrections');
      expect(res.body.error.message).toMatch(/holds 3 \(columns 1, 2, 3\): choose one with column/);
      expect(await storedRecords()).toEqual([]);
    });
  });
});
