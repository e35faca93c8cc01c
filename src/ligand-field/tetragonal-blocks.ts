import { cubicBlocks, type OperatorBlock } from './blocks.js';
import { oneBodyBlockMatrix } from './slater-condon.js';
import { projectMatrix } from './spin-projection.js';
import { dsOrbitalMatrix, dtOrbitalMatrix } from './tetragonal-field.js';

/**
 * The spin-free d^n Hamiltonian in a tetragonal (D4h) field, one block per
 * spin S and irrep of D4. The cubic channel blocks of blocks.ts are already
 * the D4 irreps (C4 along z, C2' along x): k0+ = A1, k0− = A2, k1 = E (one
 * row), k2+ = B1, k2− = B2, and the Ds, Dt operators (diagonal in m_l, even
 * under C2(x)) commute with both labels. So each channel block gets two more
 * operators, projected on the same spin-S basis; H = Dq·V + B·H_B + C·H_C +
 * Ds·V_s + Dt·V_t, with parameters in that order.
 * Only the octahedral geometry is blocked here: D2d (a tetragonally
 * distorted tetrahedron) has other axes and labels.
 */
export type D4Irrep = 'A1' | 'A2' | 'E' | 'B1' | 'B2';

/** D4 irrep of each channel, in the channel order of CHANNELS (k0+, k0−, k1, k2+, k2−). */
export const CHANNEL_D4_IRREPS: readonly D4Irrep[] = ['A1', 'A2', 'E', 'B1', 'B2'];

export const D4_DIMENSION: Readonly<Record<D4Irrep, number>> = { A1: 1, A2: 1, E: 2, B1: 1, B2: 1 };

export interface TetragonalBlocks {
  n: number;
  twoSValues: number[];
  /** blocks[spinIndex][channel]: operators [dq, b, c, ds, dt]. */
  blocks: OperatorBlock[][];
}

const cache: Array<TetragonalBlocks | undefined> = [];

/** The (S, D4 irrep) blocks of d^n (1..9), octahedral parent geometry, built once. */
export function tetragonalBlocks(n: number): TetragonalBlocks {
  const hit = cache[n];
  if (hit) return hit;
  const channels = cubicBlocks(n, 'octahedral');
  const ds = dsOrbitalMatrix();
  const dt = dtOrbitalMatrix();
  const blocks = channels.blocks.map((row) =>
    row.map((block) => {
      const rows = block.masks.length;
      const extra = [ds, dt].map((h) => projectMatrix(oneBodyBlockMatrix(block.masks, h), block.basis, rows, block.size));
      return { ...block, operators: [...block.operators, ...extra] };
    }),
  );
  const result: TetragonalBlocks = { n, twoSValues: channels.twoSValues, blocks };
  cache[n] = result;
  return result;
}
