import { describe, expect, it } from 'vitest';
import { MIGRATIONS, migrationRun, SCHEMA_VERSION, stepSql, type MigrationRequest } from '../../src/library/migrations.js';
import { librarySeries } from '../../src/library/series.js';
import { forEachEngine, libraryPerTest } from '../storage/helpers/engines.js';
import { handBuiltRecord } from '../storage/helpers/records.js';

/**
 * The one migration logic (migrationRun) as requests answered by a scripted
 * engine: `versions` are the answers to 'version' then to each 'begin' (the
 * version read inside the step's lock, which another process may have moved on).
 */
function scripted(versions: number[], target = SCHEMA_VERSION): MigrationRequest[] {
  const run = migrationRun('sqlite', 'library', target);
  const seen: MigrationRequest[] = [];
  let request = run.next();
  while (!request.done) {
    seen.push(request.value);
    const asks = request.value.kind === 'version' || request.value.kind === 'begin';
    request = run.next(asks ? versions.shift()! : 0);
  }
  return seen;
}

describe('migrationRun, the one logic of both engines', () => {
  it('applies each missing step in its own locked transaction and records the version after it', () => {
    const seen = scripted([SCHEMA_VERSION - 2, SCHEMA_VERSION - 2, SCHEMA_VERSION - 1]);
    expect(seen.map((r) => r.kind)).toEqual(['version', 'begin', 'apply', 'set-version', 'commit', 'begin', 'apply', 'set-version', 'commit']);
    expect(seen.filter((r) => r.kind === 'set-version')).toEqual([
      { kind: 'set-version', version: SCHEMA_VERSION - 1 }, { kind: 'set-version', version: SCHEMA_VERSION },
    ]);
  });

  it('skips a step another process applied while this one waited for the lock', () => {
    // found 0; inside the first lock another process has already brought it to 2; then step 2 is ours
    const seen = scripted([0, 2, 2, 2], 3);
    expect(seen.map((r) => r.kind)).toEqual(['version', 'begin', 'commit', 'begin', 'commit', 'begin', 'apply', 'set-version', 'commit']);
  });

  it('does nothing on a database already at the latest version, and refuses a newer one', () => {
    expect(scripted([SCHEMA_VERSION]).map((r) => r.kind)).toEqual(['version']);
    expect(() => scripted([SCHEMA_VERSION + 1])).toThrow(/schema version \d+, newer than this fieldgap knows/);
  });

  it('has SQL for both engines in every step of the one list', () => {
    for (const step of MIGRATIONS) {
      expect(stepSql(step, 'sqlite').trim()).not.toBe('');
      expect(stepSql(step, 'postgres').trim()).not.toBe('');
    }
  });
});

forEachEngine('schema step 6 (the series index) on a library written before it', (engine) => {
  const fresh = libraryPerTest(engine);

  it('is applied at the next open, keeps every record and gives the same series', async () => {
    const { where } = fresh;
    let library = fresh.library;
    // hand-built records; the numbers are made up for the test
    for (const [i, ligand] of ['F', 'H2O', 'NH3', 'en'].entries()) {
      const { formula: _formula, ...record } = handBuiltRecord({ sample: `s${i}`, ligands: [ligand] }, 15_000 + 1_500 * i);
      await library.add(record);
    }
    const before = await librarySeries(library, 'Cr3+');
    await library.close();
    // What a library of schema 5 is: the same tables without the indexes of steps 6 and 7.
    const names = ['analyses_series', 'analyses_series_kinds', 'analyses_by_ten_dq', 'analyses_by_one_minus_beta'];
    const drop = names.map((n) => `DROP INDEX ${n};`).join(' ');
    await where.exec(engine === 'sqlite' ? `${drop} PRAGMA user_version = 5` : `${drop} UPDATE fieldgap_schema SET version = 5`);
    const list = names.map((n) => `'${n}'`).join(', ');
    const indexes = engine === 'sqlite'
      ? `SELECT count(*) FROM sqlite_master WHERE type = 'index' AND name IN (${list})`
      : `SELECT CAST(count(*) AS INTEGER) FROM pg_indexes WHERE indexname IN (${list}) AND schemaname = current_schema()`;
    expect(await where.scalar(indexes)).toBe(0);
    library = await fresh.reopen();
    expect(await where.scalar(indexes)).toBe(names.length);
    expect(await where.scalar(engine === 'sqlite' ? 'PRAGMA user_version' : 'SELECT version FROM fieldgap_schema')).toBe(SCHEMA_VERSION);
    expect(await librarySeries(library, 'Cr3+')).toEqual(before);
    expect(before.spectrochemical.series).toBe('F < H2O < NH3 < en');
  });
});
