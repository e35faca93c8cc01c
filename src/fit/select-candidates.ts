/**
 * Choosing which grid candidates the full engine refines: the order by grid
 * rms, the cut to the best REFINED_CANDIDATES and each spin branch's best,
 * and the acceptability test for solutions that leave bands out.
 */
import { approximateScore, candidateAt, type CandidateGroup, type GridCandidate } from './candidates.js';
import type { Evaluated } from './evaluate.js';
import { effectiveWeight } from './likelihood.js';
import type { SortedObservations } from './observations.js';
import { LIMITS, penaltyTotal, plausibilityPenalties } from './penalties.js';
import { alternativeMargin } from './result.js';
import type { FitSettings } from './settings.js';
import type { Penalty } from './types.js';

/** Grid candidates refined with the full engine (besides the best of each spin branch). */
export const REFINED_CANDIDATES = 4;

/**
 * The best REFINED_CANDIDATES grid candidates by approximate score, and the
 * best of each spin branch. Candidates are visited by ascending grid rms (a
 * lower bound of the score), so penalties are computed only for those that
 * can still make the cut.
 */
export function selectForRefinement(entries: WrmsOrder, settings: FitSettings, sorted: SortedObservations, threshold: number): GridCandidate[] {
  const top: GridCandidate[] = [];
  const branchBest = new Map<number, GridCandidate>();
  const seen = new Set<string>();
  for (const index of entries.order) {
    const group = entries.groups[entries.group[index]!]!;
    const a = entries.row[index]!;
    const wrms = group.wrms[a]!;
    const kth = top.length < REFINED_CANDIDATES ? Infinity : top[top.length - 1]!.approxScore;
    // A branch's own best matters only if it can be shown as an alternative.
    const own = Math.min(branchBest.get(group.branch.multiplicity)?.approxScore ?? Infinity, alternativeMargin(top[0]?.approxScore ?? Infinity));
    if (wrms >= kth && wrms >= own) continue;
    const c = candidateAt(group, a);
    if (!acceptableOnGrid(c, settings, threshold)) continue;
    // The same assignment on another C/B scan (free C): the lower wrms, met first, stands for both.
    if (seen.has(c.key)) continue;
    seen.add(c.key);
    const score = approximateScore(c, settings, sorted);
    if (score < kth) {
      top.push(c);
      top.sort((x, y) => x.approxScore - y.approxScore);
      if (top.length > REFINED_CANDIDATES) top.pop();
    }
    if (score < own) branchBest.set(c.branch.multiplicity, c);
  }
  return [...new Set([...top, ...branchBest.values()])];
}

export interface WrmsOrder {
  groups: CandidateGroup[];
  group: Int32Array;
  row: Int32Array;
  /** Indices into group/row by ascending wrms. */
  order: Int32Array;
}

/** The (group, assignment) pairs with wrms ≤ limit, by ascending wrms, in typed arrays (no object per pair). */
export function wrmsOrder(groups: CandidateGroup[], limit: number): WrmsOrder {
  let count = 0;
  for (const g of groups) for (let a = 0; a < g.wrms.length; a++) if (g.wrms[a]! <= limit) count++;
  const group = new Int32Array(count);
  const row = new Int32Array(count);
  const key = new Float64Array(count);
  let at = 0;
  groups.forEach((g, gi) => {
    for (let a = 0; a < g.wrms.length; a++) {
      if (g.wrms[a]! <= limit) {
        group[at] = gi;
        row[at] = a;
        key[at++] = g.wrms[a]!;
      }
    }
  });
  const order = Int32Array.from({ length: count }, (_, i) => i).sort((x, y) => key[x]! - key[y]!);
  return { groups, group, row, order };
}

/** The group entry with the lowest wrms, or undefined. */
export function lowestWrms(groups: CandidateGroup[]): GridCandidate | undefined {
  let best: { group: CandidateGroup; a: number } | undefined;
  for (const group of groups) {
    for (let a = 0; a < group.wrms.length; a++) {
      if (group.wrms[a]! < (best ? best.group.wrms[best.a]! : Infinity)) best = { group, a };
    }
  }
  return best ? candidateAt(best.group, best.a) : undefined;
}

/**
 * A solution that leaves unflagged bands out (or merges them) is kept only
 * when it is a good fit on its own: rms within the threshold and no β or
 * C/B penalty. Leaving bands out must not buy an exact fit with implausible
 * parameters.
 */
export function acceptable(e: Evaluated, threshold: number): boolean {
  if (!e.candidate.variant.touchesUnflagged) return true;
  return e.wrms <= threshold && !implausible(e.penalties);
}

/** A β or C/B term beyond two σ. */
export function implausible(penalties: readonly Penalty[]): boolean {
  return penalties.some((p) => (p.rule === 'beta' || p.rule === 'c-over-b') && p.amount > LIMITS.implausible);
}

/** The same test at a grid candidate (grid B and C). */
export function acceptableOnGrid(c: GridCandidate, settings: FitSettings, threshold: number): boolean {
  if (!c.variant.touchesUnflagged) return true;
  const cValue = settings.mode === 'fixed' ? settings.cFixed : c.scan.cOverB * c.grid.b;
  // The grid's χ² as an rms in cm-1 with the same weights.
  const wSum = c.variant.observations.reduce((s, o) => s + effectiveWeight(o.position, o.sigma), 0);
  const rms = Math.sqrt(Math.max(0, c.wrms - penaltyTotal(c.variant.penalties)) / wSum);
  return rms <= threshold && !implausible(plausibilityPenalties({ b: c.grid.b, c: cValue, mode: settings.mode, priors: settings.priors }));
}

/** The lowest approximate score among the lowest-wrms entry of each group: an upper bound of the best score. */
export function groupsBound(groups: CandidateGroup[], settings: FitSettings, sorted: SortedObservations, threshold: number): number {
  let bound = Infinity;
  for (const group of groups) {
    const c = lowestWrms([group]);
    if (c && acceptableOnGrid(c, settings, threshold)) bound = Math.min(bound, approximateScore(c, settings, sorted));
  }
  return bound;
}
