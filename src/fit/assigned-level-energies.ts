/**
 * The refinement's hot call without the labelled level list: energies (cm-1)
 * of the assigned levels above the assumed ground level, read from the
 * engine's sorted level spectrum (typed arrays) instead of building every
 * level's object, term and label strings and a Map by key on each
 * Levenberg–Marquardt step.
 *
 * Same numbers, bit for bit, as assignedEnergies(computeLevels(d, geometry,
 * params), …) (refine.ts), the slow path it replaces and the reference of
 * tests/fit/assigned-level-energies.test.ts: each level's energy is its
 * spectrum energy less the ground position's (position 0), set to 0 below
 * the cluster tolerance, exactly as computeLevels writes it; a key is
 * ${2S+1}${irrep}#${rank} as levelIdentityKey. Where computeLevels does more
 * than that (Dq = 0 reorders coincident free-ion components, a Trees α uses
 * other blocks and tables, d0/d10 are closed shells) the slow path runs.
 */
import { irrepBlocks, IRREP_COLUMNS } from '../ligand-field/irrep-blocks.js';
import { irrepName } from '../ligand-field/labels.js';
import { levelSpectrum } from '../ligand-field/level-spectrum.js';
import { computeLevels, energyTolerance } from '../ligand-field/levels.js';
import { treesAlphaOf } from '../ligand-field/trees-correction.js';
import type { FieldParameters, Geometry } from '../ligand-field/types.js';
import { validateD, validateFieldParameters, validateGeometry } from '../ligand-field/validate.js';
import { levelIdentityKey } from './scan.js';

/** A level key as the spectrum's numbers: 2S, irrep column (0..4, IRREP_COLUMNS) and rank; null when no level can have it. */
export interface LevelIdentity {
  twoS: number;
  irrep: number;
  rank: number;
}

/** Parses a levelIdentityKey ("4A2g#0") for the geometry; null for a key no level of that geometry has. */
export function levelIdentityOf(key: string, geometry: Geometry): LevelIdentity | null {
  const match = /^(\d+)([A-Za-z0-9]+)#(\d+)$/.exec(key);
  if (match === null) return null;
  const irrep = IRREP_COLUMNS.findIndex((column) => irrepName(column, geometry) === match[2]);
  if (irrep < 0) return null;
  return { twoS: Number(match[1]) - 1, irrep, rank: Number(match[3]) };
}

/** What the fast path needs of a problem, parsed once per refinement: the ground key and the assigned keys. */
export interface AssignedIdentities {
  ground: LevelIdentity | null;
  levels: Array<LevelIdentity | null>;
}

export function assignedIdentitiesOf(groundKey: string, keys: readonly string[], geometry: Geometry): AssignedIdentities {
  return { ground: levelIdentityOf(groundKey, geometry), levels: keys.map((key) => levelIdentityOf(key, geometry)) };
}

/** Energy above the ground position of the level with this identity in the spectrum, or NaN when it has none. */
function energyOf(
  spectrum: { count: number; energy: Float64Array; twoS: Int32Array; irrep: Int32Array; rank: Int32Array },
  id: LevelIdentity | null,
  groundEnergy: number,
  tol: number,
): number {
  if (id === null) return Number.NaN;
  for (let p = 0; p < spectrum.count; p++) {
    if (spectrum.twoS[p] === id.twoS && spectrum.irrep[p] === id.irrep && spectrum.rank[p] === id.rank) {
      const energy = spectrum.energy[p]! - groundEnergy;
      return energy < tol ? 0 : energy;
    }
  }
  return Number.NaN;
}

/**
 * Writes into out[i] the energy of the level keys[i] above the level
 * groundKey at params (Dq, B, C in cm-1; NaN where a key has no level), and
 * validates d, geometry and params as computeLevels does (same errors).
 */
export function assignedLevelEnergies(
  d: number,
  geometry: Geometry,
  params: FieldParameters,
  groundKey: string,
  keys: readonly string[],
  identities: AssignedIdentities,
  out: Float64Array,
): void {
  validateD(d);
  validateGeometry(geometry);
  validateFieldParameters(params);
  if (d === 0 || d === 10 || params.dq === 0 || treesAlphaOf(params) !== 0) {
    slowAssignedEnergies(d, geometry, params, groundKey, keys, out);
    return;
  }
  const tol = energyTolerance(params);
  const coefficients = COEFFICIENTS;
  coefficients[0] = params.dq;
  coefficients[1] = params.b;
  coefficients[2] = params.c;
  coefficients[3] = 0;
  const spectrum = levelSpectrum(irrepBlocks(d, geometry), coefficients, tol);
  const groundEnergy = spectrum.energy[0]!;
  const zero = energyOf(spectrum, identities.ground, groundEnergy, tol);
  for (let i = 0; i < keys.length; i++) out[i] = energyOf(spectrum, identities.levels[i] ?? null, groundEnergy, tol) - zero;
}

/** [dq, b, c, alpha] for levelSpectrum; reused (the call is synchronous and reads it at once). */
const COEFFICIENTS = new Float64Array(4);

/** The slow path and reference: the labelled levels, then a Map by key (refine.ts assignedEnergies, inlined). */
export function slowAssignedEnergies(d: number, geometry: Geometry, params: FieldParameters, groundKey: string, keys: readonly string[], out: Float64Array): void {
  const byKey = new Map(computeLevels(d, geometry, params).levels.map((l) => [levelIdentityKey(l), l.energy]));
  const zero = byKey.get(groundKey) ?? Number.NaN;
  keys.forEach((key, i) => (out[i] = (byKey.get(key) ?? Number.NaN) - zero));
}
