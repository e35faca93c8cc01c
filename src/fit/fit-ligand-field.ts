/**
 * fitLigandField: 10Dq, Racah B and C from observed band maxima, with automatic
 * assignment and the spin-state logic.
 *
 * 1. Settings (settings.ts) and bands (bands.ts, observations.ts).
 * 2. Scans of reduced energies e(Dq/B) at the C/B in use (scan.ts): the fixed
 *    ratio; for a fixed C the ratio C/B_guess rounded to 0.1 (B_guess =
 *    0.8·B0, else C/4.5), redone once if the fitted C/B lands more than 0.5
 *    away; for a free C the ratios 3.0, 4.0, 5.0, 6.0, the candidates chosen
 *    for refinement being refined on these and on their neighbours among
 *    3.0, 3.5, …, 6.5 (move-candidate.ts), and the winner's polish starting
 *    from the C/B of a parabola through three of them (free-c-start.ts).
 * 3. Every order-consistent assignment on every spin branch at its grid
 *    optimum (closed-form B per grid point: profile.ts; where two roots fit
 *    equally, the one the β and 10Dq priors prefer), in typed arrays
 *    (candidates.ts). The score is a deviance, −2·ln of the posterior
 *    (likelihood.ts): the grid χ² (σ² plus model error) is a lower bound of
 *    it, so the other terms are computed only for the few that can still
 *    win: the best REFINED_CANDIDATES, and the best of each spin branch that
 *    could be shown as an alternative, and the best that explains every
 *    band. The band list is tried whole and then reduced (reductions.ts:
 *    bands left unexplained, close pairs merged) in order of the reduction's
 *    term, stopping when that term alone exceeds the best score found so far.
 * 3b. Those are refined on the interpolated scan (evaluate-scan.ts; no
 *    engine call) and the winner is polished by Levenberg–Marquardt with the
 *    full engine (refine.ts, B bounded to β 0.15–1.25), which also gives the
 *    Jacobian for the uncertainties. With a fixed C every refinement uses the
 *    engine. Only self-consistent solutions are kept: the assumed ground
 *    level is the ground level at the result.
 * 4. The lowest score wins; probabilities are exp(−score/2) normalised over
 *    the solutions evaluated. A winner whose rms exceeds max(1000 cm-1, 5% of
 *    the mean band position) is not a fit: FieldgapError('unexplained').
 * 5. What the bands cannot fix (likelihood.ts priors stand in): a free C with
 *    σ(C) above 25% of C, or that no band depends on, is fixed at its prior
 *    C/B with a warning and an `undetermined` entry. Conversely, with the C/B
 *    only assumed (not given) and at least AUTO_FREE_C_MIN_BANDS bands that
 *    the assumed C/B fits poorly or only by leaving bands out, C/B is
 *    estimated with its prior and kept when it wins by more than ln m.
 */
import { oxidationStateNote, oxidationStateWarning } from '../chemistry/oxidation-states.js';
import { FieldgapError } from '../errors.js';
import { normalizeBands } from './bands.js';
import {
  approximateScore, branchVariant, candidateGroups, dqOnlyLevel, type CandidateGroup, type DqOnlyCandidate, type GridCandidate,
} from './candidates.js';
import { primaryClass, scanBranches } from './enumerate.js';
import { bPriorOf, priorBOnScan, refinePriorB } from './prior-b.js';
import type { Reduction } from './reductions.js';
import { penaltyTotal } from './penalties.js';
import { gridPrior } from './score-terms.js';
import { fitUncertainty } from './uncertainty.js';
import { bandReductions } from './reductions.js';
import { splitBandSuggestion, splitSuggestionText } from './split-suggestion.js';
import { freeCStart } from './free-c-start.js';
import { candidateOnScan } from './move-candidate.js';
import { evaluateDqOnly, evaluateGridCandidate, type Evaluated } from './evaluate.js';
import { evaluateOnScan } from './evaluate-scan.js';
import { sortObservations, type SortedObservations } from './observations.js';
import { alternativeMargin, buildFitResult } from './result.js';
import { cachedLevelScan } from './scan.js';
import { estimatesCByDefault, resolveFitSettings, type FitSettings } from './settings.js';
import type { FitInput, FitOptions, FitResult } from './types.js';
import { acceptable, groupsBound, lowestWrms, REFINED_CANDIDATES, selectForRefinement, wrmsOrder } from './select-candidates.js';
import { treesSuggestion } from './trees-suggestion.js';

