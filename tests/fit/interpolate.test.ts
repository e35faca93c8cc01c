import { describe, expect, it } from 'vitest';
import { refineProfileOnScan, scanEnergyAt } from '../../src/fit/interpolate.js';
import { cachedLevelScan, levelIdentityKey } from '../../src/fit/scan.js';
import { scanBranches } from '../../src/fit/enumerate.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { seededRandom, uniform } from './random.js';

describe('scanEnergyAt', () => {
  it('reproduces the grid nodes exactly', () => {
    const scan = cachedLevelScan(3, 'octahedral', 4.5);
    const g = scan.ground[10]!;
    for (let k = 0; k < scan.ids.length; k++) {
      const n = scan.ids.length;
      expect(scanEnergyAt(scan, k, g, scan.x[10]!)).toBeCloseTo(scan.energies[10 * n + k]! - scan.energies[10 * n + g]!, 12);
    }
  });

  it.each([[3, 'octahedral'], [5, 'octahedral'], [6, 'octahedral'], [7, 'tetrahedral']] as const)(
    'agrees with the engine between nodes for d%i %s (seeded random Dq/B; engine as reference)',
    (d, geometry) => {
      const scan = cachedLevelScan(d, geometry, 4.5);
      const random = seededRandom(d * 17);
      let worst = 0;
      for (let trial = 0; trial < 40; trial++) {
        const x = uniform(random, 0.05, 11.5);
        const levels = computeLevels(d, geometry, { dq: x, b: 1, c: 4.5 }).levels;
        const ground = scan.index.get(levelIdentityKey(levels[0]!))!;
        for (const level of levels.slice(0, 12)) {
          const k = scan.index.get(levelIdentityKey(level))!;
          worst = Math.max(worst, Math.abs(scanEnergyAt(scan, k, ground, x) - level.energy));
        }
      }
      // In units of B, over the lowest twelve levels (the ones bands are assigned to): cubic Hermite stays near 5e-5 B
      // (0.04 cm-1 at B = 800); linear interpolation on the same grid errs by ~1.5e-3 B and fails this.
      expect(worst).toBeLessThan(2e-4);
    },
  );
});

describe('refineProfileOnScan', () => {
  it('finds the exact Dq/B and B of noise-free bands between grid nodes', () => {
    const scan = cachedLevelScan(8, 'octahedral', 4.5);
    const branch = scanBranches(scan)[0]!;
    const x = 1.2345;
    const b = 870;
    const levels = computeLevels(8, 'octahedral', { dq: x * b, b, c: 4.5 * b }).levels.filter((l) => l.multiplicity === 3 && l.energy > 0);
    const ids = levels.map((l) => scan.index.get(levelIdentityKey(l))!);
    const o = Float64Array.from(levels, (l) => l.energy);
    const result = refineProfileOnScan(scan, branch.ground, ids, o, Float64Array.of(1, 1, 1), 1.2, 1.24);
    expect(result.x).toBeCloseTo(x, 4);
    expect(result.b).toBeCloseTo(b, 1);
  });
});
