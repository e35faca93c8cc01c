/**
 * An absolute check of the chosen solution, beside its relative probability.
 *
 * The probability of an assignment (likelihood.ts) is relative: it is
 * normalised over the assignments tried, so a best among bad ones can show
 * 100 %. This check asks whether the best one fits at all: the positions' χ²
 * (each residual against σ² + σm², the band's σ and the model error of
 * likelihood.ts) against its degrees of freedom m − p, as a p-value
 * P(χ²_k ≥ χ²). With m = p (exactly determined) a solution that reproduces
 * the bands has χ² ≈ 0; what it cannot remove means the bands lie where no
 * parameters of this model put them (B at its bound, say), and it is judged
 * against k = 1 for its p-value. p below POOR_FIT_P (1 %, common
 * practice for a goodness-of-fit test) is a poor fit: the assignment is
 * "poorly fitted", and the result says so.
 *
 * With m = p the p-value against k = 1 is lenient: an exactly determined
 * fit that reproduces the bands leaves χ² ≈ 0, so any χ² above
 * NO_SOLUTION_CHI_SQUARE (one σeff of misfit in all; below it, rounding of
 * the given positions and the solver's tolerance) means no parameters of
 * this model reproduce the bands, and the verdict is "poor" whatever the
 * p-value (AUDIT3 finding 9: χ² 2.8 for 0 degrees of freedom was "good").
 *
 * β = B/B0 outside [0.3, 1.1] is flagged as unphysical (common practice:
 * first-row complexes show about 0.35–1.0, likelihood.ts; the margins leave
 * room for the free-ion B0's own uncertainty), and a fit whose β is not
 * physical is never "good": its verdict is "poor".
 */
import { chiSquareTail } from '../numeric/chi-square-tail.js';

/** p-value below which the best solution is called poorly fitted. */
export const POOR_FIT_P = 0.01;
/** An exactly determined fit is "exact" only when its χ² is below this (residuals under ~0.1 σeff). */
export const EXACT_CHI_SQUARE = 0.01;
/** With 0 degrees of freedom, χ² above this means no parameters reproduce the bands (see the module docstring). */
export const NO_SOLUTION_CHI_SQUARE = 1;
/** β outside this range is unphysical for a complex (common practice). */
export const BETA_PHYSICAL: readonly [number, number] = [0.3, 1.1];

export interface GoodnessOfFit {
  /** χ² of the positions with σ² + σm² (as FitResult.chiSquare). */
  chiSquare: number;
  /** Bands fitted minus parameters fitted (0 when exactly determined). */
  degreesOfFreedom: number;
  /** P(χ²_k ≥ chiSquare), k = max(1, degreesOfFreedom). */
  pValue: number;
  /**
   * 'poor' when pValue < POOR_FIT_P (even the best assignment misses the bands by more than their σ and the model
   * error allow), when 0 degrees of freedom leave χ² > NO_SOLUTION_CHI_SQUARE, or when β is not physical.
   */
  verdict: 'good' | 'poor';
  /** β within BETA_PHYSICAL; null when β is not known. */
  betaPhysical: boolean | null;
  /** Why the verdict is 'poor', in words (each reason that holds, joined by "; "); null when good. */
  reason: string | null;
}

/** True when the positions alone make the fit poor (the p-value, or an exactly determined fit that reproduces nothing). */
export function positionsPoor(g: Pick<GoodnessOfFit, 'chiSquare' | 'degreesOfFreedom' | 'pValue'>): boolean {
  return g.pValue < POOR_FIT_P || (g.degreesOfFreedom === 0 && !(g.chiSquare <= NO_SOLUTION_CHI_SQUARE));
}

/** The check for a solution of m bands and p fitted parameters. */
export function goodnessOfFitOf(chiSquare: number, m: number, p: number, beta: number | null): GoodnessOfFit {
  const degreesOfFreedom = Math.max(0, m - p);
  const pValue = Number.isFinite(chiSquare) ? chiSquareTail(chiSquare, Math.max(1, degreesOfFreedom)) : 0;
  const betaPhysical = beta === null ? null : beta >= BETA_PHYSICAL[0] && beta <= BETA_PHYSICAL[1];
  const reasons: string[] = [];
  if (degreesOfFreedom === 0 && !(chiSquare <= NO_SOLUTION_CHI_SQUARE)) {
    reasons.push(`no parameters reproduce the ${m} bands: χ² = ${Number.isFinite(chiSquare) ? chiSquare.toFixed(1) : 'not finite'} where an exactly determined fit leaves about 0`);
  } else if (pValue < POOR_FIT_P) {
    reasons.push(`the bands are missed by more than their σ and the model error allow (${pValueText(pValue)})`);
  }
  if (betaPhysical === false) reasons.push(`β = ${beta!.toFixed(2)} lies outside ${BETA_PHYSICAL[0]}–${BETA_PHYSICAL[1]}, not physical`);
  return {
    chiSquare, degreesOfFreedom, pValue,
    verdict: reasons.length ? 'poor' : 'good',
    betaPhysical,
    reason: reasons.length ? reasons.join('; ') : null,
  };
}

/** "p = 0.005", "p < 1e-6". */
export function pValueText(p: number): string {
  return p < 1e-6 ? 'p < 1e-6' : `p = ${p.toPrecision(2)}`;
}

/** The warnings the check gives (none for a good fit with a physical β). */
export function goodnessWarnings(g: GoodnessOfFit, probability: number, beta: number | null, rms: number): string[] {
  const out: string[] = [];
  if (positionsPoor(g)) {
    out.push(
      `the chosen assignment is poorly fitted: rms ${Math.round(rms)} cm-1, χ² = ${g.chiSquare.toFixed(1)} for ${g.degreesOfFreedom} degree${g.degreesOfFreedom === 1 ? '' : 's'} of freedom (${pValueText(g.pValue)}); `
      + `its probability (${(100 * probability).toFixed(0)}%) is relative to the other assignments tried, not a sign of a good fit: are the bands and the ion right?`,
    );
  }
  if (g.betaPhysical === false && beta !== null) {
    out.push(`β = ${beta.toFixed(2)} lies outside ${BETA_PHYSICAL[0]}–${BETA_PHYSICAL[1]}, the range of real complexes: B and the parameters that rest on it are not physical`);
  }
  return out;
}