export { REFINED_CANDIDATES };

/** Ratios scanned when C is free. */
export const FREE_C_RATIOS = [3.0, 3.5, 4.0, 4.5, 5.0, 5.5, 6.0, 6.5];
/** The ratios whose every assignment is enumerated when C is free; the chosen candidates are then refined on their FREE_C_RATIOS neighbours. */
export const FREE_C_COARSE_RATIOS = [3.0, 4.0, 5.0, 6.0];

/** rms above which the best assignment is reported as a failure, cm-1. */
export function unexplainedThreshold(positions: readonly number[]): number {
  const mean = positions.reduce((s, v) => s + v, 0) / positions.length;
  return Math.max(1000, 0.05 * mean);
}

function scanRatios(settings: FitSettings): number[] {
  if (settings.mode === 'free') return FREE_C_COARSE_RATIOS;
  if (settings.mode === 'ratio') return [settings.cOverB];
  const bGuess = settings.b0 !== null ? 0.8 * settings.b0 : settings.cFixed / 4.5;
  return [Math.min(8, Math.max(2, Math.round((10 * settings.cFixed) / bGuess) / 10))];
}

function describeSystem(settings: FitSettings): string {
  const oxidation = settings.ion ? oxidationStateNote(settings.ion) : null;
  return `d${settings.d} ${settings.geometry}${settings.ion ? ` (${settings.ion.label}${oxidation !== null ? `: ${oxidation}` : ''})` : ''}`;
}

/** Free C: the candidate refined on its coarse scan and on the FREE_C_RATIOS next to it; the best of these. */
function evaluateOnNeighbours(c: GridCandidate, settings: FitSettings, sorted: SortedObservations): Evaluated {
  let best = evaluateOnScan(c, settings, sorted);
  for (const ratio of FREE_C_RATIOS) {
    if (Math.abs(Math.abs(ratio - c.scan.cOverB) - 0.5) > 1e-9) continue;
    const moved = candidateOnScan(c, cachedLevelScan(settings.d, settings.geometry, ratio), sorted);
    const e = moved && evaluateOnScan(moved, settings, sorted);
    if (e && e.score < best.score) best = e;
  }
  return best;
}

/** Prior-B solutions (one band, B at its prior) polished with the engine at most, the best first. */
export const MAX_PRIOR_B_POLISHED = 6;

/**
 * One observation left for a branch (a single d–d band, or one with only
 * flagged bands left out): the prior-B solutions of every branch on the scan
 * at the prior's C/B (prior-b.ts), except for the transition at exactly 10Dq,
 * which the Dq-only candidate already takes without assuming B.
 */
function priorBCandidates(settings: FitSettings, sorted: SortedObservations, reduction: Reduction, scan: ReturnType<typeof cachedLevelScan>): Evaluated[] {
  // Bands left out are not a one-band reading of the spectrum; a split pair merged into one is (reductions.ts).
  const leavesUnflaggedOut = reduction.dropped.some((o) => !o.flags.includes('spin-forbidden'));
  if (leavesUnflaggedOut || reduction.sorted.primary.length + reduction.sorted.flagged.length !== 1) return [];
  const prior = bPriorOf(settings);
  const out: Evaluated[] = [];
  for (const branch of scanBranches(scan)) {
    const variant = branchVariant(branch, reduction);
    if (!variant || variant.observations.length !== 1) continue;
    const exact = dqOnlyLevel(scan, branch);
    for (const e of priorBOnScan(scan, branch, variant, settings, sorted, prior)) {
      if ((e.candidate as DqOnlyCandidate).level !== exact) out.push(e);
    }
  }
  return out;
}

