import Database from 'better-sqlite3';
import { createHash } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { FieldgapError, invalidArgument } from '../errors.js';
import { migrate } from './migrations.js';
import { fitParams, likeWord, revisionFromRow, SUMMARY_SELECT, summaryFromRow, type RevisionRow, type SummaryRow } from './rows.js';
import { translateSqliteError } from './sqlite-errors.js';
import { ionOfResult, summarizeResult } from './summary.js';
import type {
  AnalysisPatch, AnalysisRecord, AnalysisSummary, ListOptions, ListPage, NewAnalysis, OriginalFile, StoredOptions, StoredResult,
} from './types.js';
import { baseFileName, canonicalIon, canonicalIonOrNull, checkDetails } from './validate.js';
import { packageVersion as toolVersion } from '../version.js';

/** The file the library keeps inside its data folder (with -wal and -shm beside it). */
export const LIBRARY_FILE = 'library.sqlite';

export interface LibraryOptions {
  /** How long a write waits for another process's write lock before failing with 'timeout', ms. Default 10000. */
  busyTimeoutMs?: number;
  /** Largest original file accepted, bytes. Default 32 MiB. */
  maxOriginalBytes?: number;
}

export interface Library {
  /** The absolute path of the SQLite file. */
  readonly file: string;
  /** Stores a new analysis (details, original bytes, options, result) and returns it with its id. */
  add(record: NewAnalysis): AnalysisRecord;
  /** One page of records, newest first, filtered by `query` words and `ion`. */
  list(options?: ListOptions): ListPage;
  /** Every record matching the filter (no paging), newest first: for export and series. */
  listAll(filter?: Pick<ListOptions, 'query' | 'ion'>): AnalysisSummary[];
  get(id: number): AnalysisRecord;
  /** The original file, byte for byte as it was added. */
  getOriginal(id: number): OriginalFile;
  /** Edits details and/or adds a revision (options with result); returns the updated record. */
  update(id: number, patch: AnalysisPatch): AnalysisRecord;
  /** Deletes the record, its original and its history. */
  remove(id: number): void;
  close(): void;
}

const DETAIL_COLUMNS = {
  sample: 'sample', formula: 'formula', ion: 'ion', solvent: 'solvent',
  temperature: 'temperature', measuredOn: 'measured_on', note: 'note',
} as const;
const PATCH_KEYS = new Set([...Object.keys(DETAIL_COLUMNS), 'ligands', 'options', 'result', 'toolVersion']);
const SEARCHED = ['a.sample', 'a.formula', 'a.ion', 'a.ligands', 'a.solvent', 'a.note'];

/**
 * Opens (creating when needed) the results library in `dataDir`.
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
 */
export function openLibrary(dataDir: string, options: LibraryOptions = {}): Library {
  const { busyTimeoutMs = 10_000, maxOriginalBytes = 32 * 1024 * 1024 } = options;
  try {
    mkdirSync(dataDir, { recursive: true });
  } catch (error) {
    throw new FieldgapError('invalid-argument', `cannot create the data folder (${(error as NodeJS.ErrnoException).code ?? 'error'})`, dataDir);
  }
  const file = join(dataDir, LIBRARY_FILE);
  let db: Database.Database;
  try {
    db = new Database(file, { timeout: busyTimeoutMs });
  } catch (error) {
    throw translateSqliteError(error, file);
  }
  try {
    db.pragma('journal_mode = WAL');
    db.pragma('synchronous = FULL');
    db.pragma('foreign_keys = ON');
    migrate(db, file);
  } catch (error) {
    db.close();
    throw translateSqliteError(error, file);
  }
  return makeLibrary(db, file, maxOriginalBytes);
}

