import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import type { AnalysisRecord } from '../../src/library/types.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';

forEachEngine('many records in one transaction, and the current revision in the list', (engine) => {
  const fresh = libraryPerTest(engine);

  describe('addMany', () => {
    it('stores each record as add does, in the order given, and each reads back the same', async () => {
      const records = [17_000, 17_400, 21_000].map((tenDq, i) => handBuiltRecord({ sample: `sample ${i}`, fileName: `s${i}.csv` }, tenDq));
      const saved = (await fresh.library.addMany(records)) as AnalysisRecord[];
      expect(saved.map((r) => r.sample)).toEqual(['sample 0', 'sample 1', 'sample 2']);
      expect(saved.map((r) => r.summary.tenDq)).toEqual([17_000, 17_400, 21_000]);
      for (const record of saved) expect(await fresh.library.get(record.id)).toEqual(record);
      // the same fields as a record stored alone, apart from id, name and times
      const alone = await fresh.library.add(handBuiltRecord({ sample: 'sample 1', fileName: 's1.csv' }, 17_400));
      const strip = ({ id: _id, createdAt: _c, updatedAt: _u, revisions, ...rest }: AnalysisRecord) => ({ ...rest, revisions: revisions.map(({ createdAt: _r, ...r }) => r) });
      expect(strip(saved[1]!)).toEqual(strip(alone));
    });

    it('keeps a bad record out with its error and stores the others', async () => {
      const bad = handBuiltRecord({ sample: '', fileName: 'bad.csv' });
      const out = await fresh.library.addMany([handBuiltRecord({ sample: 'good 1' }), bad, handBuiltRecord({ sample: 'good 2' })]);
      expect(out[0]).toMatchObject({ sample: 'good 1' });
      expect(out[1]).toBeInstanceOf(FieldgapError);
      expect(out[1]).toMatchObject({ code: 'invalid-argument', path: 'sample' });
      expect(out[2]).toMatchObject({ sample: 'good 2' });
      expect((await fresh.library.list()).total).toBe(2);
    });

    it('stores nothing of the batch when the database refuses one row', async () => {
      await fresh.library.add(handBuiltRecord({ sample: 'before' }));
      // A guard that fails the third insert of the batch, behind the library's back.
      if (engine === 'sqlite') {
        await fresh.where.exec(`CREATE TRIGGER refuse_third BEFORE INSERT ON analyses WHEN NEW.sample = 'third'
          BEGIN SELECT RAISE(ABORT, 'refused by the test'); END;`);
      } else {
        await fresh.where.exec(`CREATE FUNCTION refuse_third() RETURNS trigger LANGUAGE plpgsql AS
            $f$ BEGIN IF NEW.sample = 'third' THEN RAISE EXCEPTION 'refused by the test'; END IF; RETURN NEW; END $f$;
          CREATE TRIGGER refuse_third BEFORE INSERT ON analyses FOR EACH ROW EXECUTE FUNCTION refuse_third();`);
      }
      // A fresh connection sees the trigger (SQLite keeps compiled statements per connection).
      await fresh.reopen();
      const batch = ['first', 'second', 'third', 'fourth'].map((sample) => handBuiltRecord({ sample }));
      await expect(fresh.library.addMany(batch)).rejects.toBeInstanceOf(Error);
      const page = await fresh.library.list();
      expect(page.analyses.map((a) => a.sample)).toEqual(['before']);
      expect(await fresh.where.scalar('SELECT count(*) FROM originals')).toBe(1);
      expect(await fresh.where.scalar('SELECT count(*) FROM revisions')).toBe(1);
    });

    it('answers an empty list with an empty list', async () => {
      expect(await fresh.library.addMany([])).toEqual([]);
    });
  });

  describe('a search counts all its matches on every page', () => {
    it('gives the total of every match on each page, and past the last one', async () => {
      await fresh.library.addMany(Array.from({ length: 23 }, (_v, i) => handBuiltRecord({ sample: `s${i}`, note: i % 2 === 0 ? 'urea batch' : 'other' })));
      const all = (await fresh.library.listAll({ query: 'urea' })).map((r) => r.id);
      expect(all).toHaveLength(12);
      const pages = [];
      for (const offset of [0, 5, 10, 12, 40]) pages.push(await fresh.library.list({ query: 'urea', limit: 5, offset }));
      expect(pages.map((p) => p.total)).toEqual([12, 12, 12, 12, 12]);
      expect(pages.map((p) => p.analyses.map((a) => a.id))).toEqual([all.slice(0, 5), all.slice(5, 10), all.slice(10, 12), [], []]);
      expect(pages[0]!.analyses[0]).toEqual((await fresh.library.listAll({ query: 'urea' }))[0]);
      expect(await fresh.library.list({ query: 'nothing like this' })).toMatchObject({ total: 0, analyses: [] });
    });
  });

  describe('getMany', () => {
    it('gives the full records in the order asked, each as get gives it, leaving out ids not there', async () => {
      const saved = (await fresh.library.addMany([1, 2, 3, 4].map((i) => handBuiltRecord({ sample: `s${i}` }, 17_000 + i)))) as AnalysisRecord[];
      const refit = handBuiltRecord({}, 18_000);
      await fresh.library.update(saved[1]!.id, { options: refit.options, result: refit.result });
      await fresh.library.remove(saved[2]!.id);
      const ids = [saved[3]!.id, saved[1]!.id, 999, saved[2]!.id, saved[0]!.id];
      const many = await fresh.library.getMany(ids);
      expect(many.map((r) => r.id)).toEqual([saved[3]!.id, saved[1]!.id, saved[0]!.id]);
      for (const record of many) expect(record).toEqual(await fresh.library.get(record.id));
      expect(many[1]!.revisions).toHaveLength(2);
      expect(many[1]!.result).toEqual(refit.result);
    });
  });

  describe('the current revision kept in the analyses row', () => {
    it('lists, exports and searches with the latest revision after refits, as the history says', async () => {
      const saved = await fresh.library.add(handBuiltRecord({ sample: 'refitted' }, 17_000));
      const second = handBuiltRecord({}, 17_500);
      await fresh.library.update(saved.id, { options: second.options, result: second.result, toolVersion: '9.9.9' });
      await fresh.library.update(saved.id, { note: 'only a detail changed' });
      const record = await fresh.library.get(saved.id);
      const [listed] = (await fresh.library.list()).analyses;
      const latest = record.revisions.at(-1)!;
      expect(listed!.revision).toBe(2);
      expect(listed!.toolVersion).toBe('9.9.9');
      expect(listed!.summary).toEqual(latest.summary);
      expect(listed!.summary.tenDq).toBe(17_500);
      expect((await fresh.library.listAll())[0]).toEqual(listed);
      // straight from the tables: the copy equals the latest revision's columns
      expect(await fresh.where.scalar(`SELECT a.ten_dq - r.ten_dq FROM analyses a JOIN revisions r ON r.analysis_id = a.id AND r.revision = a.revision`)).toBe(0);
    });
  });
});