/**
 * A Dq-only solution of a class with several transitions (ν1 of d3 and d8
 * octahedral, of d2 and d7 tetrahedral) is scored without the window
 * terms, since the other transitions' energies depend on the unknown B;
 * left so, it beats every assignment that pays for a transition missing
 * inside the measured range (a lone band read as ν1 while ν2 would then lie
 * in the window with no band). Its window terms are those of the same
 * assignment with B at its prior (prior-b.ts): charged, and listed as
 * skipped transitions, B itself staying unreported.
 */
function withWindowAtPriorB(e: Evaluated, settings: FitSettings, sorted: SortedObservations): Evaluated {
  const candidate = e.candidate as DqOnlyCandidate;
  if (primaryClass(candidate.branch).levels.length < 2) return e;
  const same = priorBOnScan(candidate.scan, candidate.branch, candidate.variant, settings, sorted, bPriorOf(settings))
    .filter((p) => (p.candidate as DqOnlyCandidate).level === candidate.level)
    .sort((a, b) => a.score - b.score)[0];
  if (!same) return e;
  const window = same.penalties.filter((p) => p.rule === 'skipped-transition')
    .map((p) => ({ ...p, detail: `${p.detail} (with B at its prior)` }));
  if (window.length === 0) return e;
  const penalties = [...e.penalties, ...window];
  return { ...e, penalties, skipped: same.skipped, score: e.score + window.reduce((t, p) => t + p.amount, 0) };
}

function evaluateAll(settings: FitSettings, sorted: SortedObservations, ratios: number[], wholeListOnly = false): Evaluated[] {
  const p = settings.mode === 'free' ? 3 : 2;
  const threshold = unexplainedThreshold([...sorted.primary, ...sorted.flagged].map((o) => o.position));
  const scans = ratios.map((ratio) => cachedLevelScan(settings.d, settings.geometry, ratio));
  const prior = gridPrior(settings);
  const groups: CandidateGroup[] = [];
  const dqOnly: DqOnlyCandidate[] = [];
  // Groups that explain every unflagged band: their best is always refined, so a failure can name its rms.
  const wholeGroups: CandidateGroup[] = [];
  // One band: B at its prior, on the scan at the C/B in use (the prior's in free mode; a fixed C keeps its first scan).
  const priorScan = settings.mode === 'fixed' ? scans[0]! : cachedLevelScan(settings.d, settings.geometry, settings.cOverB);
  const priorB: Evaluated[] = [];
  // Reductions by ascending penalty (the full band list first): one whose penalty alone exceeds the best
  // score found so far cannot win, and neither can any after it.
  let bound = Infinity;
  for (const reduction of bandReductions(sorted, p)) {
    if (reduction.penalty >= bound || (wholeListOnly && reduction.penalty > 0)) break;
    for (const e of priorBCandidates(settings, sorted, reduction, priorScan)) {
      priorB.push(e);
      bound = Math.min(bound, e.score);
    }
    scans.forEach((scan, i) => {
      const found = candidateGroups(scan, reduction, p, prior);
      groups.push(...found.groups);
      if (!reduction.touchesUnflagged) wholeGroups.push(...found.groups);
      bound = Math.min(bound, groupsBound(found.groups, settings, sorted, threshold));
      if (i === 0) {
        for (const c of found.dqOnly) {
          dqOnly.push(c);
          bound = Math.min(bound, penaltyTotal(c.variant.penalties));
        }
      }
    });
  }
  const limit = alternativeMargin(bound);
  const entries = wrmsOrder(groups, limit);
  const evaluated: Evaluated[] = [];
  let bestScore = Infinity;
  const chosen = selectForRefinement(entries, settings, sorted, threshold).sort((a, b) => a.approxScore - b.approxScore);
  const whole = lowestWrms(wholeGroups);
  const extra = whole && !chosen.some((c) => !c.variant.touchesUnflagged) ? [whole] : [];
  for (const c of chosen) {
    // Refining lowers a score by little more than the grid error, far less than the margin.
    if (c.approxScore > alternativeMargin(bestScore)) continue;
    // C/B fixed (or free, at each scanned C/B): refine on the scan, no engine call; the winner is polished
    // with the engine below. A fixed C changes C/B with B, which no one scan holds: engine throughout.
    const e = settings.mode === 'free' ? evaluateOnNeighbours(c, settings, sorted)
      : settings.mode === 'ratio' ? evaluateOnScan(c, settings, sorted) : evaluateGridCandidate(c, settings, sorted, evaluated.length === 0 ? 60 : 20);
    evaluated.push(e);
    bestScore = Math.min(bestScore, e.score);
  }
  for (const c of extra) {
    approximateScore(c, settings, sorted);
    evaluated.push(settings.mode === 'fixed' ? evaluateGridCandidate(c, settings, sorted, 20) : evaluateOnScan(c, settings, sorted));
  }
  for (const c of dqOnly) {
    const e = evaluateDqOnly(c, settings, sorted);
    if (e) evaluated.push(withWindowAtPriorB(e, settings, sorted));
  }
  // Prior-B solutions scored on the scan: the best few within the margin are polished with the engine; only those count.
  const margin = alternativeMargin(Math.min(bestScore, ...evaluated.map((e) => e.score), ...priorB.map((e) => e.score)));
  for (const e of priorB.sort((a, b) => a.score - b.score).filter((e) => e.score <= margin).slice(0, MAX_PRIOR_B_POLISHED)) {
    const polishedB = refinePriorB(e, settings, sorted);
    if (polishedB) evaluated.push(polishedB);
  }
  // Solutions within the rms threshold first (any fit beats a failure), then by score.
  const within = (e: Evaluated) => (e.wrms <= threshold ? 0 : 1);
  return evaluated.filter((e) => acceptable(e, threshold)).sort((a, b) => within(a) - within(b) || a.score - b.score);
}

