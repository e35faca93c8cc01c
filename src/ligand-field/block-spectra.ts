import type { OperatorBlock } from './blocks.js';
import { createEigenWorkspace, symmetricEigen, symmetricEigenvaluesInPlace, type EigenWorkspace, type SymmetricEigen } from './eigen-symmetric.js';

/**
 * The hot loop: form H = Σ parameter·operator in each block and diagonalise.
 * Per set of blocks (one per d, geometry and blocking) a workspace of
 * preallocated arrays is kept, so repeated evaluations do not allocate.
 */

/** Blocks in rows (one per spin) of columns (symmetry channels or irreps). */
export interface BlockSet {
  blocks: OperatorBlock[][];
}

interface Workspace {
  scratch: Float64Array;
  eigen: EigenWorkspace;
  /** values[row][column], as the blocks. */
  values: Float64Array[][];
}

const workspaces = new WeakMap<BlockSet, Workspace>();

function workspaceFor(blocks: BlockSet): Workspace {
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

/**
 * The lower triangle (row i, columns 0..i) of Σ_p coefficients[p]·operators[p]
 * into out (size², row-major): all the eigensolvers of eigen-symmetric.ts
 * read, so the upper triangle is left as it was and half the work is saved.
 */
export function blockHamiltonianInto(block: OperatorBlock, coefficients: ArrayLike<number>, out: Float64Array): void {
  const n = block.size;
  const ops = block.operators;
  // The cubic (Dq, B, C) and tetragonal (+ Ds, Dt) blocks in one pass: each entry read and written once.
  if (ops.length === 3) return sumOfThreeInto(n, ops, coefficients, out);
  if (ops.length === 5) return sumOfFiveInto(n, ops, coefficients, out);
  const first = ops[0]!;
  const c0 = coefficients[0]!;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = row; j <= row + i; j++) out[j] = c0 * first[j]!;
  }
  for (let p = 1; p < ops.length; p++) {
    const op = ops[p]!;
    const cp = coefficients[p]!;
    if (cp === 0) continue;
    for (let i = 0; i < n; i++) {
      const row = i * n;
      for (let j = row; j <= row + i; j++) out[j] = out[j]! + cp * op[j]!;
    }
  }
}

/**
 * The lower triangle of c0·A + c1·B + c2·C, summed in that order (the order
 * of the general loop above, so the entries are the same numbers).
 */
function sumOfThreeInto(n: number, ops: readonly Float64Array[], coefficients: ArrayLike<number>, out: Float64Array): void {
  const [a, b, c] = ops as [Float64Array, Float64Array, Float64Array];
  const c0 = coefficients[0]!;
  const c1 = coefficients[1]!;
  const c2 = coefficients[2]!;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = row; j <= row + i; j++) out[j] = c0 * a[j]! + c1 * b[j]! + c2 * c[j]!;
  }
}

/** As sumOfThreeInto, with five operators (Dq, B, C, Ds, Dt). */
function sumOfFiveInto(n: number, ops: readonly Float64Array[], coefficients: ArrayLike<number>, out: Float64Array): void {
  const [a, b, c, d, e] = ops as [Float64Array, Float64Array, Float64Array, Float64Array, Float64Array];
  const c0 = coefficients[0]!;
  const c1 = coefficients[1]!;
  const c2 = coefficients[2]!;
  const c3 = coefficients[3]!;
  const c4 = coefficients[4]!;
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = row; j <= row + i; j++) out[j] = c0 * a[j]! + c1 * b[j]! + c2 * c[j]! + c3 * d[j]! + c4 * e[j]!;
  }
}

/**
 * Ascending eigenvalues of every block at the parameters [dq, b, c]: for the
 * cubic blocks of blocks.ts, the spin-S levels' components in each channel;
 * for irrep-blocks.ts, the (S, Γ) levels themselves. The arrays belong to
 * the workspace: valid until the next call with the same blocks.
 */
export function cubicBlockEigenvalues(blocks: BlockSet, coefficients: ArrayLike<number>): Float64Array[][] {
  const ws = workspaceFor(blocks);
  const rows = blocks.blocks;
  for (let s = 0; s < rows.length; s++) {
    const row = rows[s]!;
    for (let column = 0; column < row.length; column++) {
      const block = row[column]!;
      if (block.size === 0) continue;
      blockHamiltonianInto(block, coefficients, ws.scratch);
      symmetricEigenvaluesInPlace(ws.scratch, block.size, ws.values[s]![column]!, ws.eigen);
    }
  }
  return ws.values;
}

/** Eigenvalues and eigenvectors of one block at the given parameters (allocates; for the rare symmetry path). */
export function blockEigen(block: OperatorBlock, coefficients: ArrayLike<number>): SymmetricEigen {
  const h = new Float64Array(block.size * block.size);
  if (block.size > 0) blockHamiltonianInto(block, coefficients, h);
  return symmetricEigen(h, block.size);
}
