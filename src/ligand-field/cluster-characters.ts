import { blockEigen } from './block-spectra.js';
import type { CubicBlocks } from './blocks.js';
import { charactersFromC4Counts, reduceCubicCharacters } from './cubic-group.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from './rotations.js';
import { projectMatrix } from './spin-projection.js';
import type { CubicIrrep } from './types.js';

/**
 * Irreps of a cluster of (near-)degenerate spin-S levels by the characters
 * of O, for clusters whose C4 block counts do not name a single irrep
 * (accidental degeneracies such as 4A1g + 4Eg in d5).
 *
 * χ(E), χ(C2), χ(C4) follow from the C4 counts. χ(C3) about [111] and χ(C2′)
 * about [110] are traces of the rotation operators over the cluster's
 * eigenvectors. The eigenvectors live in single C4 blocks, so only the
 * diagonal (k, k) blocks of a rotation matter; rotations commute with S+, so
 * they map the spin-S subspace into itself and may be projected onto it.
 * Eigenvectors are real, so only the real part of the rotation contributes
 * to the (real) character.
 */

type RotationName = 'c3' | 'c2prime';

const rotationCache = new WeakMap<CubicBlocks, Map<string, Float64Array>>();

/** Uᵀ Re(R)_kk U for spin block s, C4 block k (cached). */
export function projectedRotation(blocks: CubicBlocks, s: number, k: number, name: RotationName): Float64Array {
  let perBlocks = rotationCache.get(blocks);
  if (!perBlocks) rotationCache.set(blocks, (perBlocks = new Map()));
  const key = `${s}:${k}:${name}`;
  let matrix = perBlocks.get(key);
  if (!matrix) {
    const block = blocks.blocks[s]![k]!;
    const full = determinantRotation(block.masks, dOrbitalRotation(ROTATIONS[name])).re;
    matrix = projectMatrix(full, block.basis, block.masks.length, block.size);
    perBlocks.set(key, matrix);
  }
  return matrix;
}

/** [Σ yᵀ R y over C3, C2′] for the eigenvectors y of block (s, k) with eigenvalues in [lo, hi]. */
function blockTraces(blocks: CubicBlocks, s: number, k: number, coefficients: ArrayLike<number>, lo: number, hi: number): number[] {
  const block = blocks.blocks[s]![k]!;
  const n = block.size;
  const traces = [0, 0];
  if (n === 0) return traces;
  const { values, vectors } = blockEigen(block, coefficients);
  const rotations = (['c3', 'c2prime'] as const).map((name) => projectedRotation(blocks, s, k, name));
  for (let j = 0; j < n; j++) {
    if (values[j]! < lo || values[j]! > hi) continue;
    rotations.forEach((r, t) => {
      let sum = 0;
      for (let a = 0; a < n; a++) {
        let row = 0;
        for (let b = 0; b < n; b++) row += r[a * n + b]! * vectors[b * n + j]!;
        sum += vectors[a * n + j]! * row;
      }
      traces[t]! += sum;
    });
  }
  return traces;
}

/**
 * Irrep multiplicities of the spin-S states (spin block s) with energies in
 * [lo, hi], given their C4 counts (n0, n1, n2); blocks with no count are skipped.
 */
export function clusterIrrepsByCharacters(
  blocks: CubicBlocks,
  s: number,
  coefficients: ArrayLike<number>,
  lo: number,
  hi: number,
  counts: readonly [number, number, number],
): Record<CubicIrrep, number> {
  const chi = [0, 0];
  [counts[0], counts[1], counts[2], counts[1]].forEach((count, k) => {
    if (count === 0) return;
    const traces = blockTraces(blocks, s, k, coefficients, lo, hi);
    chi[0]! += traces[0]!;
    chi[1]! += traces[1]!;
  });
  const { e, c2, c4 } = charactersFromC4Counts(...counts);
  return reduceCubicCharacters([e, chi[0]!, c2, c4, chi[1]!]);
}
