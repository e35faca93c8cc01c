/**
 * A Map bounded in size that drops its least recently used entry. Keys are
 * compared as Map keys (SameValueZero): numbers exactly, never rounded.
 */
export class LruCache<K, V> {
  readonly #entries = new Map<K, V>();
  readonly #limit: number;

  /** limit: most entries kept (≥ 1). */
  constructor(limit: number) {
    this.#limit = Math.max(1, Math.floor(limit));
  }

  get size(): number {
    return this.#entries.size;
  }

  /** The value under key, marked as most recently used; undefined when absent. */
  get(key: K): V | undefined {
    const value = this.#entries.get(key);
    if (value !== undefined) {
      // Map keeps insertion order: re-inserting moves the key to the young end.
      this.#entries.delete(key);
      this.#entries.set(key, value);
    }
    return value;
  }

  /** Stores value under key as most recently used, dropping the oldest entry when full. */
  set(key: K, value: V): void {
    this.#entries.delete(key);
    if (this.#entries.size >= this.#limit) this.#entries.delete(this.#entries.keys().next().value as K);
    this.#entries.set(key, value);
  }
}
