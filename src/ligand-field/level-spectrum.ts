import { cubicBlockEigenvalues } from './block-spectra.js';
import type { IrrepBlocks } from './irrep-blocks.js';

/**
 * From (S, Γ) block eigenvalues to the sorted, ranked list of levels, in
 * preallocated arrays (one set per IrrepBlocks, reused by every call).
 *
 * Levels of one spin within tol of each other (a chain with gaps ≤ tol, of
 * any irreps) form a cluster and all get the cluster's mean energy, so exact
 * coincidences such as 4A1g + 4Eg in d5 come out as equal energies, not as
 * round-off apart, and their order is fixed by the ties below. (Levels of
 * different spins are not clustered: their order is that of their energies.)
 *
 * Order: ascending energy; ties by higher spin, then irrep order A1, A2, E,
 * T1, T2 (column index). rank: 0-based position among the levels of the same
 * (2S+1, Γ) in that order.
 */
export interface LevelSpectrum {
  /** Number of levels (fixed per d and geometry). */
  count: number;
  /** Sorted position → cm-1 on the Hamiltonian's zero (not yet from the ground level). */
  energy: Float64Array;
  /** Sorted position → 2S. */
  twoS: Int32Array;
  /** Sorted position → irrep column (0..4: A1, A2, E, T1, T2). */
  irrep: Int32Array;
  /** Sorted position → rank among levels of the same (S, Γ). */
  rank: Int32Array;
}

interface Workspace extends LevelSpectrum {
  /** Unsorted levels, filled spin by spin. */
  rawEnergy: Float64Array;
  rawTwoS: Int32Array;
  rawIrrep: Int32Array;
  order: Int32Array;
  /** Next unread eigenvalue per irrep column during the merge. */
  cursor: Int32Array;
  /** Per (2S, irrep column): levels ranked so far. */
  ranks: Int32Array;
}

const workspaces = new WeakMap<IrrepBlocks, Workspace>();

function workspaceFor(blocks: IrrepBlocks): Workspace {
  let ws = workspaces.get(blocks);
  if (!ws) {
    const count = blocks.blocks.flat().reduce((sum, block) => sum + block.size, 0);
    ws = {
      count,
      energy: new Float64Array(count),
      twoS: new Int32Array(count),
      irrep: new Int32Array(count),
      rank: new Int32Array(count),
      rawEnergy: new Float64Array(count),
      rawTwoS: new Int32Array(count),
      rawIrrep: new Int32Array(count),
      order: new Int32Array(count),
      cursor: new Int32Array(5),
      ranks: new Int32Array(11 * 5),
    };
    workspaces.set(blocks, ws);
  }
  return ws;
}

/**
 * Weight of a level of each irrep column in a cluster's mean: the number of
 * symmetry channels it has a state in (A1: k0+; A2: k2+; E: k0+, k2+; T1:
 * k0−, k1; T2: k2−, k1), so the mean is the one the channel eigenvalues give.
 */
const CLUSTER_WEIGHTS = [1, 1, 2, 2, 2] as const;

/**
 * Appends the levels of one spin to the raw arrays from position start, in
 * ascending order (a merge of the five sorted irrep lists), each cluster set
 * to its weighted mean energy. Returns the next free position.
 */
function appendSpinLevels(ws: Workspace, perIrrep: readonly Float64Array[], twoS: number, tol: number, start: number): number {
  const { rawEnergy, rawTwoS, rawIrrep, cursor } = ws;
  cursor.fill(0);
  let position = start;
  let from = start;
  let sum = 0;
  let weight = 0;
  let previous = -Infinity;
  for (;;) {
    let best = -1;
    let value = Infinity;
    for (let column = 0; column < 5; column++) {
      const list = perIrrep[column]!;
      const next = cursor[column]!;
      if (next < list.length && list[next]! < value) {
        value = list[next]!;
        best = column;
      }
    }
    if (best < 0) break;
    cursor[best]!++;
    if (value - previous > tol) {
      closeCluster(rawEnergy, from, position, sum / weight);
      from = position;
      sum = 0;
      weight = 0;
    }
    rawEnergy[position] = value;
    rawTwoS[position] = twoS;
    rawIrrep[position] = best;
    sum += CLUSTER_WEIGHTS[best]! * value;
    weight += CLUSTER_WEIGHTS[best]!;
    previous = value;
    position++;
  }
  closeCluster(rawEnergy, from, position, sum / weight);
  return position;
}

/** Sets energies [from, to) to mean; a lone level keeps its own value. */
function closeCluster(energy: Float64Array, from: number, to: number, mean: number): void {
  if (to - from < 2) return;
  for (let i = from; i < to; i++) energy[i] = mean;
}

/** True when raw level i sorts before raw level j (energy, then higher spin, then irrep column). */
function before(ws: Workspace, i: number, j: number): boolean {
  const de = ws.rawEnergy[i]! - ws.rawEnergy[j]!;
  if (de !== 0) return de < 0;
  const ds = ws.rawTwoS[j]! - ws.rawTwoS[i]!;
  if (ds !== 0) return ds < 0;
  return ws.rawIrrep[i]! < ws.rawIrrep[j]!;
}

/**
 * All (S, Γ) levels of the blocks at [dq, b, c], sorted and ranked. The
 * returned arrays belong to a workspace: valid until the next call with the
 * same blocks.
 */
export function levelSpectrum(blocks: IrrepBlocks, coefficients: ArrayLike<number>, tol: number): LevelSpectrum {
  const ws = workspaceFor(blocks);
  const { order, count, rawEnergy, rawTwoS, rawIrrep } = ws;
  const values = cubicBlockEigenvalues(blocks, coefficients);
  let position = 0;
  for (let s = blocks.twoSValues.length - 1; s >= 0; s--) {
    position = appendSpinLevels(ws, values[s]!, blocks.twoSValues[s]!, tol, position);
  }
  for (let i = 0; i < count; i++) order[i] = i;
  insertionSort(ws, before);
  ws.ranks.fill(0);
  for (let p = 0; p < count; p++) {
    const i = order[p]!;
    const twoS = rawTwoS[i]!;
    const irrep = rawIrrep[i]!;
    ws.energy[p] = rawEnergy[i]!;
    ws.twoS[p] = twoS;
    ws.irrep[p] = irrep;
    ws.rank[p] = ws.ranks[5 * twoS + irrep]!++;
  }
  return ws;
}

/** Sorts ws.order in place by the strict order precedes (stable; at most ~45 levels, in sorted runs per spin). */
function insertionSort(ws: Workspace, precedes: (ws: Workspace, i: number, j: number) => boolean): void {
  const { order, count } = ws;
  for (let p = 1; p < count; p++) {
    const item = order[p]!;
    let q = p - 1;
    while (q >= 0 && precedes(ws, item, order[q]!)) {
      order[q + 1] = order[q]!;
      q--;
    }
    order[q + 1] = item;
  }
}
