import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { cli, syntheticCsv, type KnownComplex } from '../analysis/helpers.js';

/**
 * `library add FILE FILE...` in one process: one record per file, in the
 * order given, each what analyzeSpectrum gives for its bytes (consistency;
 * the synthetic spectra are test input, not check values); a bad file is
 * reported and skipped.
 */
const CR: KnownComplex = {
  d: 3, geometry: 'octahedral', dq: 1700, b: 680, c: 680 * 3850 / 918,
  bands: [{ label: '4T2g(F)', epsilon: 15, fwhm: 2800 }, { label: '4T1g(F)', epsilon: 18, fwhm: 3200 }],
};

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-add-many-'));
  for (let i = 0; i < 3; i++) writeFileSync(join(dir, `s${i}.csv`), syntheticCsv({ ...CR, dq: 1600 + 100 * i }, { seed: i + 1 }));
  writeFileSync(join(dir, 'broken.csv'), 'wavelength,absorbance\nnot a spectrum\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const asJson = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

describe('library add with many files', () => {
  it('saves one record per file in order, reports the bad one and goes on (exit 1)', async () => {
    const files = ['s0.csv', 'broken.csv', 's1.csv', 's2.csv'];
    const { code, stdout, stderr } = await cli(['library', 'add', ...files, '--ion', 'Cr3+', '--conc', '0.05', '--data', 'lib', '--json'], dir);
    expect(code).toBe(1);
    expect(stderr).toBe('fieldgap library: broken.csv: not saved: no block of numeric data found: expected lines of at least two numbers (x, then y) separated by commas, semicolons, tabs or spaces\n');
    const records = JSON.parse(stdout) as Array<{ id: number; sample: string; result: unknown; options: unknown }>;
    expect(records.map((r) => [r.id, r.sample])).toEqual([[1, 's0'], [2, 's1'], [3, 's2']]);
    for (const r of records) {
      const options = { ion: 'Cr3+', concentration: 0.05, fileName: `${r.sample}.csv` };
      expect(r.options).toEqual(options);
      expect(r.result).toEqual(asJson(analyzeSpectrum(readFileSync(join(dir, `${r.sample}.csv`)), options)));
    }
    const list = await cli(['library', 'list', '--data', 'lib', '--json'], dir);
    expect((JSON.parse(list.stdout) as { total: number }).total).toBe(3);
  });

  it('prints a line per record and a count; --sample is refused for many files', async () => {
    const { code, stdout } = await cli(['library', 'add', 's0.csv', 's1.csv', '--ion', 'Cr3+', '--data', 'lib2'], dir);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^saved #1 "s0" \(Cr3\+\)\n {2}10Dq = [\s\S]*\nsaved #2 "s1" \(Cr3\+\)\n[\s\S]*\n2 of 2 files saved\.\n$/);
    const named = await cli(['library', 'add', 's0.csv', 's1.csv', '--ion', 'Cr3+', '--sample', 'x', '--data', 'lib3'], dir);
    expect(named.code).toBe(2);
    expect(named.stderr).toBe("fieldgap library: --sample names one file's record; 2 files were given (each is named after its file)\n");
  });
});
