/**
 * The probability that matters to a chemist: of the spin-allowed assignment
 * and the parameters, not of the label of one weak spin-forbidden band.
 *
 * Solutions that differ only in what they make of the spin-forbidden (or
 * unexplained) bands, say a sharp band read as 2Eg(G) or 2T1g(G) of Cr(III),
 * or left unexplained, give the same 10Dq and B; splitting the probability
 * among them made a textbook spectrum look uncertain (41 %). The chosen
 * solution's group is every solution with
 * - the same ground level (so the same spin state),
 * - the same bands assigned to the same spin-allowed transitions, and
 * - 10Dq and B within GROUP_TOLERANCE of the chosen one's: two combined
 *   standard uncertainties (the chosen solution's σ for both, √2·σ), or the
 *   model's own resolution where that is larger: 2 % of 10Dq and 5 % of B
 *   (a cubic model with one C/B misses bands by about 1.5 %, likelihood.ts,
 *   and B, read from differences of band positions, by a few per cent:
 *   fieldgap's judgement, common practice).
 * The group's probability is the sum of its members'; its parameter ranges
 * show how far the spin-forbidden labels move 10Dq and B.
 */
import type { Evaluated } from './evaluate.js';

export const GROUP_TOLERANCE = { sigmas: 2, tenDqFraction: 0.02, bFraction: 0.05 } as const;

export interface AssignmentGroup {
  /** Probability of the chosen solution's group: its spin-allowed assignment, spin state and parameters. */
  probability: number;
  /** Solutions in the group, the chosen one included. */
  members: number;
  /** The spin-allowed transitions the group shares, by band position (cm-1, rounded) and label. */
  spinAllowed: Array<{ observed: number; label: string }>;
  /** Lowest and highest 10Dq over the group, cm-1. */
  tenDqRange: [number, number];
  /** Lowest and highest B over the group, cm-1; null when B is not determined. */
  bRange: [number, number] | null;
}

/** The spin-allowed part of a solution's assignment, as comparable text. */
export function spinAllowedKey(e: Evaluated): string {
  const { scan, branch, variant } = e.candidate;
  const rows: string[] = [];
  variant.observations.forEach((o, i) => {
    const id = scan.ids[e.levelIndices[i]!]!;
    if (id.multiplicity === branch.multiplicity) rows.push(`${o.bands.join('+')}:${id.label}`);
  });
  return `${scan.ids[branch.ground]!.label}|${rows.sort().join(',')}`;
}

function within(a: number, b: number, sigma: number | null, fraction: number): boolean {
  const tolerance = Math.max(sigma === null || !Number.isFinite(sigma) ? 0 : GROUP_TOLERANCE.sigmas * Math.SQRT2 * sigma, fraction * Math.abs(a));
  return Math.abs(a - b) <= tolerance;
}

/** Whether `other` belongs to the group of `chosen` (see the module docstring); σ are the chosen one's, cm-1. */
export function sameGroup(other: Evaluated, chosen: Evaluated, sigma: { tenDq: number | null; b: number | null }): boolean {
  if (other.bDetermined !== chosen.bDetermined || spinAllowedKey(other) !== spinAllowedKey(chosen)) return false;
  if (!within(10 * chosen.params.dq, 10 * other.params.dq, sigma.tenDq, GROUP_TOLERANCE.tenDqFraction)) return false;
  return !chosen.bDetermined || within(chosen.params.b, other.params.b, sigma.b, GROUP_TOLERANCE.bFraction);
}

/**
 * The group of solutions[0] (the chosen one) with probabilities[i] the
 * probability of solutions[i]; `inGroup[i]` says which are members.
 */
export function assignmentGroupOf(
  solutions: readonly Evaluated[], probabilities: readonly number[], sigma: { tenDq: number | null; b: number | null },
): { group: AssignmentGroup; inGroup: boolean[] } {
  const chosen = solutions[0]!;
  const inGroup = solutions.map((e, i) => i === 0 || sameGroup(e, chosen, sigma));
  const members = solutions.filter((_, i) => inGroup[i]);
  const tenDq = members.map((e) => 10 * e.params.dq);
  const b = members.map((e) => e.params.b);
  const { scan, branch, variant } = chosen.candidate;
  const spinAllowed = variant.observations
    .map((o, i) => ({ o, id: scan.ids[chosen.levelIndices[i]!]! }))
    .filter(({ id }) => id.multiplicity === branch.multiplicity)
    .map(({ o, id }) => ({ observed: Math.round(o.position), label: id.label }))
    .sort((x, y) => x.observed - y.observed);
  const r = (v: number) => Math.round(v * 10) / 10;
  return {
    group: {
      probability: probabilities.reduce((s, p, i) => s + (inGroup[i] ? p : 0), 0),
      members: members.length,
      spinAllowed,
      tenDqRange: [r(Math.min(...tenDq)), r(Math.max(...tenDq))],
      bRange: chosen.bDetermined ? [r(Math.min(...b)), r(Math.max(...b))] : null,
    },
    inGroup,
  };
}
