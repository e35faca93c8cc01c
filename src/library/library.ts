import { createHash } from 'node:crypto';
import { FieldgapError, invalidArgument } from '../errors.js';
import { packageVersion as toolVersion } from '../version.js';
import { DIALECT_SQL, type SqlEngine, type SqlTx } from './engine.js';
import { openPostgresEngine, type PostgresEngineOptions } from './postgres-engine.js';
import { fitParams, likeWord, revisionFromRow, SUMMARY_SELECT, summaryFromRow, type FitColumns, type RevisionRow, type SummaryRow } from './rows.js';
import { LIBRARY_FILE, openSqliteEngine, type SqliteEngineOptions } from './sqlite-engine.js';
import { ionOfResult, summarizeResult } from './summary.js';
import type {
  AnalysisPatch, AnalysisRecord, AnalysisSummary, ListOptions, ListPage, NewAnalysis, OriginalFile, StoredOptions, StoredResult,
} from './types.js';
import { userStoreOver, type RecordScope, type UserStore } from './users.js';
import { baseFileName, canonicalIon, canonicalIonOrNull, checkDetails } from './validate.js';

export { LIBRARY_FILE };

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
  /** One page of records, newest first, filtered by `query` words and `ion`. */
  list(options?: ListOptions): Promise<ListPage>;
  /** Every record matching the filter (no paging), newest first: for export and series. */
  listAll(filter?: Pick<ListOptions, 'query' | 'ion' | 'sha256'>): Promise<AnalysisSummary[]>;
  get(id: number): Promise<AnalysisRecord>;
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

/** Opens (creating when needed) the SQLite library in `dataDir`. */
export async function openLibrary(dataDir: string, options: LibraryOptions = {}): Promise<Library> {
  return libraryOver(openSqliteEngine(dataDir, options), options);
}

/** Opens the library at `location`, applying any missing schema steps first. */
export async function openLibraryAt(location: LibraryLocation, options: LibraryOptions = {}): Promise<Library> {
  if (location.engine === 'sqlite') return openLibrary(location.dataDir, options);
  return libraryOver(await openPostgresEngine(location.url, options), options);
}

const DETAIL_COLUMNS = {
  sample: 'sample', formula: 'formula', ion: 'ion', solvent: 'solvent',
  temperature: 'temperature', measuredOn: 'measured_on', note: 'note',
} as const;
const PATCH_KEYS = new Set([...Object.keys(DETAIL_COLUMNS), 'ligands', 'options', 'result', 'toolVersion']);
const SEARCHED = ['a.sample', 'a.formula', 'a.ion', 'a.ligands', 'a.solvent', 'a.note'];
const FIT_COLUMNS: readonly (keyof FitColumns)[] = ['ten_dq', 'ten_dq_sd', 'b', 'b_sd', 'c', 'beta', 'beta_sd', 'spin_state', 'rms', 'status'];

