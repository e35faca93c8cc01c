import { cubicBlockEigenvalues } from './block-spectra.js';
import type { CubicBlocks } from './blocks.js';
import { clusterIrrepsByCharacters } from './cluster-characters.js';
import { CUBIC_IRREPS, irrepFromChannelCounts, type ChannelCounts } from './cubic-group.js';
import type { CubicIrrep } from './types.js';

/**
 * From block eigenvalues to (S, Γ) levels.
 *
 * Spin: the levels of spin S are the eigenvalues of block M_S = S less (as a
 * multiset, per C4 block) those of M_S = S + 1; blocks.ts gets them at once
 * by diagonalising H on the kernel of S+ in M_S = S. Symmetry: eigenvalues of one
 * spin within tol of each other form a cluster; its counts in the symmetry
 * channels (k = M_L mod 4 and C2(x) parity) name the irrep (see cubic-group.ts). Clusters
 * with any other count pattern are reduced by the characters of O
 * (cluster-characters.ts), which is exact for any degeneracy.
 */
export interface RawLevel {
  /** 2S. */
  twoS: number;
  irrep: CubicIrrep;
  /** cm-1, on the Hamiltonian's own zero (not yet from the ground level). */
  energy: number;
  /** Filled in by levels.ts: 0-based rank among levels of the same (S, Γ). */
  rank: number;
}

interface Cluster {
  energy: number;
  lo: number;
  hi: number;
  counts: ChannelCounts;
}

/** Clusters of the spin-S eigenvalues, given per channel (each sorted). */
function clustersOf(perChannel: readonly Float64Array[], tol: number): Cluster[] {
  const items: Array<[number, number]> = [];
  perChannel.forEach((values, channel) => {
    for (const e of values) items.push([e, channel]);
  });
  items.sort((x, y) => x[0] - y[0]);
  const clusters: Cluster[] = [];
  for (let i = 0; i < items.length; ) {
    let j = i + 1;
    while (j < items.length && items[j]![0] - items[j - 1]![0] <= tol) j++;
    const counts: ChannelCounts = [0, 0, 0, 0, 0];
    let sum = 0;
    for (let t = i; t < j; t++) {
      counts[items[t]![1]]!++;
      sum += items[t]![0];
    }
    clusters.push({ energy: sum / (j - i), lo: items[i]![0] - tol, hi: items[j - 1]![0] + tol, counts });
    i = j;
  }
  return clusters;
}

/**
 * Levels of every spin at parameters [dq, b, c]. expected(twoS, irrep) gives
 * the number of (S, Γ) levels the free-ion terms predict; a spin whose count
 * disagrees (only possible when an A1 + A2 pair coincided and read as E) is
 * redone with characters for every E-pattern cluster.
 */
export function rawLevels(
  blocks: CubicBlocks,
  coefficients: readonly number[],
  tol: number,
  expected: (twoS: number, irrep: CubicIrrep) => number,
): RawLevel[] {
  const values = cubicBlockEigenvalues(blocks, coefficients);
  const levels: RawLevel[] = [];
  for (let s = blocks.twoSValues.length - 1; s >= 0; s--) {
    const twoS = blocks.twoSValues[s]!;
    const clusters = clustersOf(values[s]!, tol);
    const resolve = (forceCharacters: boolean): RawLevel[] => {
      const out: RawLevel[] = [];
      for (const cluster of clusters) {
        const single = irrepFromChannelCounts(cluster.counts);
        if (single && !(forceCharacters && single === 'E')) {
          out.push({ twoS, irrep: single, energy: cluster.energy, rank: 0 });
          continue;
        }
        const counts = clusterIrrepsByCharacters(blocks, s, coefficients, cluster.lo, cluster.hi, cluster.counts);
        for (const irrep of CUBIC_IRREPS)
          for (let i = 0; i < counts[irrep]; i++) out.push({ twoS, irrep, energy: cluster.energy, rank: 0 });
      }
      return out;
    };
    let found = resolve(false);
    if (!countsMatch(found, twoS, expected)) found = resolve(true);
    if (!countsMatch(found, twoS, expected)) {
      throw new Error(`ligand-field levels of spin ${twoS}/2 do not match the free-ion terms`);
    }
    levels.push(...found);
  }
  return levels;
}

function countsMatch(levels: RawLevel[], twoS: number, expected: (twoS: number, irrep: CubicIrrep) => number): boolean {
  const found: Record<CubicIrrep, number> = { A1: 0, A2: 0, E: 0, T1: 0, T2: 0 };
  for (const level of levels) found[level.irrep]++;
  return CUBIC_IRREPS.every((irrep) => found[irrep] === expected(twoS, irrep));
}
