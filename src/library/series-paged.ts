import { parseIon } from '../chemistry/ions.js';
import { JORGENSEN_SOURCE, jorgensenF, jorgensenH } from '../chemistry/jorgensen.js';
import { isFieldgapError } from '../errors.js';
import { compositionPlan, factorConstants, noTabulatedKNote, type CompositionPlan } from '../series/factors.js';
import { valuesOverlap, type LigandFactor, type RankOptions, type Ranking, type RankedEntry, type Overlap } from '../series/index.js';
import type { Library } from './library-api.js';
import { formulaReader, type SeriesFactorFit, type SeriesReport, type SeriesSkip } from './series.js';
import { makeKind, type Kind } from './series-from-columns.js';
import { ligandSummaries, type LigandMeans } from './series-ligands.js';
import { addMoments, affineMoments, meanOfMoments, NO_MOMENTS, type Moments } from './series-moments.js';
import { moreNoFactorNote, seriesLine } from './series-page.js';
import { kindText, type KindKey, type SeriesKindRow, type SeriesPageRow, type SeriesQueries, type SeriesRowFilter, type SeriesRowOrder } from './series-queries.js';

/** More kinds than this and the kind conditions grow too long: the caller reads the records instead. */
const MAX_KINDS = 1_000;
/**
 * Up to this many records of the ion, the caller reads them all (a few
 * milliseconds): a small library's series is then buildSeries's to the last
 * bit, sums taken in its order included.
 */
export const EXACT_UP_TO = 2_000;

/**
 * A page of the series of every record of `ion` (a canonical label), from
 * the database's aggregates per kind (formula, ligands) and pages of the
 * rankings and lists: pageOfSeries(buildSeries(all records), offset, limit)
 * without reading every record (tests/library/series-paged.test.ts compares
 * the two on seeded libraries of both engines). The factors' values and the
 * ligands' means come from sums (series-moments.ts), equal to the
 * per-analysis ones up to rounding; everything else is the same value for value.
 *
 * Returns undefined for a library of up to `exactUpTo` records of the ion, and where buildSeries would throw or the sums cannot stand
 * for the records (nothing to rank, a value that fails buildSeries's
 * checks, a non-finite number, too many kinds): the caller then goes the
 * per-analysis way, whose error names the analysis at fault.
 */
export async function pagedLibrarySeries(
  library: Library, ion: string, options: RankOptions, offset: number, limit: number, exactUpTo = EXACT_UP_TO,
): Promise<SeriesReport | undefined> {
  return library.seriesRead(ion, (q) => pagedSeries(q, ion, options.criterion ?? 'one-sigma', offset, limit, exactUpTo));
}

interface KnownKind {
  row: SeriesKindRow;
  kind: Kind;
}

async function pagedSeries(
  q: SeriesQueries, ion: string, criterion: NonNullable<RankOptions['criterion']>, offset: number, limit: number, exactUpTo: number,
): Promise<SeriesReport | undefined> {
  const rows = await q.kinds();
  if (rows.length === 0 || rows.length > MAX_KINDS || rows.reduce((n, r) => n + r.n, 0) <= exactUpTo) return undefined;
  const readFormula = formulaReader();
  const all: KindKey[] = rows;
  const ranked: KnownKind[] = [];
  const left: KnownKind[] = [];
  for (const row of rows) {
    if (row.bad > 0) return undefined;
    if (row.fitted === 0) continue;
    const kind = makeKind(row.formula, row.ligands, readFormula);
    if (kind === undefined) return undefined;
    if (kind.skip !== undefined) {
      left.push({ row, kind });
      continue;
    }
    // buildSeries's checks of what is ranked: a sample name, σ ≥ 0.
    if (row.blank > 0 || (row.sdMin !== null && row.sdMin < 0) || (row.bsdMin !== null && row.bsdMin < 0)) return undefined;
    ranked.push({ row, kind });
  }
  const count = ranked.reduce((n, k) => n + k.row.fitted, 0);
  if (count === 0) return undefined;
  const kindOf = new Map(rows.map((r) => [kindText(r), ranked.find((k) => k.row === r)?.kind ?? left.find((k) => k.row === r)?.kind]));
  const choose = (list: readonly KnownKind[]) => ({ chosen: list.map((k) => k.row), all });
  const rankedRows: SeriesRowFilter = { rows: 'ranked', kinds: choose(ranked) };

  // Each ranked record's index in the list buildSeries ranks (newest first): its place among the ranked ids.
  const ids = await q.ids(rankedRows);
  if (ids.length !== count) return undefined;
  const indexOf = (id: number) => count - 1 - binarySearch(ids, id);
  const labelOf = (r: SeriesPageRow) => (kindOf.get(kindText(r)) as Kind).label;

  // A list with nothing from `offset` on is not read (the read would scan the whole ion to find nothing).
  const betaTotal = ranked.reduce((n, k) => n + k.row.betaN, 0);
  const skippedTotal = rows.reduce((n, r) => n + r.n - r.fitted, 0) + left.reduce((n, k) => n + k.row.fitted, 0);
  const pageOf = async (total: number, filter: SeriesRowFilter, order: SeriesRowOrder, size: number) => (total > offset ? q.page(filter, order, size, offset) : []);
  const spectrochemical = rankingPage('spectrochemical', await pageOf(count, rankedRows, 'ten-dq', limit + 1), criterion, offset, limit, indexOf, labelOf);
  const nephelauxetic = rankingPage('nephelauxetic', await pageOf(betaTotal, { ...rankedRows, beta: 'valid' }, 'one-minus-beta', limit + 1), criterion, offset, limit, indexOf, labelOf);
  nephelauxetic.skipped = (await pageOf(count - betaTotal, { ...rankedRows, beta: 'missing' }, 'newest', limit)).map((r) => ({ index: indexOf(r.id), sample: r.sample, reason: 'no beta given' }));
  const skipped = (await pageOf(skippedTotal, { rows: 'skipped', kinds: choose(left) }, 'newest', limit)).map((r): SeriesSkip => ({
    id: String(r.id), sample: r.sample, reason: r.ten_dq === null || !(r.ten_dq > 0) ? 'no fitted 10Dq' : (kindOf.get(kindText(r)) as Kind).skip as string,
  }));

  const fit = await factorPage(q, ion, ranked, all, offset, limit, indexOf);
  const notes = fit.factors === null ? [fit.error] : fit.factors.notes;
  const means = ligandMeans(ranked, indexOf);
  return {
    ion,
    count,
    spectrochemical,
    nephelauxetic,
    factors: fit.factors,
    skipped,
    notes,
    ...ligandSummaries(means, fit.factors, criterion),
    page: {
      all: false, offset, limit, total: count, nephelauxeticTotal: betaTotal, nephelauxeticSkippedTotal: count - betaTotal,
      skippedTotal, noFactorTotal: fit.noFactorTotal,
    },
  };
}

