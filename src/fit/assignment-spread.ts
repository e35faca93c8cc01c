/**
 * The uncertainty a chemist should quote when the weak bands' labels are in
 * doubt (issue 13: honest uncertainty).
 *
 * The fit's standard uncertainty (uncertainty.ts) is local: the curvature of
 * the chosen solution's least-squares minimum. The chosen solution's
 * assignment group (assignment-groups.ts) holds the solutions that share its
 * spin-allowed assignment and differ only in what they make of the
 * spin-forbidden or unexplained bands; their 10Dq and B can lie further apart
 * than that local σ (the seven quartets of [Mn(H2O)6]2+: 10Dq 7 198 ± 529 by
 * the fit, 7 198–8 411 over the labellings). Which labelling is right the
 * positions do not tell, so the spread is part of the uncertainty.
 *
 * Rule (cm-1, for 10Dq and for B alike):
 *   spread   Δ = the largest distance from the reported value to an end of
 *               the group's range (so 0 for a group of one);
 *   combined u = √(σ_fit² + Δ²).
 * Why the largest distance and not a probability-weighted second moment:
 * the members' probabilities come from a model whose intensity and prior
 * terms are judgement (likelihood.ts), and a labelling at 20 % is no reason
 * to shrink the ± below what it would move the value; what a spectroscopist
 * publishes in such a case is the value with the range its assignments span,
 * and one ± that reaches that range at one standard uncertainty. Δ is bounded
 * by the group's own tolerance (2√2·σ_fit or 2 % of 10Dq, 5 % of B), so u
 * never exceeds about 3σ_fit or σ_fit plus a few per cent.
 * The result carries both: `uncertainty` (combined, what the report, the
 * library and `series` use) and `assignmentSpread` (the range, Δ and σ_fit).
 */
import type { AssignmentGroup } from './assignment-groups.js';

export interface AssignmentSpread {
  /** Lowest and highest 10Dq over the assignment group, cm-1 (the group's tenDqRange). */
  tenDqRange: [number, number];
  /** Lowest and highest B, cm-1; null when B is not determined. */
  bRange: [number, number] | null;
  /** Δ for 10Dq and B, cm-1: largest distance from the reported value to an end of the range (null: B not determined). */
  spread: { tenDq: number; b: number | null };
  /** The fit's own standard uncertainties (before the spread was added), cm-1; null where not fitted. */
  fitUncertainty: { tenDq: number | null; b: number | null };
  /** Whether the combined uncertainty is wider than the fit's (Δ > 0 and a fit σ to widen). */
  widened: boolean;
  /** The rule, in words, for the report. */
  rule: string;
}

export const SPREAD_RULE = 'combined ± = √(σ_fit² + Δ²), Δ the largest distance from the value to an end of the range the weak-band labellings span';

/** Below this Δ (cm-1) the range is the value itself: the group's ranges are rounded to 0.1 cm-1. */
export const SPREAD_RESOLUTION = 0.5;

/** Δ: the largest distance from `value` to an end of `range` (cm-1); 0 below SPREAD_RESOLUTION. */
export function spreadFromRange(value: number, range: readonly [number, number]): number {
  const d = Math.max(Math.abs(range[0] - value), Math.abs(range[1] - value));
  return d < SPREAD_RESOLUTION ? 0 : d;
}

/** √(σ² + Δ²); a missing σ stays missing (the parameter is not fitted, so there is nothing to widen). */
export function combinedUncertainty(sigma: number | null, spread: number): number | null {
  return sigma === null || !Number.isFinite(sigma) ? sigma : Math.hypot(sigma, spread);
}

/**
 * The spread of the group about the reported 10Dq and B, and the combined
 * uncertainties that the result reports (see the module docstring).
 */
export function assignmentSpreadOf(
  group: Pick<AssignmentGroup, 'tenDqRange' | 'bRange'>,
  value: { tenDq: number; b: number | null },
  sigma: { tenDq: number | null; b: number | null },
): { spread: AssignmentSpread; combined: { tenDq: number | null; b: number | null } } {
  const dTenDq = spreadFromRange(value.tenDq, group.tenDqRange);
  const dB = value.b !== null && group.bRange ? spreadFromRange(value.b, group.bRange) : null;
  const combined = { tenDq: combinedUncertainty(sigma.tenDq, dTenDq), b: dB === null ? sigma.b : combinedUncertainty(sigma.b, dB) };
  const widened = (sigma.tenDq !== null && dTenDq > 0) || (sigma.b !== null && dB !== null && dB > 0);
  return {
    spread: {
      tenDqRange: [group.tenDqRange[0], group.tenDqRange[1]], bRange: group.bRange ? [group.bRange[0], group.bRange[1]] : null,
      spread: { tenDq: dTenDq, b: dB }, fitUncertainty: { tenDq: sigma.tenDq, b: sigma.b }, widened, rule: SPREAD_RULE,
    },
    combined,
  };
}
