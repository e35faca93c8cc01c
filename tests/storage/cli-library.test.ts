import Papa from 'papaparse';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analysisOptionsFrom } from '../../src/cli/analysis-options.js';
import { libraryCommand, plusMinus } from '../../src/cli/commands/library.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';
import { runCliCaptured } from '../helpers/cli-run.js';

forEachEngine('fieldgap library (CLI)', (engine) => {
const fresh = libraryPerTest(engine, { open: false });

/** Runs `fieldgap library ...` in process, with FIELDGAP_DATA (or FIELDGAP_DATABASE_URL) naming the test library. */
function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  return runCliCaptured(['library', ...args], { cwd: fresh.where.dir, env: { ...fresh.where.env } });
}

async function seed(): Promise<void> {
  const library = await fresh.where.open();
  await library.add(handBuiltRecord({ sample: 'chromium aqua' }));
  await library.add(handBuiltRecord({ sample: 'nickel ammine', formula: '[Ni(NH3)6]Cl2', ion: 'Ni2+', ligands: ['NH3'], content: new Uint8Array([0, 1, 2, 255]), fileName: 'ni.bin' }));
  await library.close();
}

describe('fieldgap library', () => {
  it('lists each record\'s owner and group where users exist, in text and JSON', async () => {
    // hand-built records; the numbers are made up for the test
    const library = await fresh.where.open();
    await library.add(handBuiltRecord({ sample: 'single-user record' }));
    const before = await cli('list');
    expect(before.out).not.toContain('OWNER');
    await library.scoped({ user: 'ann', group: 'inorganic', admin: false }).add(handBuiltRecord({ sample: 'ann record' }));
    await library.close();
    const { code, out } = await cli('list');
    expect(code).toBe(0);
    expect(out.split('\n')[0]).toMatch(/ SAVED +OWNER +GROUP$/);
    expect(out).toMatch(/ann record .* ann +inorganic\n/);
    expect(out).toMatch(/single-user record .* - +-\n/);
    const json = JSON.parse((await cli('list', '--json')).out) as { analyses: { sample: string; owner?: string; group?: string }[] };
    expect(json.analyses.map((a) => [a.sample, a.owner, a.group])).toEqual([['ann record', 'ann', 'inorganic'], ['single-user record', undefined, undefined]]);
  });

  it('is registered and explains itself', async () => {
    const { code, out } = await cli('--help');
    expect(code).toBe(0);
    expect(out).toBe(`${libraryCommand.usage}\n`);
  });

  it('lists newest first as a table with units, and as JSON', async () => {
    await seed();
    const { code, out } = await cli('list');
    expect(code).toBe(0);
    const lines = out.trim().split('\n');
    expect(lines[0]).toMatch(/^ID\s+SAMPLE\s+FORMULA\s+ION\s+10Dq\/cm-1\s+B\/cm-1\s+β\s+SPIN\s+RMS\/cm-1\s+SAVED$/);
    expect(lines[1]).toMatch(/^ 2\s+nickel ammine\s+\[Ni\(NH3\)6\]Cl2\s+Ni2\+\s+17400 ± 150\s+700 ± 20\s+0\.763 ± 0\.022\s+quartet\s+120/);
    expect(lines[2]).toMatch(/^ 1\s+chromium aqua/);
    expect(lines[3]).toBe('2 analyses, newest first');
    const json = JSON.parse((await cli('list', '--json', '--query', 'ammine')).out) as { total: number; analyses: { id: number }[] };
    expect(json.total).toBe(1);
    expect(json.analyses[0]!.id).toBe(2);
    expect((await cli('list', '--ion', 'Co2+')).out).toBe('no analyses match\n');
  });

  it('says when the library is empty', async () => {
    expect((await cli('list')).out).toMatch(/^the library is empty/);
  });

  it('shows one record, and fails with one line for a missing id', async () => {
    await seed();
    const { code, out } = await cli('show', '2');
    expect(code).toBe(0);
    expect(out).toMatch(/^#2  nickel ammine\n  formula +\[Ni\(NH3\)6\]Cl2\n  ion +Ni2\+\n/);
    expect(out).toContain('10Dq = 17400 ± 150 cm-1');
    expect(out).toMatch(/original +ni\.bin, 4 bytes, sha256 [0-9a-f]{64}/);
    const missing = await cli('show', '9');
    expect(missing.code).toBe(2);
    expect(missing.err).toBe('fieldgap library: id: no analysis with id 9 in the library\n');
    expect((await cli('show', 'x')).code).toBe(2);
  });

  it('writes the original back out byte for byte, never over an existing file', async () => {
    await seed();
    expect((await cli('original', '2', '--out', 'back.bin')).code).toBe(0);
    expect([...readFileSync(join(fresh.where.dir, 'back.bin'))]).toEqual([0, 1, 2, 255]);
    writeFileSync(join(fresh.where.dir, 'taken.bin'), 'mine');
    const refused = await cli('original', '2', '--out', 'taken.bin');
    expect(refused.code).toBe(2);
    expect(refused.err).toContain('taken.bin: the file exists');
    expect(readFileSync(join(fresh.where.dir, 'taken.bin'), 'utf8')).toBe('mine');
  });

  it('exports CSV to stdout or a file and JSON with the full records', async () => {
    await seed();
    const csv = (await cli('export')).out;
    const rows = Papa.parse<string[]>(csv.trim(), { newline: '\r\n' }).data; // papaparse as the reference reader
    expect(rows.map((r) => r[1])).toEqual(['sample', 'nickel ammine', 'chromium aqua']);
    expect((await cli('export', '--csv', 'all.csv')).code).toBe(0);
    expect(readFileSync(join(fresh.where.dir, 'all.csv'), 'utf8')).toBe(csv);
    expect((await cli('export', '--csv', 'all.csv')).code).toBe(2);
    expect((await cli('export', '--json', 'all.json', '--ion', 'Ni2+')).code).toBe(0);
    const json = JSON.parse(readFileSync(join(fresh.where.dir, 'all.json'), 'utf8')) as { analyses: { sample: string; result: unknown }[] };
    expect(json.analyses.map((a) => a.sample)).toEqual(['nickel ammine']);
    expect(json.analyses[0]!.result).toMatchObject({ fit: { tenDq: 17_400 } });
  });

  it('removes a record', async () => {
    await seed();
    expect((await cli('remove', '1')).out).toBe('removed #1 "chromium aqua"\n');
    expect((await cli('remove', '1')).code).toBe(2);
    expect((await cli('list', '--json')).out).toContain('"total": 1');
  });

  it('honours --data over FIELDGAP_DATA', async () => {
    await seed();
    const other = join(fresh.where.dir, 'other');
    expect((await cli('list', '--data', other)).out).toMatch(/empty/);
    expect(existsSync(join(other, 'library.sqlite'))).toBe(true);
  });

  it('rejects an unknown subcommand in one line', async () => {
    const { code, err } = await cli('frobnicate');
    expect(code).toBe(2);
    expect(err.split('\n')).toHaveLength(2);
    expect(err).toContain('unknown subcommand "frobnicate"');
  });
});
});

