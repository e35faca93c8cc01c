import { FieldgapError, invalidArgument, isFieldgapError } from '../errors.js';
import { packageVersion as toolVersion } from '../version.js';
import { DIALECT_SQL, type SqlEngine, type SqlTx } from './engine.js';
import { checkId, notFound, pageNumber, sha256Hex, words } from './input-checks.js';
import type { Library, LibraryLocation, LibraryOptions } from './library-api.js';
import { openPostgresEngine } from './postgres-engine.js';
import { likeWord, revisionFromRow, SUMMARY_SELECT, summaryFromRow, type RevisionRow, type SummaryRow } from './rows.js';
import { addRevision, FIT_COLUMNS, insertPrepared, prepareAdd, revisionTexts, ROWS_PER_INSERT, type PreparedAdd } from './record-writes.js';
import { seriesColumnsFromRow, seriesColumnsSql } from './series-columns.js';
import { seriesQueriesOver } from './series-queries.js';
import { LIBRARY_FILE, openSqliteEngine } from './sqlite-engine.js';
import type {
  AnalysisPatch, AnalysisRecord, FitRow, ListOptions, NewAnalysis, StoredOptions, StoredResult,
} from './types.js';
import { userStoreOver, type RecordScope } from './users.js';
import { canonicalIon, checkDetails } from './validate.js';

export { LIBRARY_FILE };

export type { Library, LibraryLocation, LibraryOptions } from './library-api.js';
export { sha256Hex };

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

