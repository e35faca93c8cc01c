/**
 * The shapes of a band fit: what fitLigandField takes and the plain-JSON result it
 * returns (it goes over HTTP and into a database). Energies in cm-1; level
 * energies from the ground level; terms as the engine writes them ("4T1g").
 */
import type { Ion } from '../chemistry/ions.js';
import type { Geometry, SpinState } from '../ligand-field/types.js';
import type { BandFlag, BandInput } from './bands.js';
import type { Lfse } from './lfse.js';
import type { GoodnessOfFit } from './goodness-of-fit.js';
import type { AssignmentGroup } from './assignment-groups.js';
import type { AssignmentSpread } from './assignment-spread.js';

export interface FitInput {
  /** "Cr3+", "Cr(III)", or a parsed Ion. Gives d and, where tabulated, B0 and C0. */
  ion?: string | Ion;
  /** d-electron count 1–9, instead of (or agreeing with) the ion. */
  d?: number;
  /** Default "octahedral". */
  geometry?: Geometry;
  /** Band maxima in cm-1 (numbers or objects), or band-list text ("17400,24600"). */
  bands: readonly (number | BandInput)[] | string;
  /** Fixed C/B. Default: the free ion's C0/B0 where known, else 4.5. */
  cOverB?: number;
  /** Fixed Racah C in cm-1 (instead of a fixed ratio). */
  c?: number;
  /** Fit C as a third parameter (needs ≥ 3 d–d bands that depend on C). */
  freeC?: boolean;
  /**
   * The Trees correction α·L(L+1) (src/ligand-field/trees-correction.ts): a
   * fixed α in cm-1, or "free" to fit it as one more parameter. Default: none
   * (α = 0), the cubic model of the usual published analyses.
   */
  trees?: number | 'free';
  /**
   * The measured range, cm-1: a strong transition predicted inside it must
   * show a band; one outside it may be missing. Default: unknown (the bands'
   * own span stands in for it).
   */
  window?: { min: number; max: number };
  /** The complex's formula ("[Co(H2O)6]2+"): ligands for the priors; the metal when no ion is given; the geometry guess when none is given. */
  formula?: string;
  /** Ligands ("H2O", "NH3,Cl" or a list) for the 10Dq and β priors (Jørgensen's f·g and 1 − h·k). */
  ligands?: string | readonly string[];
}

/** Tuning of the fit; every field has a documented default (see fit-ligand-field.ts). */
export interface FitOptions {
  /** Transitions above this are left out of `predicted`. Default 50 000 cm-1. */
  predictedLimit?: number;
  /** At most this many alternatives are returned. Default 4. */
  maxAlternatives?: number;
}

export type CMode = 'ratio' | 'fixed' | 'free';

export type FitStatus = 'converged' | 'exact' | 'not-converged';

export interface AssignedBand {
  /** Observed maximum, cm-1 (for a Jahn–Teller pair: the mean of its components). */
  observed: number;
  calculated: number;
  /** calculated − observed. */
  residual: number;
  term: string;
  parent: string;
  label: string;
  multiplicity: number;
  spinAllowed: boolean;
  /** Index of the band (or bands, for an averaged pair) in the input list. */
  bands: number[];
  flags: BandFlag[];
  /** Other transitions within the band (degenerate or nearly so), e.g. ["4Eg(G)"]. */
  coincident: string[];
  /**
   * Present when the band's σ was widened because its transition energy
   * depends on C and C was not fitted but tied to B by an assumed C/B: the
   * σ added in quadrature, |∂ΔE/∂C|·B·σ(C/B), cm-1 (likelihood.ts,
   * c-sensitivity.ts). Absent: the band weighs with σ² + σm² alone.
   */
  sigmaFromC?: number;
}

export interface Penalty {
  rule: 'skipped-transition' | 'unexplained-band' | 'split-band' | 'beta' | 'c-over-b' | 'jahn-teller-pair' | 'ten-dq' | 'ligands' | 'intensity' | 'forbidden-band' | 'assignments' | 'assumed-c-over-b';
  /** Added to the score: a deviance, −2·ln p (likelihood.ts). */
  amount: number;
  detail: string;
}

export interface SkippedTransition {
  energy: number;
  term: string;
  label: string;
  reason: string;
}

