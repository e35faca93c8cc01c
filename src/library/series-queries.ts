import type { DialectSql, SqlTx } from './engine.js';

/**
 * The series of a large library read as the database's aggregates and pages
 * instead of one row per record: what series-paged.ts needs, in one read
 * transaction (one snapshot). The records are those of one ion (and one
 * group, for a user's view). A record's "kind" is its (formula, ligands
 * text) pair: everything a series works out from a record's ligands depends
 * on its kind alone, and a library repeats a few kinds thousands of times.
 *
 * Every query reads an index that holds its columns in its order (schema
 * step 7): the kinds from analyses_series_kinds (ion, formula, ligands, …),
 * the rankings' pages from analyses_by_ten_dq (ion, ten_dq, id DESC) and
 * analyses_by_one_minus_beta (ion, 1 − beta, id DESC), so a page at the
 * start costs a few index entries.
 */

/** A record kind: its formula (null for none) and its ligands as stored (JSON text). */
export interface KindKey {
  formula: string | null;
  ligands: string;
}

/**
 * The sums of one kind's records: counts, and the moments a mean with its
 * uncertainty is made of. "Fitted" records have 10Dq > 0 (the others are
 * skipped by a series); the β sums are over fitted records with
 * 0 < β ≤ 1.2, of u = 1 − β. Energies in cm-1.
 */
export interface SeriesKindRow extends KindKey {
  /** Records of this kind. */
  n: number;
  /** Of them with 10Dq > 0. */
  fitted: number;
  /** The newest fitted record's id (null when none is fitted). */
  firstId: number | null;
  /** Values in the fit columns that are not finite numbers (text, NaN, ±Infinity written behind the library's back). */
  bad: number;
  /** Fitted records whose sample name is blank. */
  blank: number;
  /** Fitted records: the smallest σ(10Dq), how many have one, how many have one > 0. */
  sdMin: number | null;
  sdKnown: number;
  sdPositive: number;
  /** Σ 10Dq, Σ 10Dq², Σ 1/σ² and Σ 10Dq/σ² (the last two over σ > 0). */
  t1: number;
  t2: number;
  w: number;
  wt: number;
  /** Fitted records with 0 < β ≤ 1.2, and the same sums of u = 1 − β and its σ. */
  betaN: number;
  bsdMin: number | null;
  bsdKnown: number;
  bsdPositive: number;
  u1: number;
  u2: number;
  uw: number;
  uwu: number;
}

/** Which records: the ranked ones (fitted, of the given kinds; with or without a valid β), or the skipped ones (not fitted, or of the given kinds). */
export type SeriesRowFilter =
  | { rows: 'ranked'; kinds: KindChoice; beta?: 'valid' | 'missing' }
  | { rows: 'skipped'; kinds: KindChoice };

/** Some of the ion's kinds: `chosen` out of `all` (the condition is written with the shorter list). */
export interface KindChoice {
  chosen: readonly KindKey[];
  all: readonly KindKey[];
}

/** One record as a page gives it. */
export interface SeriesPageRow {
  id: number;
  sample: string;
  formula: string | null;
  ligands: string;
  ten_dq: number | null;
  ten_dq_sd: number | null;
  beta: number | null;
  beta_sd: number | null;
}

export type SeriesRowOrder = 'ten-dq' | 'one-minus-beta' | 'newest';

export interface SeriesQueries {
  kinds(): Promise<SeriesKindRow[]>;
  /** The ids of the records chosen, in ascending order. */
  ids(filter: SeriesRowFilter): Promise<Float64Array>;
  /** `limit` records chosen from `offset` on, in the order given (ties: newest first). */
  page(filter: SeriesRowFilter, order: SeriesRowOrder, limit: number, offset: number): Promise<SeriesPageRow[]>;
}

const FITTED = 'a.ten_dq > 0';
const BETA_VALID = 'a.beta > 0 AND a.beta <= 1.2';
const ORDER_SQL: Record<SeriesRowOrder, string> = {
  'ten-dq': 'a.ten_dq, a.id DESC',
  // The very expression of the index analyses_by_one_minus_beta; 1 − β in double precision on both engines.
  'one-minus-beta': '(1 - a.beta), a.id DESC',
  newest: 'a.id DESC',
};

/**
 * The queries over `tx`; `scope` is the condition on the analyses row `a`
 * that keeps a user's view to their group (with its parameters), or none.
 */