/** The library's rules over one engine. */
export function libraryOver(engine: SqlEngine, options: Pick<LibraryOptions, 'maxOriginalBytes'> = {}, scope?: RecordScope): Library {
  const { maxOriginalBytes = 32 * 1024 * 1024 } = options;
  const sql = DIALECT_SQL[engine.dialect];
  // The condition (on the analyses row `a`) that keeps a user to their group's records; none for an administrator or the single-user mode.
  const groupOnly = scope === undefined || scope.admin ? undefined : scope.group;
  const inScope = (alias: string) => (groupOnly === undefined ? { sql: '', params: [] as unknown[] } : { sql: ` AND ${alias}group_name = ?`, params: [groupOnly] as unknown[] });

  const addMany = async (records: readonly NewAnalysis[]): Promise<(AnalysisRecord | FieldgapError)[]> => {
    if (!Array.isArray(records)) throw invalidArgument('records', 'expected a list of analysis records');
    const prepared = records.map((record): PreparedAdd | FieldgapError => {
      try {
        return prepareAdd(record, maxOriginalBytes, scope);
      } catch (error) {
        if (isFieldgapError(error)) return error;
        throw error;
      }
    });
    if (prepared.every((p) => isFieldgapError(p))) return prepared as FieldgapError[];
    const now = new Date().toISOString();
    // The records are read back in the same transaction: what is returned is what was committed.
    return engine.write(async (tx) => {
      const valid = prepared.filter((p): p is PreparedAdd => !isFieldgapError(p));
      const records = await readRecords(tx, await insertPrepared(tx, valid, now));
      let next = 0;
      return prepared.map((p) => (isFieldgapError(p) ? p : records[next++]!));
    });
  };

  /** The full records of `ids` in scope, in the order given; ids not found (or out of scope) are left out. */
  const readRecords = async (tx: SqlTx, ids: readonly number[]): Promise<AnalysisRecord[]> => {
    const found = new Map<number, AnalysisRecord>();
    for (let start = 0; start < ids.length; start += ROWS_PER_INSERT) {
      const part = ids.slice(start, start + ROWS_PER_INSERT);
      const marks = part.map(() => '?').join(', ');
      const only = inScope('a.');
      const rows = await tx.all<SummaryRow>(`${SUMMARY_SELECT} WHERE a.id IN (${marks})${only.sql}`, [...part, ...only.params]);
      if (rows.length === 0) continue;
      const inScopeIds = rows.map((r) => Number(r.id));
      const inMarks = inScopeIds.map(() => '?').join(', ');
      // The current revision is the one the analyses row names (kept in step by every write).
      const current = await tx.all<{ analysis_id: number; options: string; result: string }>(
        `SELECT r.analysis_id, r.options, x.result FROM analyses a
         JOIN revisions r ON r.analysis_id = a.id AND r.revision = a.revision JOIN results x ON x.revision_id = r.id
         WHERE a.id IN (${inMarks})`,
        inScopeIds,
      );
      const revisions = await tx.all<RevisionRow & { analysis_id: number }>(
        `SELECT analysis_id, revision, created_at, tool_version, options, ${FIT_COLUMNS.join(', ')}
         FROM revisions WHERE analysis_id IN (${inMarks}) ORDER BY analysis_id, revision`,
        inScopeIds,
      );
      const currentOf = new Map(current.map((c) => [Number(c.analysis_id), c]));
      const historyOf = new Map<number, RevisionRow[]>();
      for (const r of revisions) {
        const list = historyOf.get(Number(r.analysis_id));
        const { analysis_id: _id, ...revision } = r;
        if (list) list.push(revision);
        else historyOf.set(Number(r.analysis_id), [revision]);
      }
      for (const row of rows) {
        const id = Number(row.id);
        const now = currentOf.get(id)!;
        found.set(id, {
          ...summaryFromRow(row),
          options: JSON.parse(now.options) as StoredOptions,
          result: JSON.parse(now.result) as StoredResult,
          revisions: historyOf.get(id)!.map(revisionFromRow),
        });
      }
    }
    return ids.flatMap((id) => found.get(id) ?? []);
  };

  const readRecord = async (tx: SqlTx, id: number): Promise<AnalysisRecord> => {
    const [record] = await readRecords(tx, [checkId(id)]);
    if (!record) throw notFound(id);
    return record;
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
      const [saved] = await addMany([record]);
      if (saved instanceof FieldgapError) throw saved;
      return saved!;
    },

    addMany,

    list: async (options: ListOptions = {}) => {
      const limit = pageNumber('limit', options.limit, 50, 1, 1000);
      const offset = pageNumber('offset', options.offset, 0, 0, Number.MAX_SAFE_INTEGER);
      const { where, params } = filterSql(options);
      const countQuery = `SELECT CAST(count(*) AS INTEGER) AS n FROM analyses a ${where}`;
      return engine.read(async (tx) => {
        const total = (await tx.get<{ n: number }>(countQuery, params))!.n;
        const rows = await tx.all<SummaryRow>(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC LIMIT ? OFFSET ?`, [...params, limit, offset]);
        return { analyses: rows.map(summaryFromRow), total, limit, offset };
      });
    },

    listAll: async (filter: Pick<ListOptions, 'query' | 'ion' | 'sha256'> = {}) => {
      const { where, params } = filterSql(filter);
      return engine.read(async (tx) => (await tx.all<SummaryRow>(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC`, params)).map(summaryFromRow));
    },

    listPages: (filter: Pick<ListOptions, 'query' | 'ion' | 'sha256'> = {}, pageSize = 500) => {
      const size = pageNumber('pageSize', pageSize, 500, 1, 10_000);
      const { where, params } = filterSql(filter);
      const after = where === '' ? 'WHERE a.id < ?' : `${where} AND a.id < ?`;
      return {
        async *[Symbol.asyncIterator]() {
          // Keyset paging: each page starts below the last id seen, so a page costs the same at the end as at the start.
          let below: number | undefined;
          for (;;) {
            const rows = await engine.read((tx) =>
              below === undefined
                ? tx.all<SummaryRow>(`${SUMMARY_SELECT} ${where} ORDER BY a.id DESC LIMIT ?`, [...params, size])
                : tx.all<SummaryRow>(`${SUMMARY_SELECT} ${after} ORDER BY a.id DESC LIMIT ?`, [...params, below, size]));
            if (rows.length === 0) return;
            yield rows.map(summaryFromRow);
            if (rows.length < size) return;
            below = rows.at(-1)!.id;
          }
        },
      };
    },

    listFits: async (filter: Pick<ListOptions, 'query' | 'ion'> = {}) => {
      const { where, params } = filterSql(filter);
      const rows = await engine.read((tx) =>
        tx.all<FitRowColumns>(`SELECT a.id, a.sample, a.formula, a.ligands, a.ion, a.ten_dq, a.ten_dq_sd, a.b, a.beta, a.beta_sd FROM analyses a ${where} ORDER BY a.id DESC`, params));
      // A library repeats a few ligand lists thousands of times: each distinct text is parsed once (the arrays are shared, read only).
      const ligandLists = new Map<string, string[]>();
      return rows.map((row): FitRow => {
        const fit: FitRow = { id: row.id, sample: row.sample, summary: { tenDq: row.ten_dq, tenDqSd: row.ten_dq_sd, b: row.b, beta: row.beta, betaSd: row.beta_sd } };
        if (row.formula !== null) fit.formula = row.formula;
        let ligands = ligandLists.get(row.ligands);
        if (ligands === undefined) {
          ligands = JSON.parse(row.ligands) as string[];
          ligandLists.set(row.ligands, ligands);
        }
        if (ligands.length > 0) fit.ligands = ligands;
        if (row.ion !== null) fit.ion = row.ion;
        return fit;
      });
    },

    seriesColumns: async (ion: string) => {
      const { where, params } = filterSql({ ion });
      const row = await engine.read((tx) => tx.get<Record<string, unknown>>(seriesColumnsSql(sql.jsonArray, where), params));
      return seriesColumnsFromRow(row);
    },

    seriesRead: (ion, fn) => engine.read((tx) => fn(seriesQueriesOver(tx, sql, ion, inScope('a.')))),

    get,

    getMany: async (ids: readonly number[]) => {
      if (!Array.isArray(ids)) throw invalidArgument('ids', 'expected a list of ids');
      ids.forEach(checkId);
      return engine.read((tx) => readRecords(tx, ids));
    },

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
      const texts = patch.options !== undefined && patch.result !== undefined ? revisionTexts(patch.options, patch.result) : undefined;
      const now = new Date().toISOString();
      await engine.write(async (tx) => {
        // Locks the record's row (PostgreSQL) so concurrent refits of one record take turns.
        const only = inScope('');
        const exists = await tx.get<{ id: number }>(`SELECT id FROM analyses WHERE id = ?${only.sql}${sql.lockRow}`, [id, ...only.params]);
        if (!exists) throw notFound(id);
        const current = await tx.get<{ n: number | null }>('SELECT max(revision) AS n FROM revisions WHERE analysis_id = ?', [id]);
        const next = (current?.n ?? 0) + 1;
        const version = patch.toolVersion ?? toolVersion();
        // A new revision becomes the current one: its numbers are copied into the analyses row (schema step 5).
        const currentSets = texts === undefined ? [] : ['revision = ?', 'tool_version = ?', ...FIT_COLUMNS.map((c) => `${c} = ?`)];
        const currentParams = texts === undefined ? [] : [next, version, ...FIT_COLUMNS.map((c) => texts.fit[c])];
        await tx.run(`UPDATE analyses SET ${[...sets, ...currentSets, 'updated_at = ?'].join(', ')} WHERE id = ?`, [...params, ...currentParams, now, id]);
        if (texts !== undefined) await addRevision(tx, id, next, texts, version, now);
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

/** The columns listFits reads. */
interface FitRowColumns {
  id: number;
  sample: string;
  formula: string | null;
  ligands: string;
  ion: string | null;
  ten_dq: number | null;
  ten_dq_sd: number | null;
  b: number | null;
  beta: number | null;
  beta_sd: number | null;
}
