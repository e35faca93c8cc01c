import { afterEach, beforeEach, expect, it } from 'vitest';
import type { Library } from '../../src/library/library.js';
import { buildSeries, librarySeries, librarySources, type SeriesReport } from '../../src/library/series.js';
import { pageOfSeries } from '../../src/library/series-page.js';
import { pagedLibrarySeries } from '../../src/library/series-paged.js';
import type { RankOptions } from '../../src/series/index.js';
import { referenceSeries as oldReferenceSeries } from '../reference/series-report.js';
import { forEachEngine, freshLibrary, type TestLibrary } from '../storage/helpers/engines.js';
import { oldFields } from './helpers/old-fields.js';
import { seededRecords } from './helpers/seeded-records.js';

/**
 * The default series of a library is a page of its per-analysis lists with
 * every ligand-level figure complete, read from the database's sums and
 * pages (pagedLibrarySeries). The slow, obvious reference: every record read
 * as a row and ranked by buildSeries, then the lists cut to the page
 * (pageOfSeries). The two must agree: exactly for every position, index,
 * id, sample, label, value, overlap, skip and note, and to 1e-9 (relative)
 * for the means and factors the database sums in its own order.
 */
async function slowPage(library: Library, ion: string, options: RankOptions, offset: number, limit: number): Promise<SeriesReport> {
  return pageOfSeries(buildSeries(ion, await librarySources(library, ion), options), offset, limit);
}

/** The numbers that are sums, each with its path; the report with them blanked (compared exactly). */
function splitSums(report: SeriesReport): { rest: unknown; sums: [string, number | null | undefined][] } {
  const copy = JSON.parse(JSON.stringify(report)) as SeriesReport;
  const sums: [string, number | null | undefined][] = [];
  const take = (path: string, holder: Record<string, unknown>, key: string) => {
    sums.push([path, holder[key] as number | null | undefined]);
    if (key in holder) holder[key] = 'sum';
  };
  copy.factors?.factors.forEach((f, i) => {
    for (const key of ['f', 'fUncertainty', 'h', 'hUncertainty']) take(`factors[${i}].${key}`, f as unknown as Record<string, unknown>, key);
  });
  copy.ligands.forEach((l, i) => {
    for (const key of ['tenDq', 'tenDqUncertainty', 'beta', 'betaUncertainty', 'f', 'fUncertainty', 'h', 'hUncertainty']) take(`ligands[${i}].${key}`, l as unknown as Record<string, unknown>, key);
  });
  return { rest: copy, sums };
}

function expectSamePage(fast: SeriesReport, slow: SeriesReport): void {
  const f = splitSums(fast);
  const s = splitSums(slow);
  expect(f.rest).toEqual(s.rest);
  expect(f.sums.map(([path]) => path)).toEqual(s.sums.map(([path]) => path));
  f.sums.forEach(([path, value], i) => {
    const expected = s.sums[i]![1];
    if (typeof expected !== 'number') {
      expect(value, path).toBe(expected);
      return;
    }
    expect(Math.abs((value as number) - expected), path).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
  });
}