export function seriesQueriesOver(tx: SqlTx, sql: Pick<DialectSql, 'jsonArray' | 'oneScanAggregates'>, ion: string, scope: { sql: string; params: unknown[] }): SeriesQueries {
  const base = { sql: `a.ion = ?${scope.sql}`, params: [ion, ...scope.params] };
  // The sums per kind, each over the rows it needs (all, fitted, fitted with a valid β). SQLite takes
  // three scans of the kinds index, each with its rows chosen by WHERE: a CASE or FILTER per aggregate
  // and row costs it more than the two extra scans. PostgreSQL scans the table in parallel workers
  // and takes one scan with FILTER. A σ of 0 gives no weight: NULLIF makes it NULL, which sum and
  // count leave out (negative σ are refused before these sums are used). Counts come from PostgreSQL
  // as text (bigint): kindRow reads every value as a number.
  const F = FITTED;
  const groups: Record<'all' | 'fitted' | 'beta', { where: string; columns: [string, string][] }> = {
    all: { where: '', columns: [['n', 'count(*)']] },
    fitted: {
      where: F,
      columns: [
        ['fitted', 'count(*)'], ['firstId', 'max(a.id)'],
        ['tMin', 'min(a.ten_dq)'], ['tMax', 'max(a.ten_dq)'], ['sdMin', 'min(a.ten_dq_sd)'], ['sdMax', 'max(a.ten_dq_sd)'],
        ['sampleMin', 'min(trim(a.sample))'],
        ['sdKnown', 'count(a.ten_dq_sd)'], ['sdPositive', 'count(NULLIF(a.ten_dq_sd, 0))'],
        ['t1', 'sum(a.ten_dq)'], ['t2', 'sum(a.ten_dq * a.ten_dq)'],
        ['w', 'sum(1 / NULLIF(a.ten_dq_sd * a.ten_dq_sd, 0))'], ['wt', 'sum(a.ten_dq / NULLIF(a.ten_dq_sd * a.ten_dq_sd, 0))'],
      ],
    },
    beta: {
      // +ten_dq: these rows are not found through the 10Dq index (SQLite would take it and sort).
      where: `+${F} AND ${BETA_VALID}`,
      columns: [
        ['betaN', 'count(*)'], ['bsdKnown', 'count(a.beta_sd)'], ['bsdPositive', 'count(NULLIF(a.beta_sd, 0))'],
        ['bsdMin', 'min(a.beta_sd)'], ['bsdMax', 'max(a.beta_sd)'], ['u1', 'sum(1 - a.beta)'], ['u2', 'sum((1 - a.beta) * (1 - a.beta))'],
        ['uw', 'sum(1 / NULLIF(a.beta_sd * a.beta_sd, 0))'], ['uwu', 'sum((1 - a.beta) / NULLIF(a.beta_sd * a.beta_sd, 0))'],
      ],
    },
  };
  const byKind = 'GROUP BY a.formula, a.ligands';
  const kindColumns = 'a.formula AS formula, a.ligands AS ligands';
  const scanSql = (g: (typeof groups)[keyof typeof groups]) =>
    `SELECT ${kindColumns}, ${g.columns.map(([name, value]) => `${value} AS "${name}"`).join(', ')} FROM analyses a WHERE ${base.sql}${g.where ? ` AND ${g.where}` : ''} ${byKind}`;
  const oneScanSql = `SELECT ${kindColumns}, ${Object.values(groups).flatMap((g) =>
    g.columns.map(([name, value]) => `${value}${g.where ? ` FILTER (WHERE ${g.where.replace('+', '')})` : ''} AS "${name}"`)).join(', ')} FROM analyses a WHERE ${base.sql} ${byKind}`;

  const kindCondition = (choice: KindChoice): { sql: string; params: unknown[] } => {
    const chosen = new Set(choice.chosen.map(kindText));
    const rest = choice.all.filter((k) => !chosen.has(kindText(k)));
    if (rest.length === 0) return { sql: '1 = 1', params: [] };
    if (chosen.size === 0) return { sql: '1 = 0', params: [] };
    const list = chosen.size <= rest.length ? choice.chosen : rest;
    // "formula IS NULL" rather than a null-safe comparison with a parameter, which PostgreSQL's planner cannot estimate (it then scans and sorts).
    const any = `(${list.map((k) => (k.formula === null ? '(a.formula IS NULL AND a.ligands = ?)' : '(a.formula = ? AND a.ligands = ?)')).join(' OR ')})`;
    return { sql: chosen.size <= rest.length ? any : `NOT ${any}`, params: list.flatMap((k) => (k.formula === null ? [k.ligands] : [k.formula, k.ligands])) };
  };
  /** The WHERE of a filter; `byTenDq` false keeps the 10Dq condition off the 10Dq index (+ten_dq), whose order the query does not want. */
  const filterSql = (filter: SeriesRowFilter, byTenDq: boolean): { sql: string; params: unknown[] } => {
    const kinds = kindCondition(filter.kinds);
    const fitted = byTenDq ? FITTED : `+${FITTED}`;
    if (filter.rows === 'skipped') {
      return { sql: `${base.sql} AND (a.ten_dq IS NULL OR NOT (${fitted}) OR ${kinds.sql})`, params: [...base.params, ...kinds.params] };
    }
    const beta = filter.beta === 'valid' ? ` AND ${BETA_VALID}` : filter.beta === 'missing' ? ` AND (a.beta IS NULL OR NOT (${BETA_VALID}))` : '';
    return { sql: `${base.sql} AND ${fitted} AND ${kinds.sql}${beta}`, params: [...base.params, ...kinds.params] };
  };

  return {
    kinds: async () => {
      if (sql.oneScanAggregates) {
        return (await tx.all<Record<string, unknown> & KindKey>(oneScanSql, base.params)).map((r) => kindRow(r, r, r));
      }
      const fitted = new Map((await tx.all<Record<string, unknown> & KindKey>(scanSql(groups.fitted), base.params)).map((r) => [kindText(r), r]));
      const beta = new Map((await tx.all<Record<string, unknown> & KindKey>(scanSql(groups.beta), base.params)).map((r) => [kindText(r), r]));
      return (await tx.all<Record<string, unknown> & KindKey>(scanSql(groups.all), base.params)).map((r) =>
        kindRow(r, fitted.get(kindText(r)), beta.get(kindText(r))));
    },
    ids: async (filter) => {
      const where = filterSql(filter, true);
      const row = await tx.get<{ ids: unknown }>(`SELECT ${sql.jsonArray}(a.id) AS ids FROM analyses a WHERE ${where.sql}`, where.params);
      const value = row?.ids ?? null;
      const list = (typeof value === 'string' ? JSON.parse(value) : value ?? []) as number[];
      // In the order of the index read (by 10Dq); a typed array sorts by number.
      return Float64Array.from(list).sort();
    },
    page: async (filter, order, limit, offset) => {
      const where = filterSql(filter, order === 'ten-dq');
      return tx.all<SeriesPageRow>(
        `SELECT a.id, a.sample, a.formula, a.ligands, a.ten_dq, a.ten_dq_sd, a.beta, a.beta_sd FROM analyses a
         WHERE ${where.sql} ORDER BY ${ORDER_SQL[order]} LIMIT ? OFFSET ?`,
        [...where.params, limit, offset],
      );
    },
  };
}

