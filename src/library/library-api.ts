/**
 * The results library's interface and how to open one (src/library/library.ts
 * implements it over an SQL engine).
 */
import type { FieldgapError } from '../errors.js';
import type { SqlEngine } from './engine.js';
import type { PostgresEngineOptions } from './postgres-engine.js';
import type { SqliteEngineOptions } from './sqlite-engine.js';
import type {
  AnalysisPatch, AnalysisRecord, AnalysisSummary, FitRow, ListOptions, ListPage, NewAnalysis, OriginalFile, SeriesColumns,
} from './types.js';
import type { RecordScope, UserStore } from './users.js';
import type { SeriesQueries } from './series-queries.js';

export interface LibraryOptions extends SqliteEngineOptions, PostgresEngineOptions {
  /** Largest original file accepted, bytes. Default 32 MiB. */
  maxOriginalBytes?: number;
}

/**
 * The results library: analyses with their original files (byte for byte,
 * with SHA-256) and every revision. One interface, two engines (SQLite, the
 * embedded default; PostgreSQL, shared by several instances): the rules
 * below are written once, the engines differ only in SQL dialect and in how
 * they open and lock. Every method is async (PostgreSQL's client is).
 */
export interface Library {
  /** "sqlite" or "postgres". */
  readonly engine: SqlEngine['dialect'];
  /** True when writes are refused (a read-only data folder): reads still work. */
  readonly readOnly: boolean;
  /** Stores a new analysis (details, original bytes, options, result) and returns it with its id. */
  add(record: NewAnalysis): Promise<AnalysisRecord>;
  /**
   * Stores many analyses in one transaction (one commit, one fsync): each
   * entry of the answer is the stored record, or the FieldgapError that kept
   * that one record out (bad details, an original over the limit), in the
   * order given. Nothing is stored unless the whole call resolves: a database
   * failure rejects it and no record of the batch is kept.
   */
  addMany(records: readonly NewAnalysis[]): Promise<(AnalysisRecord | FieldgapError)[]>;
  /** One page of records, newest first, filtered by `query` words and `ion`. */
  list(options?: ListOptions): Promise<ListPage>;
  /** Every record matching the filter (no paging), newest first: for export and series. */
  listAll(filter?: Pick<ListOptions, 'query' | 'ion' | 'sha256'>): Promise<AnalysisSummary[]>;
  /**
   * Every record matching the filter, newest first, one page at a time
   * (`pageSize` records, default 500; each page its own read, resuming after
   * the last id), so an export streams without holding the library in
   * memory. Records added during the walk are not included.
   */
  listPages(filter?: Pick<ListOptions, 'query' | 'ion' | 'sha256'>, pageSize?: number): AsyncIterable<AnalysisSummary[]>;
  /**
   * Every matching record's id, sample, formula, ligands, ion and the fit
   * numbers of a series (no paging), newest first: what `listAll` gives, cut
   * to what a series reads, so 100 000 records come back in a fraction of the time.
   */
  listFits(filter?: Pick<ListOptions, 'query' | 'ion'>): Promise<FitRow[]>;
  /**
   * What a series reads of every record of `ion` (a canonical label), newest
   * first, as columns aggregated by the database into one row: no object per
   * record on the way, so 100 000 records come back in tens of milliseconds.
   * Values not of the expected type (a NaN or text written behind the
   * library's back) make it resolve to undefined: the caller then reads
   * listFits, which keeps them as they are.
   */
  seriesColumns(ion: string): Promise<SeriesColumns | undefined>;
  /**
   * Runs `fn` with the aggregate and page queries of the records of `ion`
   * (a canonical label; series-queries.ts), all in one read (one snapshot):
   * how a series of 100 000 records is answered without reading them all.
   */
  seriesRead<T>(ion: string, fn: (queries: SeriesQueries) => Promise<T>): Promise<T>;
  get(id: number): Promise<AnalysisRecord>;
  /** The full records of `ids`, in the order given, in one read; ids not in the library (or out of scope) are left out. */
  getMany(ids: readonly number[]): Promise<AnalysisRecord[]>;
  /** The original file, byte for byte as it was added. */
  getOriginal(id: number): Promise<OriginalFile>;
  /** Edits details and/or adds a revision (options with result); returns the updated record. */
  update(id: number, patch: AnalysisPatch): Promise<AnalysisRecord>;
  /** Deletes the record, its original and its history. */
  remove(id: number): Promise<void>;
  /** Resolves when the database answers; rejects with 'storage-unavailable' when it does not. */
  ping(): Promise<void>;
  /**
   * The same library as seen by one user: only their group's records (all
   * for an administrator), new records added in their name and group. A
   * record outside the scope is 'not-found', as if it did not exist. The
   * view shares this library's connection; its close() does nothing.
   */
  scoped(scope: RecordScope): Library;
  /** The users and their tokens (users.ts). */
  readonly users: UserStore;
  close(): Promise<void>;
}

/** Where a library lives: a data folder (SQLite) or a PostgreSQL database. */
export type LibraryLocation = { engine: 'sqlite'; dataDir: string } | { engine: 'postgres'; url: string };
