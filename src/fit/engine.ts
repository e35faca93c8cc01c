/**
 * The fit's one door to the ligand-field engine, counting calls so the
 * benchmark (and a curious reader) can see what a fit costs.
 */
import { computeLevels, crossoverDqOverB } from '../ligand-field/index.js';
import type { FieldParameters, Geometry, LevelsResult } from '../ligand-field/types.js';
import { assignedLevelEnergies, type AssignedIdentities } from './assigned-level-energies.js';

let levelCalls = 0;

/** computeLevels, counted. */
export function levelsAt(d: number, geometry: Geometry, params: FieldParameters): LevelsResult {
  levelCalls++;
  return computeLevels(d, geometry, params);
}

/** assignedLevelEnergies (the refinement's energies without the labelled list), counted as one engine call. */
export function assignedEnergiesAt(
  d: number, geometry: Geometry, params: FieldParameters, groundKey: string, keys: readonly string[], identities: AssignedIdentities, out: Float64Array,
): void {
  levelCalls++;
  assignedLevelEnergies(d, geometry, params, groundKey, keys, identities, out);
}

/** Engine level computations since the process started. */
export function engineCallCount(): number {
  return levelCalls;
}

const crossovers = new Map<string, number | undefined>();

/** crossoverDqOverB up to Dq/B = 12, cached per (d, geometry, C/B to 1e-6): it costs ~100 diagonalisations. */
export function crossoverAt(d: number, geometry: Geometry, cOverB: number): number | undefined {
  const key = `${d}|${geometry}|${cOverB.toFixed(6)}`;
  if (!crossovers.has(key)) {
    if (crossovers.size > 256) crossovers.clear();
    crossovers.set(key, crossoverDqOverB(d, geometry, cOverB, { maxDqOverB: 12 }));
  }
  return crossovers.get(key);
}
