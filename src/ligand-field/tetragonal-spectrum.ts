import { cubicBlockEigenvalues } from './block-spectra.js';
import { CHANNEL_D4_IRREPS, type TetragonalBlocks } from './tetragonal-blocks.js';

/**
 * Every spin-free (S, D4 irrep) level of a tetragonal block set in
 * preallocated typed arrays (one workspace per TetragonalBlocks, reused by
 * every call): the hot path of tetragonal fits and diagrams, which call it
 * thousands of times and need neither labels nor a sorted list, only each
 * level's energy under a fixed identity and the ground level.
 *
 * Positions are in a fixed order per d^n: highest spin first, then channel
 * (CHANNEL_D4_IRREPS order), then rank, the ascending position of the level
 * in its own (S, channel) block, which is its identity along any path in
 * parameter space. twoS, channel and rank never change between calls; energy
 * (cm-1 on the Hamiltonian's zero) does. ground: the position of the lowest
 * level (exact ties: the first in that order, so the higher spin, then the
 * lower channel). coefficients: [dq, b, c, ds, dt].
 */
export interface TetragonalSpectrum {
  count: number;
  energy: Float64Array;
  twoS: Int32Array;
  channel: Int32Array;
  rank: Int32Array;
  /** Per position, the identity as text: "2S:irrep#rank" ("3:E#0"), for maps keyed by level. */
  keys: readonly string[];
  ground: number;
}

/** The identity of a spin-free tetragonal level as text: "2S:D4 irrep#rank". */
export function tetragonalLevelKey(twoS: number, channel: number, rank: number): string {
  return `${twoS}:${CHANNEL_D4_IRREPS[channel]}#${rank}`;
}

interface Workspace extends TetragonalSpectrum {
  /** The non-empty blocks in position order: [spinIndex, channel]. */
  slots: Array<[number, number]>;
}

const workspaces = new WeakMap<TetragonalBlocks, Workspace>();

function workspaceFor(blocks: TetragonalBlocks): Workspace {
  let ws = workspaces.get(blocks);
  if (!ws) {
    const slots: Array<[number, number]> = [];
    for (let s = blocks.blocks.length - 1; s >= 0; s--)
      blocks.blocks[s]!.forEach((block, c) => {
        if (block.size > 0) slots.push([s, c]);
      });
    const count = slots.reduce((sum, [s, c]) => sum + blocks.blocks[s]![c]!.size, 0);
    const made: Workspace = {
      count, energy: new Float64Array(count), twoS: new Int32Array(count), channel: new Int32Array(count), rank: new Int32Array(count),
      keys: [], ground: 0, slots,
    };
    let position = 0;
    for (const [s, c] of slots)
      for (let r = 0; r < blocks.blocks[s]![c]!.size; r++, position++) {
        made.twoS[position] = blocks.twoSValues[s]!;
        made.channel[position] = c;
        made.rank[position] = r;
      }
    made.keys = Array.from({ length: count }, (_, i) => tetragonalLevelKey(made.twoS[i]!, made.channel[i]!, made.rank[i]!));
    workspaces.set(blocks, made);
    ws = made;
  }
  return ws;
}

/**
 * The levels at the coefficients, in the fixed order above. The returned
 * arrays belong to the workspace: valid until the next call with the same
 * blocks.
 */
export function tetragonalSpectrum(blocks: TetragonalBlocks, coefficients: ArrayLike<number>): TetragonalSpectrum {
  const ws = workspaceFor(blocks);
  const values = cubicBlockEigenvalues(blocks, coefficients);
  const { energy, slots } = ws;
  let position = 0;
  let ground = 0;
  for (let k = 0; k < slots.length; k++) {
    const [s, c] = slots[k]!;
    const list = values[s]![c]!;
    for (let r = 0; r < list.length; r++, position++) {
      energy[position] = list[r]!;
      if (list[r]! < energy[ground]!) ground = position;
    }
  }
  ws.ground = ground;
  return ws;
}
