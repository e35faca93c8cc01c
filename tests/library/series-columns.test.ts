import { describe, expect, it } from 'vitest';
import type { Library } from '../../src/library/library.js';
import { buildSeries, librarySeries, type SeriesReport, type SeriesSource } from '../../src/library/series.js';
import { seriesColumnsFromRow } from '../../src/library/series-columns.js';
import type { RankOptions } from '../../src/series/index.js';
import { forEachEngine, libraryPerTest } from '../storage/helpers/engines.js';
import { partialResult } from '../storage/helpers/records.js';
import { seededRecords } from './helpers/seeded-records.js';

/**
 * librarySeries reads the records as columns aggregated by the database and
 * ranks them without an object per record on the way (seriesFromColumns).
 * The reference is the path it replaced: every record read as a row
 * (listFits) and handed to buildSeries (itself checked against the three
 * public series functions in series-identical.test.ts). The two must give
 * the same report, to the last bit and in the same key order (the JSON
 * text), on libraries of seeded records with what real libraries hold:
 * equal and overlapping values, missing uncertainties and β, formulas
 * fieldgap reads and one it does not, ligands in several spellings,
 * records of other ions and of other groups.
 */
async function referenceSeries(library: Library, ion: string, options: RankOptions = {}): Promise<SeriesReport> {
  const sources = (await library.listFits({ ion })).map((r): SeriesSource => {
    const source: SeriesSource = { id: String(r.id), sample: r.sample, summary: r.summary };
    if (r.formula !== undefined) source.formula = r.formula;
    if (r.ligands !== undefined) source.ligands = r.ligands;
    if (r.ion !== undefined) source.ion = r.ion;
    return source;
  });
  return buildSeries(ion, sources, options);
}

forEachEngine('librarySeries from columns, against the row-by-row reference', (engine) => {
  const fresh = libraryPerTest(engine);

  it.each([1, 2, 3])('gives the same report for 1 500 seeded records (seed %i)', async (seed) => {
    const { library } = fresh;
    const saved = await library.addMany(seededRecords(1_500, seed));
    expect(saved.every((s) => !(s instanceof Error))).toBe(true);
    // a refit and an edit after adding: the series reads the current revision and details
    await library.update(3, { ligands: ['NH3'], formula: null });
    await library.update(5, { options: { ion: 'Cr3+' }, result: partialResult({ fit: { ion: 'Cr3+', tenDq: 17_000.5, b: 600, beta: 600 / 918, uncertainty: { tenDq: 40 } } }) });
    for (const criterion of ['one-sigma', 'two-sigma'] as const) {
      const fast = await librarySeries(library, 'Cr(III)', { criterion, all: true });
      const slow = await referenceSeries(library, 'Cr3+', { criterion });
      expect(fast.count).toBeGreaterThan(500);
      expect(fast).toEqual(slow);
      expect(JSON.stringify(fast)).toBe(JSON.stringify(slow));
    }
  });

  it("gives one group's view its own records only, as the reference does", async () => {
    const { library } = fresh;
    const a = library.scoped({ user: 'ann', group: 'A', admin: false });
    const b = library.scoped({ user: 'bob', group: 'B', admin: false });
    await a.addMany(seededRecords(200, 4));
    await b.addMany(seededRecords(150, 5));
    const fastA = await librarySeries(a, 'Cr3+', { all: true });
    expect(fastA).toEqual(await referenceSeries(a, 'Cr3+'));
    expect(fastA.count + fastA.skipped.length).toBe((await a.listFits({ ion: 'Cr3+' })).length);
    expect(await librarySeries(library, 'Cr3+', { all: true })).toEqual(await referenceSeries(library, 'Cr3+'));
  });

  it('throws the error the reference throws for a value written behind the library\'s back', async () => {
    const { library, where } = fresh;
    await library.addMany(seededRecords(60, 6));
    await where.exec('UPDATE analyses SET ten_dq_sd = -2 WHERE id % 7 = 3');
    const error = async (fn: () => Promise<unknown>) => fn().then(() => { throw new Error('expected a throw'); }, (e: unknown) => e);
    const fast = await error(() => librarySeries(library, 'Cr3+', { all: true }));
    expect(fast).toEqual(await error(() => referenceSeries(library, 'Cr3+')));
    expect(fast).toMatchObject({ code: 'invalid-argument', path: expect.stringMatching(/^analyses\[\d+\]\.tenDqUncertainty$/) });
  });

  it('throws the same not-found error when no record of the ion can be ranked', async () => {
    const { library } = fresh;
    const error = async (fn: () => Promise<unknown>) => fn().then(() => { throw new Error('expected a throw'); }, (e: unknown) => e);
    expect(await error(() => librarySeries(library, 'Mn2+', { all: true }))).toEqual(await error(() => referenceSeries(library, 'Mn2+')));
    await library.addMany(seededRecords(5, 7).map((r) => ({ ...r, ion: 'Ni2+', result: partialResult({ fit: {} }) })));
    expect(await error(() => librarySeries(library, 'Ni2+', { all: true }))).toEqual(await error(() => referenceSeries(library, 'Ni2+')));
  });

  if (engine === 'postgres') {
    it('falls back to the reference for a NaN (which PostgreSQL can hold and prints as text in JSON)', async () => {
      const { library, where } = fresh;
      await library.addMany(seededRecords(80, 8));
      await where.exec(`UPDATE analyses SET ten_dq = 'NaN' WHERE id = 9; UPDATE analyses SET beta = 'Infinity' WHERE id = 11`);
      expect(await library.seriesColumns('Cr3+')).toBeUndefined();
      expect(await librarySeries(library, 'Cr3+', { all: true })).toEqual(await referenceSeries(library, 'Cr3+'));
    });
  }
});

