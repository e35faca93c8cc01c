/**
 * Library ingest: `fieldgap library add FILES... --ion Cr3+` as one process
 * (the built CLI) on 200 files, into a fresh library. Target: at least 50
 * files a second. With FIELDGAP_BENCH_PER_FILE=1 (for a release whose `add`
 * takes one file) it runs one process per file on 20 files instead. The
 * spectra are the invented ones of the batch bench.
 */
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { spectrumCsv } from './batch.js';
import { reportFigure } from './figures.js';
import { BIN, bundleBuilt, timeNode } from './spawn.js';

const FILES = 200;
const TARGET_PER_S = 50;

export async function run(): Promise<void> {
  if (!bundleBuilt()) {
    process.stdout.write('skipped: the CLI bundle is not built (npm run build)\n');
    return;
  }
  const perFile = process.env['FIELDGAP_BENCH_PER_FILE'] === '1';
  const count = perFile ? 20 : FILES;
  const root = mkdtempSync(join(tmpdir(), 'fieldgap-bench-library-'));
  try {
    const dir = join(root, 'files');
    mkdirSync(dir);
    for (let k = 0; k < 8; k++) writeFileSync(join(root, `v${k}.csv`), spectrumCsv(k));
    const files = Array.from({ length: count }, (_v, i) => join(dir, `sample-${String(i).padStart(4, '0')}.csv`));
    files.forEach((f, i) => copyFileSync(join(root, `v${i % 8}.csv`), f));
    const data = join(root, 'lib');
    let ms = 0;
    let cpuMs = 0;
    for (const group of perFile ? files.map((f) => [f]) : [files]) {
      const t = await timeNode([BIN, 'library', 'add', ...group, '--ion', 'Cr3+', '--data', data], { rss: true, dropStdout: true });
      if (t.code !== 0) throw new Error(`library add exited ${t.code}: ${t.stderr.trim().slice(0, 400)}`);
      ms += t.ms;
      cpuMs += t.cpuMs ?? Number.NaN;
    }
    const rate = count / (ms / 1000);
    // CPU-bound (the analyses): on a shared machine the wall rate follows the load, so the rate two free cores would give is shown too.
    const cores = Math.min(2, availableParallelism());
    process.stdout.write(`library add, ${count} files${perFile ? ' (one process each)' : ' (one process)'} (load average ${loadavg().map((l) => l.toFixed(1)).join(' ')}): ${(ms / 1000).toFixed(1)} s wall, ${rate.toFixed(0)} files/s, ${(cpuMs / count).toFixed(1)} ms CPU a file (${((cores * 1000) / (cpuMs / count)).toFixed(0)} files/s on ${cores} free cores); target ≥ ${TARGET_PER_S}/s: ${rate >= TARGET_PER_S ? 'met' : 'NOT met'}\n`);
    reportFigure({ key: 'library.add.perS', label: 'library add: files a second', value: rate, unit: '1/s', better: 'higher' });
    reportFigure({ key: 'library.add.cpuMsPerFile', label: 'library add: CPU per file', value: cpuMs / count, unit: 'ms', better: 'lower' });
  } finally {
    rmSync(root, { recursive: true, force: true });
  }
}
