/**
 * `node --import tsx scripts/fit-json-digest.ts [COUNT] [--out FILE]`: the
 * JSON answers of COUNT (default 200) seeded POST /fit bodies, run through
 * the worker's dispatch (server/tasks.ts, the text the service sends), and
 * one SHA-256 over all of them. A speed change to the fit must leave this
 * digest unchanged: run it before and after (or on two branches) and compare;
 * `--out` writes every answer, one per line, to diff when they differ.
 *
 * The bodies are drawn (mulberry32, seed 19) from the shapes clients send:
 * an ion of d1–d9, octahedral or tetrahedral, one to four band maxima in
 * cm-1 (some with an uncertainty, some with a fixed C/B or a free C). They
 * are invented for this comparison only and check no value; an error answer
 * (a body the fit refuses) is part of the digest too.
 */
import { createHash } from 'node:crypto';
import { writeFileSync } from 'node:fs';
import { mulberry32 } from '../src/spectrum/random.js';
import { dispatchTask, type Task } from '../server/tasks.js';

const IONS = ['Ti3+', 'V3+', 'Cr3+', 'Mn3+', 'Mn2+', 'Fe3+', 'Fe2+', 'Co3+', 'Co2+', 'Ni2+', 'Cu2+', 'V2+', 'Cr2+'] as const;

/** The index-th seeded fit body, as the route hands it to the pool (toFitInput's shape). */
export function seededFitTask(random: () => number): Task {
  const ion = IONS[Math.floor(random() * IONS.length)]!;
  const geometry = random() < 0.75 ? 'octahedral' : 'tetrahedral';
  const count = 1 + Math.floor(random() * 4);
  const low = geometry === 'octahedral' ? 7_000 + random() * 13_000 : 3_000 + random() * 7_000;
  const bands: Array<number | { position: number; uncertainty: number }> = [];
  let position = low;
  for (let i = 0; i < count; i++) {
    const rounded = Math.round(position);
    bands.push(random() < 0.3 ? { position: rounded, uncertainty: 100 + Math.round(random() * 400) } : rounded);
    position += 2_000 + random() * 9_000;
  }
  const input: Extract<Task, { kind: 'fit' }>['input'] = { ion, geometry, bands };
  const extra = random();
  if (extra < 0.1) input.cOverB = 4 + Math.round(random() * 10) / 10;
  else if (extra < 0.15 && count >= 3) input.freeC = true;
  return { kind: 'fit', input };
}

export function fitAnswers(count: number): string[] {
  const random = mulberry32(19);
  const answers: string[] = [];
  for (let k = 0; k < count; k++) {
    const outcome = dispatchTask(seededFitTask(random), true);
    answers.push(outcome.ok ? String(outcome.value) : JSON.stringify(outcome.error));
  }
  return answers;
}

function main(): void {
  const args = process.argv.slice(2);
  const outAt = args.indexOf('--out');
  const out = outAt >= 0 ? args[outAt + 1] : undefined;
  const count = Number(args.find((a, i) => /^\d+$/.test(a) && i !== outAt + 1) ?? 200);
  const answers = fitAnswers(count);
  const hash = createHash('sha256');
  for (const a of answers) hash.update(a).update('\n');
  const failed = answers.filter((a) => a.startsWith('{"code"')).length;
  if (out !== undefined) writeFileSync(out, `${answers.join('\n')}\n`);
  process.stdout.write(`${count} seeded fit answers (${failed} refused): sha256 ${hash.digest('hex')}\n`);
}

if (process.argv[1] !== undefined && import.meta.url.endsWith(process.argv[1].split('/').pop()!)) main();
