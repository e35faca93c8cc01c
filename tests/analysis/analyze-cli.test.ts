import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Papa from 'papaparse';
import { beforeAll, describe, expect, it } from 'vitest';
import { cli, syntheticCsv, type KnownComplex } from './helpers.js';

const CR: KnownComplex = {
  d: 3, geometry: 'octahedral', dq: 1700, b: 680, c: 680 * 3850 / 918,
  bands: [{ label: '4T2g(F)', epsilon: 15, fwhm: 2800 }, { label: '4T1g(F)', epsilon: 18, fwhm: 3200 }],
};

let dir: string;
const sha = (path: string) => createHash('sha256').update(readFileSync(path)).digest('hex');

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-analyze-'));
  writeFileSync(join(dir, 'a.csv'), syntheticCsv(CR, { seed: 1 }));
  writeFileSync(join(dir, 'b.csv'), syntheticCsv({ ...CR, dq: 2100 }, { seed: 2 }));
  writeFileSync(join(dir, 'broken.csv'), 'wavelength,absorbance\nthis is not a spectrum\n');
});

describe('fieldgap analyze', () => {
  it('prints the JSON contract for one file', async () => {
    const { code, stdout } = await cli(['analyze', join(dir, 'a.csv'), '--ion', 'Cr3+', '--conc', '0.05', '--json']);
    expect(code).toBe(0);
    const out = JSON.parse(stdout);
    expect(Object.keys(out.spectrum)).toEqual(expect.arrayContaining(['points', 'range', 'xUnit', 'yUnit', 'masked']));
    for (const band of out.bands) {
      expect(Object.keys(band)).toEqual(expect.arrayContaining(['position', 'wavelength', 'height', 'epsilon', 'fwhm', 'area', 'oscillatorStrength', 'kind']));
      expect(['d-d', 'spin-forbidden', 'charge-transfer']).toContain(band.kind);
    }
    expect(out.fit.tenDq).toBeGreaterThan(16_700);
    expect(out.fit.tenDq).toBeLessThan(17_300);
    expect(Array.isArray(out.warnings)).toBe(true);
  });

  it('prints a readable report with units', async () => {
    const { code, stdout } = await cli(['analyze', join(dir, 'a.csv'), '--ion', 'Cr3+']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/10Dq\s+\d+ ± \d+ cm-1/);
    expect(stdout).toContain('4A2g(F) → 4T2g(F)');
  });

  it('runs a batch: one row per file, a failing file does not stop the others, exit 1', async () => {
    const before = sha(join(dir, 'broken.csv'));
    const { code, stdout } = await cli(['analyze', dir, '--ion', 'Cr3+', '--csv', 'summary.csv', '--json', 'results.json'], dir);
    expect(code).toBe(1);
    expect(stdout).toMatch(/2 of 3 spectra analysed, 1 failed/);
    const rows = Papa.parse<Record<string, string>>(readFileSync(join(dir, 'summary.csv'), 'utf8').trim(), { header: true }).data;
    expect(rows.map((r) => r['file'])).toHaveLength(3);
    const broken = rows.find((r) => r['file']!.endsWith('broken.csv'))!;
    expect(broken['warnings']).toMatch(/^FAILED: /);
    const good = rows.filter((r) => r['tenDq'] !== '');
    expect(good).toHaveLength(2);
    // One number per cell, uncertainties in their own columns: a.csv was made with Dq 1700, b.csv with 2100 (round trip).
    const tenDqs = good.map((r) => Number(r['tenDq'])).sort((p, q) => p - q);
    expect(tenDqs[0]).toBeCloseTo(17_000, -2);
    expect(tenDqs[1]).toBeCloseTo(21_000, -2);
    for (const r of good) {
      for (const key of ['tenDqSd', 'b', 'bSd', 'beta', 'rms']) expect(Number.isFinite(Number(r[key])) && r[key] !== '').toBe(true);
    }
    expect(Number(good[0]!['b'])).toBeCloseTo(680, -1);
    const results = JSON.parse(readFileSync(join(dir, 'results.json'), 'utf8')).results;
    expect(results).toHaveLength(3);
    expect(results.find((r: { file: string }) => r.file.endsWith('broken.csv')).error.code).toBe('parse-error');
    expect(sha(join(dir, 'broken.csv'))).toBe(before);
  });

  it('one failing file: exit 2 and one line naming the file', async () => {
    const { code, stderr, stdout } = await cli(['analyze', join(dir, 'broken.csv'), '--ion', 'Cr3+']);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trim().split('\n')).toHaveLength(1);
    expect(stderr).toContain('broken.csv');
  });

  it('names the option that is wrong', async () => {
    const missing = await cli(['analyze', join(dir, 'a.csv')]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('--ion');
    const bad = await cli(['analyze', join(dir, 'a.csv'), '--ion', 'Cr3+', '--conc', 'lots']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--conc');
    // A misspelt ion is one usage error before any file is read, not a failure in every row of a batch.
    const badIon = await cli(['analyze', dir, '--ion', 'Qq3+']);
    expect(badIon.code).toBe(2);
    expect(badIon.stdout).toBe('');
    expect(badIon.stderr.trim()).toMatch(/^fieldgap analyze: --ion: unknown element "Qq"/);
    const nofile = await cli(['analyze', join(dir, 'nothere.csv'), '--ion', 'Cr3+']);
    expect(nofile.code).toBe(2);
    expect(nofile.stderr).toContain('nothere.csv');
  });

  it('never writes a summary over a spectrum it reads, and sets its own earlier summary aside', async () => {
    const here = mkdtempSync(join(tmpdir(), 'fieldgap-outputs-'));
    writeFileSync(join(here, 'a.csv'), syntheticCsv(CR, { seed: 3 }));
    const before = sha(join(here, 'a.csv'));
    const over = await cli(['analyze', here, '--ion', 'Cr3+', '--csv', join(here, 'a.csv')]);
    expect(over.code).toBe(2);
    expect(over.stderr.trim()).toMatch(/^fieldgap analyze: --csv: .*a\.csv is one of the spectra to analyse/);
    expect(sha(join(here, 'a.csv'))).toBe(before);
    // A summary written into the folder analysed is no spectrum on the next run: left out and replaced.
    for (const run of [1, 2]) {
      const { code, stdout } = await cli(['analyze', here, '--ion', 'Cr3+', '--csv', join(here, 'summary.csv')]);
      expect(code, `run ${run}`).toBe(0);
      expect(stdout).toMatch(/1 of 1 spectra analysed/);
    }
    // One file for two outputs, and a folder that does not exist, are refused before any work.
    const twice = await cli(['analyze', here, '--ion', 'Cr3+', '--csv', 'out.json', '--json', 'out.json'], here);
    expect(twice.code).toBe(2);
    expect(twice.stderr).toMatch(/--json: out\.json is also the file of --csv/);
    const nowhere = await cli(['analyze', here, '--ion', 'Cr3+', '--csv', join(here, 'missing', 'summary.csv')]);
    expect(nowhere.code).toBe(2);
    expect(nowhere.stderr).toMatch(/--csv: the folder of .* does not exist/);
    expect(sha(join(here, 'a.csv'))).toBe(before);
  });
});
