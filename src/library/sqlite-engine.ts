import Database from 'better-sqlite3';
import { accessSync, constants, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { FieldgapError } from '../errors.js';
import { LIBRARY_PATH, type SqlEngine, type SqlTx } from './engine.js';
import { migrate, SCHEMA_VERSION, schemaVersion } from './migrations.js';
import { translateSqliteError } from './sqlite-errors.js';

/** The file the library keeps inside its data folder (with -wal and -shm beside it). */
export const LIBRARY_FILE = 'library.sqlite';

export interface SqliteEngineOptions {
  /** How long a write waits for another process's write lock before failing with 'timeout', ms. Default 10000. */
  busyTimeoutMs?: number;
}

/**
 * The embedded engine: one SQLite file in the data folder.
 *
 * Durability: WAL journal with synchronous=FULL. In WAL mode a commit is an
 * append to the -wal file; FULL adds an fsync of it before the commit
 * returns, so an acknowledged write survives not only the process being
 * killed (NORMAL would do for that: the appended frames are in the OS cache
 * and are replayed at the next open) but also a power cut or OS crash, which
 * NORMAL may roll back. Writes here are one per analysis, a human's pace, so
 * the fsync per commit costs nothing that matters.
 *
 * Concurrency: every write is one BEGIN IMMEDIATE transaction, so writers in
 * several processes queue on SQLite's lock (waiting up to busyTimeoutMs)
 * instead of failing on a read-to-write upgrade; readers never block.
 * better-sqlite3 is synchronous while the library's interface is async
 * (for PostgreSQL): transactions on this one connection are queued in
 * process, so no two interleave between their awaits.
 *
 * A data folder this process may not write (a read-only share, an archive)
 * is opened read-only: listing and reading work, writes fail with
 * 'storage-read-only'. A WAL library whose -shm file cannot be created there
 * is read from an in-memory copy of its file (its header marked as a rollback
 * journal database, the copy only; the file is never touched).
 */
export function openSqliteEngine(dataDir: string, options: SqliteEngineOptions = {}): SqlEngine {
  const { busyTimeoutMs = 10_000 } = options;
  const file = join(dataDir, LIBRARY_FILE);
  const writable = folderWritable(dataDir, file);
  let db: Database.Database;
  try {
    db = writable ? new Database(file, { timeout: busyTimeoutMs }) : openReadOnly(file);
  } catch (error) {
    throw translateSqliteError(error);
  }
  try {
    if (writable) {
      db.pragma('journal_mode = WAL');
      db.pragma('synchronous = FULL');
      db.pragma('foreign_keys = ON');
      migrate(db, LIBRARY_PATH);
    } else {
      checkReadableVersion(db);
    }
  } catch (error) {
    db.close();
    throw translateSqliteError(error);
  }
  return sqliteEngineOver(db, !writable);
}

/** Whether the library can be written here: the folder is created when missing; false when it or the file is not writable. */
function folderWritable(dataDir: string, file: string): boolean {
  try {
    mkdirSync(dataDir, { recursive: true });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if ((code === 'EACCES' || code === 'EROFS' || code === 'EPERM') && existsSync(file)) return false;
    throw new FieldgapError('storage-unavailable', `cannot create the library's data folder (${code ?? 'error'})`, LIBRARY_PATH);
  }
  try {
    accessSync(dataDir, constants.W_OK);
    if (existsSync(file)) accessSync(file, constants.W_OK);
    return true;
  } catch {
    if (!existsSync(file)) {
      throw new FieldgapError('storage-read-only', 'the data folder is read-only and holds no library yet', LIBRARY_PATH);
    }
    return false;
  }
}

function openReadOnly(file: string): Database.Database {
  try {
    // Works when the -wal and -shm files are there (a library in use, or left by a crash).
    const db = new Database(file, { readonly: true, fileMustExist: true });
    try {
      db.prepare('SELECT count(*) FROM sqlite_master').get();
    } catch (error) {
      db.close();
      throw error;
    }
    return db;
  } catch (error) {
    // No -shm to share and none can be made here (SQLITE_CANTOPEN, SQLITE_READONLY_DIRECTORY, ...): read a copy.
    const code = String((error as { code?: unknown }).code ?? '');
    if (!code.startsWith('SQLITE_CANTOPEN') && !code.startsWith('SQLITE_READONLY')) throw error;
  }
  const bytes = readFileSync(file);
  // Bytes 18 and 19 of the header: file format versions, 2 = WAL. An in-memory copy has no WAL.
  if (bytes.length >= 20) {
    bytes[18] = 1;
    bytes[19] = 1;
  }
  return new Database(bytes, { readonly: true });
}

function checkReadableVersion(db: Database.Database): void {
  const found = schemaVersion(db);
  if (found > SCHEMA_VERSION) {
    throw new FieldgapError('storage-broken', `this library has schema version ${found}, newer than this fieldgap knows (${SCHEMA_VERSION}); use a newer fieldgap`, LIBRARY_PATH);
  }
  if (found < SCHEMA_VERSION) {
    throw new FieldgapError('storage-read-only', `this library needs an upgrade (schema ${found} to ${SCHEMA_VERSION}) and is read-only here; open it once where it can be written`, LIBRARY_PATH);
  }
}

function sqliteEngineOver(db: Database.Database, readOnly: boolean): SqlEngine {
  // One transaction at a time on this connection (see above).
  let queue: Promise<unknown> = Promise.resolve();
  const serial = <T>(fn: () => Promise<T>): Promise<T> => {
    const next = queue.then(fn, fn);
    queue = next.catch(() => undefined);
    return next;
  };
  // Compiled statements by their SQL: the library's statements are few and run often (a batch
  // of adds, a page of a list); a list with many search words makes new ones, so the cache is bounded.
  const statements = new Map<string, Database.Statement>();
  const statement = (sql: string): Database.Statement => {
    let found = statements.get(sql);
    if (found === undefined) {
      if (statements.size >= 256) statements.clear();
      found = db.prepare(sql);
      statements.set(sql, found);
    }
    return found;
  };
  const tx: SqlTx = {
    all: async <R>(sql: string, params: readonly unknown[] = []) => statement(sql).all(...params) as R[],
    get: async <R>(sql: string, params: readonly unknown[] = []) => statement(sql).get(...params) as R | undefined,
    run: async (sql: string, params: readonly unknown[] = []) => {
      statement(sql).run(...params);
    },
  };
  const transaction = <T>(begin: string, fn: (t: SqlTx) => Promise<T>): Promise<T> =>
    serial(async () => {
      try {
        db.exec(begin);
      } catch (error) {
        throw translateSqliteError(error);
      }
      try {
        const value = await fn(tx);
        db.exec('COMMIT');
        return value;
      } catch (error) {
        if (db.inTransaction) db.exec('ROLLBACK');
        throw translateSqliteError(error);
      }
    });
  return {
    dialect: 'sqlite',
    label: 'SQLite library',
    readOnly,
    write: (fn) => {
      if (readOnly) {
        return Promise.reject(new FieldgapError('storage-read-only', 'the library is read-only here (its data folder cannot be written): it can be read but not changed', LIBRARY_PATH));
      }
      return transaction('BEGIN IMMEDIATE', fn);
    },
    read: (fn) => transaction('BEGIN', fn),
    ping: async () => {
      if (!db.open) throw new FieldgapError('storage-unavailable', 'the library is closed', LIBRARY_PATH);
    },
    close: () =>
      serial(async () => {
        if (db.open) db.close();
      }),
  };
}
