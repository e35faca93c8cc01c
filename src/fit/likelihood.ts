/**
 * The one score that chooses an assignment: a deviance, −2·ln of the
 * assignment's posterior probability, up to a constant shared by every
 * assignment of the same band list. Lower wins; two solutions whose scores
 * differ by Δ have probabilities in the ratio exp(−Δ/2), and the reported
 * probability of a solution is exp(−score/2) normalised over the solutions
 * evaluated (a profile posterior: each at its best parameters, no volume
 * factor). Every term is ≥ 0 and is listed as a `Penalty` with its rule,
 * except the position term, which is `Evaluated.chiSquare`.
 *
 * Likelihood
 * - Positions: χ² = Σ (o − c)² / (σ² + σm² + σ_C²), with σ the band's
 *   uncertainty (given, or max(100 cm-1, 1% of the position)) and σm the
 *   model error of a cubic ligand field with one C/B: max(150 cm-1, 1.5% of
 *   the position) (common practice: such fits leave residuals of a few
 *   hundred cm-1). σ_C (errors in variables, c-sensitivity.ts): when C is
 *   not fitted but tied to B by an assumed C/B (the free ion's; not one the
 *   user gave), σ_C = |∂ΔE/∂C|·B·σ(C/B), ∂ΔE/∂C the derivative of the
 *   assigned transition energy with respect to C at fixed Dq and B and
 *   σ(C/B) = 1.62 the standard deviation of the C/B prior below; 0 for a
 *   transition that does not depend on C (the spin-allowed bands of d3 and
 *   d8). A sharp spin-forbidden line (4A2g → 2Eg of Cr(III), ≈ 9B + 3C) so
 *   weighs as little as the unknown C makes it worth and no longer fixes B
 *   through an assumed C/B. The same σ_C enters the least-squares weights
 *   (leastSquaresSigma) and the goodness of fit. In the score each band's
 *   σ_C is taken as independent, and in an over-determined fit the widened
 *   σ costs its normalisation, Σ ln(1 + σ_C²/(σ² + σm²)) (c-sensitivity.ts
 *   assumedCPenalty: else an assignment whose bands all depend on C would
 *   win by its discounted χ²). The reported covariance treats C as one
 *   shared error (uncertainty.ts sandwichCovariance): the two singlets of
 *   low-spin d6 move together with C, so 10Dq takes its spread and B not.
 * - A band left unexplained: a band list may hold a maximum that is no d–d
 *   maximum of this model (a split maximum, noise, an impurity) with prior
 *   probability π, anywhere in a range R = 30 000 cm-1. Against explaining
 *   it exactly that costs −2·ln(π/R) − ln(2π·σeff²): π = 0.02, times 3 for a
 *   shoulder, for a weak band (ε below 20% of the largest d–d ε) and for a
 *   narrow one (width below half the median), times 5 for a band the user
 *   flagged spin-forbidden (such bands are often components the cubic model
 *   does not resolve); π at most 0.5 (values: common practice).
 * - Two neighbouring bands read as one split band: −2·ln 0.1 + (Δ/1500 cm-1)².
 * - Jahn–Teller components averaged: −2·ln 0.5 + (10·(ratio − 1.3))² above a
 *   ratio of 1.3 between the highest and the lowest component.
 * - A predicted transition of the class the bands are assigned to with no
 *   band on it: −2·ln p, p the chance that it is missed:
 *   · outside the measured range (when the range is known), above the
 *     highest band (when it is not), or under a charge-transfer band: p = 1;
 *   · within 300 cm-1 (or half the band width) of an assigned transition:
 *     p = 1, it lies under that band;
 *   · inside the measured range above the highest band: the lowest such
 *     transition p = max(0.1, p below), those above it p = 1 (a rising
 *     charge-transfer tail hides the near-UV end of many spectra);
 *   · inside the measured range, or between observed bands: a one-electron
 *     spin-allowed transition p = 0.003 (it is strong and must appear); a
 *     two-electron one p = 0.5 (weak); in Td one that is electric-dipole
 *     forbidden by symmetry (Γground × Γexcited without T2: 3A2 → 3T2 of
 *     V(III), 4A2 → 4T2 of Co(II); orbital-selection.ts) p = 0.5 (weak);
 *     one of a spin-forbidden class (high-spin d5, whose bands are all
 *     weak) p = 0.2;
 *   · below the lowest band when the range is not known: in the infrared
 *     (< 5000 cm-1) p = 0.3 octahedral, 1 tetrahedral; a tetrahedral ion's
 *     transitions below 7000 cm-1 p = 0.7 (the lowest, and ν2 of Co(II),
 *     4T1(F) near 5 000–7 000 cm-1, common practice: UV–vis instruments
 *     seldom reach them); else p = 0.05.
 *   (Values: common practice.)
 * - A band explained by a spin-forbidden transition beside spin-allowed ones:
 *   −2·ln 0.15, the chance that a given one of the many weak spin-forbidden
 *   transitions shows as a band at all (common practice: a few sharp ones
 *   do); without it any stray band finds a doublet within its σ.
 * - Intensities, for bands that carry ε (L mol-1 cm-1): ln ε ~ Normal(μ, 1.3)
 *   with ε_μ = 20 for octahedral spin-allowed d–d bands, 300 tetrahedral
 *   (common practice: 1–150 and 50–1 500); for a two-electron transition and
 *   for a tetrahedral one forbidden by the orbital rule (ν1 of tetrahedral
 *   Co(II) and V(III): tens against hundreds, common practice) a tenth of the
 *   strongest one-electron spin-allowed ε assigned in the same spectrum, or,
 *   when none is, a tenth of the typical allowed ε (common practice: weak
 *   classes lie well below the allowed bands of the same spectrum, issue 13;
 *   an absolute yardstick alone calls a band as strong as its neighbour
 *   "weak" whenever both are weaker than typical); for spin-forbidden bands 3% of the strongest spin-allowed ε
 *   of the spectrum, or, when every band is spin-forbidden (high-spin d5),
 *   ε_μ = 0.3 octahedral / 1 tetrahedral with σ 1.7: the quartets of
 *   octahedral d5 span about 0.01 (hexaaqua Mn(II)) to 10 (Fe(III) in
 *   oxides, where charge transfer lies near and lends intensity), common
 *   practice; ±2σ covers that span around its geometric mean. Term:
 *   ((ln ε − ln ε_μ)/σ)², σ = 1.3 otherwise.
 * - Assignment prior: the spin states (branches) are a priori equally
 *   probable and each shares its probability evenly among its N order-
 *   consistent assignments of the bands, so one costs 2·ln N (score-terms.ts;
 *   an Occam factor: a branch dense in levels may not win by its number of
 *   chances).
 * - Two bands on levels degenerate at every field (4A1g, 4Eg(G) of d5): as a
 *   split band, −2·ln 0.1 + (Δ/1500 cm-1)².
 * Priors (common practice unless a source is named)
 * - β = B/B0 flat on [0.35, 1.0], half-Gaussian tails of σ 0.04 above and
 *   0.035 below (without B0: B flat on [150, 1250] cm-1, tails of 50 and
 *   15 cm-1). First-row complexes below β = 0.35 are unknown (common
 *   practice: even cyanides keep β near 0.4–0.5).
 * - C/B, when fitted: Gaussian around C0/B0 (4.5 without a free-ion value),
 *   σ 1.2, skewed up: complexes have C/B at or above the free ion's, so above
 *   the centre σ is 2.0.
 * - 10Dq: ligands given: log-normal around Jørgensen's f·g (×4/9
 *   tetrahedral), σ 15% (JORGENSEN_SOURCE; the rule holds to about 10%);
 *   otherwise flat over the range the ion shows with common ligands,
 *   0.7·g … 1.75·g (f of bromide to cyanide) with σ 15% tails; no prior
 *   without g. Above the expectation or the range, a low-spin solution (its
 *   ground is the strong-field one) has a σ of 0.41 in ln 10Dq instead: the
 *   f·g rule underestimates the low-spin cyanide complexes of M(II) and
 *   M(III) ions, [Fe(CN)6]3- Dq = 3 495 cm-1 against 1.75·g = 24 500
 *   ("Bindungsverhältnisse in Prussiaten", abstract on scilit.com, looked
 *   up) and [Fe(CN)6]4- 10Dq ≈ 33 800 against 14 875 (Lever 1984, from
 *   memory), a factor 2.3, put at two σ (σ = ln 2.3 / 2). A low-spin
 *   ground itself says the ligands are of that strong-field class; a
 *   high-spin solution keeps the 15% tail.
 * - β with ligands: Gaussian around 1 − h·k (Jørgensen), σ 0.1.
 */

