/**
 * `npm run accuracy`: runs the validation corpus (tests/accuracy/) through the
 * public pipeline and writes docs/accuracy.md. Options:
 *   --only TEXT   run only cases whose id contains TEXT (prints, does not write the report)
 *   --json        also print the graded rows as JSON on stdout (and nothing else)
 *   --write DIR   also write each selected case's spectrum as DIR/<id>.csv, with the analyze command that reads it
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { caseSpectrum, corpusCases } from '../tests/accuracy/cases.js';
import { PUBLISHED_SETS } from '../tests/accuracy/published-sets.js';
import { accuracyMarkdown, summarize } from '../tests/accuracy/report.js';
import { readFileSync } from 'node:fs';
import { analyzeSpectrum } from '../src/analysis.js';
import { REAL_LIKE } from '../tests/accuracy/real-like.js';
import { caseOptions, gradeRealLike, runCase, runPublishedSet, type CaseOutcome } from '../tests/accuracy/run-corpus.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const args = process.argv.slice(2);
const onlyAt = args.indexOf('--only');
const only = onlyAt >= 0 ? args[onlyAt + 1] : undefined;
const writeAt = args.indexOf('--write');
const writeDir = writeAt >= 0 ? args[writeAt + 1] : undefined;
const json = args.includes('--json');
const log = (text: string): void => {
  if (!json) console.log(text);
};

const selected = corpusCases().filter((c) => only === undefined || c.id.includes(only));
if (writeDir !== undefined) {
  mkdirSync(writeDir, { recursive: true });
  for (const c of selected) {
    const file = join(writeDir, `${c.id.replace('/', '-')}.csv`);
    writeFileSync(file, caseSpectrum(c).csv);
    const o = caseOptions(c);
    log(`wrote ${file}: fieldgap analyze ${file} --ion ${o.ion} --geometry ${o.geometry}${o.concentration !== undefined ? ` --conc ${o.concentration}` : ''}${o.pathLength !== undefined ? ` --path ${o.pathLength}` : ''}`);
  }
}
// One call before the clock starts: module loading and JIT warm-up are not the pipeline's time.
if (selected[0]) runCase(selected[0]);
const started = performance.now();
const spectra = selected.map((c) => runCase(c));
const sets = PUBLISHED_SETS.filter((s) => only === undefined || s.id.includes(only)).map(runPublishedSet);
const realLike = REAL_LIKE.filter((r) => only === undefined || r.file.includes(only)).map((r) => {
  const text = readFileSync(join(ROOT, 'fixtures', 'spectra', 'real-like', r.file), 'utf8');
  const t0 = performance.now();
  let outcome: CaseOutcome;
  try {
    outcome = { result: analyzeSpectrum(text, { fileName: r.file, ion: r.ion }), error: null, ms: performance.now() - t0 };
  } catch (error) {
    outcome = { result: null, error, ms: performance.now() - t0 };
  }
  return gradeRealLike(r.file, r.ion, outcome);
});
const seconds = (performance.now() - started) / 1000;

for (const r of realLike) log(`${r.pass ? 'pass' : 'FAIL'}  ${r.file.padEnd(28)} ${r.result} (issue 13: ${r.expected})`);
for (const r of [...spectra, ...sets]) {
  const what = r.failure ?? `10Dq ${r.result.tenDq} (truth ${r.truth.tenDq}), B ${r.result.b} (truth ${r.truth.b ?? '—'}), ${r.result.spinState}`;
  log(`${r.pass.all ? 'pass' : 'FAIL'}  ${r.id.padEnd(28)} ${what}`);
}
const s = summarize([...spectra, ...sets]);
log(`\n${s.passed} of ${s.cases} pass (${(100 * s.rate).toFixed(1)} %); spin state wrong in ${s.spinWrong}; refused or failed ${s.failures}; ${seconds.toFixed(1)} s`);
if (json) console.log(JSON.stringify([...spectra, ...sets], null, 2));
if (only === undefined) {
  writeFileSync(join(ROOT, 'docs', 'accuracy.md'), accuracyMarkdown(spectra, sets, realLike, { seconds, date: new Date().toISOString().slice(0, 10) }));
  log('wrote docs/accuracy.md');
}
