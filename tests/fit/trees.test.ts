/**
 * The fit with the Trees correction α·L(L+1) (`trees`: a fixed α or "free").
 *
 * Check values: the round trip is against the project's own engine (an
 * internal check, noise-free, so the tolerance is tight); the seven quartets
 * of hexaaqua Mn(II) are the published band set of tests/accuracy/
 * published-sets.ts (its source notes there: Lever, Inorganic Electronic
 * Spectroscopy, 2nd ed. (1984); Heidt, Koster & Johnson, J. Am. Chem. Soc.
 * 80 (1958) 6471; both from memory).
 */
import { describe, expect, it } from 'vitest';
import type { CliIo } from '../../src/cli/command.js';
import { runCli } from '../../src/cli/main.js';
import { FieldgapError } from '../../src/errors.js';
import { fitLigandField } from '../../src/fit/index.js';
import { computeLevels } from '../../src/ligand-field/index.js';

/** A d5 fit over seven bands takes seconds; room for a busy machine. */
const SLOW_MS = 300_000;

const MN_AQUA_7 = '18900,23100,24950,25300,27950,29700,32400'; // published-sets.ts (from memory)

describe('fit with the Trees correction', () => {
  it('round trip: seven d5 quartets made with α = 85 give back Dq, B, C and α (internal check: own engine)', () => {
    const truth = { dq: 770, b: 810, c: 3050, alpha: 85 };
    const quartets = computeLevels(5, 'octahedral', truth).levels.filter((l) => l.multiplicity === 4 && l.energy < 34_000);
    const positions: number[] = [];
    for (const l of quartets) if (!positions.some((p) => Math.abs(p - l.energy) < 1)) positions.push(l.energy);
    expect(positions.length).toBeGreaterThanOrEqual(6);
    const r = fitLigandField({ ion: 'Mn2+', bands: positions, freeC: true, trees: 'free' });
    expect(r.tenDq).toBeCloseTo(10 * truth.dq, -1);
    expect(Math.abs(r.b! - truth.b)).toBeLessThan(2);
    expect(Math.abs(r.c! - truth.c)).toBeLessThan(10);
    expect(Math.abs(r.alpha! - truth.alpha)).toBeLessThan(0.5);
    expect(r.uncertainty.alpha).not.toBeUndefined();
  }, SLOW_MS);

  it('hexaaqua Mn(II), seven quartets: with α fitted every band is reproduced (rms < 100 cm-1); without α it is not (rms > 300)', () => {
    const plain = fitLigandField({ ion: 'Mn2+', bands: MN_AQUA_7, freeC: true });
    const trees = fitLigandField({ ion: 'Mn2+', bands: MN_AQUA_7, freeC: true, trees: 'free' });
    expect(plain.rmsResidual).toBeGreaterThan(300);
    expect(trees.rmsResidual).toBeLessThan(100);
    expect(trees.assignments.map((a) => a.label)).toContain('4T1g(P)');
    for (const a of trees.assignments) expect(Math.abs(a.residual)).toBeLessThan(200);
    // α comes out positive and of the first-row order (60–100 cm-1, from memory), with a finite uncertainty.
    expect(trees.alpha!).toBeGreaterThan(40);
    expect(trees.alpha!).toBeLessThan(150);
    expect(Number.isFinite(trees.uncertainty.alpha!)).toBe(true);
    expect(trees.notes.some((n) => n.startsWith('Trees correction'))).toBe(true);
  }, SLOW_MS);

  it('α fixed at 0 gives the fit without the correction (the same numbers), and says α = 0', () => {
    const plain = fitLigandField({ ion: 'Mn2+', bands: '18900,23100,25000,28000,29700', freeC: true });
    const zero = fitLigandField({ ion: 'Mn2+', bands: '18900,23100,25000,28000,29700', freeC: true, trees: 0 });
    expect([zero.tenDq, zero.b, zero.c, zero.rmsResidual]).toEqual([plain.tenDq, plain.b, plain.c, plain.rmsResidual]);
    expect(zero.alpha).toBe(0);
    expect(plain.alpha).toBeUndefined();
    expect(zero.uncertainty.alpha).toBeUndefined();
  }, SLOW_MS);

  it.each([['abc'], [Number.NaN], [1e4], [true]])('trees = %s is refused with path "trees"', (value) => {
    try {
      fitLigandField({ ion: 'Mn2+', bands: '18900,23100,25000', trees: value as never });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).path).toBe('trees');
    }
  });
});

describe('fit --trees on the command line', () => {
  async function run(argv: string[]) {
    let stdout = '';
    let stderr = '';
    const io: CliIo = { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), isTty: false, cwd: '/', env: {} };
    const code = await runCli(argv, io);
    return { code, stdout, stderr };
  }

  it('--trees free prints α with its ±, and --json gives alpha and uncertainty.alpha', async () => {
    const text = await run(['fit', '--ion', 'Mn2+', '--bands', MN_AQUA_7, '--free-c', '--trees', 'free']);
    expect(text.code).toBe(0);
    expect(text.stdout).toMatch(/α {4}= \d+\.\d ± \d+\.\d cm-1 {3}Trees correction/);
    const json = await run(['fit', '--ion', 'Mn2+', '--bands', MN_AQUA_7, '--free-c', '--trees', 'free', '--json']);
    const parsed = JSON.parse(json.stdout) as { alpha: number; uncertainty: { alpha: number } };
    expect(typeof parsed.alpha).toBe('number');
    expect(typeof parsed.uncertainty.alpha).toBe('number');
  }, SLOW_MS);

  it('a bad --trees names the option', async () => {
    const bad = await run(['fit', '--ion', 'Mn2+', '--bands', '18900,23100,25000', '--trees', 'lots']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('--trees');
  });
});

describe('the note that suggests the Trees term (trees-suggestion.ts)', () => {
  it('seven Mn(II) quartets without trees: the note gives the α model; the result itself stays the cubic one', () => {
    const r = fitLigandField({ ion: 'Mn2+', bands: MN_AQUA_7, freeC: true });
    expect(r.alpha).toBeUndefined();
    expect(r.notes.some((n) => n.startsWith('the Trees correction α·L(L+1) explains these bands markedly better'))).toBe(true);
  }, SLOW_MS);

  it('no note where α gains little (the six quartets below 30 000 cm-1) or cannot be judged (two bands)', () => {
    const six = fitLigandField({ ion: 'Mn2+', bands: MN_AQUA_7.split(',').slice(0, 6).join(','), freeC: true });
    const two = fitLigandField({ ion: 'Cr3+', bands: '17400,24600' }); // Lever (1984), from memory
    for (const r of [six, two]) expect(r.notes.some((n) => n.startsWith('the Trees correction'))).toBe(false);
  }, SLOW_MS);
});
