import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { createBatchRunner } from '../../src/cli/batch-pool.js';
import { formatDelimited } from '../../src/spectrum/index.js';
import { cli, syntheticCsv, type KnownComplex } from '../analysis/helpers.js';

/**
 * `analyze` on many files: worker threads give, byte for byte, what the
 * calling thread gives (table, CSV, JSON), rows in the order of the file
 * list. The spectra are synthetic test input (consistency only, no check values).
 */
const CR: KnownComplex = {
  d: 3, geometry: 'octahedral', dq: 1700, b: 680, c: 680 * 3850 / 918,
  bands: [{ label: '4T2g(F)', epsilon: 15, fwhm: 2800 }, { label: '4T1g(F)', epsilon: 18, fwhm: 3200 }],
};

let dir: string;
let out: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-batch-pool-'));
  out = mkdtempSync(join(tmpdir(), 'fieldgap-batch-pool-out-'));
  for (let i = 0; i < 9; i++) writeFileSync(join(dir, `s${i}.csv`), syntheticCsv({ ...CR, dq: 1500 + 60 * i }, { seed: i + 1 }));
  writeFileSync(join(dir, 'broken.csv'), 'wavelength,absorbance\nnot a spectrum\n');
  // A two-column file: one row per column.
  const rows = syntheticCsv(CR, { seed: 11 }).trim().split('\n').slice(1).map((l) => l.split(',').map(Number));
  const x = Float64Array.from(rows, (r) => r[0]!);
  const y = Float64Array.from(rows, (r) => r[1]!);
  writeFileSync(join(dir, 'two.csv'), formatDelimited({ x, ys: [y, y.map((v) => 0.5 * v)], header: ['nm', 'A', 'B'] }));
});
afterAll(() => {
  for (const d of [dir, out]) rmSync(d, { recursive: true, force: true });
});

describe('analyze on worker threads', () => {
  it('gives the same table, CSV and JSON as the calling thread, in file order', async () => {
    const runs = [];
    for (const threads of ['1', '2']) {
      const csv = join(out, `summary-${threads}.csv`);
      const json = join(out, `results-${threads}.json`);
      const { code, stdout, stderr } = await cli(['analyze', '.', '--ion', 'Cr3+', '--threads', threads, '--csv', csv, '--json', json], dir);
      runs.push({ code, stderr, stdout: stdout.replaceAll(`-${threads}.`, '-N.'), csv: readFileSync(csv, 'utf8'), json: readFileSync(json, 'utf8') });
    }
    const [one, two] = runs as [(typeof runs)[0], (typeof runs)[0]];
    expect(one.code).toBe(1);
    expect(one.stdout, one.stderr).toMatch(/11 of 12 spectra analysed, 1 failed\./);
    expect(two).toEqual(one);
    const files = (JSON.parse(one.json) as { results: Array<{ file: string; column?: number }> }).results.map((r) => `${r.file.split('/').pop()}${r.column ? `#${r.column}` : ''}`);
    expect(files).toEqual(['broken.csv', ...Array.from({ length: 9 }, (_v, i) => `s${i}.csv`), 'two.csv#1', 'two.csv#2']);
  });

  it('a runner for a small batch stays on the calling thread unless threads are asked for', async () => {
    const small = await createBatchRunner(3, 4);
    expect(small.threads).toBe(1);
    await small.close();
    const asked = await createBatchRunner(3, 2, true);
    try {
      expect(asked.threads).toBe(2);
      const rows = await asked.run({ file: join(dir, 'two.csv'), cwd: dir, options: { ion: 'Cr3+' }, expandColumns: true, json: false });
      expect(rows.map((r) => r.summary.file)).toEqual([`${join(dir, 'two.csv')}#1 (A)`, `${join(dir, 'two.csv')}#2 (B)`]);
      // Bytes in, analysis out (library add of many files): what analyzeSpectrum gives on this thread.
      const content = readFileSync(join(dir, 's3.csv'));
      const options = { ion: 'Cr3+', fileName: 's3.csv' };
      expect(JSON.stringify(await asked.analyze({ content, options }))).toBe(JSON.stringify({ result: analyzeSpectrum(content, options) }));
      const failed = await asked.analyze({ content: readFileSync(join(dir, 'broken.csv')), options: { ion: 'Cr3+', fileName: 'broken.csv' } });
      expect(failed).toMatchObject({ error: { code: 'parse-error', path: 'broken.csv' } });
    } finally {
      await asked.close();
    }
  });
});
