/**
 * Whether the chosen assignment breaks its own priors badly: the sum of the
 * prior terms on its parameters (β, C/B, the 10Dq range, the ligands' 10Dq
 * and β) against a threshold. The intensity terms are left out: they are
 * wide, one per band, and add up on right answers (the very weak quartet
 * bands of [Mn(H2O)6]2+, ε ≈ 0.01–0.03, each cost about 3.7 against the
 * "typically about 0.30" of src/fit/likelihood.ts: AUDIT3 finding 11).
 *
 * Why: the probability of an assignment is relative to the others tried
 * (src/fit/likelihood.ts), and the goodness of fit judges only the band
 * positions. A reading that puts β at 0.15 and 10Dq at four times the ion's
 * usual range still shows "100 %" when every other reading is worse
 * (AUDIT3 finding 2: the visible multiplet of [CoCl4]2-). Saying so beside the
 * probability keeps that number from reading as confidence.
 *
 * The threshold is a deviance (−2 ln p, the score's own unit): 13.8 is
 * −2 ln 0.001, priors that make the reading less than one-in-a-thousand as
 * likely as one inside them (a conventional "very strong evidence" level,
 * common practice).
 */
import type { Penalty } from '../fit/types.js';

/** The score terms that are priors on the parameters (not on intensities, band counting or the window). */
export const PRIOR_RULES: ReadonlySet<Penalty['rule']> = new Set(['beta', 'c-over-b', 'ten-dq', 'ligands']);

/** −2 ln 0.001: prior terms summing above this mark the chosen reading as implausible. */
export const PRIOR_STRAIN_DEVIANCE = -2 * Math.log(0.001);

export interface PriorStrain {
  /** Sum of the prior terms, deviance units. */
  deviance: number;
  /** The prior terms, largest first. */
  terms: Penalty[];
}

/** The prior terms of a chosen assignment when they sum above PRIOR_STRAIN_DEVIANCE, else null. */
export function priorStrainOf(penalties: readonly Penalty[] | undefined): PriorStrain | null {
  const terms = (penalties ?? []).filter((p) => PRIOR_RULES.has(p.rule) && p.amount > 0).sort((a, b) => b.amount - a.amount);
  const deviance = terms.reduce((s, p) => s + p.amount, 0);
  return deviance > PRIOR_STRAIN_DEVIANCE ? { deviance, terms } : null;
}

/** One sentence for the CLI and the page: what the priors say and what the probability then means. */
export function priorStrainText(strain: PriorStrain): string {
  // The terms that matter (≥ 2, a factor e below the prior's best); the sum counts them all.
  const what = strain.terms.filter((t) => t.amount >= 2).map((t) => t.detail).join('; ');
  return `IMPLAUSIBLE: the chosen assignment's parameters break their priors (${what}; together −2 ln p = ${strain.deviance.toFixed(1)}, `
    + 'less than one in a thousand): its probability is relative to readings that are worse still, not a sign that it is right. '
    + 'Check the ion, the geometry and whether some bands are components of one split band';
}
