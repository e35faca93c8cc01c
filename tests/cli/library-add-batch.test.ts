import Database from 'better-sqlite3';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { LIBRARY_FILE, openLibrary } from '../../src/library/library.js';
import { cli, syntheticCsv, type KnownComplex } from '../analysis/helpers.js';

/**
 * `library add FILES...` saves a batch of files a transaction. What it
 * acknowledges (a "saved" line) must be in the library, and nothing else:
 * when the database refuses one file part way, the files of batches
 * committed before stay and are acknowledged, the failed batch's are
 * neither saved nor acknowledged. The spectra are synthetic test input.
 */
const CR: KnownComplex = {
  d: 3, geometry: 'octahedral', dq: 1700, b: 680, c: 680 * 3850 / 918,
  bands: [{ label: '4T2g(F)', epsilon: 15, fwhm: 2800 }, { label: '4T1g(F)', epsilon: 18, fwhm: 3200 }],
};
const COUNT = 70;

let dir: string;
let files: string[];
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-add-batch-'));
  const text = syntheticCsv(CR, { seed: 3 });
  files = Array.from({ length: COUNT }, (_v, i) => `f${String(i).padStart(2, '0')}.csv`);
  files.forEach((f, i) => writeFileSync(join(dir, f), `# file ${i}\n${text}`));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('library add FILES... in batches', () => {
  it('saves every file, one record each in order, past the size of one batch', async () => {
    const { code, stdout } = await cli(['library', 'add', ...files, '--ion', 'Cr3+', '--data', 'all'], dir);
    expect(code).toBe(0);
    expect([...stdout.matchAll(/^saved #(\d+) "(f\d\d)"/gm)].map((m) => `${m[1]} ${m[2]}`)).toEqual(files.map((f, i) => `${i + 1} ${f.slice(0, 3)}`));
    const library = await openLibrary(join(dir, 'all'));
    try {
      expect((await library.list({ limit: 1000 })).total).toBe(COUNT);
    } finally {
      await library.close();
    }
  });

  it('acknowledges exactly what was committed when the database refuses a file part way', async () => {
    const data = join(dir, 'refusing');
    await (await openLibrary(data)).close();
    const db = new Database(join(data, LIBRARY_FILE));
    db.exec(`CREATE TRIGGER refuse BEFORE INSERT ON analyses WHEN NEW.sample = 'f60'
      BEGIN SELECT RAISE(ABORT, 'refused by the test'); END;`);
    db.close();
    const { code, stdout } = await cli(['library', 'add', ...files, '--ion', 'Cr3+', '--data', data], dir);
    expect(code).not.toBe(0);
    const acknowledged = [...stdout.matchAll(/^saved #\d+ "(f\d\d)"/gm)].map((m) => m[1]);
    const library = await openLibrary(data);
    try {
      const stored = (await library.listAll()).map((r) => r.sample).reverse();
      expect(stored).toEqual(acknowledged);
      // the batch before the refused file at least was committed; the refused file never was
      expect(stored.length).toBeGreaterThan(0);
      expect(stored).not.toContain('f60');
      expect(stored.length).toBeLessThan(61);
    } finally {
      await library.close();
    }
  });
});
