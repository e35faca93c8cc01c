/**
 * `npm run bench`: imports every bench/*.ts module (this file and helpers
 * aside) in name order and awaits its exported `run(): Promise<void>`. A
 * module adds itself by existing; `npm run bench -- NAME` runs only the
 * modules whose file name contains NAME. At the end, the figures the modules
 * reported are printed beside the previous release's (bench/baseline.json).
 * `--write FILE` also saves this run's figures in baseline.json's form (to
 * make them the next release's baseline).
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { comparisonTable, reportedFigures, type Baseline } from './figures.js';

const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
const writeAt = args.indexOf('--write');
const writeTo = writeAt >= 0 ? args[writeAt + 1] : undefined;
const filters = args.filter((_a, i) => writeAt < 0 || (i !== writeAt && i !== writeAt + 1));
const HELPERS = new Set(['run.ts', 'figures.ts', 'spawn.ts']);
const files = readdirSync(here)
  .filter((name) => name.endsWith('.ts') && !HELPERS.has(name) && !name.endsWith('.d.ts'))
  .filter((name) => filters.length === 0 || filters.some((f) => name.includes(f)))
  .sort();

for (const file of files) {
  const module = (await import(pathToFileURL(join(here, file)).href)) as { run?: () => Promise<void> };
  if (typeof module.run !== 'function') continue;
  process.stdout.write(`\n== ${file} ==\n`);
  await module.run();
}

const figures = reportedFigures();
if (figures.length > 0) {
  const baseline = JSON.parse(readFileSync(join(here, 'baseline.json'), 'utf8')) as Baseline;
  process.stdout.write(`\n== against the previous release ==\n${comparisonTable(figures, baseline)}\n`);
}
if (writeTo !== undefined) {
  const measured = new Date().toISOString().slice(0, 10);
  const out: Baseline = { release: 'this build', measured, figures: Object.fromEntries(figures.map((f) => [f.key, Number(f.value.toPrecision(4))])) };
  writeFileSync(writeTo, `${JSON.stringify(out, null, 2)}\n`);
  process.stdout.write(`figures written to ${writeTo}\n`);
}
