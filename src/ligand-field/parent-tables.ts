import { termEnergiesUnitBInto, termEntries, termOrder, type TermEntry } from './free-ion-terms.js';
import { parentTableOf, type ParentTable } from './labels.js';
import { LruCache } from './lru-cache.js';

/**
 * The parent table of d^n at a C/B, cached so that a fit, which changes C/B
 * on every call, does not rebuild it.
 *
 * The table depends on C/B only through the energy order of the free-ion
 * terms (names and components are fixed per d^n), and that order changes
 * only where two terms cross. So two caches: C/B, keyed exactly (no
 * rounding: a rounded key could give the table of the wrong side of a
 * crossing), least recently used dropped beyond BY_C_OVER_B_LIMIT; behind
 * it, the table per term order, keyed by the order itself. A miss on C/B
 * costs the term energies (one 3×3 eigenproblem at most) and a sort of at
 * most 16 terms. The geometry is not part of the key: a table holds the
 * labels of both geometries.
 */

const BY_C_OVER_B_LIMIT = 16;
const BY_ORDER_LIMIT = 64;

interface PerD {
  entries: readonly TermEntry[];
  energies: Float64Array;
  byCOverB: LruCache<number, ParentTable>;
  byOrder: LruCache<string, ParentTable>;
}

const perD: Array<PerD | undefined> = [];

function cachesFor(n: number): PerD {
  let hit = perD[n];
  if (!hit) {
    const entries = termEntries(n);
    hit = {
      entries,
      energies: new Float64Array(entries.length),
      byCOverB: new LruCache(BY_C_OVER_B_LIMIT),
      byOrder: new LruCache(BY_ORDER_LIMIT),
    };
    perD[n] = hit;
  }
  return hit;
}

/** The parent table of d^n (1..9) at C/B = cOverB (≥ 0). Shared: do not modify. */
export function parentTableFor(n: number, cOverB: number): ParentTable {
  const caches = cachesFor(n);
  const hit = caches.byCOverB.get(cOverB);
  if (hit) return hit;
  const order = termOrder(caches.entries, termEnergiesUnitBInto(n, cOverB, caches.energies));
  const key = String.fromCharCode(...order);
  let table = caches.byOrder.get(key);
  if (!table) {
    table = parentTableOf(order.map((i) => caches.entries[i]!));
    caches.byOrder.set(key, table);
  }
  caches.byCOverB.set(cOverB, table);
  return table;
}
