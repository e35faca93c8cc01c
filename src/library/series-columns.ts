import type { SeriesColumns } from './types.js';

/**
 * The series read as one aggregated row: each column of the matching
 * analyses rows as one JSON array, made by the database (json_group_array in
 * SQLite, json_agg in PostgreSQL), so 100 000 records cross into JavaScript
 * as a few strings parsed by JSON.parse instead of 100 000 row objects built
 * value by value by the driver (five to ten times the time). Both engines
 * print a double in JSON as its shortest exact text: JSON.parse gives back
 * the very number stored.
 *
 * The aggregates take the rows in the order the engine reads them (no ORDER
 * BY: SQLite then reads the series index in id order, with no co-routine in
 * between, 15 % less time); seriesColumnsFromRow puts them newest first:
 * reversed when they came oldest first, sorted when in any other order.
 */
const COLUMNS: readonly (readonly [keyof SeriesColumns, string])[] = [
  ['id', 'id'], ['sample', 'sample'], ['formula', 'formula'], ['ligands', 'ligands'],
  ['tenDq', 'ten_dq'], ['tenDqSd', 'ten_dq_sd'], ['beta', 'beta'], ['betaSd', 'beta_sd'],
];

/** The query; `where` filters the analyses rows `a` (ion, group), `jsonArray` is the dialect's aggregate. */
export function seriesColumnsSql(jsonArray: string, where: string): string {
  return `SELECT ${COLUMNS.map(([key, column]) => `${jsonArray}(a.${column}) AS "${key}"`).join(', ')} FROM analyses a ${where}`;
}

/**
 * The columns from the row the query gave (JSON text from SQLite, parsed
 * JSON or null for no rows from PostgreSQL), newest first; undefined when a
 * value is not of its column's type (e.g. a NaN, which PostgreSQL prints as
 * the text "NaN"): the caller then reads the rows one by one.
 */
export function seriesColumnsFromRow(row: Record<string, unknown> | undefined): SeriesColumns | undefined {
  const read = (key: keyof SeriesColumns): unknown[] | undefined => {
    const value = row?.[key] ?? null;
    const parsed: unknown = typeof value === 'string' ? JSON.parse(value) : value === null ? [] : value;
    return Array.isArray(parsed) ? parsed : undefined;
  };
  const id = read('id');
  const sample = read('sample');
  const formula = read('formula');
  const ligands = read('ligands');
  const tenDq = read('tenDq');
  const tenDqSd = read('tenDqSd');
  const beta = read('beta');
  const betaSd = read('betaSd');
  if (!id || !sample || !formula || !ligands || !tenDq || !tenDqSd || !beta || !betaSd) return undefined;
  const n = id.length;
  if ([sample, formula, ligands, tenDq, tenDqSd, beta, betaSd].some((c) => c.length !== n)) return undefined;
  const isNumber = (v: unknown) => typeof v === 'number';
  const isNumberOrNull = (v: unknown) => v === null || typeof v === 'number';
  const isText = (v: unknown) => typeof v === 'string';
  if (!id.every(isNumber) || !sample.every(isText) || !ligands.every(isText) || !formula.every((v) => v === null || typeof v === 'string')) return undefined;
  if (![tenDq, tenDqSd, beta, betaSd].every((c) => c.every(isNumberOrNull))) return undefined;
  const columns = { id, sample, formula, ligands, tenDq, tenDqSd, beta, betaSd } as SeriesColumns;
  return newestFirst(columns);
}

/** The columns in descending id order: as given, or reversed (the usual cases), else sorted. */
function newestFirst(columns: SeriesColumns): SeriesColumns {
  const { id } = columns;
  let descending = true;
  let ascending = true;
  for (let i = 1; i < id.length && (descending || ascending); i++) {
    descending &&= (id[i - 1] as number) > (id[i] as number);
    ascending &&= (id[i - 1] as number) < (id[i] as number);
  }
  if (descending) return columns;
  if (ascending) {
    for (const column of Object.values(columns) as unknown[][]) column.reverse();
    return columns;
  }
  const order = id.map((_v, i) => i).sort((x, y) => (id[y] as number) - (id[x] as number));
  const pick = <T>(column: T[]): T[] => order.map((i) => column[i] as T);
  return {
    id: pick(columns.id), sample: pick(columns.sample), formula: pick(columns.formula), ligands: pick(columns.ligands),
    tenDq: pick(columns.tenDq), tenDqSd: pick(columns.tenDqSd), beta: pick(columns.beta), betaSd: pick(columns.betaSd),
  };
}
