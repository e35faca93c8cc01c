/**
 * The checked settings of a fit: d-count and ion, geometry, free-ion B0/C0,
 * and how C is treated.
 *
 * C: a fixed ratio C/B (`cOverB`; default the free ion's C0/B0 where the
 * table has it, else 4.5, a typical value for first-row ions), a fixed C
 * (`c`), or a free third parameter (`freeC`). At most one may be given.
 */
import { freeIonRacah } from '../chemistry/free-ion.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import { invalidArgument } from '../errors.js';
import { GEOMETRIES, type Geometry } from '../ligand-field/types.js';
import type { CMode, FitInput } from './types.js';

/** C/B used when neither the input nor the free-ion table gives one. */
export const DEFAULT_C_OVER_B = 4.5;

export interface FitSettings {
  d: number;
  ion: Ion | null;
  geometry: Geometry;
  b0: number | null;
  c0: number | null;
  freeIonSource: string | null;
  mode: CMode;
  /** The fixed ratio (ratio mode), or the starting ratio (fixed and free modes). */
  cOverB: number;
  /** Where cOverB comes from, for the notes. */
  cOverBSource: string;
  /** Fixed C in cm-1 (fixed mode), else NaN. */
  cFixed: number;
}

function resolveIon(value: unknown): Ion {
  if (typeof value === 'string') return parseIon(value, { path: 'ion' });
  if (typeof value === 'object' && value !== null) {
    const ion = value as Partial<Ion>;
    if (typeof ion.label === 'string' && typeof ion.d === 'number') return value as Ion;
  }
  throw invalidArgument('ion', `ion must be text such as "Cr3+" or "Co(II)", got ${JSON.stringify(value)}`);
}

function positiveField(value: unknown, path: string, what: string, max: number): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0 || value > max) {
    throw invalidArgument(path, `${path}: ${what} must be a number above 0 and at most ${max}, got ${JSON.stringify(value)}`);
  }
  return value;
}

export function resolveFitSettings(input: FitInput): FitSettings {
  if (typeof input !== 'object' || input === null) throw invalidArgument('', 'the fit input must be an object with bands and an ion or d');
  const ion = input.ion === undefined ? null : resolveIon(input.ion);
  let d: number;
  if (input.d !== undefined) {
    if (typeof input.d !== 'number' || !Number.isInteger(input.d) || input.d < 0 || input.d > 10) {
      throw invalidArgument('d', `d must be a whole number of d electrons from 1 to 9, got ${JSON.stringify(input.d)}`);
    }
    if (ion && ion.d !== input.d) throw invalidArgument('d', `d = ${input.d} disagrees with ${ion.label}, which is d${ion.d}`);
    d = input.d;
  } else if (ion) {
    d = ion.d;
  } else {
    throw invalidArgument('ion', 'give the metal as an ion (e.g. "Cr3+") or as a d-electron count');
  }
  if (d === 0 || d === 10) {
    throw invalidArgument(ion ? 'ion' : 'd', ion?.note ?? `d${d} has no d–d transitions, so there is nothing to fit`);
  }
  const geometry = input.geometry ?? 'octahedral';
  if (!GEOMETRIES.includes(geometry)) {
    throw invalidArgument('geometry', `geometry must be one of ${GEOMETRIES.join(', ')}, got ${JSON.stringify(geometry)}`);
  }
  const cOverB = positiveField(input.cOverB, 'cOverB', 'C/B', 20);
  const c = positiveField(input.c, 'c', 'C (cm-1)', 200_000);
  if (input.freeC !== undefined && typeof input.freeC !== 'boolean') {
    throw invalidArgument('freeC', `freeC must be true or false, got ${JSON.stringify(input.freeC)}`);
  }
  const freeC = input.freeC === true;
  if (cOverB !== undefined && c !== undefined) throw invalidArgument('c', 'give either a fixed C/B ratio or a fixed C, not both');
  if (freeC && (cOverB !== undefined || c !== undefined)) {
    throw invalidArgument('freeC', `a free C cannot be combined with a fixed ${c !== undefined ? 'C' : 'C/B'}`);
  }
  const free = ion ? freeIonRacah(ion) : undefined;
  const b0 = free?.b ?? null;
  const c0 = free?.c ?? null;
  let ratio = DEFAULT_C_OVER_B;
  let cOverBSource = `default C/B = ${DEFAULT_C_OVER_B} (no free-ion C0/B0 known)`;
  if (cOverB !== undefined) {
    ratio = cOverB;
    cOverBSource = `C/B = ${cOverB} as given`;
  } else if (free) {
    ratio = free.c / free.b;
    cOverBSource = `C/B = C0/B0 = ${ratio.toFixed(2)} of the free ${ion!.label} ion`;
  }
  const mode: CMode = freeC ? 'free' : c !== undefined ? 'fixed' : 'ratio';
  return {
    d, ion, geometry, b0, c0, freeIonSource: free?.source ?? null, mode, cOverB: ratio, cOverBSource,
    cFixed: c ?? Number.NaN,
  };
}