export interface Alternative {
  /** The full assignment rows, as in FitResult.assignments, so that a chosen alternative is a complete fit result. */
  assignments: AssignedBand[];
  rmsResidual: number;
  /** χ² of the band positions under this assignment (part of score). */
  chiSquare: number;
  /** Deviance, −2·ln of the posterior up to a constant (likelihood.ts): lower is better. */
  score: number;
  /** Probability of this solution among those evaluated, exp(−score/2) normalised. */
  probability: number;
  penalties: Penalty[];
  dq: number;
  tenDq: number;
  b: number | null;
  c: number | null;
  beta: number | null;
  groundTerm: string;
  groundLabel: string;
  spinState: SpinState;
  /** Why the chosen assignment was preferred to this one. */
  reason: string;
  /** Same spin-allowed assignment, spin state and parameters as the chosen one (assignment-groups.ts): it differs only in weak-band labels. */
  inChosenGroup: boolean;
}

export interface PredictedTransition {
  energy: number;
  term: string;
  label: string;
  parent: string;
  multiplicity: number;
  spinAllowed: boolean;
  /** Two or more electrons change strong-field orbital set: expected weak. */
  twoElectron: boolean;
}

export interface CrossoverInfo {
  /** Dq/B at which the ground-state spin changes, at the fitted C/B. */
  dqOverB: number;
  fittedDqOverB: number;
  /** fitted − crossover. */
  difference: number;
  /** 100·difference/crossover. */
  percent: number;
  near: boolean;
}

export interface FitResult {
  d: number;
  ion: string | null;
  geometry: Geometry;
  dq: number;
  tenDq: number;
  b: number | null;
  c: number | null;
  cOverB: number | null;
  cMode: CMode;
  beta: number | null;
  freeIonB: number | null;
  freeIonC: number | null;
  freeIonSource: string | null;
  groundTerm: string;
  groundLabel: string;
  spinState: SpinState;
  unpairedElectrons: number;
  /** μB. */
  spinOnlyMoment: number;
  lfse: Lfse;
  /** Root-mean-square of calculated − observed (weighted by 1/σ² when bands carry uncertainties), cm-1. */
  rmsResidual: number;
  status: FitStatus;
  message: string;
  evaluations: number;
  /** The Trees α in cm-1 (fixed or fitted); present only when the fit used it (`trees`). */
  alpha?: number;
  /**
   * Standard uncertainties, cm-1; null where the quantity is not fitted (alpha: present only when α was fitted).
   * tenDq, dq and b combine the fit's σ with the spread of the weak-band labellings (assignment-spread.ts):
   * √(σ_fit² + Δ²); equal to the fit's σ when the assignment group has one member. The fit's own σ: assignmentSpread.fitUncertainty.
   */
  uncertainty: { tenDq: number | null; dq: number | null; b: number | null; c: number | null; alpha?: number | null };
  /** Standard uncertainty of beta: uncertainty.b / freeIonB (betaSdOf in uncertainty.ts); null where either is unknown. */
  betaSd: number | null;
  /** Correlation coefficients of the fitted parameters. */
  correlation: { bDq: number | null; cDq: number | null; cB: number | null };
  /** Deviance, −2·ln of the posterior up to a constant (likelihood.ts): lower is better. */
  score: number;
  /** χ² of the band positions with σ² + σm² (part of score). */
  chiSquare: number;
  /** Probability of the chosen assignment among the solutions evaluated. */
  probability: number;
  /** The chosen solution's group: the solutions with its spin-allowed assignment and parameters, and their summed probability (assignment-groups.ts). */
  assignmentGroup: AssignmentGroup;
  /** How far the weak-band labellings of the assignment group move 10Dq and B, and the fit's σ before that spread was added to `uncertainty` (assignment-spread.ts). */
  assignmentSpread: AssignmentSpread;
  /** Absolute check of the chosen solution (goodness-of-fit.ts): the probability above is only relative to the other assignments. */
  goodnessOfFit: GoodnessOfFit;
  /** Probability of each spin state (summed over its solutions); only states the d-count allows. */
  spinStateProbabilities: Partial<Record<SpinState, number>>;
  /** Parameters the bands do not determine, each with what was done (fixed at its prior, or not reported). */
  undetermined: Array<{ parameter: 'b' | 'c' | 'tenDq'; reason: string; action: string }>;
  /** The measured range used for the window terms, cm-1, or null. */
  window: { min: number; max: number } | null;
  /** Ligands used for the priors (keys), or []. */
  ligands: string[];
  penalties: Penalty[];
  assignments: AssignedBand[];
  /** Bands not used: charge-transfer, or left unexplained by the chosen assignment. */
  unassigned: Array<{ observed: number; band: number; reason: string }>;
  skipped: SkippedTransition[];
  alternatives: Alternative[];
  crossover: CrossoverInfo | null;
  predicted: PredictedTransition[];
  warnings: string[];
  notes: string[];
}
