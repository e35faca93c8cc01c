/**
 * Shapes shared by the series functions: analyses of complexes of one metal
 * ion, each with its 10Dq and, optionally, its nephelauxetic ratio β = B/B0.
 * Energies in cm-1; uncertainties are one standard deviation, same unit.
 */

/** One ligand kind in an analysed complex: "NH3" × 6. */
export interface LigandShare {
  /** A ligand key or spelling ("NH3", "ammine", "ox") or the user's own name ("L1"). */
  ligand: string;
  count: number;
}

/** One analysis of a complex of the series' metal ion. */
export interface SeriesAnalysis {
  id?: string;
  /** What the user calls the sample: "[Cr(NH3)6]Cl3 in water". */
  sample: string;
  /** The ligand of a homoleptic complex; give this or `ligands`. */
  ligand?: string;
  /** The ligands of a mixed complex; give this or `ligand`. */
  ligands?: LigandShare[];
  /** The metal ion in any spelling parseIon reads ("Cr3+"); all analyses of a series must agree. */
  ion?: string;
  /** 10Dq in cm-1, > 0. */
  tenDq: number;
  /** One standard deviation of 10Dq, cm-1, ≥ 0; absent means unknown (treated as 0). */
  tenDqUncertainty?: number;
  /** β = B/B0, in (0, 1.2]. */
  beta?: number;
  betaUncertainty?: number;
  /** Racah B in cm-1, for display only. */
  b?: number;
}

/** How close two neighbours must be to be flagged as not resolved (the one list the CLI and REST options read). */
export const OVERLAP_CRITERIA = ['one-sigma', 'two-sigma'] as const;
export type OverlapCriterion = (typeof OVERLAP_CRITERIA)[number];

/** One analysis in its place in a ranking. */
export interface RankedEntry {
  /** 1-based position, weakest first. */
  position: number;
  /** Index of the analysis in the list given. */
  index: number;
  id?: string;
  sample: string;
  /** "NH3", or "NH3×5 Cl" for a mixed complex. */
  ligandLabel: string;
  /** 10Dq (cm-1) for the spectrochemical ranking, 1 − β for the nephelauxetic one. */
  value: number;
  uncertainty: number;
  /** True when this entry and the next one are not resolved by the criterion. */
  overlapsNext: boolean;
}

export interface Overlap {
  /** Positions (1-based) of the two neighbours. */
  lower: number;
  upper: number;
  difference: number;
  /** sqrt(σ1² + σ2²). */
  combinedUncertainty: number;
}

export interface Ranking {
  /** 'spectrochemical' (by 10Dq) or 'nephelauxetic' (by 1 − β). */
  kind: 'spectrochemical' | 'nephelauxetic';
  /** What `value` holds: "10Dq / cm-1" or "1 - beta". */
  quantity: string;
  criterion: OverlapCriterion;
  /** Weakest first: smallest 10Dq, or smallest 1 − β (least nephelauxetic). */
  entries: RankedEntry[];
  overlaps: Overlap[];
  /** "Cl < F < H2O ~ ox < NH3": "~" joins neighbours that overlap. */
  series: string;
  /** Analyses left out (no β for the nephelauxetic ranking), with why. */
  skipped: { index: number; sample: string; reason: string }[];
}