/** The library's rules over one engine. */
export function libraryOver(engine: SqlEngine, options: Pick<LibraryOptions, 'maxOriginalBytes'> = {}, scope?: RecordScope): Library {
  const { maxOriginalBytes = 32 * 1024 * 1024 } = options;
  const sql = DIALECT_SQL[engine.dialect];
  // The condition (on the analyses row `a`) that keeps a user to their group's records; none for an administrator or the single-user mode.
  const groupOnly = scope === undefined || scope.admin ? undefined : scope.group;
  const inScope = (alias: string) => (groupOnly === undefined ? { sql: '', params: [] as unknown[] } : { sql: ` AND ${alias}group_name = ?`, params: [groupOnly] as unknown[] });

  const addRevision = async (tx: SqlTx, id: number, revision: number, options: StoredOptions, result: StoredResult, version: string, now: string) => {
    const resultText = jsonText('result', result);
    const fit = fitParams(summarizeResult(result));
    const row = await tx.get<{ id: number }>(
      `INSERT INTO revisions (analysis_id, revision, created_at, tool_version, options, ${FIT_COLUMNS.join(', ')})
       VALUES (?, ?, ?, ?, ?, ${FIT_COLUMNS.map(() => '?').join(', ')}) RETURNING id`,
      [id, revision, now, version, jsonText('options', options), ...FIT_COLUMNS.map((c) => fit[c])],
    );
    await tx.run('INSERT INTO results (revision_id, result) VALUES (?, ?)', [row!.id, resultText]);
  };

  const readRecord = async (tx: SqlTx, id: number): Promise<AnalysisRecord> => {
    const only = inScope('a.');
    const row = await tx.get<SummaryRow>(`${SUMMARY_SELECT} WHERE a.id = ?${only.sql}`, [checkId(id), ...only.params]);
    if (!row) throw notFound(id);
    const current = (await tx.get<{ options: string; result: string }>(
      `SELECT r.options, x.result FROM revisions r JOIN results x ON x.revision_id = r.id
       WHERE r.analysis_id = ? ORDER BY r.revision DESC LIMIT 1`,
      [id],
    ))!;
    const revisions = await tx.all<RevisionRow>(
      `SELECT revision, created_at, tool_version, options, ${FIT_COLUMNS.join(', ')}
       FROM revisions WHERE analysis_id = ? ORDER BY revision`,
      [id],
    );
    return {
      ...summaryFromRow(row),
      options: JSON.parse(current.options) as StoredOptions,
      result: JSON.parse(current.result) as StoredResult,
      revisions: revisions.map(revisionFromRow),
    };
  };

  const filterSql = (filter: Pick<ListOptions, 'query' | 'ion' | 'sha256'>) => {
    const clauses: string[] = [];
    const params: unknown[] = [];
    for (const word of words(filter.query)) {
      clauses.push(`(${SEARCHED.map((col) => `${col} ${sql.like} ? ESCAPE '\\'`).join(' OR ')})`);
      params.push(...SEARCHED.map(() => likeWord(word)));
    }
    if (filter.ion !== undefined && filter.ion.trim() !== '') {
      clauses.push('a.ion = ?');
      params.push(canonicalIon(filter.ion));
    }
    if (filter.sha256 !== undefined) {
      if (!/^[0-9a-f]{64}$/i.test(filter.sha256)) throw invalidArgument('sha256', 'sha256: expected 64 hexadecimal digits');
      clauses.push('a.original_sha256 = ?');
      params.push(filter.sha256.toLowerCase());
    }
    if (groupOnly !== undefined) {
      clauses.push('a.group_name = ?');
      params.push(groupOnly);
    }
    return { where: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params };
  };

  const get = (id: number) => {
    checkId(id);
    return engine.read((tx) => readRecord(tx, id));
  };

  return {
    engine: engine.dialect,
    readOnly: engine.readOnly,

    add: async (record: NewAnalysis) => {
      if (typeof record !== 'object' || record === null) throw invalidArgument('record', 'expected an analysis record');
      const details = checkDetails({ ...record, sample: record.sample ?? '' });
      const fileName = baseFileName(record.fileName);
      const content = originalBytes(record.content, maxOriginalBytes);
      const ion = details.ion ?? canonicalIonOrNull(ionOfResult(record.result)) ?? canonicalIonOrNull(record.options?.ion);
      jsonText('options', record.options);
      jsonText('result', record.result);
      const now = new Date().toISOString();
      const id = await engine.write(async (tx) => {
        const row = await tx.get<{ id: number }>(
          `INSERT INTO analyses
            (created_at, updated_at, sample, formula, ion, ligands, solvent, temperature, measured_on, note,
             original_name, original_sha256, original_size, owner, group_name)
           VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?) RETURNING id`,
          [
            now, now, details.sample!, details.formula ?? null, ion, JSON.stringify(details.ligands ?? []), details.solvent ?? null,
            details.temperature ?? null, details.measuredOn ?? null, details.note ?? null,
            fileName, sha256Hex(content), content.length, scope?.user ?? null, scope?.group ?? null,
          ],
        );
        const newId = Number(row!.id);
        await tx.run('INSERT INTO originals (analysis_id, bytes) VALUES (?, ?)', [newId, content]);
        await addRevision(tx, newId, 1, record.options, record.result, record.toolVersion ?? toolVersion(), now);
        return newId;
      });
      return get(id);
    },

    list: async (options: ListOptions = {}) => {
      const limit = pageNumber('limit', options.limit, 50, 1, 1000);
      const offset = pageNumber('offset', options.offset, 0, 0, Number.MAX_SAFE_INTEGER);
      const { where, params } = filterSql(options);
      return engine.read(async (tx) => {
        const total = (await tx.get<{ n: number }>(`SELECT CAST(count(*) AS INTEGER) AS n FROM analyses a ${where}`, params))!.n;
        const rows = await tx.all<SummaryRow>(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC LIMIT ? OFFSET ?`, [...params, limit, offset]);
        return { analyses: rows.map(summaryFromRow), total, limit, offset };
      });
    },

    listAll: async (filter: Pick<ListOptions, 'query' | 'ion' | 'sha256'> = {}) => {
      const { where, params } = filterSql(filter);
      return engine.read(async (tx) => (await tx.all<SummaryRow>(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC`, params)).map(summaryFromRow));
    },

    get,

    getOriginal: async (id: number) => {
      checkId(id);
      const only = inScope('a.');
      const row = await engine.read((tx) =>
        tx.get<{ original_name: string; original_sha256: string; original_size: number; bytes: Buffer }>(
          `SELECT a.original_name, a.original_sha256, a.original_size, o.bytes
           FROM originals o JOIN analyses a ON a.id = o.analysis_id WHERE o.analysis_id = ?${only.sql}`,
          [id, ...only.params],
        ),
      );
      if (!row) throw notFound(id);
      return { fileName: row.original_name, sha256: row.original_sha256, size: row.original_size, bytes: row.bytes };
    },

    update: async (id: number, patch: AnalysisPatch) => {
      checkId(id);
      if (typeof patch !== 'object' || patch === null) throw invalidArgument('patch', 'expected an object of fields to change');
      for (const key of Object.keys(patch)) {
        if (!PATCH_KEYS.has(key)) throw invalidArgument(key, `${key}: not a field that can be changed`);
      }
      if ((patch.options === undefined) !== (patch.result === undefined)) {
        throw invalidArgument(patch.options === undefined ? 'options' : 'result', 'a refit needs both options and result');
      }
      const sets: string[] = [];
      const params: unknown[] = [];
      for (const [key, column] of Object.entries(DETAIL_COLUMNS) as [keyof typeof DETAIL_COLUMNS, string][]) {
        const value = patch[key];
        if (value === undefined) continue;
        const checked = value === null ? undefined : checkDetails({ [key]: value })[key];
        if (checked === undefined && key === 'sample') throw invalidArgument('sample', 'sample: a sample name is required');
        sets.push(`${column} = ?`);
        params.push(checked ?? null);
      }
      if (patch.ligands !== undefined) {
        sets.push('ligands = ?');
        params.push(JSON.stringify(patch.ligands === null ? [] : checkDetails({ ligands: patch.ligands }).ligands));
      }
      if (patch.options !== undefined) jsonText('options', patch.options);
      if (patch.result !== undefined) jsonText('result', patch.result);
      const now = new Date().toISOString();
      await engine.write(async (tx) => {
        // Locks the record's row (PostgreSQL) so concurrent refits of one record take turns.
        const only = inScope('');
        const exists = await tx.get<{ id: number }>(`SELECT id FROM analyses WHERE id = ?${only.sql}${sql.lockRow}`, [id, ...only.params]);
        if (!exists) throw notFound(id);
        const current = await tx.get<{ n: number | null }>('SELECT max(revision) AS n FROM revisions WHERE analysis_id = ?', [id]);
        await tx.run(`UPDATE analyses SET ${[...sets, 'updated_at = ?'].join(', ')} WHERE id = ?`, [...params, now, id]);
        if (patch.options !== undefined && patch.result !== undefined) {
          await addRevision(tx, id, (current?.n ?? 0) + 1, patch.options, patch.result, patch.toolVersion ?? toolVersion(), now);
        }
      });
      return get(id);
    },

    remove: async (id: number) => {
      checkId(id);
      const only = inScope('');
      const gone = await engine.write((tx) => tx.all<{ id: number }>(`DELETE FROM analyses WHERE id = ?${only.sql} RETURNING id`, [id, ...only.params]));
      if (gone.length === 0) throw notFound(id);
    },

    ping: () => engine.ping(),
    scoped: (next: RecordScope) => libraryOver(engine, options, next),
    users: userStoreOver(engine),
    // A scoped view does not own the connection it shares.
    close: () => (scope === undefined ? engine.close() : Promise.resolve()),
  };
}

