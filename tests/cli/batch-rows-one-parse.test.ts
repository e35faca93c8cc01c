/**
 * analyzeBatchFile parses a file of one spectrum once (it analyses it as it
 * stands and lists its columns only when the analysis shows several or
 * fails); its rows must be exactly those of the plain way, listing first
 * (rowsOfItems(itemsOf(...))), for every kind of file a batch meets.
 * A comparison of fieldgap with itself.
 */
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { AnalyzeOptions } from '../../src/analysis.js';
import { analyzeBatchFile, itemsOf, rowsOfItems } from '../../src/cli/batch-rows.js';

const fixtures = join(import.meta.dirname, '../../fixtures/spectra');
const scratch = mkdtempSync(join(tmpdir(), 'fieldgap-one-parse-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('analyzeBatchFile', () => {
  it('gives the rows of listing first, for single- and multi-column files, failures and missing files', () => {
    const files = readdirSync(fixtures).filter((f) => /\.(csv|txt|jdx|spc)$/.test(f)).map((f) => join(fixtures, f));
    files.push(...readdirSync(join(fixtures, 'real-like')).filter((f) => f.endsWith('.csv')).slice(0, 4).map((f) => join(fixtures, 'real-like', f)));
    // A file of two spectra of which the first has no d–d band (flat): the analysis of the whole fails, its columns do not all.
    const rows = Array.from({ length: 120 }, (_, i) => {
      const nm = 380 + 3 * i;
      const band = 0.4 * Math.exp(-4 * Math.LN2 * ((1e7 / nm - 17_000) / 2800) ** 2);
      return `${nm},0.01,${(0.02 + band).toFixed(3)}`;
    });
    writeFileSync(join(scratch, 'flat-then-band.csv'), `Wavelength (nm),blank,sample\n${rows.join('\n')}\n`);
    files.push(join(scratch, 'flat-then-band.csv'), join(scratch, 'missing.csv'));
    let multi = 0;
    let failed = 0;
    for (const options of [{ ion: 'Cr3+' }, { ion: 'Ni2+', concentration: 0.05 }] as AnalyzeOptions[]) {
      for (const file of files) {
        for (const json of [false, true]) {
          const plain = rowsOfItems(itemsOf(file, options, '/', true), options, '/', json);
          const once = analyzeBatchFile({ file, cwd: '/', options, expandColumns: true, json });
          expect(once, file).toEqual(plain);
          if (plain.length > 1) multi++;
          failed += plain.filter((r) => r.failed).length;
        }
      }
    }
    expect(multi).toBeGreaterThan(0);
    expect(failed).toBeGreaterThan(0);
  });

  it('with --column or a single file not expanded, analyses the item it is given', () => {
    const file = join(fixtures, 'multi-column.csv');
    for (const [options, expand] of [[{ ion: 'Cr3+', column: 2 }, true], [{ ion: 'Cr3+' }, false]] as Array<[AnalyzeOptions, boolean]>) {
      expect(analyzeBatchFile({ file, cwd: '/', options, expandColumns: expand, json: true })).toEqual(rowsOfItems(itemsOf(file, options, '/', expand), options, '/', true));
    }
  });
});
