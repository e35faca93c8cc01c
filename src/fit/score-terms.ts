/**
 * Every term of the score of one solution besides the position χ² and the
 * band list's own terms (likelihood.ts): the transitions left without a band,
 * the intensities and the priors. One function for the three places a
 * solution is scored (grid, scan refinement, engine refinement), so they
 * cannot drift apart.
 */
import type { GridCandidate, DqOnlyCandidate } from './candidates.js';
import { degenerateTwins, enumerateAssignments, isLowSpinBranch, primaryClass } from './enumerate.js';
import type { SortedObservations } from './observations.js';
import {
  betaPriorDeviance, intensityPenalties, plausibilityPenalties, tenDqPriorDeviance, skippedTransitionPenalties, type ClassTransition, type SkipOutcome,
} from './penalties.js';
import type { FitSettings } from './settings.js';
import { twoElectronLevels } from './two-electron.js';
import { orbitallyForbiddenLevels } from './orbital-selection.js';
import { deviance, LIKELIHOOD } from './likelihood.js';
import type { Penalty } from './types.js';

export interface ScoreTermsInput {
  candidate: GridCandidate | DqOnlyCandidate;
  settings: FitSettings;
  sorted: SortedObservations;
  /** Class transitions at the solution, cm-1 above the assumed ground. */
  transitions: ClassTransition[];
  /** Calculated energy per observation of the variant (same order). */
  calculated: Float64Array;
  /** ids index per observation. */
  levels: Int32Array;
  dq: number;
  b: number;
  c: number;
  /** False for a Dq-only solution: no β or C/B prior (B is nominal). */
  bDetermined: boolean;
}

export interface ScoreTerms extends SkipOutcome {
  /** Skipped transitions, priors and intensities (not the variant's own terms). */
  penalties: Penalty[];
}

function ctOnsetOf(sorted: SortedObservations): number | undefined {
  return sorted.chargeTransfer.length ? Math.min(...sorted.chargeTransfer.map((b) => b.position)) : undefined;
}

export function scoreTerms(input: ScoreTermsInput): ScoreTerms {
  const { candidate, settings, sorted, transitions, calculated, levels } = input;
  const { variant, scan, branch } = candidate;
  const observations = variant.observations;
  // The bands on class transitions: the unflagged ones, and a flagged one on a weak spin-allowed level (flaggedClass).
  const classLevels = new Set(primaryClass(branch).levels);
  const assigned = Array.from(levels.subarray(0, observations.length), (k, i) => {
    const entry: { level: number; calculated: number; width?: number } = { level: k, calculated: calculated[i]! };
    if (observations[i]!.width !== undefined) entry.width = observations[i]!.width!;
    return entry;
  }).filter((entry, i) => i < variant.nPrimary || classLevels.has(entry.level));
  const ctOnset = ctOnsetOf(sorted);
  const weak = orbitallyForbiddenLevels(scan, branch.ground);
  const skip = skippedTransitionPenalties({
    geometry: settings.geometry, transitions: transitions.map((t) => (weak[t.level] === 1 ? { ...t, orbitallyForbidden: true } : t)), assigned, classForbidden: variant.classForbidden,
    ...(ctOnset !== undefined ? { ctOnset } : {}), ...(settings.window ? { window: settings.window } : {}),
  });
  const priors = plausibilityPenalties({
    b: input.b, c: input.c, mode: settings.mode, dq: input.dq, lowSpin: isLowSpinBranch(scan, branch),
    priors: input.bDetermined ? settings.priors : { ...settings.priors, b0: null, betaExpected: null },
  }).filter((p) => input.bDetermined || p.rule === 'ten-dq');
  const two = twoElectronLevels(scan, branch.ground);
  const allForbidden = primaryClass(branch).forbidden;
  const intensity = intensityPenalties({
    geometry: settings.geometry, allForbidden,
    bands: observations.map((o, i) => ({
      position: o.position, epsilon: o.epsilon,
      spinAllowed: scan.ids[levels[i]!]!.multiplicity === branch.multiplicity,
      twoElectron: two[levels[i]!] === 1,
      orbitallyForbidden: weak[levels[i]!] === 1,
    })),
  });
  // A band taken by a spin-forbidden transition beside spin-allowed ones: only a few of those show at all.
  const forbidden: Penalty[] = allForbidden ? [] : observations.flatMap((o, i) =>
    scan.ids[levels[i]!]!.multiplicity === branch.multiplicity ? [] : [{
      rule: 'forbidden-band' as const, amount: deviance(LIKELIHOOD.forbiddenSeen),
      detail: `the band at ${Math.round(o.position)} cm-1 is taken as the spin-forbidden ${scan.ids[levels[i]!]!.label}, one of many weak transitions that seldom show`,
    }]);
  return { ...skip, penalties: [...skip.penalties, ...priors, ...intensity, ...forbidden, ...twinPenalties(scan, observations, levels), ...assignmentPrior(candidate)] };
}

/**
 * The prior of one assignment within its spin state: each spin state (branch)
 * is a priori as probable as the other, and its N order-consistent
 * assignments of these bands share that probability evenly, so one costs
 * 2·ln N. Without it a branch dense in levels (the doublets of low-spin
 * Co(II), the quartets of low-spin d4) finds a level within the model error
 * of any band and wins by the number of its chances, not by its fit.
 */
function assignmentPrior(candidate: GridCandidate | DqOnlyCandidate): Penalty[] {
  if (candidate.kind !== 'grid') return [];
  const { scan, branch, variant } = candidate;
  const n = enumerateAssignments(scan, branch, variant.nPrimary, variant.observations.length - variant.nPrimary).count;
  if (n <= 1) return [];
  return [{ rule: 'assignments', amount: 2 * Math.log(n), detail: `one of ${n} ways to assign these bands in this spin state` }];
}

/**
 * Two bands given to levels that are degenerate at every field (4A1g and
 * 4Eg(G) of d5): the model has one position for both, so the pair is two
 * maxima of one band and costs what reading them as a split band costs
 * (likelihood.ts): −2·ln 0.1 + (Δ/1500 cm-1)². Without it the model error
 * lets two separate bands sit on one calculated energy almost free.
 */
function twinPenalties(scan: GridCandidate['scan'], observations: ReadonlyArray<{ position: number }>, levels: Int32Array): Penalty[] {
  const twin = degenerateTwins(scan);
  const out: Penalty[] = [];
  for (let i = 0; i < observations.length; i++) {
    for (let k = i + 1; k < observations.length; k++) {
      const a = levels[i]!;
      const b = levels[k]!;
      if (a === b || twin[a] !== twin[b]) continue;
      const gap = Math.abs(observations[i]!.position - observations[k]!.position);
      out.push({
        rule: 'split-band', amount: deviance(LIKELIHOOD.splitPair) + (gap / LIKELIHOOD.splitScale) ** 2,
        detail: `${Math.round(observations[i]!.position)} and ${Math.round(observations[k]!.position)} cm-1 go to ${scan.ids[a]!.label} and ${scan.ids[b]!.label}, which the model puts at one energy: two maxima of one band`,
      });
    }
  }
  return out;
}

/**
 * The β and 10Dq priors as a function of (B, Dq), for choosing between the
 * grid points of one assignment (profile.ts gridOptimum).
 */
export function gridPrior(settings: FitSettings): (b: number, dq: number, lowSpin?: boolean) => number {
  const priors = settings.priors;
  return (b, dq, lowSpin = false) => betaPriorDeviance(b, priors) + tenDqPriorDeviance(dq, priors, lowSpin);
}
