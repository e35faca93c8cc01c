import type { Database } from 'better-sqlite3';
import { FieldgapError } from '../errors.js';

/**
 * The library's schema, as ordered migrations. `PRAGMA user_version` holds
 * the number of migrations applied; opening a library applies the missing
 * ones, each in its own IMMEDIATE transaction that re-reads the version
 * first, so two processes opening the same fresh folder at once do not both
 * apply a step. A migration is never edited once released: a change is a new
 * step at the end.
 *
 * The PostgreSQL engine applies the same steps, written in its dialect
 * (postgres-migrations.ts): step N means the same schema in both.
 *
 * Layout: `analyses` holds what the user says about a sample and the
 * original file's name, size and SHA-256; `originals` the file byte for byte
 * (one per analysis, immutable); `revisions` every analysis of that file,
 * the latest being the current one, with its options and the fit numbers
 * copied into columns for listing, sorting and export; `results` the full
 * result JSON of each revision.
 */
/** The fit columns of a revision (step 1 and 2) that step 5 copies into `analyses`, with their SQLite types. */
const CURRENT_FIT_COLUMNS: readonly (readonly [string, string])[] = [
  ['ten_dq', 'REAL'], ['ten_dq_sd', 'REAL'], ['b', 'REAL'], ['b_sd', 'REAL'], ['c', 'REAL'], ['beta', 'REAL'], ['beta_sd', 'REAL'],
  ['spin_state', 'TEXT'], ['rms', 'REAL'], ['status', 'TEXT'],
];

