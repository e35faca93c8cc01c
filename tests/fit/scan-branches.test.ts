/**
 * scanBranches is built once per scan (src/fit/enumerate.ts): every call on
 * a scan answers the same branches, equal to a fresh build from the scan's
 * ground levels (the reference below, written out from the definition:
 * one branch per distinct ground level, its points where it is the ground,
 * its allowed and ΔS = ±1 transitions). A check against the project's own
 * scan, not an outside value.
 */
import { describe, expect, it } from 'vitest';
import { scanBranches, type Branch } from '../../src/fit/enumerate.js';
import { cachedLevelScan, type LevelScan } from '../../src/fit/scan.js';

function referenceBranches(scan: LevelScan): Branch[] {
  const grounds = [...new Set(scan.ground)];
  return grounds.map((g) => {
    const multiplicity = scan.ids[g]!.multiplicity;
    const others = scan.ids.map((id, k) => ({ k, m: id.multiplicity })).filter(({ k }) => k !== g);
    return {
      ground: g,
      multiplicity,
      points: [...scan.ground.keys()].filter((j) => scan.ground[j] === g),
      allowed: others.filter(({ m }) => m === multiplicity).map(({ k }) => k),
      forbidden: others.filter(({ m }) => Math.abs(m - multiplicity) === 2).map(({ k }) => k),
    };
  });
}

describe('scanBranches', () => {
  it('answers the same branches on every call, equal to a fresh build, for d1-d9 in both geometries', () => {
    for (let d = 1; d <= 9; d++) {
      for (const geometry of ['octahedral', 'tetrahedral'] as const) {
        const scan = cachedLevelScan(d, geometry, 4.5);
        const first = scanBranches(scan);
        expect(scanBranches(scan)).toBe(first);
        expect(first).toEqual(referenceBranches(scan));
      }
    }
    // A spin crossover gives two branches (octahedral d6 at C/B 4.5).
    expect(scanBranches(cachedLevelScan(6, 'octahedral', 4.5)).length).toBe(2);
  });
});
