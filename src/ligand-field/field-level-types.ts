import type { FieldParameters, Geometry } from './types.js';

/**
 * Levels of d^n beyond the cubic field: a tetragonal field (Ds, Dt, the
 * convention of tetragonal-field.ts: positive Ds and Dt elongate along z)
 * and spin–orbit coupling ζ Σ l·s (ζ the one-electron constant, cm-1,
 * ≥ 0; more-than-half-filled shells get their inverted multiplets from the
 * many-electron algebra, not from a sign of ζ).
 *
 * Three regimes, one result shape:
 * - Ds = Dt = ζ = 0: the cubic levels of levels.ts, unchanged.
 * - ζ = 0, Ds or Dt ≠ 0 (octahedral only): (2S+1, Γ) levels, Γ an irrep
 *   of D4h (A1g, A2g, B1g, B2g, Eg); parent = the octahedral level it comes
 *   from as (Ds, Dt) → 0 at fixed Dq, B, C: the i-th lowest (S, Γ) level
 *   ends on the i-th lowest (S, Γ) component of the octahedral levels (O →
 *   D4: A1 → A1, A2 → B1, E → A1 + B1, T1 → A2 + E, T2 → B2 + E), by the
 *   non-crossing rule along the one-parameter path t·(Ds, Dt), as labels.ts
 *   argues for Dq.
 * - ζ > 0: levels of the double group (Bethe's Γ names): O' (or Td', the
 *   same labels on d^n) when Ds = Dt = 0, Γ1..Γ8; D4' otherwise, Γ1..Γ7.
 *   parent = the spin-free level (the same Dq, Ds, Dt, B, C at ζ = 0) with
 *   the largest weight Σ|<spin-free state|level>|² in the level's
 *   eigenvector, and parentWeight that weight (0..1). Degenerate spin-free
 *   levels cannot be told apart by weight: their names are joined with "+".
 * Energies in cm-1 above the ground level; degeneracies add up to C(10, n).
 */
export interface TetragonalParameters extends FieldParameters {
  /** Tetragonal Ds, cm-1 (any sign). Default 0. */
  ds?: number | undefined;
  /** Tetragonal Dt, cm-1 (any sign). Default 0. */
  dt?: number | undefined;
  /** One-electron spin–orbit constant ζ, cm-1, ≥ 0. Default 0 (off). */
  zeta?: number | undefined;
}

/** All six parameters present. */
export interface ResolvedParameters extends FieldParameters {
  ds: number;
  dt: number;
  zeta: number;
}

export type SiteGroup = 'Oh' | 'Td' | 'D4h' | "O'" | "Td'" | "D4'";

export interface FieldLevel {
  /** cm-1 above the ground level. */
  energy: number;
  /** Number of states. */
  degeneracy: number;
  /** "A2g" (D4h), "T1g" (Oh), "T1" (Td) or a double-group irrep "Γ8". */
  irrep: string;
  /** Octahedral parent ("4T1g(F)") in D4h; spin-free parent with spin–orbit; free-ion term ("4F") in a cubic field. */
  parent: string;
  /** With spin–orbit: the weight of the parent in the level (0..1); 1 otherwise. */
  parentWeight: number;
  /** "4A2g", "Γ8". */
  term: string;
  /** 2S+1; with spin–orbit, that of the dominant parent. */
  multiplicity: number;
  /** For display: "4A2g[4T1g(F)]", "Γ8[4T1(F) 97%]". */
  label: string;
  /**
   * With spin–orbit only: the weight (0..1) of every spin-free parent that
   * holds at least PARENT_WEIGHT_FLOOR of the level, the dominant one
   * included. A level whose dominant parent is a doublet can hold a large
   * share of a quartet (2T1(G) beside 4T1(P) in tetrahedral Co(II)): it
   * borrows that quartet's intensity, and a fit may put a band on it.
   */
  parentWeights?: Readonly<Record<string, number>>;
}

/** Parents below this weight in a spin–orbit level are left out of parentWeights. */
export const PARENT_WEIGHT_FLOOR = 0.01;

export interface FieldLevelsResult {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  ds: number;
  dt: number;
  zeta: number;
  symmetry: 'cubic' | 'tetragonal';
  spinOrbit: boolean;
  group: SiteGroup;
  groundTerm: string;
  levels: FieldLevel[];
  notes: string[];
}

/** Cluster tolerance, cm-1: far below any physical splitting, far above round-off. */
export function fieldTolerance(p: ResolvedParameters): number {
  return 1e-9 * (10 * Math.abs(p.dq) + 20 * p.b + 10 * p.c + 10 * Math.abs(p.ds) + 10 * Math.abs(p.dt) + 5 * p.zeta);
}