function noAssignmentError(settings: FitSettings, sorted: SortedObservations): FieldgapError {
  const n = sorted.primary.length + sorted.flagged.length;
  const p = settings.mode === 'free' ? 3 : 2;
  if (n === 0) return new FieldgapError('invalid-argument', 'every band is flagged charge-transfer: no d–d band to fit', 'bands');
  if (n < p) {
    return new FieldgapError(
      'invalid-argument',
      `${n} d–d band${n === 1 ? '' : 's'} cannot determine ${p === 3 ? '10Dq, B and C' : 'both 10Dq and B'} for ${describeSystem(settings)}: give at least ${p}`,
      settings.mode === 'free' ? 'freeC' : 'bands',
    );
  }
  return new FieldgapError(
    'unexplained',
    `no assignment explains these ${n} bands for ${describeSystem(settings)}: more bands than its transitions can take, even with up to half of them left unexplained (flag spin-forbidden bands :sf and charge-transfer bands :ct)`,
    'bands',
  );
}

/** True when the fitted C has no influence on the assigned bands (its Jacobian column vanishes). */
function cUndetermined(best: Evaluated): boolean {
  if (!best.lsq || best.problem?.mode !== 'free') return false;
  const { jacobian } = best.lsq;
  let colB = 0;
  let colC = 0;
  for (let i = 0; i < jacobian.length / 3; i++) {
    colB += jacobian[i * 3 + 1]! ** 2;
    colC += jacobian[i * 3 + 2]! ** 2;
  }
  return Math.sqrt(colC) <= 1e-6 * Math.sqrt(colB) * best.params.c;
}

/** σ(C)/C above which the bands are said not to determine C. */
export const C_UNDETERMINED_FRACTION = 0.25;

