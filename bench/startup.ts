/**
 * Start-up: whole processes of the built CLI (bin/fieldgap, the bundle in
 * dist/cli), interleaved with `node -e 0` so each figure is read against the
 * bare runtime on the same machine at the same moment. Targets: `--help`
 * under 350 ms, a one-band `fit` under 500 ms (medians). Needs `npm run build`.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { reportFigure } from './figures.js';
import { BIN, bundleBuilt, median, timeNode } from './spawn.js';

const ROUNDS = 9;

export async function run(): Promise<void> {
  if (!bundleBuilt()) {
    process.stdout.write('skipped: the CLI bundle is not built (npm run build)\n');
    return;
  }
  const data = mkdtempSync(join(tmpdir(), 'fieldgap-bench-startup-'));
  const cases = [
    { key: 'node', label: 'node -e 0', args: ['-e', '0'], targetMs: undefined },
    { key: 'help', label: 'fieldgap --help', args: [BIN, '--help'], targetMs: 350 },
    { key: 'fit', label: 'fieldgap fit --ion Cr3+ --bands 17400', args: [BIN, 'fit', '--ion', 'Cr3+', '--bands', '17400'], targetMs: 500 },
    { key: 'analyze', label: 'fieldgap analyze spectra-demo/cr-aqua.csv --ion Cr3+', args: [BIN, 'analyze', 'spectra-demo/cr-aqua.csv', '--ion', 'Cr3+'], targetMs: undefined },
    { key: 'list', label: 'fieldgap library list (empty library)', args: [BIN, 'library', 'list', '--data', data], targetMs: undefined },
  ];
  const times = new Map<string, number[]>(cases.map((c) => [c.key, []]));
  try {
    for (let round = 0; round < ROUNDS; round++) {
      for (const c of cases) {
        const { ms, code, stderr } = await timeNode(c.args);
        if (code !== 0) throw new Error(`${c.label} exited ${code}: ${stderr.trim()}`);
        times.get(c.key)!.push(ms);
      }
    }
  } finally {
    rmSync(data, { recursive: true, force: true });
  }
  const node = median(times.get('node')!);
  for (const c of cases) {
    const m = median(times.get(c.key)!);
    const over = c.key === 'node' ? '' : `, ${(m - node).toFixed(0)} ms over node`;
    const target = c.targetMs === undefined ? '' : `; target < ${c.targetMs} ms: ${m < c.targetMs ? 'met' : 'NOT met'}`;
    process.stdout.write(`${c.label.padEnd(54)} median ${m.toFixed(0).padStart(5)} ms (${ROUNDS} runs)${over}${target}\n`);
    reportFigure({ key: `startup.${c.key}.ms`, label: `start-up: ${c.label}`, value: m, unit: 'ms', better: 'lower' });
  }
}
