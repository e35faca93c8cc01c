/**
 * A map that keeps at most `limit` entries and forgets the least recently
 * used one first. Kept here rather than taken from lru-cache/quick-lru: the
 * page needs only get/set/delete on a JavaScript Map (which iterates in
 * insertion order, so re-inserting on use makes the first key the oldest),
 * and a new dependency would add a package and a lockfile change for 30 lines.
 */
export class BoundedCache<K, V> {
  private readonly entries = new Map<K, V>();

  constructor(readonly limit: number) {
    if (!Number.isInteger(limit) || limit < 1) throw new RangeError(`BoundedCache limit must be a positive integer, got ${limit}`);
  }

  get size(): number {
    return this.entries.size;
  }

  has(key: K): boolean {
    return this.entries.has(key);
  }

  /** The value, which becomes the most recently used; undefined when absent. */
  get(key: K): V | undefined {
    if (!this.entries.has(key)) return undefined;
    const value = this.entries.get(key) as V;
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  /** Stores the value as the most recently used, forgetting the oldest entries beyond the limit. */
  set(key: K, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, value);
    while (this.entries.size > this.limit) {
      const oldest = this.entries.keys().next().value as K;
      this.entries.delete(oldest);
    }
  }

  delete(key: K): boolean {
    return this.entries.delete(key);
  }

  /** Keys from least to most recently used. */
  keys(): K[] {
    return [...this.entries.keys()];
  }
}
