/**
 * The free-C path: every assignment is enumerated on the coarse C/B ratios
 * only, the chosen candidates are moved to the ratios in between
 * (move-candidate.ts) and the winner's polish starts from a parabola in C/B
 * (free-c-start.ts). Checked against slow references and by recovering
 * seeded true parameters; and the one-pass grid optimum (profile.ts) against
 * the two-pass closed form.
 */
import { describe, expect, it } from 'vitest';
import { candidateAt, candidateGroups } from '../../src/fit/candidates.js';
import { scanBranches, enumerateAssignments } from '../../src/fit/enumerate.js';
import { freeCStart } from '../../src/fit/free-c-start.js';
import { FREE_C_RATIOS, fitBands } from '../../src/fit/fit-ligand-field.js';
import { candidateOnScan } from '../../src/fit/move-candidate.js';
import { sortObservations } from '../../src/fit/observations.js';
import { bestScale, gridOptimum } from '../../src/fit/profile.js';
import { bandReductions } from '../../src/fit/reductions.js';
import { normalizeBands } from '../../src/fit/bands.js';
import { cachedLevelScan } from '../../src/fit/scan.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { seededRandom, uniform } from './random.js';

/** Slow reference: the best grid point by the two-pass bestScale at every point of the branch. */
function slowOptimum(scan: ReturnType<typeof cachedLevelScan>, ground: number, levels: ArrayLike<number>, points: ArrayLike<number>, o: Float64Array, w: Float64Array) {
  const n = scan.ids.length;
  let best = { point: -1, b: 0, ssr: Infinity };
  for (const j of Array.from(points)) {
    const e = Float64Array.from(levels, (k) => scan.energies[j * n + k]! - scan.energies[j * n + ground]!);
    const fit = bestScale(o, e, w);
    if (fit.b > 0 && fit.ssr < best.ssr) best = { point: j, b: fit.b, ssr: fit.ssr };
  }
  return best;
}

describe('grid optima', () => {
  it('one-pass gridOptimum matches the two-pass closed form on seeded random bands', () => {
    const random = seededRandom(41);
    const scan = cachedLevelScan(3, 'octahedral', 4.5);
    const branch = scanBranches(scan)[0]!;
    const table = enumerateAssignments(scan, branch, 3, 0);
    for (let trial = 0; trial < 20; trial++) {
      const o = Float64Array.from({ length: 3 }, () => uniform(random, 8000, 40000)).sort();
      const w = Float64Array.from({ length: 3 }, () => uniform(random, 0.5, 2));
      for (let a = 0; a < table.count; a++) {
        const fast = gridOptimum(scan, branch, table, a, o, w);
        const levels = table.levels.subarray(a * 3, a * 3 + 3);
        const points = table.points.subarray(table.pointStart[a]!, table.pointStart[a + 1]!);
        const slow = slowOptimum(scan, branch.ground, levels, points, o, w);
        expect(fast?.point ?? -1).toBe(slow.point);
        if (fast) {
          expect(fast.b).toBeCloseTo(slow.b, 6);
          expect(Math.abs(fast.ssr - slow.ssr)).toBeLessThan(1e-6 * Math.max(1, slow.ssr) + 1e-3);
        }
      }
    }
  });

  it('the strided grid optimum is never better than the full one and is a local minimum of the full grid', () => {
    const random = seededRandom(44);
    const scan = cachedLevelScan(3, 'octahedral', 4.5);
    const branch = scanBranches(scan)[0]!;
    const table = enumerateAssignments(scan, branch, 2, 1);
    let same = 0;
    let total = 0;
    for (let trial = 0; trial < 10; trial++) {
      const o = Float64Array.of(uniform(random, 12000, 20000), uniform(random, 22000, 30000), uniform(random, 13000, 16000));
      const w = new Float64Array(3).fill(1);
      for (let a = 0; a < table.count; a++) {
        const full = gridOptimum(scan, branch, table, a, o, w);
        const coarse = gridOptimum(scan, branch, table, a, o, w, undefined, 3);
        if (!full || !coarse) continue;
        total++;
        expect(coarse.ssr).toBeGreaterThanOrEqual(full.ssr - 1e-6 * Math.max(1, full.ssr));
        if (coarse.point === full.point) same++;
        // Its neighbours on the full grid (where the assignment holds) are no better.
        const points = Array.from(table.points.subarray(table.pointStart[a]!, table.pointStart[a + 1]!));
        const at = points.indexOf(coarse.point);
        for (const q of [points[at - 1], points[at + 1]]) {
          if (q === undefined) continue;
          const one = slowOptimum(scan, branch.ground, table.levels.subarray(a * 3, a * 3 + 3), [q], o, w);
          expect(one.ssr).toBeGreaterThanOrEqual(coarse.ssr - 1e-6 * Math.max(1, coarse.ssr));
        }
      }
    }
    // Profiles have one minimum nearly always: the coarse pass finds the full optimum in most cases.
    expect(same / total).toBeGreaterThan(0.9);
  });

  it('candidateOnScan finds the same grid optimum as the slow reference on the other scan', () => {
    const random = seededRandom(42);
    for (let trial = 0; trial < 5; trial++) {
      const bands = [uniform(random, 17000, 20000), uniform(random, 22000, 25000), uniform(random, 26000, 29000)].map(Math.round);
      const sorted = sortObservations(normalizeBands(bands));
      const from = cachedLevelScan(5, 'octahedral', 4.0);
      const to = cachedLevelScan(5, 'octahedral', 4.5);
      const group = candidateGroups(from, bandReductions(sorted, 3)[0]!, 3).groups.find((g) => g.branch.multiplicity === 6)!;
      const c = candidateAt(group, 0);
      const moved = candidateOnScan(c, to, sorted)!;
      const ground = to.index.get(from.ids[c.branch.ground]!.key)!;
      const levels = Array.from(c.levels, (k) => to.index.get(from.ids[k]!.key)!);
      const o = Float64Array.from(bands);
      // The χ² weights 1/(σ² + σm²) of src/fit/likelihood.ts, written out: σ = max(100, 1%), σm = max(150, 1.5%).
      const w = Float64Array.from(bands, (v) => 1 / (Math.max(100, 0.01 * v) ** 2 + Math.max(150, 0.015 * v) ** 2));
      const slow = slowOptimum(to, ground, levels, moved.branch.points, o, w);
      expect(moved.grid.point).toBe(slow.point);
      expect(moved.grid.b).toBeCloseTo(slow.b, 6);
      expect(Array.from(moved.levels, (k) => to.ids[k]!.key)).toEqual(Array.from(c.levels, (k) => from.ids[k]!.key));
    }
  });
});

