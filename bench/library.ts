/**
 * The results library at scale, on each engine: SQLite always, PostgreSQL
 * when FIELDGAP_BENCH_DATABASE_URL (or FIELDGAP_TEST_DATABASE_URL) names a
 * server (a fresh schema is made and dropped). FIELDGAP_BENCH_RECORDS
 * records (default 2000; the issue's figure is 100 000: set
 * FIELDGAP_BENCH_RECORDS=100000) are added through the library itself
 * (addMany, FILL_BATCH records a transaction), with the invented demo
 * spectrum (a distinct comment line each) and its real analysis result.
 * Targets (issue 17): a page of `library list` and a series (its default
 * answer: every ligand-level figure, a page of each per-analysis list) under 200 ms,
 * an export of 10 000 records under 10 s (streamed in pages as `library
 * export` does: the CSV, and the JSON of the full records), the database at
 * most about 2× the originals' bytes plus 5 kB per record. The series is
 * timed three times (median, with its CPU time: on a shared machine the wall
 * time follows the load average, printed beside each engine's figures).
 *
 * The full run: `scripts/test-postgres.sh start DIR` (prints the URL), then
 * FIELDGAP_BENCH_DATABASE_URL=<url> FIELDGAP_BENCH_RECORDS=100000 npm run
 * bench -- library.ts (about 2 GB of temporary files per engine; 5 to 6
 * minutes of filling each on a busy 2-core machine), then
 * `scripts/test-postgres.sh stop DIR`.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, statSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { analyzeSpectrum, type AnalyzeResult } from '../src/analysis.js';
import { libraryCsvChunks } from '../src/library/export.js';
import { openLibraryAt, type Library, type LibraryLocation } from '../src/library/library.js';
import type { AnalysisSummary, NewAnalysis } from '../src/library/types.js';
import { reportFigure } from './figures.js';
import { librarySeries } from '../src/library/series.js';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const RECORDS = Math.max(100, Math.min(200_000, Number(process.env['FIELDGAP_BENCH_RECORDS'] ?? 2000) || 2000));
/** Records a transaction while filling: the bulk path of `library add FILES...`. */
const FILL_BATCH = 500;
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

/** The newest `count` records, in the pages `library export` reads. */
async function* firstRecords(library: Library, count: number): AsyncGenerator<AnalysisSummary[]> {
  let left = count;
  for await (const page of library.listPages({}, 500)) {
    yield page.slice(0, left);
    left -= page.length;
    if (left <= 0) return;
  }
}

/**
 * The demo analysis with its 10Dq and β shifted by a deterministic amount per
 * record (invented spread, up to ±5 % and ±0.05), so a series ranks varied
 * values as a real library's would, not 100 000 equal ones.
 */
