/**
 * The public shapes of the ligand-field engine. Energies in cm-1; level
 * energies measured from the ground level of the same calculation.
 */

export type Geometry = 'octahedral' | 'tetrahedral';

export const GEOMETRIES: readonly Geometry[] = ['octahedral', 'tetrahedral'];

/** Dq, Racah B and C in cm-1. 10Dq = 10·dq. Dq ≥ 0: the geometry sets the sign of the field. */
export interface FieldParameters {
  dq: number;
  b: number;
  c: number;
  /** The Trees correction α·L(L+1) in cm-1 (trees-correction.ts); absent or 0: none. */
  alpha?: number;
}

/** Irreducible representations of the octahedral rotation group O, without parity. */
export type CubicIrrep = 'A1' | 'A2' | 'E' | 'T1' | 'T2';

export type SpinState = 'high-spin' | 'low-spin' | 'no-choice';

/** One (2S+1, Γ) level of a d^n ion in a cubic field. */
export interface Level {
  /** cm-1 above the ground level. */
  energy: number;
  /** "4T1g" (octahedral) or "4T1" (tetrahedral). */
  term: string;
  /** 2S+1. */
  multiplicity: number;
  /** "T1g" (octahedral) or "T1" (tetrahedral). */
  irrep: string;
  /** The irrep of O without the parity subscript. */
  cubicIrrep: CubicIrrep;
  /** (2S+1)·dim Γ. */
  degeneracy: number;
  /** Free-ion term as Dq → 0: "4F"; a repeated term is numbered by ascending energy: "2D2". */
  parent: string;
  /** term with parent for display: "4T1g(P)". */
  label: string;
  /** 0-based rank among levels of the same (multiplicity, irrep) by ascending energy: a stable identity along Dq. */
  rank: number;
}

export interface LevelsResult {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  groundTerm: string;
  spinState: SpinState;
  unpairedElectrons: number;
  levels: Level[];
  /** E.g. "d10 has no ligand-field transitions". */
  notes: string[];
}

/** A free-ion (Russell–Saunders) term at Dq = 0. */
export interface FreeIonTerm {
  /** "4F", or "2D2" when repeated. */
  term: string;
  multiplicity: number;
  /** Orbital angular momentum L. */
  L: number;
  /** cm-1 above the free-ion ground term. */
  energy: number;
}

export interface DiagramLine {
  /** "4T1g(P)". */
  label: string;
  term: string;
  parent: string;
  multiplicity: number;
  irrep: string;
  rank: number;
  /** E/B above the ground level at each step. */
  energies: number[];
}

export interface Diagram {
  d: number;
  geometry: Geometry;
  cOverB: number;
  /** Dq/B at each step, from 0 to maxDqOverB. */
  dqOverB: number[];
  /** Term of the ground level at each step (changes at a spin crossover). */
  groundTerms: string[];
  lines: DiagramLine[];
}
