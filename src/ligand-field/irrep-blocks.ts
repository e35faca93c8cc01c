import { blockPart, cubicBlocks, type CubicBlocks, type OperatorBlock } from './blocks.js';
import { projectedRotation } from './cluster-characters.js';
import type { CubicIrrep, Geometry } from './types.js';

/**
 * The d^n Hamiltonian in one block per spin S and irrep Γ of O, built once
 * per (d, geometry) from the channel blocks of blocks.ts. Block (S, Γ) holds
 * one partner row of every copy of Γ, so its eigenvalues are the (S, Γ)
 * levels, each once: naming a level needs neither eigenvectors nor
 * characters, and levels of different Γ that coincide at every Dq (4A1g and
 * 4Eg of 4G in d5) are simply in different blocks.
 *
 * Rows, by channel (see CHANNELS in cubic-group.ts): only T1 has states in
 * k0− and only T2 in k2−, so those channels are the T1 and T2 blocks (and
 * the k = 1 channel, the largest, is not needed: it repeats T1 and T2).
 * k0+ holds A1 and one row (θ) of each E; k2+ holds A2 and the other row
 * (ε) of each E. C3 about [111], compressed onto k0+ (or k2+), is +1 on A1
 * (A2), which it leaves fixed, and −½ on the E rows: C3 θ = −½θ ± (√3/2)ε,
 * and ε lies in the other channel. Its eigenvectors split the channel; the E
 * block is taken from k0+.
 */
export interface IrrepBlocks {
  n: number;
  geometry: Geometry;
  /** 2S values present, ascending. */
  twoSValues: number[];
  /** blocks[spinIndex][irrepIndex], irreps in the order of IRREP_COLUMNS. */
  blocks: OperatorBlock[][];
}

/** Column order of IrrepBlocks.blocks (= CUBIC_IRREPS). */
export const IRREP_COLUMNS: readonly CubicIrrep[] = ['A1', 'A2', 'E', 'T1', 'T2'];

/** C3 is +1 on A1, A2 and −½ on E rows: anything above ¼ is the one-dimensional irrep. */
const C3_SPLIT = 0.25;

function irrepRow(channels: CubicBlocks, s: number): OperatorBlock[] {
  const [k0plus, k0minus, , k2plus, k2minus] = channels.blocks[s]! as [OperatorBlock, OperatorBlock, OperatorBlock, OperatorBlock, OperatorBlock];
  const c3On0 = projectedRotation(channels, s, 0, 'c3');
  const c3On2 = projectedRotation(channels, s, 3, 'c3');
  const a1 = blockPart(k0plus, c3On0, (value) => value > C3_SPLIT);
  const e = blockPart(k0plus, c3On0, (value) => value < C3_SPLIT);
  const a2 = blockPart(k2plus, c3On2, (value) => value > C3_SPLIT);
  return [a1, a2, e, k0minus, k2minus];
}

const cache: Array<IrrepBlocks | undefined> = [];

/** The (S, Γ) blocks of d^n in a geometry, built once and cached. n in 1..9. */
export function irrepBlocks(n: number, geometry: Geometry): IrrepBlocks {
  const index = 2 * n + (geometry === 'octahedral' ? 0 : 1);
  const hit = cache[index];
  if (hit) return hit;
  const channels = cubicBlocks(n, geometry);
  const blocks = channels.twoSValues.map((_, s) => irrepRow(channels, s));
  const result: IrrepBlocks = { n, geometry, twoSValues: channels.twoSValues, blocks };
  cache[index] = result;
  return result;
}
