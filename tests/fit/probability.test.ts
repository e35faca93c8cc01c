/**
 * The probabilistic score (src/fit/likelihood.ts) and where it reaches the
 * user: probabilities that add up, the grid choosing the plausible root with
 * the priors, the two-electron label, and the CLI report and JSON.
 */
import { describe, expect, it } from 'vitest';
import { parseWindow } from '../../src/cli/commands/fit.js';
import { enumerateAssignments, scanBranches } from '../../src/fit/enumerate.js';
import { deviance, effectiveWeight, flatWithTails, probabilitiesOf } from '../../src/fit/likelihood.js';
import { gridOptimum } from '../../src/fit/profile.js';
import { cachedLevelScan } from '../../src/fit/scan.js';
import { twoElectronLevels } from '../../src/fit/two-electron.js';
import { seededRandom, uniform } from './random.js';
import { runCliCaptured } from '../helpers/cli-run.js';

async function cli(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  const { code, out, err } = await runCliCaptured(argv, { cwd: '/' });
  return { code, stdout: out, stderr: err };
}

describe('likelihood helpers', () => {
  it('probabilitiesOf is exp(−s/2) normalised: sums to 1, ratios exp(−Δ/2), shift-invariant', () => {
    const random = seededRandom(5);
    for (let trial = 0; trial < 20; trial++) {
      const scores = Array.from({ length: 5 }, () => uniform(random, 0, 40));
      const p = probabilitiesOf(scores);
      expect(p.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 12);
      expect(p[1]! / p[0]!).toBeCloseTo(Math.exp(-(scores[1]! - scores[0]!) / 2), 9);
      const shifted = probabilitiesOf(scores.map((s) => s + 1000));
      shifted.forEach((v, i) => expect(v).toBeCloseTo(p[i]!, 12));
    }
  });

  it('deviance, weights and tails are what their docstrings say', () => {
    expect(deviance(1)).toBeCloseTo(0, 12);
    expect(deviance(0.1)).toBeGreaterThan(0);
    expect(deviance(Math.exp(-1))).toBeCloseTo(2, 12);
    // σ² + σm² with σm = max(150, 1.5%): at 20 000 cm-1, 200² + 300².
    expect(1 / effectiveWeight(20000, 200)).toBeCloseTo(200 ** 2 + 300 ** 2, 6);
    expect(flatWithTails(0.5, 0.35, 1, 0.035, 0.04)).toBe(0);
    expect(flatWithTails(1.08, 0.35, 1, 0.035, 0.04)).toBeCloseTo(4, 9);
    expect(flatWithTails(0.28, 0.35, 1, 0.035, 0.04)).toBeCloseTo(4, 9);
  });
});

describe('grid optimum with the priors', () => {
  it('picks the plausible root of two bands and two parameters; the same point as the prior-free optimum when it is plausible', () => {
    // Ni2+ octahedral, bands taken as 3T1g(F) and 3T1g(P): two roots fit exactly, β ≈ 0.9 and β ≈ 0.1 (see hard-cases.test.ts).
    const scan = cachedLevelScan(8, 'octahedral', 4.64);
    const branch = scanBranches(scan)[0]!;
    const table = enumerateAssignments(scan, branch, 2, 0);
    const o = Float64Array.of(13800, 25300);
    const w = Float64Array.from(o, (v) => effectiveWeight(v, Math.max(100, 0.01 * v)));
    const b0 = 1041;
    // The β prior of likelihood.ts written out: flat 0.35–1.0, tails 0.035 and 0.04.
    const prior = (b: number) => flatWithTails(b / b0, 0.35, 1, 0.035, 0.04);
    const label = (k: number) => scan.ids[k]!.label;
    let found = false;
    for (let a = 0; a < table.count; a++) {
      const levels = Array.from(table.levels.subarray(2 * a, 2 * a + 2), label);
      if (levels.join() !== '3T1g(F),3T1g(P)') continue;
      found = true;
      const withPrior = gridOptimum(scan, branch, table, a, o, w, undefined, 1, prior)!;
      expect(withPrior.b / b0).toBeGreaterThan(0.35);
      expect(withPrior.b / b0).toBeLessThan(1);
      // Without the prior the lowest sum of squares may sit on either root; with it, never below the plausible one's prior.
      const without = gridOptimum(scan, branch, table, a, o, w)!;
      expect(withPrior.ssr + prior(withPrior.b)).toBeLessThanOrEqual(without.ssr + prior(without.b) + 1e-9);
    }
    expect(found).toBe(true);
  });
});