function variedResult(result: AnalyzeResult, i: number): AnalyzeResult {
  const fit = result.fit;
  if (!fit) return result;
  const shift = ((i * 7_919) % 1_000) / 1_000 - 0.5;
  return { ...result, fit: { ...fit, tenDq: fit.tenDq * (1 + 0.1 * shift), beta: fit.beta === null ? null : fit.beta + 0.1 * (((i * 104_729) % 1_000) / 1_000 - 0.5) } };
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
        for (let start = 0; start < RECORDS; start += FILL_BATCH) {
          const batch: NewAnalysis[] = [];
          for (let i = start; i < Math.min(RECORDS, start + FILL_BATCH); i++) {
            const content = Buffer.concat([Buffer.from(`# bench record ${i}\n`), spectrum]);
            originalBytes += content.length;
            const ligand = ligands[i % ligands.length]!;
            batch.push({ sample: `bench ${ligand} ${i}`, ligands: [ligand], fileName: `run-${i}.csv`, content, options, result: variedResult(result, i) });
          }
          const saved = await library.addMany(batch);
          const refused = saved.find((s) => s instanceof Error);
          if (refused) throw refused;
        }
      });
      const pages: number[] = [];
      for (let i = 0; i < 20; i++) pages.push((await timed(() => library.list({ limit: 50, offset: i * 50 })))[1]);
      const deep = (await timed(() => library.list({ limit: 50, offset: Math.max(0, RECORDS - 100) })))[1];
      const search = (await timed(() => library.list({ query: 'urea', limit: 50 })))[1];
      const seriesRuns: number[] = [];
      const seriesCpu: number[] = [];
      for (let i = 0; i < 3; i++) {
        const cpu = process.cpuUsage();
        seriesRuns.push((await timed(() => librarySeries(library, 'Cr3+')))[1]);
        const used = process.cpuUsage(cpu);
        seriesCpu.push((used.user + used.system) / 1000);
      }
      const seriesMs = median(seriesRuns);
      const seriesBytes = JSON.stringify(await librarySeries(library, 'Cr3+')).length;
      // The whole report (--all): every analysis in every list, for comparison (not a target).
      const [whole, allMs] = await timed(() => librarySeries(library, 'Cr3+', { all: true }));
      const allBytes = JSON.stringify(whole).length;
      const exported = Math.min(RECORDS, 10_000);
      // Streamed as `library export` does: pages of 500, each turned to text as it comes.
      const [csvBytes, exportMs] = await timed(async () => {
        let bytes = 0;
        for await (const chunk of libraryCsvChunks(firstRecords(library, exported))) bytes += chunk.length;
        return bytes;
      });
      const [jsonBytes, jsonMs] = await timed(async () => {
        let bytes = 0;
        for await (const page of firstRecords(library, exported)) {
          const records = await library.getMany(page.map((s) => s.id));
          for (const record of records) bytes += JSON.stringify(record, null, 2).length;
        }
        return bytes;
      });
      await library.close();
      library = await openLibraryAt(where.location);
      await library.close();
      const bytes = await where.size(library);
      reportFigure({ key: `library.${engine.name}.seriesMs`, label: `library (${engine.name}): series of ${RECORDS}`, value: seriesMs, unit: 'ms', better: 'lower' });
      reportFigure({ key: `library.${engine.name}.exportCsvMs`, label: `library (${engine.name}): CSV export of ${exported}`, value: exportMs, unit: 'ms', better: 'lower' });
      const bound = 2 * originalBytes + 5_000 * RECORDS;
      process.stdout.write(
        `${engine.name} (load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}): ${RECORDS} records added in ${(fillMs / 1000).toFixed(1)} s (${(RECORDS / (fillMs / 1000)).toFixed(0)} adds/s, ${FILL_BATCH} a transaction)\n` +
        `  list, a page of 50: median ${median(pages).toFixed(1)} ms (first 20 pages), last page ${deep.toFixed(1)} ms, search "urea" ${search.toFixed(1)} ms   target < 200 ms: ${Math.max(median(pages), deep, search) < 200 ? 'met' : 'NOT met'}\n` +
        `  series of ${RECORDS} Cr3+ analyses (every ligand figure, a page of 50 of each list; ${(seriesBytes / 1e3).toFixed(0)} kB of JSON): median ${seriesMs.toFixed(0)} ms (${median(seriesCpu).toFixed(0)} ms CPU in this process; runs ${seriesRuns.map((t) => t.toFixed(0)).join(', ')} ms)   target < 200 ms: ${seriesMs < 200 ? 'met' : 'NOT met'}\n` +
        `  the whole series (--all, every analysis listed; ${(allBytes / 1e6).toFixed(0)} MB of JSON): ${allMs.toFixed(0)} ms (no target)\n` +
        `  export of ${exported} records, streamed: CSV ${(exportMs / 1000).toFixed(2)} s (${(csvBytes / 1e6).toFixed(1)} MB), JSON of the full records ${(jsonMs / 1000).toFixed(2)} s (${(jsonBytes / 1e6).toFixed(0)} MB)   target < 10 s: ${Math.max(exportMs, jsonMs) < 10_000 ? 'met' : 'NOT met'}\n` +
        `  database ${(bytes / 1e6).toFixed(1)} MB for ${(originalBytes / 1e6).toFixed(1)} MB of originals: ${(bytes / originalBytes).toFixed(2)}× (bound 2× + 5 kB/record = ${(bound / 1e6).toFixed(1)} MB): ${bytes <= bound ? 'met' : 'NOT met'}\n`,
      );
    } finally {
      await library.close().catch(() => undefined);
      await where.drop();
    }
  }
}
