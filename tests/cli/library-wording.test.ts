import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, expect, it } from 'vitest';
import { analyzeSpectrum } from '../../src/analysis.js';
import { changeLines, fitLine, recordText, summaryTable } from '../../src/cli/commands/library-text.js';
import { openLibraryAt, type Library } from '../../src/library/library.js';
import { NO_SPIN_STATE_CHOICE } from '../../src/report/spin-state-wording.js';

/**
 * Issue 17 (audit): `library show` and `watch` printed the raw value
 * "no-choice" in their sentences, and `library show` listed both Ni(II)
 * bands as "3T1g", the parent term (F)/(P) lost. The spectrum is the
 * real-like Ni(II) aqua fixture (fixtures/spectra/real-like/README.md).
 * That the two spin-allowed visible bands of [Ni(H2O)6]2+ go to 3T1g(F) and
 * 3T1g(P) is the textbook assignment (common practice: Tanabe–Sugano d8).
 */

const NI = readFileSync(new URL('../../fixtures/spectra/real-like/ni-aqua-visible.csv', import.meta.url));

let dir: string;
let library: Library;
beforeEach(async () => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-library-wording-'));
  library = await openLibraryAt({ engine: 'sqlite', dataDir: join(dir, 'lib') });
});
afterEach(async () => {
  await library.close();
  rmSync(dir, { recursive: true, force: true });
});

it('library show: the spin state in words, and each band by its full term with its parent', async () => {
  const options = { ion: 'Ni2+', fileName: 'ni-aqua-visible.csv' };
  const saved = await library.add({ sample: 'ni aqua', fileName: 'ni-aqua-visible.csv', content: NI, options, result: analyzeSpectrum(NI, options) });
  const text = recordText(await library.get(saved.id));
  expect(saved.summary.spinState).toBe('no-choice'); // d8 octahedral: the stored value stays the value
  expect(text).toContain(NO_SPIN_STATE_CHOICE);
  expect(text).not.toContain('no-choice');
  expect(text).toMatch(/→?\s*3T1g\(F\)/);
  expect(text).toMatch(/3T1g\(P\)/);
  expect(fitLine(saved.summary)).toContain(NO_SPIN_STATE_CHOICE);
});

it('a refit that changes the spin state says it in words', () => {
  expect(changeLines([{ what: 'spinState', before: 'no-choice', after: 'high-spin' }] as never)).toBe(`  spin state: ${NO_SPIN_STATE_CHOICE} → high-spin\n`);
});

it('library list: the SPIN cell of a d^n with one spin state says "one possible", as the analyze summary table does (AUDIT2 finding 7)', async () => {
  const options = { ion: 'Ni2+', fileName: 'ni-aqua-visible.csv' };
  await library.add({ sample: 'ni aqua', fileName: 'ni-aqua-visible.csv', content: NI, options, result: analyzeSpectrum(NI, options) });
  const table = summaryTable((await library.list({ limit: 10, offset: 0 })).analyses);
  expect(table).toContain('one possible');
  expect(table).not.toContain('no-choice');
});