export const MIGRATIONS: ReadonlyArray<(db: Database) => void> = [
  // 1: the tables. Large values live in tables of their own (originals,
  // results), so listing reads only small rows and never their pages.
  (db) => {
    db.exec(`
      CREATE TABLE analyses (
        id              INTEGER PRIMARY KEY AUTOINCREMENT,
        created_at      TEXT NOT NULL,
        updated_at      TEXT NOT NULL,
        sample          TEXT NOT NULL,
        formula         TEXT,
        ion             TEXT,  -- canonical label ("Cr3+"), so the ion filter is an equality
        ligands         TEXT NOT NULL DEFAULT '[]',
        solvent         TEXT,
        temperature     REAL,
        measured_on     TEXT,
        note            TEXT,
        original_name   TEXT NOT NULL,
        original_sha256 TEXT NOT NULL,
        original_size   INTEGER NOT NULL
      );
      CREATE TABLE originals (
        analysis_id INTEGER PRIMARY KEY REFERENCES analyses(id) ON DELETE CASCADE,
        bytes       BLOB NOT NULL
      );
      CREATE TABLE revisions (
        id           INTEGER PRIMARY KEY AUTOINCREMENT,
        analysis_id  INTEGER NOT NULL REFERENCES analyses(id) ON DELETE CASCADE,
        revision     INTEGER NOT NULL,
        created_at   TEXT NOT NULL,
        tool_version TEXT NOT NULL,
        options      TEXT NOT NULL,
        ten_dq       REAL,
        b            REAL,
        c            REAL,
        beta         REAL,
        spin_state   TEXT,
        rms          REAL,
        status       TEXT,
        UNIQUE (analysis_id, revision)
      );
      CREATE TABLE results (
        revision_id INTEGER PRIMARY KEY REFERENCES revisions(id) ON DELETE CASCADE,
        result      TEXT NOT NULL
      );
    `);
  },
  // 2: uncertainties as columns (backfilled from the stored results), an
  // index for the ion filter, and guards that make the originals immutable.
  (db) => {
    db.exec(`
      ALTER TABLE revisions ADD COLUMN ten_dq_sd REAL;
      ALTER TABLE revisions ADD COLUMN b_sd REAL;
      ALTER TABLE revisions ADD COLUMN beta_sd REAL;
      UPDATE revisions SET
        ten_dq_sd = (SELECT json_extract(result, '$.fit.uncertainty.tenDq') FROM results WHERE revision_id = revisions.id),
        b_sd      = (SELECT json_extract(result, '$.fit.uncertainty.b') FROM results WHERE revision_id = revisions.id);
      UPDATE revisions SET beta_sd = b_sd / (SELECT json_extract(result, '$.fit.freeIonB') FROM results WHERE revision_id = revisions.id)
        WHERE b_sd IS NOT NULL
          AND (SELECT json_extract(result, '$.fit.freeIonB') FROM results WHERE revision_id = revisions.id) > 0;
      CREATE INDEX analyses_by_ion ON analyses(ion);
      CREATE TRIGGER originals_are_immutable BEFORE UPDATE ON originals
        BEGIN SELECT RAISE(ABORT, 'stored originals are never modified'); END;
      CREATE TRIGGER original_facts_are_immutable BEFORE UPDATE OF original_name, original_sha256, original_size ON analyses
        BEGIN SELECT RAISE(ABORT, 'stored originals are never modified'); END;
    `);
  },
  // 3: originals found by their SHA-256 (watch resumes without duplicates; a folder of 100 000 files).
  (db) => {
    db.exec('CREATE INDEX analyses_by_sha256 ON analyses(original_sha256);');
  },
  // 4: users and groups. A record belongs to the user who added it and to
  // that user's group (both NULL for records of the single-user mode, which
  // only administrators see once users exist). Tokens are kept only as their
  // SHA-256, so a copy of the database gives no one a working token.
  (db) => {
    db.exec(`
      CREATE TABLE users (
        name       TEXT PRIMARY KEY,
        group_name TEXT NOT NULL,
        is_admin   INTEGER NOT NULL DEFAULT 0,
        created_at TEXT NOT NULL
      );
      CREATE TABLE tokens (
        sha256     TEXT PRIMARY KEY,
        user_name  TEXT NOT NULL REFERENCES users(name) ON DELETE CASCADE,
        created_at TEXT NOT NULL
      );
      ALTER TABLE analyses ADD COLUMN owner TEXT;
      ALTER TABLE analyses ADD COLUMN group_name TEXT;
      CREATE INDEX analyses_by_group ON analyses(group_name);
    `);
  },
  // 5: the current revision's number, version and fit columns copied into
  // its analyses row (kept in step by every write, in the same transaction),
  // so listing, export and series read one narrow table instead of joining
  // the latest revision of each record (a join that took seconds at 100 000
  // records). The revisions table stays the history and the source.
  (db) => {
    db.exec(`
      ALTER TABLE analyses ADD COLUMN revision INTEGER;
      ALTER TABLE analyses ADD COLUMN tool_version TEXT;
      ${CURRENT_FIT_COLUMNS.map(([name, type]) => `ALTER TABLE analyses ADD COLUMN ${name} ${type};`).join('\n      ')}
      UPDATE analyses SET (revision, tool_version, ${CURRENT_FIT_COLUMNS.map(([name]) => name).join(', ')}) = (
        SELECT r.revision, r.tool_version, ${CURRENT_FIT_COLUMNS.map(([name]) => `r.${name}`).join(', ')}
        FROM revisions r WHERE r.analysis_id = analyses.id ORDER BY r.revision DESC LIMIT 1);
    `);
  },
];

/** The schema version this fieldgap writes. */
export const SCHEMA_VERSION = MIGRATIONS.length;

export function schemaVersion(db: Database): number {
  return db.pragma('user_version', { simple: true }) as number;
}

/**
 * Brings the database up to `target` (default: the latest). Refuses a
 * library written by a newer fieldgap rather than guess at its layout.
 */
export function migrate(db: Database, where: string, target = SCHEMA_VERSION): void {
  const found = schemaVersion(db);
  if (found > SCHEMA_VERSION) {
    throw new FieldgapError(
      'storage-broken',
      `this library has schema version ${found}, newer than this fieldgap knows (${SCHEMA_VERSION}); use a newer fieldgap`,
      where,
    );
  }
  for (let step = found; step < target; step++) {
    db.transaction(() => {
      // Another process may have applied this step while we waited for the lock.
      if (schemaVersion(db) !== step) return;
      MIGRATIONS[step]!(db);
      db.pragma(`user_version = ${step + 1}`);
    }).immediate();
  }
}
