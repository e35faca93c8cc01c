/**
 * Bands whose energy rests on an assumed C (src/fit/c-sensitivity.ts,
 * likelihood.ts "Positions"): ∂ΔE/∂C, the σ it adds, and what that does to
 * a fit.
 *
 * Every check here is against the project's own engine or its dense
 * reference Hamiltonian (tests/reference/), not an outside value: the
 * derivative is a property of the model, and the outside checks of the
 * engine itself are in tests/ligand-field/.
 */
import { describe, expect, it } from 'vitest';
import {
  assumedCOverBSd, cOverBPriorSd, scanTransitionCDerivatives, transitionCDerivatives,
} from '../../src/fit/c-sensitivity.js';
import { fitLigandField } from '../../src/fit/index.js';
import { cachedLevelScan, levelIdentityKey } from '../../src/fit/scan.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import type { FieldParameters, Geometry, Level } from '../../src/ligand-field/types.js';
import { denseHamiltonian } from '../reference/dense-hamiltonian.js';
import { jacobiEigen } from '../reference/jacobi-eigen.js';
import { seededRandom } from '../reference/seeded-random.js';

/**
 * Slow reference: Hellmann–Feynman on the dense Hamiltonian over all C(10, n)
 * determinants. H is linear in (Dq, B, C), so ∂H/∂C is the dense matrix at
 * Dq = B = 0, C = 1; a level's ∂E/∂C is ⟨ψ|∂H/∂C|ψ⟩ averaged over its
 * degenerate eigenvectors (the trace over the level, whatever basis the
 * eigensolver picks in it). Returns, per engine level, that mean, or NaN
 * where the level's energy cluster is not exactly its own (an accidental
 * degeneracy with another level).
 */
function hellmannFeynman(d: number, geometry: Geometry, params: FieldParameters, levels: readonly Level[]): number[] {
  const h = denseHamiltonian(d, geometry, params);
  const dH = denseHamiltonian(d, geometry, { dq: 0, b: 0, c: 1 });
  const { values, vectors } = jacobiEigen(h);
  const size = values.length;
  const ground = Math.min(...values);
  const expectation = values.map((_, j) => {
    let sum = 0;
    for (let a = 0; a < size; a++) {
      let row = 0;
      for (let b = 0; b < size; b++) row += dH[a]![b]! * vectors[b]![j]!;
      sum += vectors[a]![j]! * row;
    }
    return sum;
  });
  const scale = Math.max(...values) - ground;
  return levels.map((level) => {
    const members = values.map((_, j) => j).filter((j) => Math.abs(values[j]! - ground - level.energy) <= 1e-7 * scale);
    if (members.length !== level.degeneracy) return Number.NaN;
    return members.reduce((s, j) => s + expectation[j]!, 0) / members.length;
  });
}

const randomParams = (random: () => number): FieldParameters => {
  const b = 500 + 500 * random();
  return { dq: 400 + 2600 * random(), b, c: b * (3.5 + 2 * random()) };
};

describe('∂ΔE/∂C: engine central difference against dense Hellmann–Feynman (own engine vs own dense reference)', () => {
  describe.each(['octahedral', 'tetrahedral'] as const)('%s', (geometry) => {
    it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i, seeded Dq, B, C', (d) => {
      const random = seededRandom(7100 + 10 * d + (geometry === 'octahedral' ? 1 : 2));
      const params = randomParams(random);
      const levels = computeLevels(d, geometry, params).levels;
      const groundKey = levelIdentityKey(levels[0]!);
      const keys = levels.map(levelIdentityKey);
      const fast = transitionCDerivatives(d, geometry, params, groundKey, keys);
      const reference = hellmannFeynman(d, geometry, params, levels);
      const groundReference = reference[0]!;
      let compared = 0;
      levels.forEach((_, i) => {
        if (!Number.isFinite(reference[i]!) || !Number.isFinite(groundReference)) return;
        const expected = reference[i]! - groundReference;
        // Central difference with h = 1e-3·C: exact for H linear in C up to the curvature of E(C), tiny here.
        expect(Math.abs(fast[i]! - expected)).toBeLessThanOrEqual(1e-4 + 1e-4 * Math.abs(expected));
        compared++;
      });
      // d1 and d9 have one level pair only (the ground and one excited level, C-free): the rest have many.
      expect(compared).toBeGreaterThanOrEqual(d === 1 || d === 9 ? 2 : 5);
      if (d === 1 || d === 9) expect(Array.from(fast)).toEqual([0, 0]);
    });
  });
});

