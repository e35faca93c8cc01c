import { describe, expect, it } from 'vitest';
import { BoundedCache } from '../../../web/plots/lru.js';

/** Slow, obviously correct reference: an array of [key, value], most recent last. */
function referenceRun(limit: number, ops: readonly ['get' | 'set', number][]): { keys: number[]; hits: (number | undefined)[] } {
  let list: [number, number][] = [];
  const hits: (number | undefined)[] = [];
  for (const [op, key] of ops) {
    const found = list.find(([k]) => k === key);
    if (op === 'get') {
      hits.push(found?.[1]);
      if (found !== undefined) list = [...list.filter(([k]) => k !== key), found];
    } else {
      list = [...list.filter(([k]) => k !== key), [key, key * 10]];
      if (list.length > limit) list = list.slice(list.length - limit);
    }
  }
  return { keys: list.map(([k]) => k), hits };
}

describe('BoundedCache (the diagram cache of the page)', () => {
  it('never holds more than its limit and forgets the least recently used first', () => {
    const cache = new BoundedCache<string, number>(3);
    cache.set('a', 1);
    cache.set('b', 2);
    cache.set('c', 3);
    expect(cache.get('a')).toBe(1); // a is now the most recent
    cache.set('d', 4); // b, the least recently used, goes
    expect(cache.size).toBe(3);
    expect(cache.has('b')).toBe(false);
    expect(cache.keys()).toEqual(['c', 'a', 'd']);
    cache.set('c', 30); // overwriting refreshes, does not grow
    expect(cache.keys()).toEqual(['a', 'd', 'c']);
    expect(cache.get('c')).toBe(30);
    expect(cache.delete('a')).toBe(true);
    expect(cache.get('a')).toBeUndefined();
  });

  it('stays bounded at 16 over many distinct keys, as the page uses it', () => {
    const cache = new BoundedCache<number, number>(16);
    for (let i = 0; i < 1000; i++) cache.set(i, i);
    expect(cache.size).toBe(16);
    expect(cache.keys()).toEqual(Array.from({ length: 16 }, (_, i) => 984 + i));
  });

  it('agrees with a list-based reference on a bounded pseudo-random mix of gets and sets', () => {
    let seed = 12345;
    const next = (): number => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed;
    };
    const ops: ['get' | 'set', number][] = Array.from({ length: 2000 }, () => [next() % 3 === 0 ? 'get' : 'set', next() % 12]);
    const cache = new BoundedCache<number, number>(5);
    const hits: (number | undefined)[] = [];
    for (const [op, key] of ops) {
      if (op === 'get') hits.push(cache.get(key));
      else cache.set(key, key * 10);
    }
    const reference = referenceRun(5, ops);
    expect(hits).toEqual(reference.hits);
    expect(cache.keys()).toEqual(reference.keys);
  });

  it('refuses a limit that is not a positive integer', () => {
    expect(() => new BoundedCache(0)).toThrow(RangeError);
    expect(() => new BoundedCache(2.5)).toThrow(RangeError);
  });
});
