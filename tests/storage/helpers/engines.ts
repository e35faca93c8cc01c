/**
 * The storage suite runs against both engines. SQLite needs nothing; the
 * PostgreSQL runs need a server named by FIELDGAP_TEST_DATABASE_URL (.ci/run
 * starts a throwaway one with scripts/test-postgres.sh). Without it the
 * PostgreSQL runs are skipped with a printed line, except when CI=true:
 * then they fail, so CI never passes with half the suite silently left out.
 *
 * Each test gets a fresh library: a new data folder, or a new schema in the
 * test database (dropped afterwards), named through the URL's search_path.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterEach, beforeEach, describe, it } from 'vitest';
import Database from 'better-sqlite3';
import { LIBRARY_FILE, openLibraryAt, type Library, type LibraryLocation, type LibraryOptions } from '../../../src/library/library.js';

export type EngineName = 'sqlite' | 'postgres';

export interface TestLibrary {
  engine: EngineName;
  location: LibraryLocation;
  /** A folder for the test's other files (always a new temporary folder). */
  dir: string;
  open(options?: LibraryOptions): Promise<Library>;
  /** CLI options naming this library. */
  flags: string[];
  /** Environment naming this library (FIELDGAP_DATA or FIELDGAP_DATABASE_URL). */
  env: Record<string, string>;
  /** createApp options naming this library. */
  app: { dataDir: string } | { database: string };
  /** One number from a SQL query run directly on the database, behind the library's back. */
  scalar(sql: string): Promise<number>;
  /** Runs SQL directly on the database (to break things on purpose). */
  exec(sql: string): Promise<void>;
  dispose(): Promise<void>;
}

const TEST_URL = process.env['FIELDGAP_TEST_DATABASE_URL']?.trim() || undefined;
const IN_CI = process.env['CI'] === 'true' || process.env['CI'] === '1';

let announced = false;

/** Registers `suite` once per engine, as describe(`${title} [engine]`). */
export function forEachEngine(title: string, suite: (engine: EngineName) => void): void {
  describe(`${title} [sqlite]`, () => suite('sqlite'));
  if (TEST_URL !== undefined) {
    describe(`${title} [postgres]`, () => suite('postgres'));
  } else if (IN_CI) {
    describe(`${title} [postgres]`, () => {
      it('needs a PostgreSQL server (FIELDGAP_TEST_DATABASE_URL, started by .ci/run)', () => {
        throw new Error('FIELDGAP_TEST_DATABASE_URL is not set under CI: the PostgreSQL half of the storage suite cannot run');
      });
    });
  } else {
    if (!announced) {
      announced = true;
      console.warn('storage tests: PostgreSQL runs skipped (set FIELDGAP_TEST_DATABASE_URL, or run .ci/run, which starts a throwaway server)');
    }
    describe.skip(`${title} [postgres]`, () => suite('postgres'));
  }
}

/** A fresh, empty library of `engine` for one test. */
export async function freshLibrary(engine: EngineName): Promise<TestLibrary> {
  const dir = mkdtempSync(join(tmpdir(), `fieldgap-${engine}-`));
  if (engine === 'sqlite') {
    const dataDir = join(dir, 'lib');
    const location: LibraryLocation = { engine: 'sqlite', dataDir };
    const raw = <T>(fn: (db: Database.Database) => T): T => {
      const db = new Database(join(dataDir, LIBRARY_FILE));
      try {
        return fn(db);
      } finally {
        db.close();
      }
    };
    return {
      engine, location, dir,
      open: (options) => openLibraryAt(location, options),
      flags: ['--data', dataDir],
      env: { FIELDGAP_DATA: dataDir },
      app: { dataDir },
      scalar: async (sql) => raw((db) => Number(Object.values(db.prepare(sql).get() as object)[0])),
      exec: async (sql) => raw((db) => void db.exec(sql)),
      dispose: async () => rmSync(dir, { recursive: true, force: true }),
    };
  }
  const schema = `fg_${process.pid}_${Math.random().toString(36).slice(2, 10)}`;
  await adminQuery(`CREATE SCHEMA ${schema}`);
  const url = withSearchPath(TEST_URL!, schema);
  const location: LibraryLocation = { engine: 'postgres', url };
  return {
    engine, location, dir,
    open: (options) => openLibraryAt(location, options),
    flags: ['--database', url],
    env: { FIELDGAP_DATABASE_URL: url },
    app: { database: url },
    scalar: async (sql) => {
      const rows = await adminQuery(`SET search_path = ${schema}; ${sql}`);
      return Number(Object.values(rows[0]!)[0]);
    },
    exec: async (sql) => {
      await adminQuery(`SET search_path = ${schema}; ${sql}`);
    },
    dispose: async () => {
      await adminQuery(`DROP SCHEMA IF EXISTS ${schema} CASCADE`);
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** The library of the test running now, made by libraryPerTest. */
export interface LibraryPerTest {
  /** Where this test's library lives (its folder or schema, flags, environment). */
  readonly where: TestLibrary;
  /** The library opened there before the test (unless libraryPerTest was told open: false). */
  readonly library: Library;
  /** Closes the library and opens it again on a fresh connection (what a restart sees); the new one is `library`. */
  reopen(): Promise<Library>;
}

/**
 * Gives every test of the enclosing suite a fresh library of `engine`
 * (freshLibrary), opened unless `open` is false, and closes and removes it
 * after the test. Hooks registered later in the suite run inside these
 * (vitest runs after-hooks in reverse), so a suite's own clean-up (a
 * service, child processes) ends before the library goes.
 */
export function libraryPerTest(engine: EngineName, options: { open?: boolean } = {}): LibraryPerTest {
  let where: TestLibrary | undefined;
  let library: Library | undefined;
  beforeEach(async () => {
    where = await freshLibrary(engine);
    if (options.open !== false) library = await where.open();
  });
  afterEach(async () => {
    try {
      await library?.close();
    } finally {
      await where?.dispose();
      where = undefined;
      library = undefined;
    }
  });
  const current = {
    get where(): TestLibrary {
      if (where === undefined) throw new Error('libraryPerTest: there is a library only while a test runs');
      return where;
    },
    get library(): Library {
      if (library === undefined) throw new Error('libraryPerTest: no library is open (open: false, or outside a test)');
      return library;
    },
    async reopen(): Promise<Library> {
      await library?.close();
      library = await current.where.open();
      return library;
    },
  };
  return current;
}

/** The test URL with a search_path, so a library lives in its own schema. */
export function withSearchPath(url: string, schema: string): string {
  const u = new URL(url);
  u.searchParams.set('options', `-c search_path=${schema}`);
  return u.toString();
}

/** Runs SQL (several statements allowed) on the test database; the rows of the last statement. */
export async function adminQuery(sql: string): Promise<Record<string, unknown>[]> {
  const client = new pg.Client({ connectionString: TEST_URL! });
  await client.connect();
  try {
    const result = (await client.query(sql)) as pg.QueryResult | pg.QueryResult[];
    const last = Array.isArray(result) ? result.at(-1)! : result;
    return last.rows as Record<string, unknown>[];
  } finally {
    await client.end();
  }
}

export const POSTGRES_TEST_URL = TEST_URL;