describe('∂ΔE/∂C on the scan (fast) against the engine central difference (slow); own engine', () => {
  it.each([2, 3, 4, 5, 6, 7, 8])('d%i octahedral at seeded Dq/B between grid points', (d) => {
    const random = seededRandom(9300 + d);
    const scan = cachedLevelScan(d, 'octahedral', 4.2);
    for (let t = 0; t < 4; t++) {
      const j = 5 + Math.floor(random() * (scan.x.length - 10));
      if (scan.ground[j - 1] !== scan.ground[j + 2]) continue; // not across the spin crossover
      const x = scan.x[j]! + random() * (scan.x[j + 1]! - scan.x[j]!);
      const b = 700;
      const ground = scan.ground[j]!;
      const levels = Int32Array.from({ length: scan.ids.length }, (_, k) => k).filter((k) => k !== ground);
      const fast = scanTransitionCDerivatives(scan, ground, levels, x);
      const slow = transitionCDerivatives(d, 'octahedral', { dq: x * b, b, c: 4.2 * b }, scan.ids[ground]!.key, Array.from(levels, (k) => scan.ids[k]!.key));
      levels.forEach((_, i) => {
        if (!Number.isFinite(slow[i]!)) return;
        // Interpolated in Dq/B between grid nodes (steps ≤ 0.25): a few hundredths of a unit at worst.
        expect(Math.abs(fast[i]! - slow[i]!)).toBeLessThanOrEqual(0.05 + 0.01 * Math.abs(slow[i]!));
      });
    }
  });
});

