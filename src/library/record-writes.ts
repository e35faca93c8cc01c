import { invalidArgument } from '../errors.js';
import { packageVersion as toolVersion } from '../version.js';
import type { SqlTx } from './engine.js';
import { jsonText, originalBytes, sha256Hex } from './input-checks.js';
import { fitParams, type FitColumns } from './rows.js';
import { ionOfResult, summarizeResult } from './summary.js';
import type { NewAnalysis, StoredOptions, StoredResult } from './types.js';
import type { RecordScope } from './users.js';
import { baseFileName, canonicalIonOrNull, checkDetails } from './validate.js';

/**
 * How new records and revisions are written: checked and made into row
 * values before any transaction (prepareAdd), then inserted in few
 * statements (insertPrepared, addRevision). library.ts calls them inside
 * its transactions.
 */

/** Rows a multi-row INSERT or an IN (...) list takes at most (PostgreSQL allows 65 535 parameters a statement). */
export const ROWS_PER_INSERT = 200;
export const FIT_COLUMNS: readonly (keyof FitColumns)[] = ['ten_dq', 'ten_dq_sd', 'b', 'b_sd', 'c', 'beta', 'beta_sd', 'spin_state', 'rms', 'status'];

/** Adds revision `revision` of record `id` with its result. */
export async function addRevision(tx: SqlTx, id: number, revision: number, texts: RevisionTexts, version: string, now: string): Promise<void> {
  const row = await tx.get<{ id: number }>(
    `INSERT INTO revisions (analysis_id, revision, created_at, tool_version, options, ${FIT_COLUMNS.join(', ')})
     VALUES (?, ?, ?, ?, ?, ${FIT_COLUMNS.map(() => '?').join(', ')}) RETURNING id`,
    [id, revision, now, version, texts.options, ...FIT_COLUMNS.map((c) => texts.fit[c])],
  );
  await tx.run('INSERT INTO results (revision_id, result) VALUES (?, ?)', [row!.id, texts.result]);
}

/** Checks a new record and makes every value its rows need, before any transaction. */
export function prepareAdd(record: NewAnalysis, maxOriginalBytes: number, scope: RecordScope | undefined): PreparedAdd {
  if (typeof record !== 'object' || record === null) throw invalidArgument('record', 'expected an analysis record');
  const details = checkDetails({ ...record, sample: record.sample ?? '' });
  const fileName = baseFileName(record.fileName);
  const content = originalBytes(record.content, maxOriginalBytes);
  const ion = details.ion ?? canonicalIonOrNull(ionOfResult(record.result)) ?? canonicalIonOrNull(record.options?.ion);
  return {
    values: [
      details.sample!, details.formula ?? null, ion, JSON.stringify(details.ligands ?? []), details.solvent ?? null,
      details.temperature ?? null, details.measuredOn ?? null, details.note ?? null,
      fileName, sha256Hex(content), content.length, scope?.user ?? null, scope?.group ?? null,
    ],
    content,
    texts: revisionTexts(record.options, record.result),
    toolVersion: record.toolVersion ?? toolVersion(),
  };
}

/**
 * Inserts checked records; returns their ids in order. Each analyses row is
 * its own INSERT (its id is needed, and RETURNING gives no order for many
 * rows); the originals, revisions and results go in multi-row INSERTs of
 * up to ROWS_PER_INSERT rows, matched to their analysis by id, not by order.
 */
export async function insertPrepared(tx: SqlTx, records: readonly PreparedAdd[], now: string): Promise<number[]> {
  const ids: number[] = [];
  for (const p of records) {
    const row = await tx.get<{ id: number }>(
      `INSERT INTO analyses
        (created_at, updated_at, sample, formula, ion, ligands, solvent, temperature, measured_on, note,
         original_name, original_sha256, original_size, owner, group_name, revision, tool_version, ${FIT_COLUMNS.join(', ')})
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ${FIT_COLUMNS.map(() => '?').join(', ')}) RETURNING id`,
      [now, now, ...p.values, 1, p.toolVersion, ...FIT_COLUMNS.map((c) => p.texts.fit[c])],
    );
    ids.push(Number(row!.id));
  }
  for (let start = 0; start < records.length; start += ROWS_PER_INSERT) {
    const part = records.slice(start, start + ROWS_PER_INSERT);
    const partIds = ids.slice(start, start + ROWS_PER_INSERT);
    await tx.run(`INSERT INTO originals (analysis_id, bytes) VALUES ${part.map(() => '(?, ?)').join(', ')}`, part.flatMap((p, i) => [partIds[i], p.content]));
    const revisionRow = `(?, 1, ?, ?, ?, ${FIT_COLUMNS.map(() => '?').join(', ')})`;
    const revisions = await tx.all<{ id: number; analysis_id: number }>(
      `INSERT INTO revisions (analysis_id, revision, created_at, tool_version, options, ${FIT_COLUMNS.join(', ')})
       VALUES ${part.map(() => revisionRow).join(', ')} RETURNING id, analysis_id`,
      part.flatMap((p, i) => [partIds[i], now, p.toolVersion, p.texts.options, ...FIT_COLUMNS.map((c) => p.texts.fit[c])]),
    );
    const revisionOf = new Map(revisions.map((r) => [Number(r.analysis_id), Number(r.id)]));
    await tx.run(`INSERT INTO results (revision_id, result) VALUES ${part.map(() => '(?, ?)').join(', ')}`, part.flatMap((p, i) => [revisionOf.get(partIds[i]!), p.texts.result]));
  }
  return ids;
}

/** A revision's options and result as the JSON text stored, and its fit numbers as columns. */
export interface RevisionTexts {
  options: string;
  result: string;
  fit: FitColumns;
}

export function revisionTexts(options: StoredOptions, result: StoredResult): RevisionTexts {
  return { options: jsonText('options', options), result: jsonText('result', result), fit: fitParams(summarizeResult(result)) };
}

/** A checked new record: the analyses row's values after its two timestamps, the original, the revision. */
export interface PreparedAdd {
  values: unknown[];
  content: Buffer;
  texts: RevisionTexts;
  toolVersion: string;
}

