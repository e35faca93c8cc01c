import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { rankByNephelauxetic, rankByTenDq, valuesOverlap } from '../../src/series/rank.js';
import type { SeriesAnalysis } from '../../src/series/types.js';

// 10Dq of octahedral Cr(III) complexes, the 4A2g → 4T2g band maximum, cm-1.
// From memory; cf. Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), Cr(III) tables. Found cross-check beside each:
// Jørgensen's f(L)·g(Cr3+) with g(Cr3+) = 17 400 (Modern Aspects of Ligand Field Theory, 1971, pp. 347–348; an estimate,
// good to a few per cent): the same order except ox and H2O, which swap (both within 2 %), and CN- lies 11 % higher).
// ±200 cm-1 for reading the maximum of a broad band: common practice.
const CR3: SeriesAnalysis[] = [
  { sample: '[CrCl6]3-', ligand: 'Cl', ion: 'Cr3+', tenDq: 13600, tenDqUncertainty: 200 }, // from memory, less certain; f·g = 13 572
  { sample: '[CrF6]3-', ligand: 'F', ion: 'Cr3+', tenDq: 15200, tenDqUncertainty: 200 }, // from memory; f·g = 15 660
  { sample: '[Cr(H2O)6]3+', ligand: 'H2O', ion: 'Cr3+', tenDq: 17400, tenDqUncertainty: 200 }, // Jørgensen's g(Cr3+) = 17 400 (f(H2O) = 1)
  { sample: '[Cr(ox)3]3-', ligand: 'ox', ion: 'Cr3+', tenDq: 17500, tenDqUncertainty: 200 }, // from memory; f·g = 17 226
  { sample: '[Cr(NCS)6]3-', ligand: 'NCS', ion: 'Cr3+', tenDq: 17800, tenDqUncertainty: 200 }, // from memory; f·g = 17 748
  { sample: '[Cr(NH3)6]3+', ligand: 'NH3', ion: 'Cr3+', tenDq: 21550, tenDqUncertainty: 200 }, // from memory; f·g = 21 750
  { sample: '[Cr(en)3]3+', ligand: 'en', ion: 'Cr3+', tenDq: 21900, tenDqUncertainty: 200 }, // from memory; f·g = 22 272
  { sample: '[Cr(CN)6]3-', ligand: 'CN', ion: 'Cr3+', tenDq: 26600, tenDqUncertainty: 200 }, // from memory; f·g = 29 580
];

/** Seeded shuffle (mulberry32), so the test does not depend on the input order. */
function shuffled<T>(list: readonly T[], seed: number): T[] {
  let s = seed >>> 0;
  const random = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const out = [...list];
  for (let i = out.length - 1; i > 0; i -= 1) {
    const j = Math.floor(random() * (i + 1));
    [out[i], out[j]] = [out[j] as T, out[i] as T];
  }
  return out;
}