function checkId(id: unknown): number {
  if (typeof id !== 'number' || !Number.isSafeInteger(id) || id < 1) {
    throw invalidArgument('id', `id: expected a whole number from 1, got ${JSON.stringify(id)}`);
  }
  return id;
}

function notFound(id: number): FieldgapError {
  return new FieldgapError('not-found', `no analysis with id ${id} in the library`, 'id');
}

function pageNumber(name: string, value: unknown, fallback: number, min: number, max: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw invalidArgument(name, `${name}: expected a whole number from ${min} to ${max}, got ${JSON.stringify(value)}`);
  }
  return value;
}

function originalBytes(content: unknown, max: number): Buffer {
  if (!(content instanceof Uint8Array)) throw invalidArgument('content', 'content: the original file must be given as bytes');
  if (content.length > max) {
    throw new FieldgapError('too-large', `the original file is ${content.length} bytes, over the library's limit of ${max}`, 'content');
  }
  return Buffer.from(content.buffer, content.byteOffset, content.byteLength);
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

function jsonText(field: string, value: unknown): string {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidArgument(field, `${field}: expected a JSON object`);
  }
  return JSON.stringify(value);
}

function words(query: string | undefined): string[] {
  return (query ?? '').trim().split(/\s+/).filter((w) => w !== '');
}
