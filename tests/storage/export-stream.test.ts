import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, expect, it } from 'vitest';
import { exportLibrary } from '../../src/cli/commands/library-export.js';
import type { CliIo } from '../../src/cli/command.js';
import { libraryCsv, libraryCsvChunks } from '../../src/library/export.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';

async function joined(chunks: AsyncIterable<string>): Promise<string> {
  let text = '';
  for await (const chunk of chunks) text += chunk;
  return text;
}

forEachEngine('export a page at a time', (engine) => {
  const fresh = libraryPerTest(engine);
  let out: string;
  let dir: string;
  const io = (): CliIo => ({ stdout: (t) => void (out += t), stderr: () => {}, isTty: false, cwd: dir, env: {} });

  beforeEach(async () => {
    dir = mkdtempSync(join(tmpdir(), 'fieldgap-export-'));
    out = '';
    // 257 records over pages of 50: full pages, a last short one; samples that need CSV quoting and formula escaping
    const records = Array.from({ length: 257 }, (_v, i) =>
      handBuiltRecord({ sample: i % 10 === 0 ? `=odd, "quoted" ${i}` : `sample ${i}`, note: i % 3 === 0 ? 'urea batch' : 'other' }, 15_000 + i));
    await fresh.library.addMany(records);
    await fresh.library.remove(100);
  });
  afterEach(async () => {
    rmSync(dir, { recursive: true, force: true });
  });

  it('walks every record once, newest first, in pages', async () => {
    const pages: number[][] = [];
    for await (const page of fresh.library.listPages({}, 50)) pages.push(page.map((r) => r.id));
    expect(pages.map((p) => p.length)).toEqual([50, 50, 50, 50, 50, 6]);
    expect(pages.flat()).toEqual((await fresh.library.listAll()).map((r) => r.id));
  });

  it('gives the CSV of the whole list, with and without a filter, and for no records', async () => {
    expect(await joined(libraryCsvChunks(fresh.library.listPages({}, 50)))).toBe(libraryCsv(await fresh.library.listAll()));
    expect(await joined(libraryCsvChunks(fresh.library.listPages({ query: 'urea' }, 7)))).toBe(libraryCsv(await fresh.library.listAll({ query: 'urea' })));
    const none = await joined(libraryCsvChunks(fresh.library.listPages({ ion: 'V3+' })));
    expect(none).toBe(libraryCsv([]));
    expect(none.split('\r\n')).toHaveLength(2);
  });

  it('writes JSON exactly as one JSON.stringify of every full record', async () => {
    await exportLibrary(fresh.library, { query: 'urea' }, 'json', undefined, false, io());
    const records = [];
    for (const s of await fresh.library.listAll({ query: 'urea' })) records.push(await fresh.library.get(s.id));
    expect(out).toBe(`${JSON.stringify({ analyses: records }, null, 2)}\n`);
    out = '';
    await exportLibrary(fresh.library, { ion: 'V3+' }, 'json', undefined, false, io());
    expect(out).toBe(`${JSON.stringify({ analyses: [] }, null, 2)}\n`);
  });

  it('refuses an existing file without --force, and replaces it whole with --force', async () => {
    writeFileSync(join(dir, 'mine.csv'), 'keep me');
    await expect(exportLibrary(fresh.library, {}, 'csv', 'mine.csv', false, io())).rejects.toMatchObject({ code: 'invalid-argument', path: 'mine.csv' });
    expect(readFileSync(join(dir, 'mine.csv'), 'utf8')).toBe('keep me');
    await exportLibrary(fresh.library, {}, 'csv', 'mine.csv', true, io());
    expect(readFileSync(join(dir, 'mine.csv'), 'utf8')).toBe(libraryCsv(await fresh.library.listAll()));
  });
});
