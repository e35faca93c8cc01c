/**
 * Reductions of a band list: which bands an assignment may leave
 * unexplained, and which close pairs it may read as one split band. A band
 * finder sometimes reports an extra band (a maximum split in two, a weak
 * component on a broad maximum, a narrow spike at the edge of the range);
 * the fit must then explain the real bands and list the extra ones, not fail.
 *
 * Every reduction costs a term of the score (a deviance; likelihood.ts has
 * the model):
 * - leaving a band unexplained: −2·ln(π/R) − ln(2π·σeff²), π the prior
 *   chance of a spurious band (0.02, ×3 for a shoulder, a weak band (ε below
 *   20% of the largest ε of the d–d bands) or a narrow one (width below half
 *   the median width of the d–d bands), ×5 for a band flagged
 *   spin-forbidden). So the weak, shoulder and narrow ones are left first.
 * - two neighbouring unflagged bands closer than max(2000 cm-1, 6% of their
 *   mean) read as the two maxima of one split band, averaged (1/σ²-weighted
 *   when the fit is weighted: precisionWeights says why):
 *   −2·ln 0.1 + (separation/1500 cm-1)².
 *
 * Limits: of the unflagged bands, at most half (and at most
 * MAX_UNEXPLAINED_UNFLAGGED) are left unexplained, and fewer than half of
 * those that are neither shoulders nor weak nor narrow, so most of what was
 * clearly measured is explained; a reduction that leaves
 * an unflagged band out must leave at least p observations (p the number of
 * fitted parameters), so an exact fit never buys its way out of a poor fit
 * of all of them; one that only merges split pairs explains every band and
 * may leave a single observation (when each merged pair is two maxima at
 * least 300 cm-1 apart, resolvedPair), for the one-band reading with B at its
 * prior (prior-b.ts: the spin–orbit multiplet of 4T1(P) of tetrahedral
 * Co(II) alone in a visible-only window, AUDIT3 finding 2). Bands flagged spin-forbidden may always be left
 * (at most MAX_UNEXPLAINED_FLAGGED), down to a single remaining band. Reductions are returned by ascending
 * penalty, the identity (nothing left out, penalty 0) first, so a caller can
 * stop as soon as the penalty alone exceeds the best score found.
 */
import { averageObservations, precisionWeights, type Observation, type SortedObservations } from './observations.js';
import { deviance, effectiveWeight, LIKELIHOOD, unexplainedDeviance } from './likelihood.js';
import { LIMITS, splitPairLimit } from './penalties.js';
import type { Penalty } from './types.js';
import { median } from '../numeric/median.js';

/** Unflagged bands left unexplained at most (besides the half rule). */
export const MAX_UNEXPLAINED_UNFLAGGED = 3;
/** Bands flagged spin-forbidden left unexplained at most. */
export const MAX_UNEXPLAINED_FLAGGED = 3;
/** Reductions returned at most (the cheapest). */
export const MAX_REDUCTIONS = 2000;

export interface Reduction {
  /** The observations kept (merged pairs as one), sorted by energy. */
  sorted: SortedObservations;
  dropped: Observation[];
  /** Components of each pair read as one split band. */
  merged: Observation[][];
  penalties: Penalty[];
  /** Sum of the penalties. */
  penalty: number;
  /** Unflagged bands dropped or merged (0: only flagged bands were left out). */
  touchesUnflagged: boolean;
}

interface BandContext {
  maxEpsilon: number;
  medianWidth: number;
}

function contextOf(sorted: SortedObservations): BandContext {
  const all = [...sorted.primary, ...sorted.flagged];
  const eps = all.map((o) => o.epsilon).filter((e): e is number => e !== undefined);
  const widths = all.map((o) => o.width).filter((w): w is number => w !== undefined);
  return { maxEpsilon: eps.length ? Math.max(...eps) : Number.NaN, medianWidth: widths.length >= 2 ? median(widths) : Number.NaN };
}

/** A band whose unexplained term is at least this is "strong" (neither shoulder, weak, narrow nor flagged). */
function strongThreshold(o: Observation): number {
  return unexplainedDeviance(LIKELIHOOD.spuriousPrior, 1 / Math.sqrt(effectiveWeight(o.position, o.sigma)));
}

/** The term for leaving one band unexplained, and why it is what it is. */
export function unexplainedPenalty(o: Observation, context: BandContext): Penalty {
  let factor = 1;
  const why: string[] = [];
  if (o.flags.includes('spin-forbidden')) {
    factor *= LIKELIHOOD.spuriousFlaggedFactor;
    why.push('flagged spin-forbidden');
  }
  if (o.flags.includes('shoulder')) {
    factor *= LIKELIHOOD.spuriousFactor;
    why.push('a shoulder');
  }
  if (o.epsilon !== undefined && o.epsilon < LIMITS.weakEpsilonFraction * context.maxEpsilon) {
    factor *= LIKELIHOOD.spuriousFactor;
    why.push('weak');
  }
  if (o.width !== undefined && o.width < LIMITS.narrowWidthFraction * context.medianWidth) {
    factor *= LIKELIHOOD.spuriousFactor;
    why.push('narrow');
  }
  const prior = Math.min(LIKELIHOOD.spuriousMax, LIKELIHOOD.spuriousPrior * factor);
  const amount = unexplainedDeviance(prior, 1 / Math.sqrt(effectiveWeight(o.position, o.sigma)));
  const detail = `the band at ${Math.round(o.position)} cm-1${why.length ? ` (${why.join(', ')})` : ''} is left unexplained`;
  return { rule: 'unexplained-band', amount, detail };
}

