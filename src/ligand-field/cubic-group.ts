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
 * Symmetry channels of the cubic blocks: k = M_L mod 4 (the C4(z) label) and,
 * for k = 0 and 2, the parity under C2 about x (which maps M_L → −M_L, so
 * k = 0 and k = 2 map to themselves; k = 1 and 3 swap and k = 3 is the
 * mirror image of k = 1). Channel order: k0+, k0−, k1, k2+, k2−.
 *
 * Restricted to D4 (C4 along z, C2′ along x), each irrep of O has its own
 * pattern of channel counts: A1 → k0+; A2 → k2+ (B1 of D4); E → k0+ + k2+;
 * T1 → k0− + k1 (+ k3); T2 → k2− + k1 (+ k3).
 */
export const CHANNELS = [
  { k: 0, parity: 1 },
  { k: 0, parity: -1 },
  { k: 1, parity: 0 },
  { k: 2, parity: 1 },
  { k: 2, parity: -1 },
] as const;

export type ChannelCounts = [number, number, number, number, number];

export const CHANNEL_PATTERN: Readonly<Record<CubicIrrep, readonly number[]>> = {
  A1: [1, 0, 0, 0, 0],
  A2: [0, 0, 0, 1, 0],
  E: [1, 0, 0, 1, 0],
  T1: [0, 1, 1, 0, 0],
  T2: [0, 0, 1, 0, 1],
};

/**
 * The irrep whose channel pattern equals counts, or undefined when the
 * counts are a sum of several irreps. [1, 0, 0, 1, 0] reads as E, though
 * A1 + A2 has the same pattern; levels.ts catches that case by counting.
 */
export function irrepFromChannelCounts(counts: readonly number[]): CubicIrrep | undefined {
  for (const irrep of CUBIC_IRREPS) {
    const pattern = CHANNEL_PATTERN[irrep];
    if (pattern.every((n, c) => n === counts[c])) return irrep;
  }
  return undefined;
}

/**
 * χ(E), χ(C2), χ(C4) of a set of states from its channel counts (k3 = k1):
 * C4(z) is e^(−ikπ/2) on channel k; C2(z) = C4² is (−1)^k.
 */
export function charactersFromChannelCounts(counts: readonly number[]): { e: number; c2: number; c4: number } {
  const [n0p, n0m, n1, n2p, n2m] = counts as ChannelCounts;
  const n0 = n0p + n0m;
  const n2 = n2p + n2m;
  return { e: n0 + 2 * n1 + n2, c2: n0 - 2 * n1 + n2, c4: n0 - n2 };
}