/** Why C is not determined by the best free-C solution, or undefined when it is. */
function cNotDetermined(best: Evaluated | undefined, weighted: boolean): string | undefined {
  if (!best) return undefined;
  if (best.bPrior) return 'one band cannot fix C';
  if (cUndetermined(best) || !best.bDetermined) return 'their energies do not depend on C';
  if (!best.lsq) return undefined;
  const { uncertainty } = fitUncertainty(best, weighted);
  if (uncertainty.c === null || !Number.isFinite(uncertainty.c)) return 'the fit cannot separate C from 10Dq and B';
  if (uncertainty.c > C_UNDETERMINED_FRACTION * best.params.c) {
    return `C would be ${Math.round(best.params.c)} ± ${uncertainty.c.toPrecision(2)} cm-1, more than ${100 * C_UNDETERMINED_FRACTION}% uncertain`;
  }
  return undefined;
}

/** Polishes the winner with the engine when it was refined on the scan only (or did not converge). */
function polished(best: Evaluated, settings: FitSettings, sorted: SortedObservations): Evaluated {
  if (best.candidate.kind !== 'grid' || !(best.levels === null || (best.lsq && !best.lsq.success))) return best;
  let from = best.levels === null ? best.params : undefined;
  if (from && settings.mode === 'free') from = freeCStart(best.candidate, from, FREE_C_RATIOS, sorted) ?? from;
  return evaluateGridCandidate(best.candidate, settings, sorted, 200, from);
}

/**
 * The positions' χ² above its mean plus two standard deviations for m − 2
 * degrees of freedom (χ² has mean k and variance 2k): the model with this
 * C/B misses the bands by more than their σ and the model error allow.
 */
function poorFit(e: Evaluated): boolean {
  const dof = e.candidate.variant.observations.length - 2;
  return dof > 0 && e.chiSquare > dof + 2 * Math.sqrt(2 * dof);
}

/** Runners-up polished when the polished winner scores worse than they did on the scan (bounds the engine calls). */
const MAX_REPOLISHED = 4;

/** Observations that depend on C: bands at least this many, beyond the three parameters, before C/B is estimated unasked. */
export const AUTO_FREE_C_MIN_BANDS = 4;