/** Model error of a band position, cm-1. */
export function modelSigma(position: number): number {
  return Math.max(150, 0.015 * position);
}

/**
 * 1/(σ² + σm² + σ_C²): the weight of a band in χ², σ_C the spread its
 * position takes from an assumed C/B (c-sensitivity.ts; 0 when C is fitted
 * or fixed, or the transition does not depend on C).
 */
export function effectiveWeight(position: number, sigma: number, sigmaC = 0): number {
  return 1 / (sigma * sigma + modelSigma(position) ** 2 + sigmaC * sigmaC);
}

/**
 * The divisor of a band's residual in the least-squares fit: σ_eff without
 * the model error, √(σ² + σ_C²), when the fit is weighted (or any band is
 * widened by σ_C: such a fit is weighted, every band taking its σ, given or
 * default); 1 when it is unweighted.
 */
export function leastSquaresSigma(sigma: number, sigmaC: number, weighted: boolean): number {
  return weighted ? Math.sqrt(sigma * sigma + sigmaC * sigmaC) : 1;
}

/** −2·ln p, ≥ 0 for p ≤ 1. */
export function deviance(p: number): number {
  return -2 * Math.log(Math.min(1, p));
}

export const LIKELIHOOD = {
  /** Range a spurious band may fall anywhere in, cm-1. */
  spuriousRange: 30_000,
  spuriousPrior: 0.02,
  spuriousFactor: 3,
  spuriousFlaggedFactor: 5,
  spuriousMax: 0.5,
  splitPair: 0.1,
  splitScale: 1500,
  jahnTellerPair: 0.5,
  jahnTellerRatio: 1.3,
  missAllowed: 0.003,
  missAboveHighest: 0.1,
  forbiddenSeen: 0.15,
  missTwoElectron: 0.5,
  missOrbitallyForbidden: 0.5,
  missForbiddenClass: 0.2,
  missBelowOctahedral: 0.05,
  missInfraredOctahedral: 0.3,
  missTetrahedralLowest: 0.7,
  coincidence: 300,
  infrared: 5000,
  tetrahedralLowest: 7000,
  logEpsilonSigma: 1.3,
  logEpsilonSigmaAllForbidden: 1.7,
  epsilonOctahedral: 20,
  epsilonTetrahedral: 300,
  epsilonTwoElectronFactor: 0.1,
  epsilonOrbitallyForbiddenFactor: 0.1,
  forbiddenRelative: 0.03,
  epsilonForbiddenOctahedral: 0.3,
  epsilonForbiddenTetrahedral: 1,
  betaMin: 0.35,
  betaMax: 1.0,
  betaSigmaHigh: 0.04,
  betaSigmaLow: 0.035,
  bMaxWithoutIon: 1250,
  bMinWithoutIon: 150,
  cOverBSigmaLow: 1.2,
  cOverBSigmaHigh: 2.0,
  defaultCOverB: 4.5,
  tenDqSigma: 0.15,
  tenDqSigmaLowSpinHigh: Math.log(2.3) / 2,
  fLow: 0.7,
  fHigh: 1.75,
  tetrahedralFactor: 4 / 9,
  betaLigandSigma: 0.1,
  /** Alternatives are kept while their probability is at least this fraction of the winner's. */
  alternativeRatio: 1e-6,
} as const;

/** Deviance of leaving a band unexplained, given its spurious-band prior π and σeff. */
export function unexplainedDeviance(prior: number, sigmaEff: number): number {
  const { spuriousRange } = LIKELIHOOD;
  return Math.max(0, deviance(prior / spuriousRange) - Math.log(2 * Math.PI * sigmaEff * sigmaEff));
}

/** Half-Gaussian tails outside [lo, hi]: 0 inside. */
export function flatWithTails(value: number, lo: number, hi: number, sigmaLow: number, sigmaHigh: number): number {
  if (value < lo) return ((lo - value) / sigmaLow) ** 2;
  if (value > hi) return ((value - hi) / sigmaHigh) ** 2;
  return 0;
}

/** Probabilities exp(−score/2), normalised. */
export function probabilitiesOf(scores: readonly number[]): number[] {
  if (scores.length === 0) return [];
  const best = Math.min(...scores);
  const w = scores.map((s) => Math.exp(-(s - best) / 2));
  const total = w.reduce((a, b) => a + b, 0);
  return w.map((v) => v / total);
}
