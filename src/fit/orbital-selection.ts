/**
 * The orbital selection rule of a tetrahedral complex: which spin-allowed
 * transitions are electric-dipole forbidden by symmetry, and so weak.
 *
 * Td has no inversion centre: a d–d transition is electric-dipole allowed
 * when Γground × Γexcited contains T2, the irrep of (x, y, z). A transition
 * whose product lacks T2 (A1↔A1, A2, E, T1; A2↔A2, E, T2; E↔E) borrows
 * intensity only through spin–orbit and vibronic mixing, and is an order of
 * magnitude weaker: 3A2 → 3T2 of tetrahedral V(III) and 4A2 → 4T2 of
 * tetrahedral Co(II) (ν1, ε of a few tens against several hundred for ν2 and
 * ν3) are the familiar cases (common practice; the rule is the standard
 * direct-product argument, e.g. Cotton, Chemical Applications of Group
 * Theory, 3rd ed. (1990), ch. 9, from memory).
 *
 * Octahedral d–d transitions are all parity (Laporte) forbidden and gain
 * intensity vibronically, which the symmetry rule does not rank: no level of
 * an octahedral scan is flagged.
 */
import type { LevelScan } from './scan.js';

/** Td irreps whose product with each irrep contains T2. */
const TD_DIPOLE_PARTNERS: Readonly<Record<string, readonly string[]>> = {
  A1: ['T2'],
  A2: ['T1'],
  E: ['T1', 'T2'],
  T1: ['A2', 'E', 'T1', 'T2'],
  T2: ['A1', 'E', 'T1', 'T2'],
};

/** True when ground → excited (Td irrep names) is electric-dipole allowed by symmetry. */
export function tetrahedralDipoleAllowed(ground: string, excited: string): boolean {
  return TD_DIPOLE_PARTNERS[ground]?.includes(excited) ?? true;
}

const cache = new WeakMap<LevelScan, Map<number, Uint8Array>>();

/**
 * 1 for each ids index of the ground's spin whose transition from `ground` is
 * electric-dipole forbidden by the tetrahedral rule; all 0 for an octahedral
 * scan. Spin-forbidden levels are left 0: their weakness is the spin rule's.
 */
export function orbitallyForbiddenLevels(scan: LevelScan, ground: number): Uint8Array {
  let perScan = cache.get(scan);
  if (!perScan) cache.set(scan, (perScan = new Map()));
  const hit = perScan.get(ground);
  if (hit) return hit;
  const g = scan.ids[ground]!;
  const flags = Uint8Array.from(scan.ids, (id, k) => (
    scan.geometry === 'tetrahedral' && k !== ground && id.multiplicity === g.multiplicity && !tetrahedralDipoleAllowed(g.irrep, id.irrep) ? 1 : 0
  ));
  perScan.set(ground, flags);
  return flags;
}
