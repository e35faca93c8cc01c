/**
 * The refinement's fast path (src/fit/assigned-level-energies.ts) against
 * the slow path it replaces, the labelled levels of computeLevels and a Map
 * by key: the same numbers bit for bit (Object.is, NaN included) for every
 * d^n, both geometries, seeded Dq, B, C and every level key, and the same
 * errors for parameters computeLevels refuses. A check of the fast path
 * against the project's own engine, not an outside value (the engine's own
 * outside checks are in tests/ligand-field).
 */
import { describe, expect, it } from 'vitest';
import { assignedIdentitiesOf, assignedLevelEnergies, levelIdentityOf, slowAssignedEnergies } from '../../src/fit/assigned-level-energies.js';
import { levelIdentityKey } from '../../src/fit/scan.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import type { FieldParameters, Geometry } from '../../src/ligand-field/types.js';
import { seededRandom } from '../reference/seeded-random.js';

const GEOMETRIES: Geometry[] = ['octahedral', 'tetrahedral'];

function both(d: number, geometry: Geometry, params: FieldParameters, groundKey: string, keys: string[]): [Float64Array, Float64Array] {
  const fast = new Float64Array(keys.length);
  const slow = new Float64Array(keys.length);
  assignedLevelEnergies(d, geometry, params, groundKey, keys, assignedIdentitiesOf(groundKey, keys, geometry), fast);
  slowAssignedEnergies(d, geometry, params, groundKey, keys, slow);
  return [fast, slow];
}

function expectSameBits(fast: Float64Array, slow: Float64Array): void {
  expect(fast.length).toBe(slow.length);
  for (let i = 0; i < fast.length; i++) {
    if (!Object.is(fast[i], slow[i])) expect({ i, fast: fast[i] }).toEqual({ i, fast: slow[i] });
  }
}

describe('assignedLevelEnergies (fast path of the refinement)', () => {
  it('gives the slow path bit for bit for d1-d9, both geometries, seeded parameters and every level as ground and as band', () => {
    const random = seededRandom(1919);
    let compared = 0;
    for (let d = 1; d <= 9; d++) {
      for (const geometry of GEOMETRIES) {
        for (let trial = 0; trial < 6; trial++) {
          const b = 300 + random() * 800;
          // Weak to strong fields, both sides of every spin crossover; trial 0 at a tiny Dq (near-coincident free-ion components).
          const dq = trial === 0 ? 1e-3 * b : random() * 4 * b;
          const params = { dq, b, c: (3 + random() * 3) * b };
          const keys = computeLevels(d, geometry, params).levels.map((l) => levelIdentityKey(l));
          for (const groundKey of [keys[0]!, keys[Math.floor(random() * keys.length)]!]) {
            const [fast, slow] = both(d, geometry, params, groundKey, keys);
            expectSameBits(fast, slow);
            compared += keys.length;
          }
        }
      }
    }
    expect(compared).toBeGreaterThan(1000);
  });

  it('falls back to the slow path where computeLevels does more (Dq = 0, a Trees alpha, d10), with the same numbers', () => {
    for (const [d, params] of [[3, { dq: 0, b: 700, c: 2800 }], [4, { dq: 1500, b: 700, c: 2800, alpha: 70 }], [8, { dq: 0, b: 900, c: 3600 }]] as const) {
      const keys = computeLevels(d, 'octahedral', params).levels.map((l) => levelIdentityKey(l));
      const [fast, slow] = both(d, 'octahedral', params, keys[0]!, keys);
      expectSameBits(fast, slow);
    }
    const [fast, slow] = both(10, 'octahedral', { dq: 1000, b: 700, c: 2800 }, '1A1g#0', ['1A1g#0', '3T1g#0']);
    expectSameBits(fast, slow);
    expect(Number.isNaN(fast[1])).toBe(true);
  });

  it('answers NaN for keys no level has, as the slow path does', () => {
    const keys = ['4A2g#0', '4T2g#0', '4T2g#7', '9A1g#0', 'nonsense', '4T2#0'];
    const [fast, slow] = both(3, 'octahedral', { dq: 1700, b: 700, c: 2800 }, '4A2g#0', keys);
    expectSameBits(fast, slow);
    expect([...fast].map(Number.isNaN)).toEqual([false, false, true, true, true, true]);
    const missingGround = both(3, 'octahedral', { dq: 1700, b: 700, c: 2800 }, '2Eg#5', ['4T2g#0']);
    expectSameBits(...missingGround);
  });

  it('refuses what computeLevels refuses, with the same error', () => {
    for (const params of [{ dq: -1, b: 700, c: 2800 }, { dq: 1000, b: 0, c: 2800 }, { dq: 1000, b: 700, c: Number.NaN }]) {
      const slowError = (() => {
        try {
          computeLevels(3, 'octahedral', params);
        } catch (error) {
          return error;
        }
        return undefined;
      })();
      expect(slowError).toBeDefined();
      expect(() => assignedLevelEnergies(3, 'octahedral', params, '4A2g#0', ['4T2g#0'], assignedIdentitiesOf('4A2g#0', ['4T2g#0'], 'octahedral'), new Float64Array(1))).toThrow(
        (slowError as Error).message,
      );
    }
  });

  it('reads a level key as 2S, irrep column and rank for the geometry', () => {
    expect(levelIdentityOf('4T1g#1', 'octahedral')).toEqual({ twoS: 3, irrep: 3, rank: 1 });
    expect(levelIdentityOf('3A2#0', 'tetrahedral')).toEqual({ twoS: 2, irrep: 1, rank: 0 });
    expect(levelIdentityOf('3A2#0', 'octahedral')).toBeNull();
    expect(levelIdentityOf('2Eg', 'octahedral')).toBeNull();
  });
});
