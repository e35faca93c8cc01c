import type { CubicBlocks, OperatorBlock } from './blocks.js';
import { createEigenWorkspace, symmetricEigen, symmetricEigenvaluesInPlace, type EigenWorkspace, type SymmetricEigen } from './eigen-symmetric.js';

/**
 * The hot loop: form H = Σ parameter·operator in each block and diagonalise.
 * Per (d, geometry) a workspace of preallocated arrays is kept, so repeated
 * evaluations do not allocate.
 */

interface Workspace {
  scratch: Float64Array;
  eigen: EigenWorkspace;
  /** values[spinIndex][channel] (CHANNELS: k0+, k0−, k1, k2+, k2−). */
  values: Float64Array[][];
}

const workspaces = new WeakMap<CubicBlocks, Workspace>();

function workspaceFor(blocks: CubicBlocks): Workspace {
  let ws = workspaces.get(blocks);
  if (!ws) {
    const largest = Math.max(...blocks.blocks.flat().map((b) => b.size), 1);
    ws = {
      scratch: new Float64Array(largest * largest),
      eigen: createEigenWorkspace(largest),
      values: blocks.blocks.map((row) => row.map((b) => new Float64Array(b.size))),
    };
    workspaces.set(blocks, ws);
  }
  return ws;
}

/** out[0..size²) = Σ_p coefficients[p]·operators[p]. */
export function blockHamiltonianInto(block: OperatorBlock, coefficients: ArrayLike<number>, out: Float64Array): void {
  const length = block.size * block.size;
  const ops = block.operators;
  const first = ops[0]!;
  const c0 = coefficients[0]!;
  for (let i = 0; i < length; i++) out[i] = c0 * first[i]!;
  for (let p = 1; p < ops.length; p++) {
    const op = ops[p]!;
    const cp = coefficients[p]!;
    if (cp === 0) continue;
    for (let i = 0; i < length; i++) out[i] = out[i]! + cp * op[i]!;
  }
}

/**
 * Ascending eigenvalues of every cubic block (spin S, channel) at the
 * parameters [dq, b, c]: the spin-S levels' components in that channel. The arrays belong to the workspace: valid until the next call
 * with the same blocks.
 */
export function cubicBlockEigenvalues(blocks: CubicBlocks, coefficients: ArrayLike<number>): Float64Array[][] {
  const ws = workspaceFor(blocks);
  blocks.blocks.forEach((row, s) => {
    row.forEach((block, channel) => {
      if (block.size === 0) return;
      blockHamiltonianInto(block, coefficients, ws.scratch);
      symmetricEigenvaluesInPlace(ws.scratch, block.size, ws.values[s]![channel]!, ws.eigen);
    });
  });
  return ws.values;
}

/** Eigenvalues and eigenvectors of one block at the given parameters (allocates; for the rare symmetry path). */
export function blockEigen(block: OperatorBlock, coefficients: ArrayLike<number>): SymmetricEigen {
  const h = new Float64Array(block.size * block.size);
  if (block.size > 0) blockHamiltonianInto(block, coefficients, h);
  return symmetricEigen(h, block.size);
}
