/**
 * The reductions of a band list (src/fit/reductions.ts): their order, their
 * limits and their penalties; and the B-independent transition a single band
 * is assigned to (dqOnlyLevel).
 */
import { describe, expect, it } from 'vitest';
import { normalizeBands } from '../../src/fit/bands.js';
import { dqOnlyLevel } from '../../src/fit/candidates.js';
import { scanBranches } from '../../src/fit/enumerate.js';
import { sortObservations } from '../../src/fit/observations.js';
import { bandReductions } from '../../src/fit/reductions.js';
import { cachedLevelScan } from '../../src/fit/scan.js';
import type { Geometry } from '../../src/ligand-field/types.js';

const reductionsOf = (text: string, p = 2) => bandReductions(sortObservations(normalizeBands(text)), p);

describe('bandReductions', () => {
  it('starts with the whole list at no cost and goes by ascending penalty', () => {
    const list = reductionsOf('8500, 13800, 19000, 25300, 15000:sf');
    expect(list[0]!.penalty).toBe(0);
    expect(list[0]!.dropped).toEqual([]);
    for (let i = 1; i < list.length; i++) expect(list[i]!.penalty).toBeGreaterThanOrEqual(list[i - 1]!.penalty);
    for (const r of list) expect(r.penalty).toBeCloseTo(r.penalties.reduce((s, q) => s + q.amount, 0), 9);
  });

  it('leaves fewer than half of the plain unflagged bands, and at most half with weak ones', () => {
    const plain = reductionsOf('9000, 14000, 17400, 24600, 30000, 35000');
    expect(Math.max(...plain.map((r) => r.dropped.length))).toBe(2);
    const weak = reductionsOf('11000:e=1, 15000:e=1, 22000:e=10, 30000:e=10');
    expect(Math.max(...weak.map((r) => r.dropped.length))).toBe(2);
    const strongFour = reductionsOf('11000, 15000, 22000, 30000');
    expect(Math.max(...strongFour.map((r) => r.dropped.length))).toBe(1);
  });

  it('keeps at least p observations when it touches unflagged bands, and may leave flagged ones down to one band', () => {
    for (const r of reductionsOf('17400, 24600, 33333:sf', 2)) {
      const kept = r.sorted.primary.length + r.sorted.flagged.length;
      expect(kept).toBeGreaterThanOrEqual(r.touchesUnflagged ? 2 : 1);
    }
    expect(reductionsOf('17400, 4000:sf').some((r) => r.dropped.length === 1 && r.sorted.primary.length === 1)).toBe(true);
  });

  it('prices a band by what it is: −2·ln(π/R) − ln(2π·σeff²), π 0.02 ×3 per shoulder, weak, narrow, ×5 flagged, at most 0.5', () => {
    const amount = (text: string, at: number) => {
      const r = reductionsOf(text, 1).find((x) => x.dropped.length === 1 && Math.round(x.dropped[0]!.position) === at && x.merged.length === 0)!;
      return r.penalty;
    };
    // The model of src/fit/likelihood.ts written out again: σ default max(100, 1%), model error max(150, 1.5%), R = 30 000 cm-1.
    const expected = (prior: number, position: number) => {
      const s2 = Math.max(100, 0.01 * position) ** 2 + Math.max(150, 0.015 * position) ** 2;
      return -2 * Math.log(prior / 30000) - Math.log(2 * Math.PI * s2);
    };
    expect(amount('10000, 20000, 30000', 20000)).toBeCloseTo(expected(0.02, 20000), 9);
    expect(amount('10000, 20000:sh, 30000', 20000)).toBeCloseTo(expected(0.06, 20000), 9);
    expect(amount('10000:e=10, 20000:sh:e=1, 30000:e=10', 20000)).toBeCloseTo(expected(0.18, 20000), 9);
    expect(amount('10000, 20000, 30000, 40000:sf', 40000)).toBeCloseTo(expected(0.1, 40000), 9);
    expect(amount('10000:w=3000, 20000:w=3000, 30000:w=3000, 40000:sf:sh:w=200', 40000)).toBeCloseTo(expected(0.5, 40000), 9);
    // The less a band looks like a real d–d maximum, the cheaper it is to leave.
    expect(amount('10000, 20000:sh, 30000', 20000)).toBeLessThan(amount('10000, 20000, 30000', 20000));
  });

  it('merges only close neighbours, at −2·ln 0.1 + (separation/1500 cm-1)² each', () => {
    const list = reductionsOf('21175, 22304, 27523, 28834');
    const both = list.find((r) => r.merged.length === 2 && r.dropped.length === 0)!;
    expect(both.penalty).toBeCloseTo(2 * -2 * Math.log(0.1) + (1129 / 1500) ** 2 + (1311 / 1500) ** 2, 6);
    expect(both.sorted.primary.map((o) => o.position)).toEqual([(21175 + 22304) / 2, (27523 + 28834) / 2]);
    expect(reductionsOf('17400, 24600').some((r) => r.merged.length > 0)).toBe(false);
  });
});

describe('dqOnlyLevel', () => {
  // ν1 = 10Dq for d3, d8 octahedral and d2, d7 tetrahedral; the one transition of d1 (common practice).
  it.each([
    [3, 'octahedral', '4T2g(F)'],
    [8, 'octahedral', '3T2g(F)'],
    [2, 'tetrahedral', '3T2(F)'],
    [7, 'tetrahedral', '4T2(F)'],
    [1, 'octahedral', '2Eg(D)'],
  ] as const)('d%i %s: %s lies at exactly 10Dq', (d, geometry, label) => {
    const scan = cachedLevelScan(d, geometry as Geometry, 4.5);
    const [branch] = scanBranches(scan);
    expect(scan.ids[dqOnlyLevel(scan, branch!)!]!.label).toBe(label);
  });

  it.each([[2, 'octahedral'], [7, 'octahedral'], [3, 'tetrahedral']] as const)('d%i %s: none (ν1 depends on B)', (d, geometry) => {
    const scan = cachedLevelScan(d, geometry as Geometry, 4.5);
    expect(dqOnlyLevel(scan, scanBranches(scan)[0]!)).toBeUndefined();
  });
});
