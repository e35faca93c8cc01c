import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { CliIo } from '../../src/cli/command.js';
import { runCli } from '../../src/cli/main.js';
import { openLibrary } from '../../src/library/library.js';
import { handBuiltRecord } from '../storage/helpers/records.js';

/**
 * `series --criterion` and `watch --formula/--ligands` are checked by the
 * fields of the one options schema (src/analysis-option-schema.ts) that the
 * REST fields of the same names use, with errors naming the option as typed.
 */
let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-cli-schema-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

async function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: CliIo = { stdout: (t) => (out += t), stderr: (t) => (err += t), isTty: false, cwd: dir, env: {} };
  const code = await runCli(args, io);
  return { code, out, err };
}

describe('fieldgap series --criterion', () => {
  it('takes the criteria of the schema in any case and refuses others, naming --criterion', async () => {
    const library = await openLibrary(join(dir, 'lib'));
    // hand-built records; the numbers are made up for the test
    await library.add(handBuiltRecord({ sample: 'a' }, 17_400));
    await library.add(handBuiltRecord({ sample: 'b' }, 17_500));
    await library.close();
    const two = await cli('series', '--ion', 'Cr3+', '--criterion', ' Two-Sigma', '--data', 'lib', '--json');
    expect(two.code).toBe(0);
    expect(JSON.parse(two.out).spectrochemical.criterion).toBe('two-sigma');
    const bad = await cli('series', '--ion', 'Cr3+', '--criterion', 'three-sigma', '--data', 'lib');
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--criterion: expected one of "one-sigma"\|"two-sigma", got "three-sigma"/);
  });
});

describe('fieldgap watch --formula / --ligands', () => {
  it('refuses a formula or ligand list the REST fields refuse, before reading any file', async () => {
    writeFileSync(join(dir, 'cr.csv'), 'nm,absorbance\n400,0.1\n');
    const long = await cli('watch', dir, '--ion', 'Cr3+', '--formula', `[Cr(H2O)6]${'x'.repeat(200)}`, '--once', '--data', 'lib');
    expect(long.code).toBe(2);
    expect(long.err).toMatch(/--formula: .*200/);
    expect(long.out).toBe('');
    const ligands = await cli('watch', dir, '--ion', 'Cr3+', '--ligands', 'NH3,'.repeat(60), '--once', '--data', 'lib');
    expect(ligands.code).toBe(2);
    expect(ligands.err).toMatch(/--ligands: .*200/);
  });
});
