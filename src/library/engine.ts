/**
 * What the results library needs from a database engine, and no more: one
 * write transaction at a time per record, consistent reads, and a way to
 * tell a missing database from a broken one. Two engines implement it:
 * SQLite (sqlite-engine.ts, the embedded default) and PostgreSQL
 * (postgres-engine.ts, for a facility's shared library). library.ts holds
 * every rule (validation, revisions, hashes) once, over this interface.
 *
 * SQL given to an engine uses `?` placeholders in order; the PostgreSQL
 * engine numbers them ($1, $2, …). No `?` may appear in the SQL otherwise.
 */

export type Dialect = 'sqlite' | 'postgres';

/** The path every storage error names: the library, never a file path or host of the machine it runs on. */
export const LIBRARY_PATH = 'library';

export interface SqlTx {
  all<R>(sql: string, params?: readonly unknown[]): Promise<R[]>;
  get<R>(sql: string, params?: readonly unknown[]): Promise<R | undefined>;
  run(sql: string, params?: readonly unknown[]): Promise<void>;
}

export interface SqlEngine {
  readonly dialect: Dialect;
  /** A description for messages that names no server path nor password: "SQLite library", "PostgreSQL library". */
  readonly label: string;
  /** Runs `fn` in one write transaction; commits when it resolves, rolls back when it throws. */
  write<T>(fn: (tx: SqlTx) => Promise<T>): Promise<T>;
  /** Runs `fn` in one read-only transaction (one consistent snapshot). */
  read<T>(fn: (tx: SqlTx) => Promise<T>): Promise<T>;
  /** Resolves when the database answers; rejects with 'unavailable' otherwise. */
  ping(): Promise<void>;
  /** Whether writes are refused (a read-only data folder). */
  readonly readOnly: boolean;
  close(): Promise<void>;
}

/** The SQL that differs between the engines. */
export interface DialectSql {
  /** Case-insensitive LIKE. */
  like: string;
  /** Appended to a SELECT of the record row that a write will change, to lock it against concurrent writers. */
  lockRow: string;
  /** The aggregate that makes a JSON array of a column's values in the order the rows come (SQLite gives its text, PostgreSQL json). */
  jsonArray: string;
  /** Whether aggregates over different rows are cheaper as one scan with FILTER than as a scan each (series-queries.ts). */
  oneScanAggregates: boolean;
}

export const DIALECT_SQL: Record<Dialect, DialectSql> = {
  // SQLite's LIKE ignores ASCII case; one writer at a time holds the whole database.
  sqlite: { like: 'LIKE', lockRow: '', jsonArray: 'json_group_array', oneScanAggregates: false },
  postgres: { like: 'ILIKE', lockRow: ' FOR UPDATE', jsonArray: 'json_agg', oneScanAggregates: true },
};
