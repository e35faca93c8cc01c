import { describe, expect, it } from 'vitest';
import { ligandFromFileName } from '../../src/cli/commands/series.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';
import { runCliCaptured } from '../helpers/cli-run.js';

forEachEngine('fieldgap series --library', (engine) => {
  const fresh = libraryPerTest(engine, { open: false });

  function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
    return runCliCaptured(['series', ...args], { cwd: fresh.where.dir });
  }

  it('prints both rankings with units and the fitted factors', async () => {
    // hand-built records; the numbers are made up for the test
    const library = await fresh.where.open();
    await library.add(handBuiltRecord({ sample: 'cr-en', formula: '[Cr(en)3]Cl3', ligands: ['en'] }, 21_900));
    await library.add(handBuiltRecord({ sample: 'cr-aqua', formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_400));
    await library.add(handBuiltRecord({ sample: 'cr-aqua-2', formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_500));
    await library.close();
    const { code, out } = await cli('--ion', 'Cr3+', ...fresh.where.flags);
    expect(code).toBe(0);
    expect(out).toMatch(/^Cr3\+: 3 analyses\n\nSpectrochemical series \(by 10Dq, weakest field first\)\n/);
    expect(out).toMatch(/ 1 +H2O +cr-aqua +2 +17400 ± 150 +~ next/);
    expect(out).toContain('  H2O ~ H2O < en');
    expect(out).toContain('Nephelauxetic series');
    expect(out).toMatch(/Jørgensen factors for Cr3\+ \(f = 10Dq\/g, g = \d+ cm-1/);
    expect(out).toMatch(/ H2O +[\d.]+ ± [\d.]+ .* 2 analyses/);
    const json = JSON.parse((await cli('--ion', 'Cr(III)', ...fresh.where.flags, '--json')).out) as { count: number };
    expect(json.count).toBe(3);
  });

  it('shows a page of each list with a line saying so, the ligand table whole, and every analysis with --all', async () => {
    // hand-built records; the numbers are made up for the test
    const library = await fresh.where.open();
    for (let i = 0; i < 7; i++) {
      await library.add(handBuiltRecord({ sample: `aqua ${i}`, formula: '[Cr(H2O)6]3+', ligands: ['H2O'] }, 17_000 + 100 * i));
      await library.add(handBuiltRecord({ sample: `en ${i}`, formula: '[Cr(en)3]Cl3', ligands: ['en'] }, 21_000 + 100 * i));
    }
    await library.close();
    const paged = await cli('--ion', 'Cr3+', '--limit', '3', '--offset', '2', ...fresh.where.flags);
    expect(paged.code).toBe(0);
    expect(paged.out).toContain('(showing 3–5 of 14 in the ranking; --all for every analysis, --offset N for the next)');
    expect(paged.out).toMatch(/\n +3 +H2O +aqua 2 /);
    expect(paged.out).not.toMatch(/\n +6 +H2O /);
    expect(paged.out).toMatch(/Ligands \(mean of their analyses, weakest field first; 14 analyses\)\n.*\n +1 +H2O +7 +17300 ± \d+/);
    expect(paged.out).toContain('  H2O < en');
    expect(paged.out).toMatch(/ H2O +[\d.]+ ± [\d.]+ .* 7 analyses/);
    const whole = await cli('--ion', 'Cr3+', '--all', ...fresh.where.flags);
    expect(whole.out).not.toContain('showing');
    expect(whole.out).toMatch(/\n +14 +en +en 6 /);
    const json = JSON.parse((await cli('--ion', 'Cr3+', '--limit', '4', '--json', ...fresh.where.flags)).out) as { spectrochemical: { entries: unknown[] }; page: object; ligands: { ligand: string; count: number }[] };
    expect(json.spectrochemical.entries).toHaveLength(4);
    expect(json.page).toMatchObject({ all: false, offset: 0, limit: 4, total: 14, skippedTotal: 0 });
    expect(json.ligands.map((l) => [l.ligand, l.count])).toEqual([['H2O', 7], ['en', 7]]);
    expect((await cli('--ion', 'Cr3+', '--limit', '0', ...fresh.where.flags)).err).toMatch(/^fieldgap series: .*limit/);
    expect((await cli('--ion', 'Cr3+', '--all', '--offset', '2', ...fresh.where.flags)).err).toBe('fieldgap series: --all: give --all or --limit/--offset, not both\n');
  });

  it('fails in one line without --ion or without analyses', async () => {
    expect((await cli()).err).toBe('fieldgap series: --ion is required: the metal ion of the series, e.g. --ion Cr3+\n');
    const none = await cli('--ion', 'V3+', ...fresh.where.flags);
    expect(none.code).toBe(2);
    expect(none.err).toBe('fieldgap series: ion: no analyses of V3+: nothing to rank\n');
  });
});

describe('ligandFromFileName', () => {
  it('takes the last word of the name that is a known ligand', () => {
    expect(ligandFromFileName('data/cr-NH3.csv')).toBe('NH3');
    expect(ligandFromFileName('Cr_en_2.csv')).toBe('en');
    expect(ligandFromFileName('cr aqua.jdx')).toBe('H2O');
    expect(() => ligandFromFileName('run-17.csv')).toThrow(expect.objectContaining({ code: 'invalid-argument', path: 'run-17.csv' }));
  });
});
