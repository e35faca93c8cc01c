/**
 * The fast path (cached unit-B scan, closed-form B per grid point, then
 * Levenberg–Marquardt with the Euler-relation Jacobian) against the slow
 * brute-force reference in tests/reference/fit/, on seeded random noisy
 * band sets with a fixed assignment.
 */
import { describe, expect, it } from 'vitest';
import { enumerateAssignments, scanBranches } from '../../src/fit/enumerate.js';
import { bestScale, gridOptimum } from '../../src/fit/profile.js';
import { refineSolution } from '../../src/fit/refine.js';
import { cachedLevelScan, levelIdentityKey } from '../../src/fit/scan.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { bruteForceFit, sumOfSquares, type BruteForceProblem } from '../reference/fit/brute-force-fit.js';
import { seededRandom, uniform } from './random.js';

describe('bestScale', () => {
  it('matches a direct minimisation over B on seeded random data', () => {
    const random = seededRandom(5);
    for (let trial = 0; trial < 20; trial++) {
      const n = 2 + Math.floor(random() * 4);
      const e = Float64Array.from({ length: n }, () => uniform(random, 5, 60));
      const o = Float64Array.from(e, (v) => v * 700 + uniform(random, -500, 500));
      const w = Float64Array.from({ length: n }, () => uniform(random, 0.2, 2));
      const fast = bestScale(o, e, w);
      // Reference: golden-section search of Σ w (o − B e)² over B in [0, 2000].
      const ssr = (b: number) => o.reduce((s, oi, i) => s + w[i]! * (oi - b * e[i]!) ** 2, 0);
      let [lo, hi] = [0, 2000];
      const g = (Math.sqrt(5) - 1) / 2;
      for (let k = 0; k < 200; k++) {
        const m1 = hi - g * (hi - lo);
        const m2 = lo + g * (hi - lo);
        if (ssr(m1) < ssr(m2)) hi = m2;
        else lo = m1;
      }
      // A golden-section search locates a quadratic minimum only to ~√ε relative (≈1e-8·700): 4 digits.
      expect(fast.b).toBeCloseTo((lo + hi) / 2, 4);
      expect(fast.ssr).toBeLessThanOrEqual(ssr((lo + hi) / 2) * (1 + 1e-12));
      expect(fast.ssr).toBeCloseTo(ssr(fast.b), 6);
    }
  });
});

describe('scan + closed-form B + refinement against brute force', () => {
  it.each([
    [2, 11],
    [3, 12],
    [7, 13],
    [8, 14],
  ])('d%i octahedral, seeded noisy three-band sets', (d, seed) => {
    const random = seededRandom(seed);
    const cOverB = 4.5;
    const scan = cachedLevelScan(d, 'octahedral', cOverB);
    const branch = scanBranches(scan)[0]!;
    for (let trial = 0; trial < 2; trial++) {
      const b = uniform(random, 600, 1000);
      const dq = uniform(random, 0.9, 1.6) * b;
      const levels = computeLevels(d, 'octahedral', { dq, b, c: cOverB * b }).levels;
      const ground = levels[0]!;
      const allowed = levels.filter((l) => l.energy > 0 && l.multiplicity === ground.multiplicity).slice(0, 3);
      const observed = allowed.map((l) => l.energy + uniform(random, -300, 300));
      const levelKeys = allowed.map(levelIdentityKey);
      const problem: BruteForceProblem = {
        d, geometry: 'octahedral', cOverB, groundKey: levelIdentityKey(ground), levelKeys, observed, weights: [1, 1, 1],
      };
      const reference = bruteForceFit(problem);

      const table = enumerateAssignments(scan, branch, 3, 0);
      const wanted = levelKeys.map((k) => scan.index.get(k)!).join(',');
      const row = Array.from({ length: table.count }, (_, a) => a).find(
        (a) => Array.from(table.levels.subarray(a * 3, a * 3 + 3)).join(',') === wanted,
      )!;
      expect(row).toBeDefined();
      const grid = gridOptimum(scan, branch, table, row, Float64Array.from(observed), Float64Array.of(1, 1, 1))!;
      const refined = refineSolution(
        {
          d, geometry: 'octahedral', mode: 'ratio', cOverB, cFixed: Number.NaN, groundKey: problem.groundKey, levelKeys,
          observed: Float64Array.from(observed), sigma: Float64Array.of(1, 1, 1),
        },
        { dq: grid.x * grid.b, b: grid.b, c: cOverB * grid.b },
      );
      expect(refined.lsq.success).toBe(true);
      expect(refined.params.dq).toBeCloseTo(reference.dq, 2);
      expect(refined.params.b).toBeCloseTo(reference.b, 2);
      const fastSsr = sumOfSquares(problem, refined.params.dq, refined.params.b);
      expect(fastSsr).toBeLessThanOrEqual(reference.ssr * (1 + 1e-9) + 1e-6);
      expect(2 * refined.lsq.cost).toBeCloseTo(fastSsr, 3);
    }
  });
});
