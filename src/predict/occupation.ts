import type { PredictGeometry } from './rules.js';

/**
 * The one-electron picture of a complex: d orbitals grouped in degenerate
 * sets, their energies in units of Dq relative to the barycentre, and how
 * d^n electrons fill them.
 *
 * Energies (Dq, barycentre 0): octahedral t2g −4, eg +6; tetrahedral e −6,
 * t2 +4 (Dq of the tetrahedral field); square planar (xz, yz) −5.14, z² −4.28,
 * xy +2.28, x²−y² +12.28 (in Dq of the octahedron with the same ligands), the
 * crystal-field values of Day & Selbin, Theoretical Inorganic Chemistry
 * (1962), p. 292 (looked up, as tabulated at chemprof.tripod.com/dorbit.htm);
 * real square-planar complexes differ in the order of the lower three.
 *
 * High-spin fills every orbital singly before pairing (Hund's rule over all
 * five); low-spin fills the sets in order of energy, Hund's rule within a set.
 */
export interface OrbitalSet {
  /** "t2g", "eg", "e", "t2", "xz,yz", "z2", "xy", "x2-y2". */
  name: string;
  /** Number of orbitals. */
  orbitals: number;
  /** Energy in Dq from the barycentre. */
  energyDq: number;
  /** Electrons in the set. */
  electrons: number;
  /** Spin-up and spin-down electrons per orbital, in orbital order: [[1,1],[1,0],[0,0]]. */
  boxes: [up: number, down: number][];
}

export interface Occupation {
  geometry: PredictGeometry;
  /** Sets from lowest to highest energy. */
  sets: OrbitalSet[];
  unpairedElectrons: number;
  /** "t2g^6 eg^0". */
  configuration: string;
  /** Σ n·E in Dq (negative: stabilising), without the pairing energy. */
  lfseDq: number;
}

const SETS: Record<PredictGeometry, readonly [string, number, number][]> = {
  octahedral: [['t2g', 3, -4], ['eg', 2, 6]],
  tetrahedral: [['e', 2, -6], ['t2', 3, 4]],
  'square-planar': [['xz,yz', 2, -5.14], ['z2', 1, -4.28], ['xy', 1, 2.28], ['x2-y2', 1, 12.28]],
};

/** Electrons per orbital, in orbital order across the sets (lowest first). */
function fillOrbitals(d: number, orbitalsPerSet: readonly number[], highSpin: boolean): [number, number][] {
  const total = orbitalsPerSet.reduce((a, b) => a + b, 0);
  const boxes: [number, number][] = Array.from({ length: total }, () => [0, 0]);
  if (highSpin) {
    for (let e = 0; e < d; e++) {
      const box = boxes[e % total] as [number, number];
      if (e < total) box[0] = 1;
      else box[1] = 1;
    }
    return boxes;
  }
  let left = d;
  let start = 0;
  for (const size of orbitalsPerSet) {
    const inSet = Math.min(left, 2 * size);
    for (let e = 0; e < inSet; e++) {
      const box = boxes[start + (e % size)] as [number, number];
      if (e < size) box[0] = 1;
      else box[1] = 1;
    }
    left -= inSet;
    start += size;
  }
  return boxes;
}

/** The occupation of d^n (0–10) in a geometry, high- or low-spin. */
export function orbitalOccupation(d: number, geometry: PredictGeometry, highSpin: boolean): Occupation {
  const table = SETS[geometry];
  const boxes = fillOrbitals(d, table.map(([, n]) => n), highSpin);
  let at = 0;
  const sets: OrbitalSet[] = table.map(([name, orbitals, energyDq]) => {
    const own = boxes.slice(at, at + orbitals);
    at += orbitals;
    return { name, orbitals, energyDq, electrons: own.reduce((s, [u, v]) => s + u + v, 0), boxes: own };
  });
  const unpairedElectrons = boxes.reduce((s, [u, v]) => s + Math.abs(u - v), 0);
  const lfseDq = sets.reduce((s, set) => s + set.electrons * set.energyDq, 0);
  const configuration = sets.map((s) => `${s.name}^${s.electrons}`).join(' ');
  return { geometry, sets, unpairedElectrons, configuration, lfseDq: Math.round(lfseDq * 1e9) / 1e9 };
}

/** "↑↓" "↑ " "  " for one box. */
export function boxArrows([up, down]: readonly [number, number]): string {
  return `${up ? '↑' : ' '}${down ? '↓' : ' '}`;
}
