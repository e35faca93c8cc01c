import { describe, expect, it, vi } from 'vitest';
import { freeIonRecordsUnitB, termEnergiesUnitBInto, termEntries, termOrder } from '../../src/ligand-field/free-ion-terms.js';
import { parentTableOf } from '../../src/ligand-field/labels.js';
import { LruCache } from '../../src/ligand-field/lru-cache.js';
import { parentTableFor } from '../../src/ligand-field/parent-tables.js';
import type { FieldParameters, Geometry, LevelsResult } from '../../src/ligand-field/types.js';
import { seededRandom } from '../reference/seeded-random.js';

/** The parent table built from scratch (no cache) from the free-ion records at C/B. */
function freshTable(d: number, cOverB: number) {
  return parentTableOf(freeIonRecordsUnitB(d, cOverB).map(({ term, components }) => ({ name: term.term, components })));
}

const tableContent = (table: ReturnType<typeof parentTableFor>) => ({
  parents: table.parents,
  octahedral: table.labels('octahedral'),
  tetrahedral: table.labels('tetrahedral'),
});

/** The term order of d^n at C/B as one string. */
function orderAt(d: number, cOverB: number): string {
  const entries = termEntries(d);
  return termOrder(entries, termEnergiesUnitBInto(d, cOverB, new Float64Array(entries.length))).join(',');
}

describe('LruCache', () => {
  it('keeps at most limit entries and drops the least recently used', () => {
    const cache = new LruCache<number, string>(2);
    cache.set(1, 'a');
    cache.set(2, 'b');
    expect(cache.get(1)).toBe('a'); // 1 is now the most recent
    cache.set(3, 'c');
    expect(cache.size).toBe(2);
    expect(cache.get(2)).toBeUndefined();
    expect(cache.get(1)).toBe('a');
    expect(cache.get(3)).toBe('c');
  });

  it('keys numbers exactly: 4.5 and the next double up are different entries', () => {
    const cache = new LruCache<number, string>(4);
    const next = 4.5 + 2 ** -50;
    cache.set(4.5, 'at');
    expect(cache.get(next)).toBeUndefined();
    cache.set(next, 'above');
    expect(cache.get(4.5)).toBe('at');
    expect(cache.get(next)).toBe('above');
  });
});

describe('parent tables per C/B', () => {
  it('equal a table built from scratch, at random C/B and on both sides of every term crossing in 0 ≤ C/B ≤ 8', () => {
    const random = seededRandom(5);
    for (let d = 1; d <= 9; d++) {
      const points = Array.from({ length: 20 }, () => 8 * random());
      // Bisect each change of term order down to adjacent doubles, and test both sides.
      for (let x = 0; x < 8; x += 0.05) {
        let [lo, hi] = [x, x + 0.05];
        if (orderAt(d, lo) === orderAt(d, hi)) continue;
        const low = orderAt(d, lo);
        for (let i = 0; i < 200 && hi - lo > 2 * Number.EPSILON * hi; i++) {
          const mid = (lo + hi) / 2;
          if (orderAt(d, mid) === low) lo = mid;
          else hi = mid;
        }
        points.push(lo, hi);
      }
      // The cache is filled in this order and read again in reverse, so hits and misses both occur.
      for (const cOverB of [...points, ...[...points].reverse()]) {
        expect(tableContent(parentTableFor(d, cOverB)), `d${d} C/B = ${cOverB}`).toEqual(tableContent(freshTable(d, cOverB)));
      }
    }
  });
});

describe('computeLevels keeps no state between calls', () => {
  const cases: Array<[number, Geometry, FieldParameters]> = [
    [5, 'octahedral', { dq: 1500, b: 800, c: 3600 }],
    [5, 'octahedral', { dq: 1500, b: 800, c: 2400 }],
    [5, 'octahedral', { dq: 0, b: 800, c: 3600 }],
    [5, 'tetrahedral', { dq: 400, b: 750, c: 3400 }],
    [4, 'octahedral', { dq: 2100, b: 700, c: 3100 }],
    [6, 'octahedral', { dq: 2000, b: 650, c: 2900 }],
    [6, 'octahedral', { dq: 2000, b: 650, c: 2900.0000001 }],
    [3, 'octahedral', { dq: 1740, b: 650, c: 3250 }],
    [2, 'tetrahedral', { dq: 450, b: 600, c: 2700 }],
    [8, 'octahedral', { dq: 850, b: 900, c: 3800 }],
    [1, 'octahedral', { dq: 2000, b: 1, c: 4.5 }],
    [9, 'tetrahedral', { dq: 600, b: 1000, c: 0 }],
  ];

  it('interleaved calls (d, geometry and C/B changing every call) equal fresh results from an empty module', async () => {
    const fresh: LevelsResult[] = [];
    for (const [d, geometry, params] of cases) {
      vi.resetModules(); // a new module instance: every cache starts empty
      const { computeLevels } = await import('../../src/ligand-field/index.js');
      fresh.push(computeLevels(d, geometry, params));
    }
    vi.resetModules();
    const { computeLevels } = await import('../../src/ligand-field/index.js');
    const random = seededRandom(9);
    for (let round = 0; round < 30; round++) {
      const i = Math.floor(random() * cases.length);
      const [d, geometry, params] = cases[i]!;
      expect(computeLevels(d, geometry, { ...params }), `round ${round}, case ${i}`).toEqual(fresh[i]);
    }
  });

  it('a result is the caller’s own: changing it does not change the next result', async () => {
    const { computeLevels } = await import('../../src/ligand-field/index.js');
    const first = computeLevels(5, 'octahedral', { dq: 1500, b: 800, c: 3600 });
    const copy = structuredClone(first);
    first.levels[3]!.label = 'changed';
    first.levels.pop();
    first.notes.push('changed');
    expect(computeLevels(5, 'octahedral', { dq: 1500, b: 800, c: 3600 })).toEqual(copy);
  });
});