/** The place of `id` in the ascending `ids` (it is there). */
function binarySearch(ids: Float64Array, id: number): number {
  let lo = 0;
  let hi = ids.length - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((ids[mid] as number) < id) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Entries offset+1 … offset+limit of a ranking, as rank() writes them, from its rows offset+1 … offset+limit+1 (the one more says whether the last one overlaps the next). */
function rankingPage(
  kind: Ranking['kind'], rows: readonly SeriesPageRow[], criterion: NonNullable<RankOptions['criterion']>, offset: number, limit: number,
  indexOf: (id: number) => number, labelOf: (r: SeriesPageRow) => string,
): Ranking {
  const byTenDq = kind === 'spectrochemical';
  const value = (r: SeriesPageRow) => (byTenDq ? (r.ten_dq as number) : 1 - (r.beta as number));
  const sigma = (r: SeriesPageRow) => (byTenDq ? r.ten_dq_sd : r.beta_sd) ?? 0;
  const entries: RankedEntry[] = [];
  const overlaps: Overlap[] = [];
  for (let i = 0; i < Math.min(limit, rows.length); i++) {
    const r = rows[i] as SeriesPageRow;
    const next = rows[i + 1];
    const v = value(r);
    const u = sigma(r);
    const overlapsNext = next !== undefined && valuesOverlap(v, u, value(next), sigma(next), criterion);
    const position = offset + i + 1;
    if (overlapsNext) overlaps.push({ lower: position, upper: position + 1, difference: value(next) - v, combinedUncertainty: Math.hypot(u, sigma(next)) });
    entries.push({ position, index: indexOf(r.id), sample: r.sample, ligandLabel: labelOf(r), value: v, uncertainty: u, overlapsNext, id: String(r.id) });
  }
  return { kind, quantity: byTenDq ? '10Dq / cm-1' : '1 - beta', criterion, entries, overlaps, series: seriesLine(entries), skipped: [] };
}

/** The 10Dq moments of a kind's fitted records, and the moments of u = 1 − β of those with a β. */
function tenDqMoments(r: SeriesKindRow): Moments {
  return { n: r.fitted, known: r.sdKnown, positive: r.sdPositive, s1: r.t1, s2: r.t2, w: r.w, wx: r.wt, onlySigma: r.fitted === 1 ? r.sdMin : null };
}

function uMoments(r: SeriesKindRow): Moments {
  return { n: r.betaN, known: r.bsdKnown, positive: r.bsdPositive, s1: r.u1, s2: r.u2, w: r.uw, wx: r.uwu, onlySigma: r.betaN === 1 ? r.bsdMin : null };
}

/** Each label's means, from its kinds' sums; β = 1 − mean of 1 − β. */
function ligandMeans(ranked: readonly KnownKind[], indexOf: (id: number) => number): LigandMeans[] {
  const byLabel = new Map<string, { first: number; t: Moments; u: Moments }>();
  for (const { row, kind } of ranked) {
    const first = indexOf(row.firstId as number);
    const entry = byLabel.get(kind.label);
    if (entry === undefined) byLabel.set(kind.label, { first, t: tenDqMoments(row), u: uMoments(row) });
    else byLabel.set(kind.label, { first: Math.min(first, entry.first), t: addMoments(entry.t, tenDqMoments(row)), u: addMoments(entry.u, uMoments(row)) });
  }
  return [...byLabel].map(([ligand, e]) => {
    const u = e.u.n > 0 ? meanOfMoments(e.u) : undefined;
    return {
      ligand, first: e.first, count: e.t.n, tenDq: meanOfMoments(e.t), betaCount: e.u.n,
      beta: u === undefined ? undefined : { value: 1 - u.value, sigma: u.sigma },
    };
  });
}

/**
 * Jørgensen's factors of the ranked records (fitCheckedLigandFactors's
 * rules, from sums), with a page of each factor's fFrom and hFrom and of the
 * notes of records that give no f; or the note of why they cannot be fitted.
 */
async function factorPage(
  q: SeriesQueries, ionLabel: string, ranked: readonly KnownKind[], all: readonly KindKey[], offset: number, limit: number, indexOf: (id: number) => number,
): Promise<{ factors: SeriesFactorFit; noFactorTotal: number } | { factors: null; error: string; noFactorTotal: 0 }> {
  let constants: ReturnType<typeof factorConstants>;
  try {
    constants = factorConstants(parseIon(ionLabel, { path: 'analyses[0].ion' }), { ion: ionLabel });
  } catch (error) {
    if (!isFieldgapError(error) || error.code !== 'invalid-argument') throw error;
    return { factors: null, error: `ligand factors not fitted: ${error.message}`, noFactorTotal: 0 };
  }
  const { ion, g, k, knownF, knownH } = constants;
  const plans = ranked.map((x) => ({ ...x, plan: compositionPlan(x.kind.canonical, g, k, knownF, knownH) }));
  type Part = { row: SeriesKindRow; m: Moments };
  const fParts = new Map<string, Part[]>();
  const hParts = new Map<string, Part[]>();
  const push = (map: Map<string, Part[]>, key: string, part: Part) => map.set(key, [...(map.get(key) ?? []), part]);
  const noF: { row: SeriesKindRow; reason: string }[] = [];
  for (const { row, plan } of plans) {
    if (typeof plan.f === 'string') noF.push({ row, reason: plan.f });
    else push(fParts, plan.f.ligand, { row, m: affineMoments(tenDqMoments(row), plan.f.scale, plan.f.restPerPosition) });
    const h: CompositionPlan['h'] = plan.h;
    if (h !== undefined && row.betaN > 0) push(hParts, h.ligand, { row, m: affineMoments(uMoments(row), h.scale, h.restPerPosition) });
  }
  const from = async (parts: readonly Part[], beta: boolean) =>
    parts.reduce((n, p) => n + p.m.n, 0) <= offset ? [] : (await q.page({ rows: 'ranked', kinds: { chosen: parts.map((p) => p.row), all }, ...(beta && { beta: 'valid' as const }) }, 'newest', limit, offset)).map((r) => indexOf(r.id));
  // In the order of each ligand's newest record, as the per-analysis fit meets them.
  const newest = (parts: readonly Part[]) => Math.min(...parts.map((p) => indexOf(p.row.firstId as number)));
  const ligands = [...fParts].sort((x, y) => newest(x[1]) - newest(y[1]));
  const factors: SeriesFactorFit['factors'] = [];
  for (const [ligand, parts] of ligands) {
    const mean = meanOfMoments(parts.map((p) => p.m).reduce(addMoments, NO_MOMENTS));
    const factor: LigandFactor = { ligand, f: mean.value, fUncertainty: mean.sigma, fFrom: await from(parts, false) };
    const hs = hParts.get(ligand);
    if (hs) {
      const h = meanOfMoments(hs.map((p) => p.m).reduce(addMoments, NO_MOMENTS));
      factor.h = h.value;
      factor.hUncertainty = h.sigma;
      factor.hFrom = await from(hs, true);
    }
    const tf = jorgensenF(ligand);
    const th = jorgensenH(ligand);
    if (tf !== undefined) factor.tabulatedF = tf;
    if (th !== undefined) factor.tabulatedH = th;
    const fCount = parts.reduce((n, p) => n + p.m.n, 0);
    factors.push(hs ? { ...factor, fCount, hCount: hs.reduce((n, p) => n + p.m.n, 0) } : { ...factor, fCount });
  }
  const noFactorTotal = noF.reduce((n, x) => n + x.row.fitted, 0);
  const notes: string[] = [];
  if (noFactorTotal > 0) {
    const reasonOf = new Map(noF.map((x) => [kindText(x.row), x.reason]));
    const shown = noFactorTotal <= offset ? [] : await q.page({ rows: 'ranked', kinds: { chosen: noF.map((x) => x.row), all } }, 'newest', limit, offset);
    for (const r of shown) notes.push(`analyses[${indexOf(r.id)}] (${r.sample}): ${reasonOf.get(kindText(r))}: gives no f`);
    if (noFactorTotal > shown.length) notes.push(moreNoFactorNote(noFactorTotal - shown.length));
  }
  if (k === undefined) notes.push(noTabulatedKNote(ion));
  return { factors: { ion: ion.label, g, k, source: JORGENSEN_SOURCE, factors, notes }, noFactorTotal };
}
