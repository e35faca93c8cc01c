/**
 * The results library at scale, on each engine: SQLite always, PostgreSQL
 * when FIELDGAP_BENCH_DATABASE_URL (or FIELDGAP_TEST_DATABASE_URL) names a
 * server (a fresh schema is made and dropped). FIELDGAP_BENCH_RECORDS
 * records (default 2000, which a busy machine adds in minutes; the issue's
 * figure is 100 000: set FIELDGAP_BENCH_RECORDS=100000) are added through
 * the library itself, one committed add each, with the invented demo
 * spectrum (a distinct comment line each) and its real analysis result.
 * Targets (issue 17): a page of `library list` and a series under 200 ms,
 * an export of 10 000 records under 10 s, the database at most about 2× the
 * originals' bytes plus 5 kB per record.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { analyzeSpectrum, type AnalyzeResult } from '../src/analysis.js';
import { libraryCsv } from '../src/library/export.js';
import { openLibraryAt, type Library, type LibraryLocation } from '../src/library/library.js';
import { librarySeries } from '../src/library/series.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const RECORDS = Math.max(100, Math.min(200_000, Number(process.env['FIELDGAP_BENCH_RECORDS'] ?? 2000) || 2000));
const PG_URL = process.env['FIELDGAP_BENCH_DATABASE_URL'] ?? process.env['FIELDGAP_TEST_DATABASE_URL'];

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1]!;
}

async function timed<T>(fn: () => Promise<T>): Promise<[T, number]> {
  const t = performance.now();
  const value = await fn();
  return [value, performance.now() - t];
}

export async function run(): Promise<void> {
  const spectrum = readFileSync(join(ROOT, 'spectra-demo', 'cr-aqua.csv'));
  const options = { ion: 'Cr3+', fileName: 'cr-aqua.csv' };
  const result = JSON.parse(JSON.stringify(analyzeSpectrum(spectrum, options))) as AnalyzeResult;
  const ligands = ['H2O', 'NH3', 'en', 'urea', 'Cl', 'F', 'CN', 'ox'];

  const engines: { name: string; open: () => Promise<{ location: LibraryLocation; size: (lib: Library) => Promise<number>; drop: () => Promise<void> }> }[] = [
    {
      name: 'sqlite',
      open: async () => {
        const dir = mkdtempSync(join(tmpdir(), 'fieldgap-bench-'));
        return {
          location: { engine: 'sqlite', dataDir: dir },
          // After close the WAL is checkpointed into the file: the size on disk of the whole folder.
          size: async () => readdirSync(dir).reduce((sum, f) => sum + statSync(join(dir, f)).size, 0),
          drop: async () => rmSync(dir, { recursive: true, force: true }),
        };
      },
    },
  ];
  if (PG_URL) {
    engines.push({
      name: 'postgres',
      open: async () => {
        const schema = `fg_bench_${process.pid}`;
        const admin = async (sql: string) => {
          const client = new pg.Client({ connectionString: PG_URL });
          await client.connect();
          try {
            return (await client.query(sql)) as pg.QueryResult;
          } finally {
            await client.end();
          }
        };
        await admin(`DROP SCHEMA IF EXISTS ${schema} CASCADE; CREATE SCHEMA ${schema}`);
        const url = new URL(PG_URL);
        url.searchParams.set('options', `-c search_path=${schema}`);
        return {
          location: { engine: 'postgres', url: url.toString() },
          size: async () => {
            const rows = await admin(`SELECT sum(pg_total_relation_size(c.oid))::bigint AS n FROM pg_class c
              WHERE c.relnamespace = '${schema}'::regnamespace AND c.relkind IN ('r', 'm')`);
            return Number((rows as pg.QueryResult).rows[0].n);
          },
          drop: async () => {
            await admin(`DROP SCHEMA IF EXISTS ${schema} CASCADE`);
          },
        };
      },
    });
  } else {
    process.stdout.write('PostgreSQL: skipped (set FIELDGAP_BENCH_DATABASE_URL, e.g. from scripts/test-postgres.sh start DIR)\n');
  }

  for (const engine of engines) {
    const where = await engine.open();
    let library = await openLibraryAt(where.location);
    try {
      let originalBytes = 0;
      const [, fillMs] = await timed(async () => {
        for (let i = 0; i < RECORDS; i++) {
          const content = Buffer.concat([Buffer.from(`# bench record ${i}\n`), spectrum]);
          originalBytes += content.length;
          const ligand = ligands[i % ligands.length]!;
          await library.add({ sample: `bench ${ligand} ${i}`, ligands: [ligand], fileName: `run-${i}.csv`, content, options, result });
        }
      });
      const pages: number[] = [];
      for (let i = 0; i < 20; i++) pages.push((await timed(() => library.list({ limit: 50, offset: i * 50 })))[1]);
      const deep = (await timed(() => library.list({ limit: 50, offset: Math.max(0, RECORDS - 100) })))[1];
      const search = (await timed(() => library.list({ query: 'urea', limit: 50 })))[1];
      const [, seriesMs] = await timed(() => librarySeries(library, 'Cr3+'));
      const exported = Math.min(RECORDS, 10_000);
      const [csv, exportMs] = await timed(async () => libraryCsv((await library.listAll()).slice(0, exported)));
      await library.close();
      library = await openLibraryAt(where.location);
      await library.close();
      const bytes = await where.size(library);
      const bound = 2 * originalBytes + 5_000 * RECORDS;
      process.stdout.write(
        `${engine.name}: ${RECORDS} records added in ${(fillMs / 1000).toFixed(1)} s (${(RECORDS / (fillMs / 1000)).toFixed(0)} adds/s, each its own committed transaction)\n` +
        `  list, a page of 50: median ${median(pages).toFixed(1)} ms (first 20 pages), last page ${deep.toFixed(1)} ms, search "urea" ${search.toFixed(1)} ms   target < 200 ms: ${Math.max(median(pages), deep, search) < 200 ? 'met' : 'NOT met'}\n` +
        `  series of ${RECORDS} Cr3+ analyses: ${seriesMs.toFixed(0)} ms   target < 200 ms: ${seriesMs < 200 ? 'met' : 'NOT met'}\n` +
        `  export of ${exported} records as CSV: ${(exportMs / 1000).toFixed(2)} s (${(csv.length / 1e6).toFixed(1)} MB)   target < 10 s: ${exportMs < 10_000 ? 'met' : 'NOT met'}\n` +
        `  database ${(bytes / 1e6).toFixed(1)} MB for ${(originalBytes / 1e6).toFixed(1)} MB of originals: ${(bytes / originalBytes).toFixed(2)}× (bound 2× + 5 kB/record = ${(bound / 1e6).toFixed(1)} MB): ${bytes <= bound ? 'met' : 'NOT met'}\n`,
      );
    } finally {
      await library.close().catch(() => undefined);
      await where.drop();
    }
  }
}