/** A kind as one text, for sets and maps. */
export function kindText(kind: KindKey): string {
  return `${kind.formula ?? '\u0000'}\u0001${kind.ligands}`;
}

/**
 * One kind's row from the three scans. `bad` counts the extremes of the
 * ranked records' 10Dq and σ that are not finite numbers: SQLite sorts text
 * above every number (so max is text when any is), PostgreSQL sorts NaN
 * above every number, and ±Infinity is an extreme itself. A β that is not
 * a number in (0, 1.2] (text, NaN, ±Infinity) fails the β condition, so the
 * record counts as one without β, as buildSeries takes it too.
 */
function kindRow(all: Record<string, unknown> & KindKey, fitted: Record<string, unknown> | undefined, beta: Record<string, unknown> | undefined): SeriesKindRow {
  const n = (v: unknown) => (v === null || v === undefined ? 0 : Number(v));
  const orNull = (v: unknown) => (v === null || v === undefined ? null : Number(v));
  const f = fitted ?? {};
  const b = beta ?? {};
  const extremes = [f['tMin'], f['tMax'], f['sdMin'], f['sdMax'], b['bsdMin'], b['bsdMax']].map((v) => v ?? null);
  return {
    formula: all.formula, ligands: all.ligands, n: n(all['n']), fitted: n(f['fitted']), firstId: orNull(f['firstId']),
    bad: extremes.filter((v) => v !== null && !(typeof v === 'number' && Number.isFinite(v))).length,
    blank: f['sampleMin'] === '' ? 1 : 0,
    sdMin: orNull(f['sdMin']), sdKnown: n(f['sdKnown']), sdPositive: n(f['sdPositive']), t1: n(f['t1']), t2: n(f['t2']), w: n(f['w']), wt: n(f['wt']),
    betaN: n(b['betaN']), bsdMin: orNull(b['bsdMin']), bsdKnown: n(b['bsdKnown']), bsdPositive: n(b['bsdPositive']),
    u1: n(b['u1']), u2: n(b['u2']), uw: n(b['uw']), uwu: n(b['uwu']),
  };
}
