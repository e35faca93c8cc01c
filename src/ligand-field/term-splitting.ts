import { CUBIC_IRREPS, reduceCubicCharacters } from './cubic-group.js';
import type { CubicIrrep } from './types.js';

/** Class rotation angles of O in the order of cubic-group.ts: E, C3, C2, C4, C2'. */
const CLASS_ANGLES = [0, (2 * Math.PI) / 3, Math.PI, Math.PI / 2, Math.PI];

/** Character of the SO(3) representation L for a rotation by theta: sin((2L+1)θ/2) / sin(θ/2). */
function rotationCharacter(L: number, theta: number): number {
  if (theta === 0) return 2 * L + 1;
  return Math.sin(((2 * L + 1) * theta) / 2) / Math.sin(theta / 2);
}

/**
 * The irreps of O in a free-ion term of orbital angular momentum L, with
 * repetition, in the order A1, A2, E, T1, T2: e.g. L = 3 (F) → [A2, T1, T2].
 * Derived by reducing the SO(3) characters on the classes of O.
 */
export function cubicComponentsOfL(L: number): readonly CubicIrrep[] {
  const hit = cache[L];
  if (hit) return hit;
  const counts = reduceCubicCharacters(CLASS_ANGLES.map((theta) => Math.round(rotationCharacter(L, theta) * 1e9) / 1e9));
  const components = Object.freeze(CUBIC_IRREPS.flatMap((irrep) => Array<CubicIrrep>(counts[irrep]).fill(irrep)));
  cache[L] = components;
  return components;
}

const cache: Array<readonly CubicIrrep[] | undefined> = [];
