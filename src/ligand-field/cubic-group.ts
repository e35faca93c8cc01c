import type { CubicIrrep } from './types.js';

/**
 * The octahedral rotation group O: classes, character table, reduction of a
 * representation, and the irreps read off from C4(z) block counts.
 *
 * Class order: E, 8C3, 3C2 (= C4² about x, y, z), 6C4, 6C2' (about face
 * diagonals such as [110]).
 */
export const CUBIC_IRREPS: readonly CubicIrrep[] = ['A1', 'A2', 'E', 'T1', 'T2'];

export const IRREP_DIMENSION: Readonly<Record<CubicIrrep, number>> = { A1: 1, A2: 1, E: 2, T1: 3, T2: 3 };

export const CLASS_SIZES = [1, 8, 3, 6, 6] as const;

export const CHARACTER_TABLE: Readonly<Record<CubicIrrep, readonly number[]>> = {
  A1: [1, 1, 1, 1, 1],
  A2: [1, 1, 1, -1, -1],
  E: [2, -1, 2, 0, 0],
  T1: [3, 0, -1, 1, -1],
  T2: [3, 0, -1, -1, 1],
};

/**
 * Multiplicities of each irrep in a representation with characters
 * chi = [χ(E), χ(C3), χ(C2), χ(C4), χ(C2')]. Throws when the result is not a
 * set of non-negative integers (a sign that the characters are wrong).
 */
export function reduceCubicCharacters(chi: readonly number[]): Record<CubicIrrep, number> {
  const result = {} as Record<CubicIrrep, number>;
  for (const irrep of CUBIC_IRREPS) {
    let sum = 0;
    for (let c = 0; c < 5; c++) sum += CLASS_SIZES[c]! * chi[c]! * CHARACTER_TABLE[irrep][c]!;
    const count = sum / 24;
    const rounded = Math.round(count);
    if (Math.abs(count - rounded) > 1e-6 || rounded < 0) {
      throw new Error(`cubic characters [${chi.join(', ')}] do not reduce to irreps of O`);
    }
    result[irrep] = Math.abs(rounded); // no −0 from rounding a tiny negative
  }
  return result;
}

/**
 * Counts of a level's components in the C4(z) blocks k = 0, 1, 2 (k = 3
 * mirrors k = 1) for each irrep: restricted to C4, A1 → k0, A2 → k2,
 * E → k0 + k2, T1 → k0 + k1 + k3, T2 → k2 + k1 + k3.
 */
export const C4_PATTERN: Readonly<Record<CubicIrrep, readonly [number, number, number]>> = {
  A1: [1, 0, 0],
  A2: [0, 0, 1],
  E: [1, 0, 1],
  T1: [1, 1, 0],
  T2: [0, 1, 1],
};

/**
 * The irrep whose C4 pattern equals (n0, n1, n2), or undefined when the
 * counts are a sum of several irreps. (1, 0, 1) reads as E, though A1 + A2
 * has the same pattern; levels.ts catches that case by counting.
 */
export function irrepFromC4Counts(n0: number, n1: number, n2: number): CubicIrrep | undefined {
  for (const irrep of CUBIC_IRREPS) {
    const [a, b, c] = C4_PATTERN[irrep];
    if (a === n0 && b === n1 && c === n2) return irrep;
  }
  return undefined;
}

/** χ(E), χ(C2), χ(C4) of a set of states from its C4 block counts (k3 = k1). */
export function charactersFromC4Counts(n0: number, n1: number, n2: number): { e: number; c2: number; c4: number } {
  return { e: n0 + 2 * n1 + n2, c2: n0 - 2 * n1 + n2, c4: n0 - n2 };
}
