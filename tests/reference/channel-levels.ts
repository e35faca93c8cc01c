import { cubicBlockEigenvalues } from '../../src/ligand-field/block-spectra.js';
import type { CubicBlocks } from '../../src/ligand-field/blocks.js';
import { clusterIrrepsByCharacters } from '../../src/ligand-field/cluster-characters.js';
import { CUBIC_IRREPS, irrepFromChannelCounts, type ChannelCounts } from '../../src/ligand-field/cubic-group.js';
import type { CubicIrrep } from '../../src/ligand-field/types.js';

/**
 * The engine's former labelling path, kept as a slower reference for
 * src/ligand-field/level-spectrum.ts (one block per (S, Γ)): eigenvalues of
 * the symmetry-channel blocks, clustered, named by channel counts and, for
 * any other pattern, by the characters of O over the cluster's eigenvectors.
 * It shares the channel blocks with the engine but none of the irrep split.
 *
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

/**
 * Clusters of the spin-S eigenvalues, given per channel (each sorted): a
 * merge of the sorted lists, a new cluster wherever the gap exceeds tol.
 */
function clustersOf(perChannel: readonly Float64Array[], tol: number): Cluster[] {
  const channels = perChannel.length;
  const next = new Int32Array(channels);
  const clusters: Cluster[] = [];
  let current: Cluster | undefined;
  let members = 0;
  let previous = -Infinity;
  for (;;) {
    let best = -1;
    let value = Infinity;
    for (let c = 0; c < channels; c++) {
      const list = perChannel[c]!;
      if (next[c]! < list.length && list[next[c]!]! < value) {
        value = list[next[c]!]!;
        best = c;
      }
    }
    if (best < 0) break;
    next[best]!++;
    if (!current || value - previous > tol) {
      if (current) current.energy /= members;
      current = { energy: 0, lo: value - tol, hi: value + tol, counts: [0, 0, 0, 0, 0] };
      clusters.push(current);
      members = 0;
    }
    current.energy += value;
    current.hi = value + tol;
    current.counts[best]!++;
    members++;
    previous = value;
  }
  if (current) current.energy /= members;
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

const IRREP_ORDER = new Map(CUBIC_IRREPS.map((irrep, i) => [irrep, i]));

/** rawLevels sorted as computeLevels lists its levels: ascending energy; ties by higher spin, then irrep order. */
export function sortedChannelLevels(
  blocks: CubicBlocks,
  coefficients: readonly number[],
  tol: number,
  expected: (twoS: number, irrep: CubicIrrep) => number,
): RawLevel[] {
  return rawLevels(blocks, coefficients, tol, expected).sort(
    (x, y) => x.energy - y.energy || y.twoS - x.twoS || IRREP_ORDER.get(x.irrep)! - IRREP_ORDER.get(y.irrep)!,
  );
}

function countsMatch(levels: RawLevel[], twoS: number, expected: (twoS: number, irrep: CubicIrrep) => number): boolean {
  const found: Record<CubicIrrep, number> = { A1: 0, A2: 0, E: 0, T1: 0, T2: 0 };
  for (const level of levels) found[level.irrep]++;
  return CUBIC_IRREPS.every((irrep) => found[irrep] === expected(twoS, irrep));
}