describe('free C', () => {
  it('recovers seeded true Dq, B and C of high-spin d5 from its quartet bands', () => {
    const random = seededRandom(43);
    for (let trial = 0; trial < 4; trial++) {
      const b = uniform(random, 600, 850);
      const ratio = uniform(random, 3.6, 5.9);
      const dq = uniform(random, 0.9, 1.4) * b;
      const levels = computeLevels(5, 'octahedral', { dq, b, c: ratio * b }).levels;
      const bands: number[] = [];
      for (const l of levels) if (l.multiplicity === 4 && l.energy < 32_000 && !bands.some((p) => Math.abs(p - l.energy) < 1)) bands.push(l.energy);
      const context = `Dq=${dq.toFixed(1)} B=${b.toFixed(1)} C/B=${ratio.toFixed(3)} bands=${bands.map(Math.round).join(',')}`;
      const r = fitBands({ d: 5, bands, freeC: true });
      expect(Math.abs(r.dq - dq) / dq, context).toBeLessThan(1e-3);
      expect(Math.abs(r.b! - b) / b, context).toBeLessThan(1e-3);
      expect(Math.abs(r.c! - ratio * b) / (ratio * b), context).toBeLessThan(1e-3);
    }
  });

  it('starts the polish nearer the true C/B than the scanned ratio it was found on', () => {
    const [b, ratio, dq] = [720, 4.8, 900];
    const levels = computeLevels(5, 'octahedral', { dq, b, c: ratio * b }).levels;
    const bands = levels.filter((l) => l.multiplicity === 4 && l.energy < 32_000).map((l) => l.energy);
    const sorted = sortObservations(normalizeBands(bands));
    const scan = cachedLevelScan(5, 'octahedral', 5.0);
    const reduction = bandReductions(sorted, 3)[0]!;
    const group = candidateGroups(scan, reduction, 3).groups.find((g) => g.branch.multiplicity === 6)!;
    let a = 0;
    for (let k = 1; k < group.wrms.length; k++) if (group.wrms[k]! < group.wrms[a]!) a = k;
    const c = candidateAt(group, a);
    const start = freeCStart(c, { dq: c.grid.x * c.grid.b, b: c.grid.b, c: 5 * c.grid.b }, FREE_C_RATIOS, sorted)!;
    expect(Math.abs(start.c / start.b - ratio)).toBeLessThan(Math.abs(5.0 - ratio));
    expect(Math.abs(start.b - b) / b).toBeLessThan(0.05);
  });
});