/** Whether two neighbouring unflagged bands may be read as one split band. */
export function splitPairAllowed(a: Observation, b: Observation): boolean {
  const separation = Math.abs(b.position - a.position);
  return separation <= splitPairLimit(0.5 * (a.position + b.position));
}

/**
 * Two maxima at least LIKELIHOOD.coincidence apart: resolved components of
 * one split band. Closer, they are one maximum given twice, and the fit of
 * the pair as two transitions (poor, and said so) is the honest answer.
 */
function resolvedPair(pair: Observation[]): boolean {
  return Math.abs(pair[1]!.position - pair[0]!.position) >= LIKELIHOOD.coincidence;
}

function splitPenalty(a: Observation, b: Observation): Penalty {
  const separation = Math.abs(b.position - a.position);
  return {
    rule: 'split-band',
    amount: deviance(LIKELIHOOD.splitPair) + (separation / LIKELIHOOD.splitScale) ** 2,
    detail: `${Math.round(a.position)} and ${Math.round(b.position)} cm-1 are read as one split band (mean taken)`,
  };
}

/** Every allowed reduction of the band list for a fit of p parameters, by ascending penalty (see the module docstring). */
export function bandReductions(sorted: SortedObservations, p: number): Reduction[] {
  const context = contextOf(sorted);
  const { primary, flagged } = sorted;
  const maxDrops = Math.min(MAX_UNEXPLAINED_UNFLAGGED, Math.floor(primary.length / 2));
  const maxStrongDrops = Math.min(maxDrops, Math.floor((primary.length - 1) / 2));
  const total = primary.length + flagged.length;
  const out: Reduction[] = [];
  // Walk the unflagged bands in order: keep, leave, or merge with the next; then the flagged ones: keep or leave.
  const keptP: Observation[] = [];
  const dropped: Observation[] = [];
  const merged: Observation[][] = [];
  const penalties: Penalty[] = [];
  let unflaggedDrops = 0;
  let strongDrops = 0;
  const finish = (keptF: Observation[], flaggedDropped: Observation[], flaggedPenalties: Penalty[]) => {
    const touches = unflaggedDrops > 0 || merged.length > 0;
    const remaining = keptP.length + keptF.length;
    // Merging explains both bands (as one): it may leave fewer than p, for the one-band prior-B reading,
    // when every merged pair is two resolved maxima.
    if (remaining < (unflaggedDrops > 0 ? p : 1)) return;
    if (remaining < p && !merged.every(resolvedPair)) return;
    const all = [...penalties, ...flaggedPenalties];
    out.push({
      sorted: { ...sorted, primary: [...keptP], flagged: [...keptF] },
      dropped: [...dropped, ...flaggedDropped].sort((a, b) => a.position - b.position),
      merged: merged.map((m) => [...m]),
      penalties: all,
      penalty: all.reduce((s, q) => s + q.amount, 0),
      touchesUnflagged: touches,
    });
  };
  const walkFlagged = (i: number, keptF: Observation[], left: Observation[], pens: Penalty[]) => {
    if (i === flagged.length) {
      finish(keptF, left, pens);
      return;
    }
    const o = flagged[i]!;
    walkFlagged(i + 1, [...keptF, o], left, pens);
    if (left.length < MAX_UNEXPLAINED_FLAGGED) walkFlagged(i + 1, keptF, [...left, o], [...pens, unexplainedPenalty(o, context)]);
  };
  const walkPrimary = (i: number) => {
    if (i >= primary.length) {
      walkFlagged(0, [], [], []);
      return;
    }
    const o = primary[i]!;
    keptP.push(o);
    walkPrimary(i + 1);
    keptP.pop();
    const penalty = unexplainedPenalty(o, context);
    const strong = penalty.amount >= strongThreshold(o) - 1e-9;
    if (unflaggedDrops < maxDrops && total > 1 && (!strong || strongDrops < maxStrongDrops)) {
      unflaggedDrops++;
      if (strong) strongDrops++;
      dropped.push(o);
      penalties.push(penalty);
      walkPrimary(i + 1);
      penalties.pop();
      dropped.pop();
      if (strong) strongDrops--;
      unflaggedDrops--;
    }
    const next = primary[i + 1];
    if (next && splitPairAllowed(o, next)) {
      keptP.push(averageObservations([o, next], precisionWeights([o, next], sorted.weighted)));
      merged.push([o, next]);
      penalties.push(splitPenalty(o, next));
      walkPrimary(i + 2);
      penalties.pop();
      merged.pop();
      keptP.pop();
    }
  };
  walkPrimary(0);
  out.sort((a, b) => a.penalty - b.penalty);
  return out.slice(0, MAX_REDUCTIONS);
}