function makeLibrary(db: Database.Database, file: string, maxOriginalBytes: number): Library {
  const guard = <A extends unknown[], R>(fn: (...args: A) => R) => (...args: A): R => {
    try {
      return fn(...args);
    } catch (error) {
      throw translateSqliteError(error, file);
    }
  };

  const insertAnalysis = db.prepare(`INSERT INTO analyses
    (created_at, updated_at, sample, formula, ion, ligands, solvent, temperature, measured_on, note,
     original_name, original_sha256, original_size)
    VALUES (@now, @now, @sample, @formula, @ion, @ligands, @solvent, @temperature, @measured_on, @note,
     @original_name, @original_sha256, @original_size)`);
  const insertOriginal = db.prepare('INSERT INTO originals (analysis_id, bytes) VALUES (?, ?)');
  const insertRevision = db.prepare(`INSERT INTO revisions
    (analysis_id, revision, created_at, tool_version, options,
     ten_dq, ten_dq_sd, b, b_sd, c, beta, beta_sd, spin_state, rms, status)
    VALUES (@analysis_id, @revision, @created_at, @tool_version, @options,
     @ten_dq, @ten_dq_sd, @b, @b_sd, @c, @beta, @beta_sd, @spin_state, @rms, @status)`);
  const insertResult = db.prepare('INSERT INTO results (revision_id, result) VALUES (?, ?)');
  const selectOne = db.prepare<[number], SummaryRow>(`${SUMMARY_SELECT} WHERE a.id = ?`);
  const selectCurrent = db.prepare<[number], { options: string; result: string }>(`SELECT r.options, x.result
    FROM revisions r JOIN results x ON x.revision_id = r.id WHERE r.analysis_id = ? ORDER BY r.revision DESC LIMIT 1`);
  const selectRevisions = db.prepare<[number], RevisionRow>(`SELECT revision, created_at, tool_version, options,
    ten_dq, ten_dq_sd, b, b_sd, c, beta, beta_sd, spin_state, rms, status
    FROM revisions WHERE analysis_id = ? ORDER BY revision`);
  const selectOriginal = db.prepare<[number], { original_name: string; original_sha256: string; original_size: number; bytes: Buffer }>(
    `SELECT a.original_name, a.original_sha256, a.original_size, o.bytes
     FROM originals o JOIN analyses a ON a.id = o.analysis_id WHERE o.analysis_id = ?`);

  const addRevision = (id: number, revision: number, options: StoredOptions, result: StoredResult, version: string, now: string) => {
    const resultText = jsonText('result', result);
    const { lastInsertRowid } = insertRevision.run({
      analysis_id: id, revision, created_at: now, tool_version: version,
      options: jsonText('options', options), ...fitParams(summarizeResult(result)),
    });
    insertResult.run(lastInsertRowid, resultText);
  };

  const get = (id: number): AnalysisRecord =>
    db.transaction(() => {
      const row = selectOne.get(checkId(id));
      if (!row) throw notFound(id);
      const current = selectCurrent.get(id)!;
      return {
        ...summaryFromRow(row),
        options: JSON.parse(current.options) as StoredOptions,
        result: JSON.parse(current.result) as StoredResult,
        revisions: selectRevisions.all(id).map(revisionFromRow),
      };
    })();

  const filterSql = (filter: Pick<ListOptions, 'query' | 'ion'>) => {
    const clauses: string[] = [];
    const params: Record<string, string> = {};
    words(filter.query).forEach((word, i) => {
      clauses.push(`(${SEARCHED.map((col) => `${col} LIKE @w${i} ESCAPE '\\'`).join(' OR ')})`);
      params[`w${i}`] = likeWord(word);
    });
    if (filter.ion !== undefined && filter.ion.trim() !== '') {
      clauses.push('a.ion = @ion');
      params['ion'] = canonicalIon(filter.ion);
    }
    return { where: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params };
  };

  return {
    file,
    add: guard((record: NewAnalysis) => {
      if (typeof record !== 'object' || record === null) throw invalidArgument('record', 'expected an analysis record');
      const details = checkDetails({ ...record, sample: record.sample ?? '' });
      const fileName = baseFileName(record.fileName);
      const content = originalBytes(record.content, maxOriginalBytes);
      const ion = details.ion ?? canonicalIonOrNull(ionOfResult(record.result)) ?? canonicalIonOrNull(ionOfOptions(record.options));
      const now = new Date().toISOString();
      const id = db.transaction(() => {
        const { lastInsertRowid } = insertAnalysis.run({
          original_name: fileName, original_sha256: sha256Hex(content), original_size: content.length,
          now, sample: details.sample!, formula: details.formula ?? null, ion,
          ligands: JSON.stringify(details.ligands ?? []), solvent: details.solvent ?? null,
          temperature: details.temperature ?? null, measured_on: details.measuredOn ?? null, note: details.note ?? null,
        });
        const newId = Number(lastInsertRowid);
        insertOriginal.run(newId, content);
        addRevision(newId, 1, record.options, record.result, record.toolVersion ?? toolVersion(), now);
        return newId;
      }).immediate();
      return get(id);
    }),

    list: guard((options: ListOptions = {}) => {
      const limit = pageNumber('limit', options.limit, 50, 1, 1000);
      const offset = pageNumber('offset', options.offset, 0, 0, Number.MAX_SAFE_INTEGER);
      const { where, params } = filterSql(options);
      return db.transaction(() => {
        const total = (db.prepare(`SELECT count(*) AS n FROM analyses a ${where}`).get(params) as { n: number }).n;
        const rows = db.prepare(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC LIMIT @limit OFFSET @offset`)
          .all({ ...params, limit, offset }) as SummaryRow[];
        return { analyses: rows.map(summaryFromRow), total, limit, offset };
      })();
    }),

    listAll: guard((filter: Pick<ListOptions, 'query' | 'ion'> = {}) => {
      const { where, params } = filterSql(filter);
      return (db.prepare(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC`).all(params) as SummaryRow[]).map(summaryFromRow);
    }),

    get: guard(get),

    getOriginal: guard((id: number) => {
      const row = selectOriginal.get(checkId(id));
      if (!row) throw notFound(id);
      return { fileName: row.original_name, sha256: row.original_sha256, size: row.original_size, bytes: row.bytes };
    }),

    update: guard((id: number, patch: AnalysisPatch) => {
      checkId(id);
      if (typeof patch !== 'object' || patch === null) throw invalidArgument('patch', 'expected an object of fields to change');
      for (const key of Object.keys(patch)) {
        if (!PATCH_KEYS.has(key)) throw invalidArgument(key, `${key}: not a field that can be changed`);
      }
      if ((patch.options === undefined) !== (patch.result === undefined)) {
        throw invalidArgument(patch.options === undefined ? 'options' : 'result', 'a refit needs both options and result');
      }
      const sets: string[] = [];
      const params: Record<string, unknown> = { id };
      for (const [key, column] of Object.entries(DETAIL_COLUMNS) as [keyof typeof DETAIL_COLUMNS, string][]) {
        const value = patch[key];
        if (value === undefined) continue;
        const checked = value === null ? undefined : checkDetails({ [key]: value })[key];
        if (checked === undefined && key === 'sample') throw invalidArgument('sample', 'sample: a sample name is required');
        sets.push(`${column} = @${column}`);
        params[column] = checked ?? null;
      }
      if (patch.ligands !== undefined) {
        sets.push('ligands = @ligands');
        params['ligands'] = JSON.stringify(patch.ligands === null ? [] : checkDetails({ ligands: patch.ligands }).ligands);
      }
      const now = new Date().toISOString();
      db.transaction(() => {
        const current = db.prepare<[number], { n: number | null }>('SELECT max(revision) AS n FROM revisions WHERE analysis_id = ?').get(id);
        if (current?.n == null) throw notFound(id);
        db.prepare(`UPDATE analyses SET ${[...sets, 'updated_at = @now'].join(', ')} WHERE id = @id`).run({ ...params, now });
        if (patch.options !== undefined && patch.result !== undefined) {
          addRevision(id, current.n + 1, patch.options, patch.result, patch.toolVersion ?? toolVersion(), now);
        }
      }).immediate();
      return get(id);
    }),

    remove: guard((id: number) => {
      const { changes } = db.transaction(() => db.prepare('DELETE FROM analyses WHERE id = ?').run(checkId(id))).immediate();
      if (changes === 0) throw notFound(id);
    }),

    close: () => {
      if (db.open) db.close();
    },
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

function ionOfOptions(options: unknown): unknown {
  return (options as { ion?: unknown } | null)?.ion;
}

function words(query: string | undefined): string[] {
  return (query ?? '').trim().split(/\s+/).filter((w) => w !== '');
}
