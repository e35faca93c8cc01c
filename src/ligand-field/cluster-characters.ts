import { blockEigen } from './block-spectra.js';
import type { CubicBlocks } from './blocks.js';
import { charactersFromC4Counts, reduceCubicCharacters } from './cubic-group.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from './rotations.js';
import type { CubicIrrep } from './types.js';

/**
 * Irreps of a cluster of (near-)degenerate levels of one spin by the
 * characters of O, for clusters whose C4 block counts do not name a single
 * irrep (accidental degeneracies such as 4A1g + 4Eg in d5).
 *
 * χ(E), χ(C2), χ(C4) follow from the C4 counts. χ(C3) about [111] and χ(C2')
 * about [110] are traces of the rotation operators over the cluster's
 * eigenvectors: Tr over the eigenspace in block M_S = S minus the same in
 * M_S = S + 1 leaves the spin-S states only, because characters add.
 * Eigenvectors are real, so only the real part of the rotation matrix
 * contributes to the (real) character.
 */

type RotationName = 'c3' | 'c2prime';

const rotationCache = new WeakMap<CubicBlocks, Map<string, Float64Array>>();

/** Real part of the rotation operator on all determinants of spin block s, cached. */
export function spinBlockRotationReal(blocks: CubicBlocks, s: number, name: RotationName): Float64Array {
  let perBlocks = rotationCache.get(blocks);
  if (!perBlocks) rotationCache.set(blocks, (perBlocks = new Map()));
  const key = `${s}:${name}`;
  let matrix = perBlocks.get(key);
  if (!matrix) {
    matrix = determinantRotation(blocks.spinMasks[s]!, dOrbitalRotation(ROTATIONS[name])).re;
    perBlocks.set(key, matrix);
  }
  return matrix;
}

/** Σ vᵀ Re(R) v over eigenvectors with eigenvalues in [lo, hi], all four C4 blocks of spin block s. */
function eigenspaceTraces(blocks: CubicBlocks, s: number, coefficients: ArrayLike<number>, lo: number, hi: number): number[] {
  const full = blocks.spinMasks[s]!;
  const position = new Map(full.map((mask, i) => [mask, i]));
  const rotations = (['c3', 'c2prime'] as const).map((name) => spinBlockRotationReal(blocks, s, name));
  const traces = [0, 0];
  const n = full.length;
  const vector = new Float64Array(n);
  for (const block of blocks.blocks[s]!) {
    if (block.size === 0) continue;
    const { values, vectors } = blockEigen(block, coefficients);
    const embed = block.masks.map((mask) => position.get(mask)!);
    for (let j = 0; j < block.size; j++) {
      if (values[j]! < lo || values[j]! > hi) continue;
      vector.fill(0);
      for (let i = 0; i < block.size; i++) vector[embed[i]!] = vectors[i * block.size + j]!;
      rotations.forEach((r, t) => {
        let sum = 0;
        for (let a = 0; a < n; a++) {
          const va = vector[a]!;
          if (va === 0) continue;
          let row = 0;
          for (let b = 0; b < n; b++) row += r[a * n + b]! * vector[b]!;
          sum += va * row;
        }
        traces[t]! += sum;
      });
    }
  }
  return traces;
}

/**
 * Irrep multiplicities of the spin-S states (S from spin block s) with
 * energies in [lo, hi], given their C4 counts (n0, n1, n2).
 */
export function clusterIrrepsByCharacters(
  blocks: CubicBlocks,
  s: number,
  coefficients: ArrayLike<number>,
  lo: number,
  hi: number,
  counts: readonly [number, number, number],
): Record<CubicIrrep, number> {
  const upper = eigenspaceTraces(blocks, s, coefficients, lo, hi);
  const lower = s + 1 < blocks.twoMsValues.length ? eigenspaceTraces(blocks, s + 1, coefficients, lo, hi) : [0, 0];
  const { e, c2, c4 } = charactersFromC4Counts(...counts);
  return reduceCubicCharacters([e, upper[0]! - lower[0]!, c2, c4, upper[1]! - lower[1]!]);
}
