import { blockEigen } from './block-spectra.js';
import type { CubicBlocks } from './blocks.js';
import { charactersFromChannelCounts, reduceCubicCharacters } from './cubic-group.js';
import type { OperatorBlock } from './blocks.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from './rotations.js';
import { projectMatrix } from './spin-projection.js';
import type { CubicIrrep } from './types.js';

/**
 * Irreps of a cluster of (near-)degenerate spin-S levels by the characters
 * of O, for clusters whose C4 block counts do not name a single irrep
 * (accidental degeneracies such as 4A1g + 4Eg in d5).
 *
 * χ(E), χ(C2), χ(C4) follow from the channel counts. χ(C3) about [111] and
 * χ(C2′) about [110] are traces of the rotation operators over the cluster's
 * eigenvectors. The eigenvectors live in single blocks (channels, and the
 * k = 3 mirror), so only the diagonal blocks of a rotation matter; rotations commute with S+, so
 * they map the spin-S subspace into itself and may be projected onto it.
 * Eigenvectors are real, so only the real part of the rotation contributes
 * to the (real) character.
 */

type RotationName = 'c3' | 'c2prime';

const rotationCache = new WeakMap<CubicBlocks, Map<string, Float64Array>>();

/** The block of spin index s for channel 0..4, or 5 for the k = 3 mirror. */
function blockOf(blocks: CubicBlocks, s: number, channel: number): OperatorBlock {
  return channel === 5 ? blocks.mirrors[s]! : blocks.blocks[s]![channel]!;
}

/** Uᵀ Re(R) U on one block of spin index s (channel 0..4, or 5 for k = 3), cached. */
export function projectedRotation(blocks: CubicBlocks, s: number, channel: number, name: RotationName): Float64Array {
  let perBlocks = rotationCache.get(blocks);
  if (!perBlocks) rotationCache.set(blocks, (perBlocks = new Map()));
  const key = `${s}:${channel}:${name}`;
  let matrix = perBlocks.get(key);
  if (!matrix) {
    const block = blockOf(blocks, s, channel);
    const full = determinantRotation(block.masks, dOrbitalRotation(ROTATIONS[name])).re;
    matrix = projectMatrix(full, block.basis, block.masks.length, block.size);
    perBlocks.set(key, matrix);
  }
  return matrix;
}

/** [Σ yᵀ R y over C3, C2′] for the eigenvectors y of one block with eigenvalues in [lo, hi]. */
function blockTraces(blocks: CubicBlocks, s: number, channel: number, coefficients: ArrayLike<number>, lo: number, hi: number): number[] {
  const block = blockOf(blocks, s, channel);
  const n = block.size;
  const traces = [0, 0];
  if (n === 0) return traces;
  const { values, vectors } = blockEigen(block, coefficients);
  const rotations = (['c3', 'c2prime'] as const).map((name) => projectedRotation(blocks, s, channel, name));
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
 * [lo, hi], given their channel counts; blocks with no count are skipped.
 */
export function clusterIrrepsByCharacters(
  blocks: CubicBlocks,
  s: number,
  coefficients: ArrayLike<number>,
  lo: number,
  hi: number,
  counts: readonly number[],
): Record<CubicIrrep, number> {
  const chi = [0, 0];
  [...counts, counts[2]!].forEach((count, channel) => {
    if (count === 0) return;
    const traces = blockTraces(blocks, s, channel, coefficients, lo, hi);
    chi[0]! += traces[0]!;
    chi[1]! += traces[1]!;
  });
  const { e, c2, c4 } = charactersFromChannelCounts(counts);
  return reduceCubicCharacters([e, chi[0]!, c2, c4, chi[1]!]);
}
