/**
 * The unit-B level scan a fit starts from.
 *
 * Every level energy is homogeneous of degree 1 in (Dq, B, C):
 * E(Dq, B, C) = B·e(Dq/B, C/B). At a fixed C/B the reduced energies e(x),
 * x = Dq/B, do not depend on the bands, so they are computed once per
 * (d, geometry, C/B) on a grid of x and cached. Levels are identified across
 * the grid by (multiplicity, irrep, rank): levels of one (S, Γ) never cross,
 * so the rank is a stable identity as Dq varies.
 *
 * Layout: energies[j·ids.length + k] = e of level k at x[j], in units of B,
 * above the ground level at x[j]; ground[j] is the index of that ground level.
 */
import { levelsAt as computeLevels } from './engine.js';
import type { Geometry, Level } from '../ligand-field/types.js';

export interface LevelIdentity {
  /** "4T1g#1": multiplicity, irrep, rank. */
  key: string;
  multiplicity: number;
  irrep: string;
  rank: number;
  term: string;
  parent: string;
  label: string;
}

export interface LevelScan {
  d: number;
  geometry: Geometry;
  cOverB: number;
  /** Dq/B at each grid point, ascending, > 0. */
  x: Float64Array;
  ids: LevelIdentity[];
  /** Index of each key in ids. */
  index: Map<string, number>;
  /** Row-major (x index, level index): E/B above the ground level at that x. */
  energies: Float64Array;
  /** ids index of the ground level at each x. */
  ground: Int32Array;
}

/** "4T1g#1". */
export function levelIdentityKey(level: Pick<Level, 'multiplicity' | 'irrep' | 'rank'>): string {
  return `${level.multiplicity}${level.irrep}#${level.rank}`;
}

/**
 * The default grid of Dq/B: steps of 0.02 up to 1 (tetrahedral fields and
 * weak-field ions live here), 0.04 up to 4, 0.1 up to 8, 0.25 up to 12
 * (strong-field low-spin ions and tetrahedral spin crossovers). 
 */
export function defaultDqOverBGrid(): Float64Array {
  const x: number[] = [];
  const segment = (from: number, to: number, step: number) => {
    for (let v = from + step; v <= to + 1e-9; v += step) x.push(Math.round(v * 1e6) / 1e6);
  };
  segment(0, 1, 0.02);
  segment(1, 4, 0.04);
  segment(4, 8, 0.1);
  segment(8, 12, 0.25);
  return Float64Array.from(x);
}

/** Reduced energies of every level on a grid of Dq/B at fixed C/B (not cached). */
export function scanLevels(d: number, geometry: Geometry, cOverB: number, x: Float64Array = defaultDqOverBGrid()): LevelScan {
  const ids: LevelIdentity[] = [];
  const index = new Map<string, number>();
  const rows: Level[][] = [];
  const ground = new Int32Array(x.length);
  x.forEach((xj, j) => {
    const result = computeLevels(d, geometry, { dq: xj, b: 1, c: cOverB });
    rows.push(result.levels);
    result.levels.forEach((level, i) => {
      const key = levelIdentityKey(level);
      if (!index.has(key)) {
        index.set(key, ids.length);
        const { multiplicity, irrep, rank, term, parent, label } = level;
        ids.push({ key, multiplicity, irrep, rank, term, parent, label });
      }
      if (i === 0) ground[j] = index.get(key)!;
    });
  });
  const energies = new Float64Array(x.length * ids.length).fill(Number.NaN);
  rows.forEach((levels, j) => {
    for (const level of levels) energies[j * ids.length + index.get(levelIdentityKey(level))!] = level.energy;
  });
  return { d, geometry, cOverB, x, ids, index, energies, ground };
}

const cache = new Map<string, LevelScan>();
/** Scans kept; each is ~200 × 43 doubles. */
const CACHE_LIMIT = 64;

/** scanLevels on the default grid, cached per (d, geometry, C/B rounded to 1e-6). */
export function cachedLevelScan(d: number, geometry: Geometry, cOverB: number): LevelScan {
  const key = `${d}|${geometry}|${cOverB.toFixed(6)}`;
  const hit = cache.get(key);
  if (hit) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const scan = scanLevels(d, geometry, cOverB);
  cache.set(key, scan);
  if (cache.size > CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  return scan;
}

/** The distinct ground levels along the scan (ids indices), in order of increasing Dq/B. */
export function scanGroundLevels(scan: LevelScan): number[] {
  const seen: number[] = [];
  for (const g of scan.ground) if (!seen.includes(g)) seen.push(g);
  return seen;
}

/**
 * For each level, how many electrons its strong-field configuration has in
 * the upper orbital set beyond those of `ground`'s: the slope dE/dDq at the
 * strong-field end of the scan is 10 per electron promoted (t2g → eg in an
 * octahedron, e → t2 in a tetrahedron). A transition with |count| ≥ 2 is a
 * two-electron jump, expected weak.
 */
export function promotedElectrons(scan: LevelScan, ground: number): Int32Array {
  let perScan = promotedCache.get(scan);
  if (!perScan) promotedCache.set(scan, (perScan = new Map()));
  const hit = perScan.get(ground);
  if (hit) return hit;
  const counts = promotedElectronsUncached(scan, ground);
  perScan.set(ground, counts);
  return counts;
}

const promotedCache = new WeakMap<LevelScan, Map<number, Int32Array>>();

function promotedElectronsUncached(scan: LevelScan, ground: number): Int32Array {
  const n = scan.ids.length;
  const last = scan.x.length - 1;
  const dx = scan.x[last]! - scan.x[last - 1]!;
  const slope = (k: number) => (scan.energies[last * n + k]! - scan.energies[(last - 1) * n + k]!) / dx;
  const zero = slope(ground);
  return Int32Array.from({ length: n }, (_, k) => Math.round((slope(k) - zero) / 10));
}
