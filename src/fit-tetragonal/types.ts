import type { BandInput } from '../fit/bands.js';
import type { AssignedBand, Penalty } from '../fit/types.js';
import type { FieldLevel } from '../ligand-field/field-levels.js';
import type { Geometry } from '../ligand-field/types.js';
import type { SolveResult } from './solve.js';

/** What `fit --symmetry tetragonal` (or `fit --zeta`) takes; see fit-tetragonal.ts. */
export interface TetragonalFitInput {
  ion?: string;
  d?: number;
  geometry?: Geometry;
  bands: readonly (number | BandInput)[] | string;
  /** 'tetragonal' (Dq, Ds, Dt) or 'cubic' (Dq only; with ζ, the spin–orbit fit). Default 'tetragonal'. */
  symmetry?: 'cubic' | 'tetragonal';
  /** Fixed ζ in cm-1, or 'free-ion' for the ion's tabulated value. Default 0. */
  zeta?: number | 'free-ion';
  /** Fit ζ as well (starting from the zeta given, or 0.8 × the free ion's, or 400 cm-1). */
  freeZeta?: boolean;
  /** Fixed C/B. Default: C0/B0 of the free ion, else 4.5. */
  cOverB?: number;
  /** Fixed Racah B in cm-1 (instead of fitting it). */
  b?: number;
}

/** A band's assignment in tetragonal symmetry: the cubic fit's row (src/fit/types.ts) with the level's degeneracy. */
export interface TetragonalAssignment extends Pick<AssignedBand, 'observed' | 'calculated' | 'residual' | 'term' | 'parent' | 'label' | 'bands'> {
  degeneracy: number;
}

/** A score term (src/fit's Penalty), or the ζ prior of score.ts. */
export interface TetragonalPenalty extends Omit<Penalty, 'rule'> {
  rule: Penalty['rule'] | 'zeta';
}

/** Two or more bands assigned to components of one octahedral (or spin-free) parent: one band of the cubic parent, split. */
export interface ParentComponents {
  /** The parent level, "4T1g(F)". */
  parent: string;
  /** Band positions (cm-1), ascending, and the component each is assigned to. */
  bands: number[];
  labels: string[];
  /** Highest minus lowest calculated component energy, cm-1. */
  splitting: number;
}

export interface TetragonalFitResult {
  d: number;
  ion: string | null;
  geometry: Geometry;
  symmetry: 'cubic' | 'tetragonal';
  dq: number;
  tenDq: number;
  ds: number;
  dt: number;
  b: number | null;
  c: number | null;
  cOverB: number;
  zeta: number;
  zetaMode: 'fixed' | 'free-ion' | 'free';
  freeIonZeta: number | null;
  /** Standard uncertainties (cm-1); null when fixed or not determined by the data on its own. */
  uncertainty: { dq: number | null; tenDq: number | null; ds: number | null; dt: number | null; b: number | null; c: number | null; zeta: number | null };
  status: 'exact' | 'converged' | 'underdetermined' | 'not-converged';
  /** The parameter combinations the data fix, e.g. ["Dq", "Ds − 1.667·Dt"]. */
  determined: string[];
  /** Free parameters the data do not fix on their own. */
  undetermined: string[];
  rmsResidual: number;
  /** The winner's score (deviance, src/fit/likelihood.ts: lower is better) and its probability among the assignments fitted. */
  score: number;
  probability: number;
  /** The score's terms other than the positions' χ²: transitions left without a band, the β prior. */
  penalties: TetragonalPenalty[];
  groundTerm: string;
  groundLabel: string;
  assignments: TetragonalAssignment[];
  /** Parents with more than one band on their components (a split cubic band). */
  components: ParentComponents[];
  alternatives: Array<{ labels: string[]; rmsResidual: number; score: number; probability: number }>;
  predicted: Array<Pick<FieldLevel, 'energy' | 'degeneracy' | 'irrep' | 'parent' | 'label'>>;
  warnings: string[];
  notes: string[];
}

/** One assignment to fit: level keys per band (bands ascending), from a start. */
export interface Plan {
  chosen: string[];
  /** Spin-allowed candidates passed over below the highest chosen one (enumeration order only). */
  skipped: number;
  x0: Float64Array;
}

/** A fitted plan. */
export interface Trial {
  solve: SolveResult;
  /** Level keys of the bands, in band order. */
  chosen: string[];
  skipped: number;
  /** All five parameters at the start (the fixed ones stay). */
  base: Float64Array;
  /** The ground level at the solution has the multiplicity the candidates were chosen for. */
  keepsGround: boolean;
  /** Filled by score.ts. */
  score: number;
  penalties: TetragonalPenalty[];
}
