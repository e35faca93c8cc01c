/**
 * Batch: `fieldgap analyze DIR --ion Cr3+ --csv FILE` as a user runs it (the
 * built CLI, one process), on folders of 100, 1 000 and 10 000 generated
 * files. Targets: 10 000 files in under 60 s on 2 cores, and peak memory
 * (whole process, worker threads included) for 10 000 files within 1.2× of
 * that for 100. BENCH_BATCH_MAX caps the largest folder (e.g. 1000 for a
 * quick run). Needs `npm run build`.
 *
 * What made a long batch's peak higher than a short one's (measured with a
 * per-thread heap trace and 1 s RSS samples): the workers' heaps stay flat
 * (about 27 MB each over 10 000 files, young generation capped, a full
 * collection every 200 files); the main thread grew, first by ~16 MB of
 * young generation while listing the folder (path.join and path.relative
 * per file: src/cli/files.ts now joins a prefix), then by dead rows and
 * promises in its old generation (12 to 19 MB: batch-pool.ts now collects
 * every 500 files). MALLOC_ARENA_MAX=2 gave 151 against 157 MB for 10 000
 * files in one pair of runs, within the noise of a busy machine, and glibc
 * reads it only at process start (the launcher would have to start a second
 * process, against the start-up target), so it is not set.
 *
 * The spectra are invented for timing only: Cr(III)-like d-d bands from the
 * engine with a shoulder on each (asymmetric), a sharp spin-forbidden band,
 * a UV edge, a sloping baseline and noise, four significant digits; every
 * fourth one cut to the 380–780 nm window of a visible-only instrument.
 */
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { computeLevels } from '../src/ligand-field/index.js';
import { formatDelimited, synthesizeSpectrum } from '../src/spectrum/index.js';
import { reportFigure } from './figures.js';
import { BIN, bundleBuilt, timeNode } from './spawn.js';

const VARIANTS = 24;
const TARGET_S = 60;
const TARGET_RSS_RATIO = 1.2;

/** One invented spectrum (CSV text), variant `k`. */
export function spectrumCsv(k: number): string {
  const dq = 1500 + 35 * k;
  const b = 620 + 6 * k;
  const { levels } = computeLevels(3, 'octahedral', { dq, b, c: 4.2 * b });
  const at = (label: string) => levels.find((l) => l.label === label)!.energy;
  const t2 = at('4T2g(F)');
  const t1 = at('4T1g(F)');
  const e = at('2Eg(G)');
  const s = synthesizeSpectrum({
    bands: [
      { position: t2, fwhm: 2600, height: 0.30 }, { position: t2 + 1400, fwhm: 2200, height: 0.08 },
      { position: t1, fwhm: 3000, height: 0.36 }, { position: t1 + 1600, fwhm: 2600, height: 0.09 },
      { position: e, fwhm: 220, height: 0.012 },
    ],
    fromNm: k % 4 === 3 ? 380 : 300, toNm: k % 4 === 3 ? 780 : 1100, stepNm: 1,
    baselineOffset: 0.02, baselineSlope: 0.01, edge: { position: 42_000, fwhm: 9000, height: 2.2 }, noise: 0.002, seed: k + 1,
  });
  return formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['wavelength_nm', 'absorbance'], digits: 4 });
}

/** A folder of `count` spectrum files (copies of the variants). */
function makeFolder(root: string, count: number): string {
  const dir = join(root, `files-${count}`);
  mkdirSync(dir);
  for (let i = 0; i < count; i++) copyFileSync(join(root, `variant-${i % VARIANTS}.csv`), join(dir, `s${String(i).padStart(5, '0')}.csv`));
  return dir;
}

export async function run(): Promise<void> {
  if (!bundleBuilt()) {
    process.stdout.write('skipped: the CLI bundle is not built (npm run build)\n');
    return;
  }
  const max = Number(process.env['BENCH_BATCH_MAX'] ?? 10_000);
  const sizes = [100, 1000, 10_000].filter((n) => n <= max);
  const root = mkdtempSync(join(tmpdir(), 'fieldgap-bench-batch-'));
  try {
    for (let k = 0; k < VARIANTS; k++) writeFileSync(join(root, `variant-${k}.csv`), spectrumCsv(k));
    const rss = new Map<number, number>();
    process.stdout.write(`${availableParallelism()} cores, load average ${loadavg().map((l) => l.toFixed(1)).join(' ')} at the start\n`);
    for (const n of sizes) {
      const dir = makeFolder(root, n);
      const summary = join(root, `summary-${n}.csv`);
      const { ms, code, stderr, maxRssKb, cpuMs = Number.NaN } = await timeNode([BIN, 'analyze', dir, '--ion', 'Cr3+', '--csv', summary], { rss: true, dropStdout: true });
      if (code !== 0 && code !== 1) throw new Error(`analyze of ${n} files exited ${code}: ${stderr.trim().slice(0, 400)}`);
      const rows = readFileSync(summary, 'utf8').split('\r\n').length - 1;
      const failed = (readFileSync(summary, 'utf8').match(/FAILED: /g) ?? []).length;
      rmSync(dir, { recursive: true, force: true });
      const mb = (maxRssKb ?? Number.NaN) / 1024;
      rss.set(n, mb);
      const target = n === 10_000 ? `; target < ${TARGET_S} s: ${ms / 1000 < TARGET_S ? 'met' : 'NOT met'}` : '';
      process.stdout.write(`${String(n).padStart(6)} files: ${(ms / 1000).toFixed(1)} s wall, ${(n / (ms / 1000)).toFixed(0)} files/s, ${(cpuMs / 1000).toFixed(1)} s CPU (${(cpuMs / n).toFixed(1)} ms a file), peak RSS ${mb.toFixed(0)} MB, ${rows} rows (${failed} failed), load average ${loadavg()[0]!.toFixed(1)}${target}\n`);
      reportFigure({ key: `batch.${n}.s`, label: `batch: analyze ${n} files`, value: ms / 1000, unit: 's', better: 'lower' });
      reportFigure({ key: `batch.${n}.cpuMsPerFile`, label: `batch: CPU per file, ${n} files`, value: cpuMs / n, unit: 'ms', better: 'lower' });
      reportFigure({ key: `batch.${n}.rssMB`, label: `batch: peak RSS, ${n} files`, value: mb, unit: 'MB', better: 'lower' });
    }
    const largest = sizes[sizes.length - 1]!;
    if (largest > 100) {
      const ratio = rss.get(largest)! / rss.get(100)!;
      process.stdout.write(`peak RSS ${largest} files / 100 files: ${ratio.toFixed(2)}; target ≤ ${TARGET_RSS_RATIO} (for 10 000): ${ratio <= TARGET_RSS_RATIO ? 'met' : 'NOT met'}\n`);
      reportFigure({ key: `batch.rssRatio.${largest}`, label: `batch: peak RSS ${largest} / 100 files`, value: ratio, unit: '×', better: 'lower' });
    }
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}