describe('analysisOptionsFrom', () => {
  it('sets only the options given, in the pipeline\'s names and units', () => {
    expect(analysisOptionsFrom({ ion: 'Cr3+', conc: '0.05', path: '0.5', 'x-unit': 'eV', column: '2', 'c-over-b': '4.2' })).toEqual({
      ion: 'Cr3+', concentration: 0.05, pathLength: 0.5, xUnit: 'eV', column: 2, cOverB: 4.2,
    });
    expect(analysisOptionsFrom({ 'x-unit': 'µm', column: 'Cr-en', geometry: 'Tetrahedral' })).toEqual({ xUnit: 'um', column: 'Cr-en', geometry: 'tetrahedral' });
    expect(analysisOptionsFrom({})).toEqual({});
  });

  it('names the option that is wrong', () => {
    expect(() => analysisOptionsFrom({ conc: '-1' })).toThrow(expect.objectContaining({ path: '--conc' }));
    expect(() => analysisOptionsFrom({ 'x-unit': 'furlong' })).toThrow(expect.objectContaining({ path: '--x-unit' }));
    expect(() => analysisOptionsFrom({ c: '3000', 'free-c': true })).toThrow(expect.objectContaining({ path: '--c-over-b' }));
  });
});

describe('plusMinus', () => {
  it('gives the uncertainty two significant figures and the value the same decimals', () => {
    expect(plusMinus(17_412.3, 153)).toBe('17412 ± 153');
    expect(plusMinus(0.76253, 0.0218, 2)).toBe('0.763 ± 0.022');
    expect(plusMinus(655.54, 4.2)).toBe('655.5 ± 4.2');
    expect(plusMinus(null, 3)).toBe('-');
    expect(plusMinus(700, null)).toBe('700');
  });
});