describe('seriesColumnsFromRow', () => {
  const row = {
    id: '[3,9,5]', sample: '["c","i","e"]', formula: '[null,"[Cr(H2O)6]3+",null]', ligands: '["[]","[\\"H2O\\"]","[\\"F\\"]"]',
    tenDq: '[1,2,3]', tenDqSd: '[null,0.5,null]', beta: '[0.7,null,0.8]', betaSd: '[null,null,0.01]',
  };

  it('puts the records newest first when the aggregate did not keep the order', () => {
    expect(seriesColumnsFromRow(row)).toEqual({
      id: [9, 5, 3], sample: ['i', 'e', 'c'], formula: ['[Cr(H2O)6]3+', null, null], ligands: ['["H2O"]', '["F"]', '[]'],
      tenDq: [2, 3, 1], tenDqSd: [0.5, null, null], beta: [null, 0.8, 0.7], betaSd: [null, 0.01, null],
    });
  });

  it('reverses columns that came oldest first', () => {
    const ascending = { ...row, id: '[3,5,9]' };
    expect(seriesColumnsFromRow(ascending)).toEqual({
      id: [9, 5, 3], sample: ['e', 'i', 'c'], formula: [null, '[Cr(H2O)6]3+', null], ligands: ['["F"]', '["H2O"]', '[]'],
      tenDq: [3, 2, 1], tenDqSd: [null, 0.5, null], beta: [0.8, null, 0.7], betaSd: [0.01, null, null],
    });
  });

  it('reads no rows (PostgreSQL aggregates them to null) as empty columns', () => {
    const empty = Object.fromEntries(Object.keys(row).map((k) => [k, null]));
    expect(seriesColumnsFromRow(empty)).toEqual({ id: [], sample: [], formula: [], ligands: [], tenDq: [], tenDqSd: [], beta: [], betaSd: [] });
  });

  it('refuses a value of the wrong type or columns of different lengths', () => {
    expect(seriesColumnsFromRow({ ...row, tenDq: '[1,"NaN",3]' })).toBeUndefined();
    expect(seriesColumnsFromRow({ ...row, sample: '["c","i"]' })).toBeUndefined();
    expect(seriesColumnsFromRow({ ...row, id: '[3,null,5]' })).toBeUndefined();
  });
});
