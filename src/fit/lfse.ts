/**
 * Ligand-field stabilisation energy and the strong-field configuration it is
 * counted from, and the spin-only magnetic moment.
 *
 * Conventions: Dq ≥ 0 in both geometries (DEVELOPERS.md). Octahedral: the
 * lower set is t2g (3 orbitals, −4Dq each), the upper set eg (2, +6Dq).
 * Tetrahedral: the lower set is e (2 orbitals, −6Dq_t each), the upper set
 * t2 (3, +4Dq_t). The occupation is not read from a table: it is the
 * lowest-energy distribution of the d electrons over the two sets that can
 * hold the ground level's number of unpaired electrons (from its 2S+1), so a
 * high-spin and a low-spin ground give their own configurations.
 */
import type { Geometry } from '../ligand-field/types.js';

export interface OrbitalSets {
  lower: { name: string; orbitals: number; energyInDq: number };
  upper: { name: string; orbitals: number; energyInDq: number };
}

export function orbitalSets(geometry: Geometry): OrbitalSets {
  return geometry === 'octahedral'
    ? { lower: { name: 't2g', orbitals: 3, energyInDq: -4 }, upper: { name: 'eg', orbitals: 2, energyInDq: 6 } }
    : { lower: { name: 'e', orbitals: 2, energyInDq: -6 }, upper: { name: 't2', orbitals: 3, energyInDq: 4 } };
}

/** Most unpaired electrons n electrons can have in a set of `orbitals` degenerate orbitals. */
function maxUnpaired(n: number, orbitals: number): number {
  return Math.min(n, 2 * orbitals - n);
}

export interface StrongFieldConfiguration {
  lower: number;
  upper: number;
  /** "t2g^3 eg^0" or "e^4 t2^3". */
  text: string;
}

/**
 * The lowest-energy strong-field configuration of d^n able to carry
 * `unpaired` unpaired electrons (2S = multiplicity − 1 of the ground level).
 */
export function strongFieldConfiguration(d: number, unpaired: number, geometry: Geometry): StrongFieldConfiguration {
  const { lower, upper } = orbitalSets(geometry);
  let best: { lower: number; upper: number; energy: number } | undefined;
  for (let nUpper = 0; nUpper <= Math.min(d, 2 * upper.orbitals); nUpper++) {
    const nLower = d - nUpper;
    if (nLower > 2 * lower.orbitals) continue;
    const most = maxUnpaired(nLower, lower.orbitals) + maxUnpaired(nUpper, upper.orbitals);
    if (most < unpaired || (most - unpaired) % 2 !== 0) continue;
    const energy = nLower * lower.energyInDq + nUpper * upper.energyInDq;
    if (!best || energy < best.energy) best = { lower: nLower, upper: nUpper, energy };
  }
  if (!best) throw new RangeError(`d${d} cannot have ${unpaired} unpaired electrons`);
  const text = `${lower.name}^${best.lower} ${upper.name}^${best.upper}`;
  return { lower: best.lower, upper: best.upper, text };
}

export interface Lfse {
  /** LFSE in units of Dq: −12 for t2g^3 eg^0. */
  dq: number;
  /** LFSE in cm-1 at the fitted Dq (pairing energy not included). */
  cm1: number;
  /** "t2g^6 eg^0". */
  configuration: string;
  /** Electron pairs in the complex's configuration. */
  pairs: number;
  /** Pairs beyond those of the high-spin free ion (each costs a pairing energy P, not included in cm1). */
  extraPairs: number;
}

/** LFSE of d^n with `unpaired` unpaired electrons at field `dq` (cm-1). */
export function ligandFieldStabilisation(d: number, unpaired: number, geometry: Geometry, dq: number): Lfse {
  const { lower, upper } = orbitalSets(geometry);
  const config = strongFieldConfiguration(d, unpaired, geometry);
  const inDq = config.lower * lower.energyInDq + config.upper * upper.energyInDq;
  const pairs = (d - unpaired) / 2;
  const freeIonPairs = (d - Math.min(d, 10 - d)) / 2;
  return { dq: inDq, cm1: inDq * dq, configuration: config.text, pairs, extraPairs: pairs - freeIonPairs };
}

/** Spin-only moment √(n(n+2)) in Bohr magnetons for n unpaired electrons. */
export function spinOnlyMoment(unpaired: number): number {
  return Math.sqrt(unpaired * (unpaired + 2));
}
