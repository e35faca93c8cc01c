import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import type { AnalysisRecord } from '../../src/library/types.js';
import { forEachEngine, freshLibrary, type TestLibrary } from './helpers/engines.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * `library add`, `library refit` and `series FILES` with the real pipeline on
 * the invented demo spectra. The check is consistency: what the library
 * stores must be exactly what analyzeSpectrum gives for the same bytes and
 * options (the demo numbers themselves are never check values).
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const AQUA = join(ROOT, 'spectra-demo', 'cr-aqua.csv');
const AMMINE = join(ROOT, 'spectra-demo', 'cr-ammine.jdx');

forEachEngine('the CLI with the pipeline', (engine) => {
let where: TestLibrary;
beforeAll(async () => {
  where = await freshLibrary(engine);
});
afterAll(() => where.dispose());

function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(args, { cwd: ROOT, env: { ...where.env } });
}

const asJson = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

describe('library add and refit with the pipeline', () => {
  let saved: AnalysisRecord;
  const before = createHash('sha256').update(readFileSync(AQUA)).digest('hex');

  it('stores what analyzeSpectrum gives, with the file byte for byte', async () => {
    const { code, out, err } = await cli('library', 'add', AQUA, '--ion', 'Cr3+', '--conc', '0.05', '--formula', '[Cr(H2O)6]3+', '--json');
    expect(err).toMatch(/geometry octahedral guessed from the formula/);
    expect(code).toBe(0);
    saved = JSON.parse(out) as AnalysisRecord;
    const options = { ion: 'Cr3+', concentration: 0.05, geometry: 'octahedral' as const, fileName: 'cr-aqua.csv' };
    expect(saved.options).toEqual(options);
    expect(saved.result).toEqual(asJson(analyzeSpectrum(readFileSync(AQUA), options)));
    expect(saved).toMatchObject({ sample: 'cr-aqua', ion: 'Cr3+', ligands: ['H2O'], original: { fileName: 'cr-aqua.csv', sha256: before } });
    const library = await where.open();
    try {
      expect(Buffer.compare((await library.getOriginal(saved.id)).bytes, readFileSync(AQUA))).toBe(0);
    } finally {
      await library.close();
    }
    expect(createHash('sha256').update(readFileSync(AQUA)).digest('hex')).toBe(before); // the user's file is untouched
  });

  it('refits on the stored original with the changed option', async () => {
    const { code, out } = await cli('library', 'refit', String(saved.id), '--c-over-b', '4.2', '--json');
    expect(code).toBe(0);
    const refit = JSON.parse(out) as AnalysisRecord;
    const options = { ion: 'Cr3+', concentration: 0.05, geometry: 'octahedral' as const, fileName: 'cr-aqua.csv', cOverB: 4.2 };
    expect(refit.options).toEqual(options);
    expect(refit.result).toEqual(asJson(analyzeSpectrum(readFileSync(AQUA), options)));
    expect(refit.revisions.map((r) => r.revision)).toEqual([1, 2]);
    expect(refit.revisions[0]!.summary).toEqual(saved.summary);
  });

  it('prints a readable line without --json, and one error line for a bad file', async () => {
    const { code, out } = await cli('library', 'add', AMMINE, '--ion', 'Cr3+', '--ligands', 'NH3');
    expect(code).toBe(0);
    expect(out).toMatch(/^saved #2 "cr-ammine" \(Cr3\+\)\n  10Dq = \d+ ± \d+ cm-1 {3}B = /);
    const bad = await cli('library', 'add', 'no-such-file.csv', '--ion', 'Cr3+');
    expect(bad.code).toBe(2);
    expect(bad.err).toBe('fieldgap library: no-such-file.csv: no such file\n');
  });
});

describe('series FILES', () => {
  it('ranks the freshly analysed files, ligands from the file names', async () => {
    const { code, out } = await cli('series', '--ion', 'Cr3+', '--conc', '0.05', AQUA, AMMINE, '--json');
    expect(code).toBe(0);
    const report = JSON.parse(out) as { spectrochemical: { entries: { ligandLabel: string; value: number }[] } };
    const tenDq = (file: string) => analyzeSpectrum(readFileSync(file), { ion: 'Cr3+', concentration: 0.05, fileName: file.split('/').pop()! }).fit.tenDq;
    const expected = [['H2O', tenDq(AQUA)], ['NH3', tenDq(AMMINE)]].sort((a, b) => (a[1] as number) - (b[1] as number));
    expect(report.spectrochemical.entries.map((e) => [e.ligandLabel, e.value])).toEqual(expected);
  });
});
});
