import Database from 'better-sqlite3';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { LIBRARY_FILE, openLibrary } from '../../src/library/library.js';
import { migrate, SCHEMA_VERSION, schemaVersion } from '../../src/library/migrations.js';

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-mig-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function openError(): Promise<FieldgapError> {
  try {
    await (await openLibrary(dir)).close();
  } catch (error) {
    if (error instanceof FieldgapError) return error;
    throw error;
  }
  throw new Error('expected openLibrary to fail');
}

/** A library as the first schema left it, with one analysis written by hand in that layout. */
function writeVersion1Library(): void {
  const db = new Database(join(dir, LIBRARY_FILE));
  migrate(db, 'test', 1);
  db.exec(`
    INSERT INTO analyses (created_at, updated_at, sample, ion, ligands, original_name, original_sha256, original_size)
      VALUES ('2025-01-01T00:00:00.000Z', '2025-01-01T00:00:00.000Z', 'old sample', 'V3+', '["H2O"]', 'old.csv', '00', 3);
    INSERT INTO originals (analysis_id, bytes) VALUES (1, X'616263');
    INSERT INTO revisions (analysis_id, revision, created_at, tool_version, options, ten_dq, b)
      VALUES (1, 1, '2025-01-01T00:00:00.000Z', '0.0.1', '{}', 18000, 600);
    INSERT INTO results (revision_id, result)
      VALUES (1, '{"fit":{"tenDq":18000,"b":600,"freeIonB":800,"uncertainty":{"tenDq":90,"b":12}}}');
  `);
  expect(schemaVersion(db)).toBe(1);
  db.close();
}

describe('schema migrations', () => {
  it('creates the latest schema in an empty folder', async () => {
    await (await openLibrary(dir)).close();
    const db = new Database(join(dir, LIBRARY_FILE), { readonly: true });
    expect(schemaVersion(db)).toBe(SCHEMA_VERSION);
    db.close();
  });

  it('brings an old library up to date and keeps its records', async () => {
    writeVersion1Library();
    const library = await openLibrary(dir);
    try {
      const record = await library.get(1);
      expect(record).toMatchObject({ sample: 'old sample', ion: 'V3+', ligands: ['H2O'], toolVersion: '0.0.1' });
      // step 2 backfills the uncertainty columns from the stored result JSON
      expect(record.summary).toMatchObject({ tenDq: 18000, tenDqSd: 90, bSd: 12 });
      expect(record.summary.betaSd).toBeCloseTo(12 / 800, 12);
      expect((await library.getOriginal(1)).bytes.toString('latin1')).toBe('abc');
      expect((await library.list({ ion: 'v(III)' })).total).toBe(1);
    } finally {
      await library.close();
    }
    const db = new Database(join(dir, LIBRARY_FILE));
    expect(schemaVersion(db)).toBe(SCHEMA_VERSION);
    expect(() => db.prepare(`UPDATE originals SET bytes = X'00'`).run()).toThrow(/never modified/);
    expect(() => db.prepare(`UPDATE analyses SET original_sha256 = 'x'`).run()).toThrow(/never modified/);
    expect(() => db.prepare(`UPDATE analyses SET note = 'fine'`).run()).not.toThrow();
    db.close();
  });

  it('copies each record\'s latest revision into its row when upgrading to step 5', async () => {
    const db = new Database(join(dir, LIBRARY_FILE));
    migrate(db, 'test', 4);
    db.exec(`
      INSERT INTO analyses (created_at, updated_at, sample, ion, ligands, original_name, original_sha256, original_size)
        VALUES ('2025-01-01T00:00:00.000Z', '2025-01-02T00:00:00.000Z', 'refitted', 'Cr3+', '["H2O"]', 'a.csv', '00', 3),
               ('2025-01-01T00:00:00.000Z', '2025-01-01T00:00:00.000Z', 'once', 'Cr3+', '["NH3"]', 'b.csv', '01', 3);
      INSERT INTO originals (analysis_id, bytes) VALUES (1, X'616263'), (2, X'646566');
      INSERT INTO revisions (analysis_id, revision, created_at, tool_version, options, ten_dq, b, spin_state)
        VALUES (1, 2, '2025-01-02T00:00:00.000Z', '0.0.2', '{}', 17600, 700, 'quartet'),
               (1, 1, '2025-01-01T00:00:00.000Z', '0.0.1', '{}', 17400, 710, 'quartet'),
               (2, 1, '2025-01-01T00:00:00.000Z', '0.0.1', '{}', 21500, 650, NULL);
      INSERT INTO results (revision_id, result) VALUES (1, '{}'), (2, '{}'), (3, '{}');
    `);
    db.close();
    const library = await openLibrary(dir);
    try {
      const listed = (await library.listAll()).map((a) => [a.sample, a.revision, a.toolVersion, a.summary.tenDq, a.summary.b, a.summary.spinState]);
      expect(listed).toEqual([
        ['once', 1, '0.0.1', 21500, 650, null],
        ['refitted', 2, '0.0.2', 17600, 700, 'quartet'],
      ]);
      expect((await library.get(1)).revisions.map((r) => r.summary.tenDq)).toEqual([17400, 17600]);
    } finally {
      await library.close();
    }
  });

  it('refuses a library from a newer fieldgap', async () => {
    await (await openLibrary(dir)).close();
    const db = new Database(join(dir, LIBRARY_FILE));
    db.pragma(`user_version = ${SCHEMA_VERSION + 1}`);
    db.close();
    expect(await openError()).toMatchObject({ code: 'storage-broken', path: 'library' });
  });

  it('refuses a file that is not a database, without changing it', async () => {
    const text = 'nm,absorbance\n400,0.1\n'.repeat(200);
    writeFileSync(join(dir, LIBRARY_FILE), text);
    const error = await openError();
    expect(error).toMatchObject({ code: 'storage-broken', path: 'library' });
    expect(error.message).not.toContain(dir);
    expect(readFileSync(join(dir, LIBRARY_FILE), 'utf8')).toBe(text);
  });
});