describe('which bands are widened', () => {
  it('gives exactly 0 for the spin-allowed transitions of d3 and d8 and not for their spin-forbidden ones (own engine)', () => {
    for (const [d, multiplicity] of [[3, 4], [8, 3]] as const) {
      const params = { dq: 1500, b: 750, c: 3200 };
      const levels = computeLevels(d, 'octahedral', params).levels;
      const keys = levels.map(levelIdentityKey);
      const g = transitionCDerivatives(d, 'octahedral', params, keys[0]!, keys);
      levels.forEach((level, i) => {
        if (level.multiplicity === multiplicity) expect(g[i]).toBe(0);
      });
      expect(levels.some((level, i) => level.multiplicity !== multiplicity && Math.abs(g[i]!) > 0.5)).toBe(true);
    }
  });

  it('takes σ(C/B) from the prior only when C/B is assumed', () => {
    // Two-piece normal with σ 1.2 and 2.0: √((1 − 2/π)·0.8² + 2.4) (moments of the split normal, common practice).
    expect(cOverBPriorSd()).toBeCloseTo(Math.sqrt((1 - 2 / Math.PI) * 0.64 + 2.4), 12);
    expect(cOverBPriorSd(1, 1)).toBeCloseTo(1, 12);
    expect(assumedCOverBSd({ mode: 'ratio', cOverBGiven: false })).toBeCloseTo(1.623, 3);
    expect(assumedCOverBSd({ mode: 'ratio', cOverBGiven: true })).toBe(0);
    expect(assumedCOverBSd({ mode: 'free', cOverBGiven: false })).toBe(0);
    expect(assumedCOverBSd({ mode: 'fixed', cOverBGiven: false })).toBe(0);
  });

  it('leaves spin-allowed d3 and d8 fits as they were: the same as with the C/B stated (σ_C = 0 by rule)', () => {
    // Own-engine check: the assumed and the stated ratio are the same number, so any difference would come from
    // a widened band; with ∂ΔE/∂C = 0 there is none.
    for (const [ion, bands, ratio] of [['Cr3+', '17400,24600', 0], ['Ni2+', '8500,13800,25300', 0]] as const) {
      const assumed = fitLigandField({ ion, bands });
      const stated = fitLigandField({ ion, bands, cOverB: assumed.cOverB! + ratio });
      expect(assumed.assignments.every((a) => a.sigmaFromC === undefined)).toBe(true);
      expect(assumed.tenDq).toBe(stated.tenDq);
      expect(assumed.b).toBe(stated.b);
      expect(assumed.chiSquare).toBe(stated.chiSquare);
      expect(assumed.uncertainty).toEqual(stated.uncertainty);
    }
  });

  it('widens the sharp Cr(III) line: its label (2Eg or 2T1g) no longer moves B by more than the fit σ', () => {
    // Own-engine check on an invented band list (positions of the kind hexaaqua Cr(III) shows).
    for (const line of [14400, 14900]) {
      const fit = fitLigandField({ ion: 'Cr3+', bands: `17400,24600,${line}:sf` });
      const sharp = fit.assignments.find((a) => a.observed === line)!;
      expect(sharp.sigmaFromC).toBeGreaterThan(1000); // ≈ 3·B·1.62
      expect(fit.assignments.filter((a) => a.observed !== line).every((a) => a.sigmaFromC === undefined)).toBe(true);
      const spread = fit.assignmentSpread!;
      expect(spread.spread.b).toBeLessThanOrEqual(spread.fitUncertainty.b!);
      // B as the two spin-allowed bands give it, within a small fraction of its σ.
      const twoBands = fitLigandField({ ion: 'Cr3+', bands: '17400,24600' });
      expect(Math.abs(fit.b! - twoBands.b!)).toBeLessThan(0.25 * fit.uncertainty.b!);
      expect(fit.notes.some((n) => n.includes('depends on C') && n.includes(`${line} cm-1 by`))).toBe(true);
    }
  });

  it('carries the assumed C/B into the covariance as one shared shift: low-spin Co(III) refitted at C/B ± 0.3', () => {
    // Own-engine check, independent of the derivative code: refits with the ratio stated (no widening) give
    // d10Dq/d(C/B) and dB/d(C/B); the reported σ² must be the stated fit's σ² plus (slope·σ(C/B))².
    // 1T1g ≈ 10Dq − C and 1T2g ≈ 10Dq + 16B − C move together with C: 10Dq takes C's spread, B hardly any.
    const bands = '16600,24700';
    const assumed = fitLigandField({ ion: 'Co3+', bands });
    expect(assumed.assignments.every((a) => (a.sigmaFromC ?? 0) > 0)).toBe(true);
    const ratio = assumed.cOverB!;
    const step = 0.3;
    const stated = fitLigandField({ ion: 'Co3+', bands, cOverB: ratio });
    const up = fitLigandField({ ion: 'Co3+', bands, cOverB: ratio + step });
    const down = fitLigandField({ ion: 'Co3+', bands, cOverB: ratio - step });
    const sd = cOverBPriorSd();
    const expected = (sigma: number, slope: number) => Math.hypot(sigma, slope * sd);
    const tenDq = expected(stated.uncertainty.tenDq!, (up.tenDq - down.tenDq) / (2 * step));
    const b = expected(stated.uncertainty.b!, (up.b! - down.b!) / (2 * step));
    expect(Math.abs(assumed.uncertainty.tenDq! / tenDq - 1)).toBeLessThan(0.02);
    expect(Math.abs(assumed.uncertainty.b! / b - 1)).toBeLessThan(0.02);
    expect(assumed.uncertainty.tenDq!).toBeGreaterThan(3 * stated.uncertainty.tenDq!);
  });

  it('does not widen a line when C/B is stated or C is fitted', () => {
    const stated = fitLigandField({ ion: 'Cr3+', bands: '17400,24600,14900:sf', cOverB: 4.19 });
    expect(stated.assignments.every((a) => a.sigmaFromC === undefined)).toBe(true);
  });
});