describe('rankByTenDq', () => {
  it('reproduces the published spectrochemical order for Cr(III)', () => {
    // Spectrochemical series Cl < F < H2O ~ ox < NCS < NH3 < en < CN (the part of
    // I < Br < Cl < F < OH < H2O/ox < NCS < NH3 < en < NO2 < CN for which values are given):
    // common practice; found in the order of Jørgensen's f: Cl- 0.78 < F- 0.90 < ox 0.99 ≈ H2O 1.00 < NCS- 1.02 < NH3 1.25
    // < en 1.28 < CN- 1.7 (Modern Aspects of Ligand Field Theory, 1971, pp. 347–348, via chemprof.tripod.com/fghk.htm)
    for (const seed of [1, 2, 3, 4, 5]) {
      const ranking = rankByTenDq(shuffled(CR3, seed));
      expect(ranking.series).toBe('Cl < F < H2O ~ ox < NCS < NH3 < en < CN');
    }
  });

  it('flags overlaps by the chosen criterion', () => {
    const one = rankByTenDq(CR3);
    expect(one.criterion).toBe('one-sigma');
    expect(one.overlaps).toEqual([{ lower: 3, upper: 4, difference: 100, combinedUncertainty: Math.hypot(200, 200) }]);
    const two = rankByTenDq(CR3, { criterion: 'two-sigma' });
    expect(two.series).toBe('Cl < F < H2O ~ ox ~ NCS < NH3 ~ en < CN');
  });

  it('invariants on seeded random series: sorted, positions 1..n, two-sigma overlaps include one-sigma ones', () => {
    for (let seed = 10; seed < 30; seed += 1) {
      let s = seed;
      const rnd = () => ((s = (s * 16807) % 2147483647) / 2147483647);
      const list: SeriesAnalysis[] = Array.from({ length: 12 }, (_, i) => ({
        sample: `s${i}`, ligand: `L${i}`, tenDq: 8000 + 20000 * rnd(), tenDqUncertainty: 1000 * rnd(),
      }));
      const one = rankByTenDq(list);
      const two = rankByTenDq(list, { criterion: 'two-sigma' });
      expect(one.entries.map((e) => e.position)).toEqual(list.map((_, i) => i + 1));
      for (let i = 1; i < one.entries.length; i += 1) {
        expect(one.entries[i]!.value).toBeGreaterThanOrEqual(one.entries[i - 1]!.value);
      }
      expect(new Set(one.entries.map((e) => e.index)).size).toBe(list.length);
      for (const e of one.entries) if (e.overlapsNext) expect(two.entries[e.position - 1]!.overlapsNext).toBe(true);
    }
  });

  it('labels mixed complexes and keeps ids', () => {
    const ranking = rankByTenDq([
      { id: 'a', sample: 'x', ligands: [{ ligand: 'ammine', count: 5 }, { ligand: 'Cl', count: 1 }], tenDq: 19000 },
      { id: 'b', sample: 'y', ligand: 'aqua', tenDq: 17400 },
    ]);
    expect(ranking.series).toBe('H2O < NH3×5 Cl');
    expect(ranking.entries.map((e) => e.id)).toEqual(['b', 'a']);
  });

  it('errors name the field', () => {
    const err = (list: SeriesAnalysis[]) => {
      try {
        rankByTenDq(list);
      } catch (e) {
        return e as FieldgapError;
      }
      throw new Error('expected an error');
    };
    expect(err([]).message).toBe('analyses: expected at least one analysis');
    expect(err([{ sample: 'a', ligand: 'F', tenDq: -3 }]).path).toBe('analyses[0].tenDq');
    expect(err([{ sample: 'a', ligand: 'F', tenDq: 1, tenDqUncertainty: Number.NaN }]).path).toBe('analyses[0].tenDqUncertainty');
    expect(err([{ sample: 'a', tenDq: 1 }]).path).toBe('analyses[0].ligand');
    const mixed = err([{ sample: 'a', ligand: 'F', tenDq: 1, ion: 'Cr3+' }, { sample: 'b', ligand: 'F', tenDq: 1, ion: 'Co3+' }]);
    expect(mixed.path).toBe('analyses[1].ion');
    expect(mixed.message).toMatch(/Co3\+ differs from Cr3\+ in analyses\[0\]/);
    expect(err([{ sample: 'a', ligand: 'F', tenDq: 1, beta: 3 }]).path).toBe('analyses[0].beta');
  });
});

describe('rankByNephelauxetic', () => {
  it('orders by 1 - beta, least nephelauxetic first, skipping analyses without beta', () => {
    const ranking = rankByNephelauxetic([
      { sample: 'a', ligand: 'Cl', tenDq: 13600, beta: 0.6, betaUncertainty: 0.02 },
      { sample: 'b', ligand: 'F', tenDq: 15200, beta: 0.9, betaUncertainty: 0.02 },
      { sample: 'c', ligand: 'NH3', tenDq: 21550, beta: 0.72, betaUncertainty: 0.02 },
      { sample: 'd', ligand: 'en', tenDq: 21900, beta: 0.71, betaUncertainty: 0.02 },
      { sample: 'e', ligand: 'CN', tenDq: 26600 },
    ]);
    expect(ranking.series).toBe('F < NH3 ~ en < Cl');
    expect(ranking.entries[0]!.value).toBeCloseTo(0.1, 12);
    expect(ranking.skipped).toEqual([{ index: 4, sample: 'e', reason: 'no beta given' }]);
  });
});

describe('valuesOverlap', () => {
  it('is symmetric and uses |Δ| < k·sqrt(σ1² + σ2²)', () => {
    expect(valuesOverlap(0, 3, 4.9, 4)).toBe(true);
    expect(valuesOverlap(0, 3, 5, 4)).toBe(false);
    expect(valuesOverlap(5, 4, 0, 3)).toBe(false);
    expect(valuesOverlap(0, 3, 9.9, 4, 'two-sigma')).toBe(true);
    expect(valuesOverlap(1, 0, 1, 0)).toBe(true);
    expect(valuesOverlap(1, 0, 1.0001, 0)).toBe(false);
  });
});