forEachEngine('a series page from the database, against the whole report cut to the page', (engine) => {
  let where: TestLibrary;
  let library: Library;
  beforeEach(async () => {
    where = await freshLibrary(engine);
    library = await where.open();
  });
  afterEach(async () => {
    await library.close();
    await where.dispose();
  });

  it.each([1, 2])('gives the same pages of 1 500 seeded records (seed %i)', async (seed) => {
    const saved = await library.addMany(seededRecords(1_500, seed));
    expect(saved.every((s) => !(s instanceof Error))).toBe(true);
    await library.update(3, { ligands: ['NH3'], formula: null });
    for (const criterion of ['one-sigma', 'two-sigma'] as const) {
      for (const [offset, limit] of [[0, 50], [0, 7], [37, 25], [1_200, 100], [5_000, 10], [0, 100_000]] as const) {
        // exactUpTo 0: the database path even for this small a library.
        const fast = await pagedLibrarySeries(library, 'Cr3+', { criterion }, offset, limit, 0);
        expect(fast).toBeDefined();
        expectSamePage(fast!, await slowPage(library, 'Cr3+', { criterion }, offset, limit));
      }
    }
    const fast = (await pagedLibrarySeries(library, 'Cr3+', {}, 0, 50, 0))!;
    expect(fast.spectrochemical.entries).toHaveLength(50);
    expect(fast.page).toMatchObject({ all: false, offset: 0, limit: 50, total: fast.count });
    expect(fast.skipped.length).toBeGreaterThan(0);
    expect(fast.notes.some((n) => /more analyses give no f/.test(n))).toBe(true);
  });

  it('gives the same weighted means and factors when every analysis has its σ', async () => {
    await library.addMany(seededRecords(800, 12, true));
    for (const [offset, limit] of [[0, 50], [300, 40]] as const) {
      const fast = (await pagedLibrarySeries(library, 'Cr3+', {}, offset, limit, 0))!;
      expectSamePage(fast, await slowPage(library, 'Cr3+', {}, offset, limit));
      // weighted: the σ of a mean is 1/sqrt(Σ 1/σ²), below the smallest σ
      expect(fast.ligands.every((l) => l.tenDqUncertainty !== null && l.tenDqUncertainty > 0)).toBe(true);
    }
  });

  it("keeps a group's view to its own records, as the reference does", async () => {
    const a = library.scoped({ user: 'ann', group: 'A', admin: false });
    const b = library.scoped({ user: 'bob', group: 'B', admin: false });
    await a.addMany(seededRecords(300, 4));
    await b.addMany(seededRecords(250, 5));
    expectSamePage((await pagedLibrarySeries(a, 'Cr3+', {}, 10, 30, 0))!, await slowPage(a, 'Cr3+', {}, 10, 30));
    expectSamePage((await pagedLibrarySeries(library, 'Cr3+', {}, 10, 30, 0))!, await slowPage(library, 'Cr3+', {}, 10, 30));
  });

  it('gives a small library the report cut to the page to the last bit, and --all the old report', async () => {
    await library.addMany(seededRecords(120, 9));
    const sources = await librarySources(library, 'Cr3+');
    const whole = await librarySeries(library, 'Cr3+', { all: true });
    // --all: every field the report had before, as the three public series functions make it.
    expect(oldFields(whole)).toEqual(oldReferenceSeries('Cr3+', sources));
    expect(whole.page).toMatchObject({ all: true, limit: null });
    const page = await librarySeries(library, 'Cr3+', { offset: 5, limit: 20 });
    expect(JSON.stringify(page)).toBe(JSON.stringify(pageOfSeries(whole, 5, 20)));
    // At most a page of analyses: the default report is the whole one, but for the page field.
    const few = seededRecords(30, 10).map((r) => ({ ...r, ion: 'Cr3+' }));
    const other = await freshLibrary(engine);
    const small = await other.open();
    try {
      await small.addMany(few);
      const full = await librarySeries(small, 'Cr3+', { all: true });
      const byDefault = await librarySeries(small, 'Cr3+');
      expect(full.count + full.skipped.length).toBeLessThanOrEqual(50);
      expect({ ...byDefault, page: undefined }).toEqual({ ...full, page: undefined });
    } finally {
      await small.close();
      await other.dispose();
    }
  });

  it('goes the per-analysis way, with its error, for a value written behind the library\'s back', async () => {
    await library.addMany(seededRecords(200, 6));
    await where.exec('UPDATE analyses SET ten_dq_sd = -2 WHERE id % 7 = 3');
    expect(await pagedLibrarySeries(library, 'Cr3+', {}, 0, 50, 0)).toBeUndefined();
    const error = async (fn: () => Promise<unknown>) => fn().then(() => { throw new Error('expected a throw'); }, (e: unknown) => e);
    expect(await error(() => librarySeries(library, 'Cr3+'))).toMatchObject({ code: 'invalid-argument', path: expect.stringMatching(/^analyses\[\d+\]\.tenDqUncertainty$/) });
  });

  it('takes a β that is not a number as no β, as the reference does, and goes the per-analysis way for such a 10Dq', async () => {
    await library.addMany(seededRecords(300, 13));
    await where.exec("UPDATE analyses SET beta = 'Infinity' WHERE id % 5 = 1");
    expectSamePage((await pagedLibrarySeries(library, 'Cr3+', {}, 0, 60, 0))!, await slowPage(library, 'Cr3+', {}, 0, 60));
    await where.exec("UPDATE analyses SET ten_dq = 'Infinity' WHERE id = 7");
    expect(await pagedLibrarySeries(library, 'Cr3+', {}, 0, 60, 0)).toBeUndefined();
  });

  it('refuses a limit or offset that is not a whole number in range, naming it', async () => {
    await library.addMany(seededRecords(20, 3));
    await expect(librarySeries(library, 'Cr3+', { limit: 0 })).rejects.toMatchObject({ code: 'invalid-argument', path: 'limit' });
    await expect(librarySeries(library, 'Cr3+', { offset: -1 })).rejects.toMatchObject({ code: 'invalid-argument', path: 'offset' });
    await expect(librarySeries(library, 'Cr3+', { limit: 2.5 })).rejects.toMatchObject({ code: 'invalid-argument', path: 'limit' });
  });
});
