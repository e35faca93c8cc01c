import type { Geometry } from './types.js';

/**
 * Whether a d^n ion in a cubic field can be high- or low-spin.
 *
 * The weak-field ground term follows Hund's first rule: 2S = min(n, 10 − n).
 * The strong-field ground configuration fills the lower orbital set first
 * (t2g, three orbitals, in an octahedron; e, two orbitals, in a tetrahedron),
 * each set by Hund's rule. When the two spins differ the ion has a choice.
 * Octahedral: d4–d7; tetrahedral: d3–d6.
 */

/** Unpaired electrons of k electrons in a set of g degenerate orbitals (Hund's rule). */
function unpairedInSet(k: number, g: number): number {
  return Math.min(k, 2 * g - k);
}

/** 2S of the free-ion (Hund) ground term of d^n. */
export function hundTwoSpin(n: number): number {
  return unpairedInSet(n, 5);
}

/** 2S of the strong-field ground configuration of d^n. */
export function strongFieldTwoSpin(n: number, geometry: Geometry): number {
  const lower = geometry === 'octahedral' ? 3 : 2;
  const inLower = Math.min(n, 2 * lower);
  return unpairedInSet(inLower, lower) + unpairedInSet(n - inLower, 5 - lower);
}

/** True when d^n in this geometry has distinct high-spin and low-spin ground states. */
export function spinStateChoice(d: number, geometry: Geometry): boolean {
  return hundTwoSpin(d) !== strongFieldTwoSpin(d, geometry);
}
