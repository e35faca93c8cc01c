import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { LIBRARY_FILE, openLibrary, sha256Hex, type Library } from '../../src/library/library.js';
import { handBuiltRecord } from './helpers/records.js';
import { errorOf } from '../helpers/errors.js';

let dir: string;
let library: Library;

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-lib-'));
  library = openLibrary(dir);
});
afterEach(() => {
  library.close();
  rmSync(dir, { recursive: true, force: true });
});


describe('add and get', () => {
  it('returns the saved record with an id, the details, options, result and version', () => {
    const input = handBuiltRecord();
    const saved = library.add(input);
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
    expect(library.get(saved.id)).toEqual(saved);
  });

  it('gives back the original byte for byte with its SHA-256', () => {
    const bytes = new Uint8Array(4096);
    for (let i = 0; i < bytes.length; i++) bytes[i] = (i * 73 + 11) % 256; // every byte value, NULs included
    const saved = library.add(handBuiltRecord({ content: bytes, fileName: '/some/folder/raw.bin' }));
    const original = library.getOriginal(saved.id);
    expect(Buffer.compare(original.bytes, Buffer.from(bytes))).toBe(0);
    expect(original.sha256).toBe(createHash('sha256').update(bytes).digest('hex')); // node:crypto as reference
    expect(original).toMatchObject({ fileName: 'raw.bin', size: 4096 });
    expect(saved.original).toEqual({ fileName: 'raw.bin', sha256: original.sha256, size: 4096 });
  });

  it('hashes with SHA-256', () => {
    // FIPS 180-2, Appendix B.1 ("abc")
    expect(sha256Hex(new TextEncoder().encode('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('takes the ion from the fit when the details do not give it', () => {
    const { ion: _ignored, ...rest } = handBuiltRecord();
    expect(library.add(rest).ion).toBe('Cr3+');
  });

  it('omits details that were not given, and keeps nulls in the summary of a result without a fit', () => {
    const saved = library.add({ sample: 'bare', fileName: 'b.csv', content: new Uint8Array([1]), options: {}, result: { fit: null } });
    expect(Object.keys(saved)).not.toContain('formula');
    expect(Object.keys(saved)).not.toContain('ligands');
    expect(saved.summary.tenDq).toBeNull();
    expect(saved.summary.status).toBeNull();
  });

  it('names the field that is wrong', () => {
    expect(errorOf(() => library.add(handBuiltRecord({ sample: '  ' })))).toMatchObject({ code: 'invalid-argument', path: 'sample' });
    expect(errorOf(() => library.add(handBuiltRecord({ temperature: -3 })))).toMatchObject({ code: 'invalid-argument', path: 'temperature' });
    expect(errorOf(() => library.add(handBuiltRecord({ measuredOn: '2025-02-30' })))).toMatchObject({ path: 'measuredOn' });
    expect(errorOf(() => library.add(handBuiltRecord({ ligands: ['H2O', 7 as unknown as string] })))).toMatchObject({ path: 'ligands[1]' });
    expect(errorOf(() => library.add(handBuiltRecord({ fileName: '' })))).toMatchObject({ path: 'fileName' });
    expect(errorOf(() => library.add(handBuiltRecord({ ion: 'Cr3' })))).toMatchObject({ path: 'ion' });
    expect(library.list().total).toBe(0);
  });

  it('refuses an original over the size limit', () => {
    const small = openLibrary(join(dir, 'small'), { maxOriginalBytes: 10 });
    try {
      expect(errorOf(() => small.add(handBuiltRecord({ content: new Uint8Array(11) })))).toMatchObject({ code: 'too-large', path: 'content' });
    } finally {
      small.close();
    }
  });

  it('answers not-found for a missing id and invalid-argument for a bad one', () => {
    expect(errorOf(() => library.get(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(errorOf(() => library.getOriginal(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(errorOf(() => library.update(99, { note: 'x' }))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(errorOf(() => library.remove(99))).toMatchObject({ code: 'not-found', path: 'id' });
    expect(errorOf(() => library.get(1.5))).toMatchObject({ code: 'invalid-argument', path: 'id' });
  });
});

describe('list and search', () => {
  beforeEach(() => {
    library.add(handBuiltRecord({ sample: 'chromium aqua', formula: '[Cr(H2O)6]3+', ion: 'Cr3+', ligands: ['H2O'], note: 'first' }));
    library.add(handBuiltRecord({ sample: 'chromium urea', formula: '[Cr(urea)6]3+', ion: 'Cr 3+', ligands: ['urea'], note: 'green 100%' }));
    library.add(handBuiltRecord({ sample: 'nickel ammine', formula: '[Ni(NH3)6]2+', ion: 'Ni2+', ligands: ['NH3'], note: 'blue' }));
  });

  it('lists newest first without results or bytes', () => {
    const page = library.list();
    expect(page.total).toBe(3);
    expect(page.analyses.map((a) => a.sample)).toEqual(['nickel ammine', 'chromium urea', 'chromium aqua']);
    expect(Object.keys(page.analyses[0]!)).not.toContain('result');
    expect(JSON.stringify(page)).not.toContain('hand-built test file');
  });

  it('pages with limit and offset, counting all matches', () => {
    const page = library.list({ limit: 2, offset: 1 });
    expect(page).toMatchObject({ total: 3, limit: 2, offset: 1 });
    expect(page.analyses.map((a) => a.id)).toEqual([2, 1]);
    expect(library.list({ limit: 2, offset: 3 }).analyses).toEqual([]);
    expect(errorOf(() => library.list({ limit: 0 }))).toMatchObject({ path: 'limit' });
  });

  it('searches sample, formula, ion, ligand and note, every word having to match', () => {
    const samples = (query: string) => library.list({ query }).analyses.map((a) => a.sample);
    expect(samples('CHROMIUM')).toEqual(['chromium urea', 'chromium aqua']);
    expect(samples('NH3')).toEqual(['nickel ammine']);
    expect(samples('urea')).toEqual(['chromium urea']);
    expect(samples('blue')).toEqual(['nickel ammine']);
    expect(samples('chromium first')).toEqual(['chromium aqua']);
    expect(samples('100%')).toEqual(['chromium urea']);
    expect(samples('1_0')).toEqual([]); // LIKE wildcards are taken literally
    expect(samples('cobalt')).toEqual([]);
  });

  it('filters by ion in any spelling, stored as its canonical label', () => {
    expect(library.list({ ion: 'cr3+' }).analyses.map((a) => a.id)).toEqual([2, 1]);
    expect(library.list({ ion: 'Cr(III)' }).analyses.map((a) => a.ion)).toEqual(['Cr3+', 'Cr3+']);
    expect(errorOf(() => library.list({ ion: 'Xx9' }))).toMatchObject({ code: 'invalid-argument', path: 'ion' });
    expect(library.listAll({ ion: 'Ni2+', query: 'ammine' }).map((a) => a.id)).toEqual([3]);
  });
});

describe('update, refit and remove', () => {
  it('edits details and clears a field given as null', () => {
    const saved = library.add(handBuiltRecord());
    const updated = library.update(saved.id, { note: 'remeasured', solvent: null, ligands: ['H2O', 'Cl-'] });
    expect(updated).toMatchObject({ note: 'remeasured', ligands: ['H2O', 'Cl-'], revision: 1 });
    expect(Object.keys(updated)).not.toContain('solvent');
    expect(updated.updatedAt >= saved.updatedAt).toBe(true);
    expect(errorOf(() => library.update(saved.id, { sample: '' }))).toMatchObject({ path: 'sample' });
    expect(errorOf(() => library.update(saved.id, { colour: 'red' } as never))).toMatchObject({ path: 'colour' });
  });

  it('keeps every revision on refit and never touches the original', () => {
    const saved = library.add(handBuiltRecord());
    const before = library.getOriginal(saved.id);
    const refit = handBuiltRecord({}, 17_600);
    const updated = library.update(saved.id, { options: { ...refit.options, cOverB: 4.2 }, result: refit.result });
    expect(updated.revision).toBe(2);
    expect(updated.summary.tenDq).toBe(17_600);
    expect(updated.options).toMatchObject({ cOverB: 4.2 });
    expect(updated.revisions.map((r) => [r.revision, r.summary.tenDq])).toEqual([[1, 17_400], [2, 17_600]]);
    expect(library.getOriginal(saved.id)).toEqual(before);
    expect(errorOf(() => library.update(saved.id, { options: {} }))).toMatchObject({ path: 'result' });
  });

  it('removes the record with its original and history', () => {
    const saved = library.add(handBuiltRecord());
    library.update(saved.id, { options: {}, result: {} });
    library.remove(saved.id);
    expect(errorOf(() => library.get(saved.id))).toMatchObject({ code: 'not-found' });
    const db = new Database(join(dir, LIBRARY_FILE), { readonly: true });
    try {
      const left = 'SELECT (SELECT count(*) FROM originals) + (SELECT count(*) FROM revisions) + (SELECT count(*) FROM results) AS n';
      expect(db.prepare(left).get()).toEqual({ n: 0 });
    } finally {
      db.close();
    }
    expect(library.add(handBuiltRecord()).id).toBe(2); // ids are never reused
  });
});

describe('persistence', () => {
  it('keeps everything across close and reopen', () => {
    const saved = library.add(handBuiltRecord());
    library.update(saved.id, { note: 'edited' });
    const full = library.get(saved.id);
    library.close();
    library = openLibrary(dir);
    expect(library.get(saved.id)).toEqual(full);
    expect(library.getOriginal(saved.id).sha256).toBe(saved.original.sha256);
  });

  it('runs in WAL mode', () => {
    const db = new Database(join(dir, LIBRARY_FILE));
    try {
      expect(db.pragma('journal_mode', { simple: true })).toBe('wal');
    } finally {
      db.close();
    }
  });
});
