import {
  computeFieldLevels, doubleGroupRawLevels, tetragonalEnergies, type FieldLevel, type ResolvedParameters,
} from '../ligand-field/field-levels.js';
import type { Geometry } from '../ligand-field/types.js';

/**
 * The forward model of the tetragonal / spin–orbit fit: level energies above
 * the ground level, each under an identity that does not change with the
 * parameters (so a band stays on "its" level while the fit moves them):
 * spin-free (2S, D4 irrep, rank in its block); with spin–orbit (D4' irrep,
 * rank). Energies cm-1. Eigenvalues only: the labels come once, from
 * labelKeys, at the start and at the end.
 */
export interface ModelSetting {
  d: number;
  geometry: Geometry;
  /** With spin–orbit: the double-group blocks (ζ > 0 somewhere in the fit). */
  spinOrbit: boolean;
}

/** key → energy above the lowest level, in the model's identities. */
export function modelEnergies(setting: ModelSetting, p: ResolvedParameters): Map<string, number> {
  const out = new Map<string, number>();
  if (setting.spinOrbit) {
    const raw = doubleGroupRawLevels(setting.d, setting.geometry, p);
    const ground = raw[0]!.energy;
    for (const r of raw) out.set(`${r.irrep}#${r.rank}`, r.energy - ground);
  } else {
    const { count, energy, keys, ground } = tetragonalEnergies(setting.d, p);
    const zero = energy[ground]!;
    for (let i = 0; i < count; i++) out.set(keys[i]!, energy[i]! - zero);
  }
  return out;
}

/** Each key's labelled level at p (the level of nearest energy; a cubic Γ8 is two keys with one level). */
export function labelKeys(setting: ModelSetting, p: ResolvedParameters): { byKey: Map<string, FieldLevel>; levels: FieldLevel[] } {
  const levels = computeFieldLevels(setting.d, setting.geometry, p).levels;
  const byKey = new Map<string, FieldLevel>();
  for (const [key, energy] of modelEnergies(setting, p)) {
    let best = levels[0]!;
    for (const level of levels) if (Math.abs(level.energy - energy) < Math.abs(best.energy - energy)) best = level;
    byKey.set(key, best);
  }
  return { byKey, levels };
}