describe('two-electron transitions', () => {
  it('are those with no one-electron partner of the same symmetry and spin', () => {
    const label = (d: number, geometry: 'octahedral' | 'tetrahedral', cOverB: number) => {
      const scan = cachedLevelScan(d, geometry, cOverB);
      const ground = scan.ground[0]!;
      const two = twoElectronLevels(scan, ground);
      return (l: string) => two[scan.ids.findIndex((id) => id.label === l)] === 1;
    };
    // common practice: 3T1g(P) of Ni(II) and 4T1(P) of tetrahedral Co(II) are strong; 4A2g of Co(II) and 3A2g of V(III) weak
    expect(label(8, 'octahedral', 4.64)('3T1g(P)')).toBe(false);
    expect(label(7, 'tetrahedral', 3.9)('4T1(P)')).toBe(false);
    expect(label(7, 'octahedral', 3.9)('4A2g(F)')).toBe(true);
    expect(label(2, 'octahedral', 4.8)('3A2g(F)')).toBe(true);
  });
});

describe('fieldgap fit: probabilities, window, formula', () => {
  it('parses a measured range in nm or cm-1', () => {
    expect(parseWindow('380-780nm')).toEqual({ min: 1e7 / 780, max: 1e7 / 380 });
    expect(parseWindow('12800–26300')).toEqual({ min: 12800, max: 26300 });
    expect(() => parseWindow('380')).toThrow(/--window "380" is not a range/);
    expect(() => parseWindow('380-780 furlongs')).toThrow(/unknown unit "furlongs"/);
  });

  it('prints the probability of the assignment and of each spin state', async () => {
    const { code, stdout } = await cli(['fit', '--formula', '[Co(H2O)6]2+', '--bands', '19400,21550:sh', '--window', '380-780nm']);
    expect(code).toBe(0);
    expect(stdout).toMatch(/Probability of this assignment: [\d.]+%; spin state: high-spin (9\d|100)[\d.]*%, low-spin/);
    expect(stdout).toMatch(/Measured range: 12821–26316 cm-1 \(380–780 nm\)/);
  });

  it('JSON carries probability, spinStateProbabilities, undetermined and each alternative\'s probability', async () => {
    const { code, stdout } = await cli(['fit', '--ion', 'Ni2+', '--bands', '8500,13800,25300', '--free-c', '--json']);
    expect(code).toBe(0);
    const doc = JSON.parse(stdout) as Record<string, unknown>;
    expect(typeof doc.probability).toBe('number');
    expect(doc.spinStateProbabilities).toEqual({ 'no-choice': 1 });
    expect((doc.undetermined as Array<{ parameter: string }>)[0]!.parameter).toBe('c');
    for (const alt of doc.alternatives as Array<{ probability: number }>) expect(typeof alt.probability).toBe('number');
  });

  it('names --formula and --ligands in their errors', async () => {
    const formula = await cli(['fit', '--formula', '[Co(H2O6]2+', '--bands', '19400']);
    expect(formula.code).toBe(2);
    expect(formula.stderr).toMatch(/--formula/);
    const ligands = await cli(['fit', '--ion', 'Ni2+', '--ligands', 'H2O,zz', '--bands', '13800,25300']);
    expect(ligands.code).toBe(2);
    expect(ligands.stderr).toMatch(/--ligands/);
  });
});