export function fitLigandField(input: FitInput, options: FitOptions = {}): FitResult {
  let settings = resolveFitSettings(input);
  const bands = normalizeBands(input.bands, 'bands');
  const sorted = sortObservations(bands);
  // An ion above its element's known oxidation states is fitted as asked, with a word (src/chemistry/oxidation-states.ts).
  const oxidation = settings.ion ? oxidationStateWarning(settings.ion) : null;
  const warnings: string[] = oxidation !== null ? [oxidation] : [];
  const notes: string[] = [...settings.notes];
  const byDefault = estimatesCByDefault(settings, sorted.primary.length + sorted.flagged.length);
  if (byDefault) {
    settings = { ...settings, mode: 'free' };
    notes.push(byDefault);
  }
  const undetermined: FitResult['undetermined'] = [];
  let evaluated = evaluateAll(settings, sorted, scanRatios(settings));
  if (settings.mode === 'fixed' && evaluated[0]?.bDetermined) {
    const ratio = evaluated[0].params.c / evaluated[0].params.b;
    if (Math.abs(ratio - scanRatios(settings)[0]!) > 0.5) {
      evaluated = evaluateAll(settings, sorted, [Math.min(8, Math.max(2, Math.round(ratio * 10) / 10))]);
    }
  }
  if (settings.mode === 'free' && evaluated[0]) {
    const why = cNotDetermined(polished(evaluated[0], settings, sorted), sorted.weighted);
    if (why) {
      warnings.push(`C is not determined by these bands (${why}): C/B fixed at its prior ${settings.cOverB.toFixed(2)} instead (${settings.cOverBSource})`);
      undetermined.push({ parameter: 'c', reason: why, action: `C/B fixed at ${settings.cOverB.toFixed(2)} (${settings.cOverBSource})` });
      settings = { ...settings, mode: 'ratio' };
      evaluated = evaluateAll(settings, sorted, scanRatios(settings));
    }
  } else if (settings.mode === 'ratio' && !settings.cOverBGiven && evaluated[0] && evaluated[0].bDetermined
    && sorted.primary.length + sorted.flagged.length >= AUTO_FREE_C_MIN_BANDS
    && (poorFit(polished(evaluated[0], settings, sorted)) || evaluated[0].candidate.variant.touchesUnflagged
      || evaluated[0].candidate.variant.dropped.length > 0)) {
    // Enough bands to estimate C/B (with its prior), and the assumed C/B fits them poorly or only by leaving
    // bands out: every band explained with C/B estimated is tried, and kept when it explains the bands better
    // by more than the cost of the extra parameter (ln m in −2·ln units, BIC-like).
    const free = { ...settings, mode: 'free' as const };
    const alternative = evaluateAll(free, sorted, FREE_C_COARSE_RATIOS, true);
    const top = alternative[0] && polished(alternative[0], free, sorted);
    const m = sorted.primary.length + sorted.flagged.length;
    const ratioBest = polished(evaluated[0], settings, sorted);
    if (top && !cNotDetermined(top, sorted.weighted) && top.score + Math.log(m) < ratioBest.score) {
      notes.push(`C/B estimated from the ${m} bands (prior around ${settings.priors.cOverB.toFixed(2)}): it explains them better than the assumed ${settings.cOverBSource}`);
      settings = free;
      evaluated = [top, ...alternative.slice(1)];
    } else {
      evaluated = [ratioBest, ...evaluated.slice(1)];
    }
  }
  if (!evaluated[0]) throw noAssignmentError(settings, sorted);
  const positions = [...sorted.primary, ...sorted.flagged].map((o) => o.position);
  const threshold = unexplainedThreshold(positions);
  // Polishing with the engine may move a solution; one that then leaves bands out implausibly gives way to the next.
  let best = polished(evaluated[0], settings, sorted);
  // Polishing fits the positions and may slide into a prior's tail (a worse posterior than on the scan): the
  // runners-up that scored better than the polished winner are polished too, and the lowest score wins.
  evaluated = [best, ...evaluated.slice(1)];
  for (let i = 1; i < Math.min(evaluated.length, 1 + MAX_REPOLISHED) && evaluated[i]!.score < best.score; i++) {
    const e = polished(evaluated[i]!, settings, sorted);
    evaluated[i] = e;
    if (e.score < best.score && acceptable(e, threshold) && (e.wrms <= threshold || best.wrms > threshold)) {
      evaluated = [e, ...evaluated.filter((_, k) => k !== i)];
      best = e;
    }
  }
  for (let i = 1; i < evaluated.length && !acceptable(best, threshold); i++) {
    best = polished(evaluated[i]!, settings, sorted);
    evaluated = [best, ...evaluated.filter((_, k) => k !== i)];
  }
  if (!acceptable(best, threshold)) {
    // Every fit that explains fewer bands is implausible: report the best fit of the whole list, which fails on its rms.
    const whole = evaluated.filter((e) => !e.candidate.variant.touchesUnflagged).sort((a, b) => a.wrms - b.wrms)[0];
    if (!whole) throw noAssignmentError(settings, sorted);
    best = whole;
  }
  if (best.wrms > threshold) {
    // A way forward (split-suggestion.ts): the closest bands read as one split band, when that fits.
    let tenDq = Number.NaN;
    const split = splitBandSuggestion(bands, (next) => {
      tenDq = fitLigandField({ ...input, bands: next }, { maxAlternatives: 0 }).tenDq;
      return true;
    });
    throw new FieldgapError(
      'unexplained',
      `no assignment explains these bands for ${describeSystem(settings)}; best rms ${Math.round(best.wrms)} cm-1 (limit ${Math.round(threshold)} cm-1)${split ? `; ${splitSuggestionText(split, tenDq)}` : ''}`,
      'bands',
    );
  }
  const trees = treesSuggestion(best, settings);
  if (trees) notes.push(trees);
  return buildFitResult({ settings, sorted, best, others: evaluated.slice(1), warnings, notes, undetermined, options });
}

/** @deprecated The old name of fitLigandField (issue 18: two exported fitBands meant two things); kept for clients and tests that import it. */
export const fitBands = fitLigandField;
