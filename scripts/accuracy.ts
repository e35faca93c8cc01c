/**
 * `npm run accuracy`: runs the validation corpus (tests/accuracy/) through the
 * public pipeline and writes docs/accuracy.md. Options:
 *   --only TEXT   run only cases whose id contains TEXT (prints, does not write the report)
 *   --json        also print the graded rows as JSON on stdout
 */
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { corpusCases } from '../tests/accuracy/cases.js';
import { PUBLISHED_SETS } from '../tests/accuracy/published-sets.js';
import { accuracyMarkdown, summarize } from '../tests/accuracy/report.js';
import { runCase, runPublishedSet } from '../tests/accuracy/run-corpus.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? args[onlyAt + 1] : undefined;

const started = performance.now();
const spectra = corpusCases().filter((c) => only === undefined || c.id.includes(only)).map(runCase);
const sets = PUBLISHED_SETS.filter((s) => only === undefined || s.id.includes(only)).map(runPublishedSet);
const seconds = (performance.now() - started) / 1000;

for (const r of [...spectra, ...sets]) {
  const what = r.failure ?? `10Dq ${r.result.tenDq} (truth ${r.truth.tenDq}), B ${r.result.b} (truth ${r.truth.b ?? '—'}), ${r.result.spinState}`;
  console.log(`${r.pass.all ? 'pass' : 'FAIL'}  ${r.id.padEnd(28)} ${what}`);
}
const s = summarize([...spectra, ...sets]);
console.log(`\n${s.passed} of ${s.cases} pass (${(100 * s.rate).toFixed(1)} %); spin state wrong in ${s.spinWrong}; refused or failed ${s.failures}; ${seconds.toFixed(1)} s`);
if (args.includes('--json')) console.log(JSON.stringify([...spectra, ...sets], null, 2));
if (only === undefined) {
  writeFileSync(join(ROOT, 'docs', 'accuracy.md'), accuracyMarkdown(spectra, sets, { seconds, date: new Date().toISOString().slice(0, 10) }));
  console.log('wrote docs/accuracy.md');
}
