/**
 * The rule of average environment: a mixed-ligand complex's factor is the
 * average of its ligands' factors weighted by the coordination positions
 * each kind fills,  f_mix = Σ n_i f_i / N  with N = Σ n_i,  so that
 * 10Dq ≈ g · f_mix and, applied the same way to the nephelauxetic factors,
 * 1 − β ≈ k · h_mix. It is an estimate: it ignores the lower symmetry and
 * cis/trans differences (Jørgensen 1969; common practice).
 */
export interface FactorShare {
  /** The ligand's factor (f or h). */
  factor: number;
  /** Coordination positions this ligand kind fills: count × denticity. */
  positions: number;
}

/** Σ n_i f_i / Σ n_i; NaN for an empty list. */
export function averageEnvironmentFactor(shares: readonly FactorShare[]): number {
  let weighted = 0;
  let positions = 0;
  for (const { factor, positions: n } of shares) {
    weighted += n * factor;
    positions += n;
  }
  return positions === 0 ? Number.NaN : weighted / positions;
}

/** 10Dq estimate in cm-1 for a mixed complex: g · Σ n_i f_i / N. */
export function averageEnvironmentTenDq(shares: readonly FactorShare[], g: number): number {
  return g * averageEnvironmentFactor(shares);
}
