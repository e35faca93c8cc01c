/**
 * The ranges of ligand-field parameters fieldgap accepts at its edges (CLI
 * options, REST fields), in cm-1. They are wide enough for every d^n
 * complex and narrow enough that the engine's numbers stay meaningful:
 * the free-ion B0 tabulated in src/chemistry/free-ion-racah.ts run from 718 to
 * 1 244 cm-1 and C0 from 2 629 to 4 976 cm-1 (3d ions; 4d and 5d ions have
 * smaller B, from memory), complexes reduce B by β ≥ ~0.2, and 10Dq of known
 * complexes stays below ~50 000 cm-1 (common practice). The bounds leave a
 * wide margin around all of these; values far outside (B = 1e-150,
 * Dq = 1e300) are typing errors, not chemistry.
 */
import { invalidArgument } from '../errors.js';

export interface ParameterRange {
  min: number;
  max: number;
  /** How the quantity is named in messages. */
  what: string;
  unit: string;
}

export const PARAMETER_BOUNDS = {
  dq: { min: 0, max: 10_000, what: 'Dq (10Dq up to 100 000 cm-1)', unit: 'cm-1' },
  b: { min: 10, max: 5_000, what: 'Racah B', unit: 'cm-1' },
  c: { min: 0, max: 50_000, what: 'Racah C', unit: 'cm-1' },
  cOverB: { min: 0, max: 20, what: 'C/B', unit: '' },
  maxDqOverB: { min: 0.1, max: 100, what: 'the largest Dq/B', unit: '' },
} as const satisfies Record<string, ParameterRange>;

export type BoundedParameter = keyof typeof PARAMETER_BOUNDS;

/** Throws invalid-argument naming `path` when value lies outside the range of `name`; returns value. */
export function checkParameterRange(name: BoundedParameter, value: number, path: string): number {
  const { min, max, what, unit } = PARAMETER_BOUNDS[name];
  if (Number.isFinite(value) && value >= min && value <= max) return value;
  const u = unit === '' ? '' : ` ${unit}`;
  throw invalidArgument(path, `${path}: ${value}${u} is outside the range fieldgap accepts for ${what}, ${min} to ${max}${u}`);
}
