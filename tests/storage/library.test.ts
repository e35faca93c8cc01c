import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { readFileSync } from 'node:fs';
import { beforeEach, describe, expect, it } from 'vitest';
import { LIBRARY_FILE, sha256Hex } from '../../src/library/library.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord, partialResult } from './helpers/records.js';
import { rejectionOf as errorOf } from './helpers/rejection.js';

forEachEngine('the results library', (engine) => {
const fresh = libraryPerTest(engine);

describe('add and get', () => {
  it('returns the saved record with an id, the details, options, result and version', async () => {
    const input = handBuiltRecord();
    const saved = await fresh.library.add(input);
    expect(saved.id).toBe(1);
    expect(saved).toMatchObject({
      sample: input.sample, formula: input.formula, ion: 'Cr3+', ligands: ['H2O'], solvent: 'water',
      temperature: 295, measuredOn: '2025-03-14', note: input.note, revision: 1,
      options: input.options, result: input.result,
    });
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    expect(saved.toolVersion).toBe(pkg.version);
    expect(saved.summary).toMatchObject({ tenDq: 17_400, tenDqSd: 150, b: 700, bSd: 20, spinState: 'quartet', rmsResidual: 120 });
    expect(saved.summary.betaSd).toBeCloseTo(20 / 918, 12);
    expect(await fresh.library.get(saved.id)).toEqual(saved);
  });

  it('gives back the original byte for byte with its SHA-256', async () => {
    const bytes = new Uint8Array(4096);
    for (let i = 0; i < bytes.length; i++) bytes[i] = (i * 73 + 11) % 256; // every byte value, NULs included
    const saved = await fresh.library.add(handBuiltRecord({ content: bytes, fileName: '/some/folder/raw.bin' }));
    const original = await fresh.library.getOriginal(saved.id);
    expect(Buffer.compare(original.bytes, Buffer.from(bytes))).toBe(0);
    expect(original.sha256).toBe(createHash('sha256').update(bytes).digest('hex')); // node:crypto as reference
    expect(original).toMatchObject({ fileName: 'raw.bin', size: 4096 });
    expect(saved.original).toEqual({ fileName: 'raw.bin', sha256: original.sha256, size: 4096 });
  });

  it('hashes with SHA-256', async () => {
    // FIPS 180-2, Appendix B.1 ("abc")
    expect(sha256Hex(new TextEncoder().encode('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('takes the ion from the fit when the details do not give it', async () => {
    const { ion: _ignored, ...rest } = handBuiltRecord();
    expect((await fresh.library.add(rest)).ion).toBe('Cr3+');
  });

  it('omits details that were not given, and keeps nulls in the summary of a result without a fit', async () => {
    const saved = await fresh.library.add({ sample: 'bare', fileName: 'b.csv', content: new Uint8Array([1]), options: {}, result: partialResult({ fit: null }) });
    expect(Object.keys(saved)).not.toContain('formula');
    expect(Object.keys(saved)).not.toContain('ligands');
    expect(saved.summary.tenDq).toBeNull();
    expect(saved.summary.status).toBeNull();
  });

  it('names the field that is wrong', async () => {
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ sample: '  ' })))).toMatchObject({ code: 'invalid-argument', path: 'sample' });
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ temperature: -3 })))).toMatchObject({ code: 'invalid-argument', path: 'temperature' });
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ measuredOn: '2025-02-30' })))).toMatchObject({ path: 'measuredOn' });
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ ligands: ['H2O', 7 as unknown as string] })))).toMatchObject({ path: 'ligands[1]' });
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ fileName: '' })))).toMatchObject({ path: 'fileName' });
    expect(await errorOf(() => fresh.library.add(handBuiltRecord({ ion: 'Cr3' })))).toMatchObject({ path: 'ion' });
    expect((await fresh.library.list()).total).toBe(0);
  });

  it('refuses an original over the size limit', async () => {
    const small = await fresh.where.open({ maxOriginalBytes: 10 });
    try {
      expect(await errorOf(() => small.add(handBuiltRecord({ content: new Uint8Array(11) })))).toMatchObject({ code: 'too-large', path: 'content' });
    } finally {
      await small.close();
    }
  });

  it('answers not-found for a missing id and invalid-argument for a bad one', async () => {
    expect(await errorOf(() => fresh.library.get(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(await errorOf(() => fresh.library.getOriginal(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(await errorOf(() => fresh.library.update(99, { note: 'x' }))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(await errorOf(() => fresh.library.remove(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(await errorOf(() => fresh.library.get(1.5))).toMatchObject({ code: 'invalid-argument', path: 'id' });
  });
});

describe('list and search', () => {
  beforeEach(async () => {
    await fresh.library.add(handBuiltRecord({ sample: 'chromium aqua', formula: '[Cr(H2O)6]3+', ion: 'Cr3+', ligands: ['H2O'], note: 'first' }));
    await fresh.library.add(handBuiltRecord({ sample: 'chromium urea', formula: '[Cr(urea)6]3+', ion: 'Cr 3+', ligands: ['urea'], note: 'green 100%' }));
    await fresh.library.add(handBuiltRecord({ sample: 'nickel ammine', formula: '[Ni(NH3)6]2+', ion: 'Ni2+', ligands: ['NH3'], note: 'blue' }));
  });

  it('lists newest first without results or bytes', async () => {
    const page = await fresh.library.list();
    expect(page.total).toBe(3);
    expect(page.analyses.map((a) => a.sample)).toEqual(['nickel ammine', 'chromium urea', 'chromium aqua']);
    expect(Object.keys(page.analyses[0]!)).not.toContain('result');
    expect(JSON.stringify(page)).not.toContain('hand-built test file');
  });

  it('pages with limit and offset, counting all matches', async () => {
    const page = await fresh.library.list({ limit: 2, offset: 1 });
    expect(page).toMatchObject({ total: 3, limit: 2, offset: 1 });
    expect(page.analyses.map((a) => a.id)).toEqual([2, 1]);
    expect((await fresh.library.list({ limit: 2, offset: 3 })).analyses).toEqual([]);
    expect(await errorOf(() => fresh.library.list({ limit: 0 }))).toMatchObject({ path: 'limit' });
  });

  it('searches sample, formula, ion, ligand and note, every word having to match', async () => {
    const samples = async (query: string) => (await fresh.library.list({ query })).analyses.map((a) => a.sample);
    expect(await samples('CHROMIUM')).toEqual(['chromium urea', 'chromium aqua']);
    expect(await samples('NH3')).toEqual(['nickel ammine']);
    expect(await samples('urea')).toEqual(['chromium urea']);
    expect(await samples('blue')).toEqual(['nickel ammine']);
    expect(await samples('chromium first')).toEqual(['chromium aqua']);
    expect(await samples('100%')).toEqual(['chromium urea']);
    expect(await samples('1_0')).toEqual([]); // LIKE wildcards are taken literally
    expect(await samples('cobalt')).toEqual([]);
  });

  it('filters by ion in any spelling, stored as its canonical label', async () => {
    expect((await fresh.library.list({ ion: 'cr3+' })).analyses.map((a) => a.id)).toEqual([2, 1]);
    expect((await fresh.library.list({ ion: 'Cr(III)' })).analyses.map((a) => a.ion)).toEqual(['Cr3+', 'Cr3+']);
    expect(await errorOf(() => fresh.library.list({ ion: 'Xx9' }))).toMatchObject({ code: 'invalid-argument', path: 'ion' });
    expect((await fresh.library.listAll({ ion: 'Ni2+', query: 'ammine' })).map((a) => a.id)).toEqual([3]);
  });
});

describe('update, refit and remove', () => {
  it('edits details and clears a field given as null', async () => {
    const saved = await fresh.library.add(handBuiltRecord());
    const updated = await fresh.library.update(saved.id, { note: 'remeasured', solvent: null, ligands: ['H2O', 'Cl-'] });
    expect(updated).toMatchObject({ note: 'remeasured', ligands: ['H2O', 'Cl-'], revision: 1 });
    expect(Object.keys(updated)).not.toContain('solvent');
    expect(updated.updatedAt >= saved.updatedAt).toBe(true);
    expect(await errorOf(() => fresh.library.update(saved.id, { sample: '' }))).toMatchObject({ path: 'sample' });
    expect(await errorOf(() => fresh.library.update(saved.id, { colour: 'red' } as never))).toMatchObject({ path: 'colour' });
  });

  it('keeps every revision on refit and never touches the original', async () => {
    const saved = await fresh.library.add(handBuiltRecord());
    const before = await fresh.library.getOriginal(saved.id);
    const refit = handBuiltRecord({}, 17_600);
    const updated = await fresh.library.update(saved.id, { options: { ...refit.options, cOverB: 4.2 }, result: refit.result });
    expect(updated.revision).toBe(2);
    expect(updated.summary.tenDq).toBe(17_600);
    expect(updated.options).toMatchObject({ cOverB: 4.2 });
    expect(updated.revisions.map((r) => [r.revision, r.summary.tenDq])).toEqual([[1, 17_400], [2, 17_600]]);
    expect(await fresh.library.getOriginal(saved.id)).toEqual(before);
    expect(await errorOf(() => fresh.library.update(saved.id, { options: {} }))).toMatchObject({ path: 'result' });
  });

  it('removes the record with its original and history', async () => {
    const saved = await fresh.library.add(handBuiltRecord());
    await fresh.library.update(saved.id, { options: {}, result: partialResult({}) });
    await fresh.library.remove(saved.id);
    expect(await errorOf(() => fresh.library.get(saved.id))).toMatchObject({ code: 'not-found' });
    const left = 'SELECT (SELECT count(*) FROM originals) + (SELECT count(*) FROM revisions) + (SELECT count(*) FROM results) AS n';
    expect(await fresh.where.scalar(left)).toBe(0);
    expect((await fresh.library.add(handBuiltRecord())).id).toBe(2); // ids are never reused
  });
});

describe('persistence', () => {
  it('keeps everything across close and reopen', async () => {
    const saved = await fresh.library.add(handBuiltRecord());
    await fresh.library.update(saved.id, { note: 'edited' });
    const full = await fresh.library.get(saved.id);
    await fresh.reopen();
    expect(await fresh.library.get(saved.id)).toEqual(full);
    expect((await fresh.library.getOriginal(saved.id)).sha256).toBe(saved.original.sha256);
  });

  it.runIf(engine === 'sqlite')('runs in WAL mode', async () => {
    if (fresh.where.location.engine !== 'sqlite') return;
    const db = new Database(join(fresh.where.location.dataDir, LIBRARY_FILE));
    try {
      expect(db.pragma('journal_mode', { simple: true })).toBe('wal');
    } finally {
      db.close();
    }
  });

  it.runIf(engine === 'postgres')('commits only once the server has flushed its WAL (fsync and synchronous_commit on)', async () => {
    // PostgreSQL manual, "Write Ahead Log" settings: with both on, COMMIT returns after the WAL reaches disk.
    expect(await fresh.where.scalar("SELECT CASE WHEN current_setting('fsync') = 'on' AND current_setting('synchronous_commit') = 'on' THEN 1 ELSE 0 END")).toBe(1);
  });
});
});
