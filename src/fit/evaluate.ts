/**
 * Turning a grid candidate into a scored solution with the full engine, and
 * the Dq-only solution of a single-transition branch.
 */
import { crossoverAt, levelsAt as computeLevels } from './engine.js';
import type { FieldParameters, LevelsResult, SpinState } from '../ligand-field/types.js';
import type { DqOnlyCandidate, GridCandidate } from './candidates.js';
import { primaryClass } from './enumerate.js';
import type { LeastSquaresResult } from './least-squares.js';
import { effectiveWeight, leastSquaresSigma } from './likelihood.js';
import { anyWidened, assumedCOverBSd, assumedCPenalty, sigmaFromCOf, transitionCDerivatives } from './c-sensitivity.js';
import { penaltyTotal, type ClassTransition } from './penalties.js';
import { assignedEnergies, parameterCount, refineSolution, type RefineProblem } from './refine.js';
import { levelIdentityKey } from './scan.js';
import { scoreTerms } from './score-terms.js';
import { twoElectronLevels } from './two-electron.js';
import type { FitSettings } from './settings.js';
import type { SortedObservations } from './observations.js';
import type { Penalty, SkippedTransition } from './types.js';
import type { PriorBFix } from './prior-b.js';
import { float64Of } from './float64-of.js';

export interface Evaluated {
  candidate: GridCandidate | DqOnlyCandidate;
  params: FieldParameters;
  /** False for a Dq-only solution: b and c in params are nominal. */
  bDetermined: boolean;
  /** One band, B fixed at its prior and Dq fitted (prior-b.ts); absent otherwise. */
  bPrior?: PriorBFix;
  /** Engine levels at params; null for a solution refined on the scan only (an alternative). */
  levels: LevelsResult | null;
  groundTerm: string;
  spinState: SpinState;
  /** Per observation of candidate.variant.observations. */
  calculated: Float64Array;
  /** ids index per observation. */
  levelIndices: Int32Array;
  wrms: number;
  /** χ² of the positions with σ² + σm² (likelihood.ts). */
  chiSquare: number;
  penalties: Penalty[];
  skipped: SkippedTransition[];
  coincident: string[][];
  /** chiSquare + the penalties: a deviance (likelihood.ts). */
  score: number;
  lsq: LeastSquaresResult | null;
  problem: RefineProblem | null;
  /** The refinement crossed the spin crossover; the grid solution is kept. */
  keptGrid: boolean;
  notes: string[];
  /**
   * Per observation, the σ its position takes from an assumed C/B, cm-1
   * (c-sensitivity.ts), at params; absent or 0 where none (C fitted or
   * fixed, or the transition does not depend on C).
   */
  sigmaFromC?: Float64Array;
  /**
   * When C is tied to B by an assumed C/B: the signed ∂ΔE/∂C of each
   * observation at params and σ_C = B·σ(C/B), cm-1, for the covariance
   * (uncertainty.ts: one C moves every band at once).
   */
  assumedC?: { derivatives: Float64Array; sigma: number };
}

/** The spin state a branch stands for: the higher multiplicity of a scan with two ground levels is high-spin. */
export function branchSpinState(candidate: GridCandidate | DqOnlyCandidate): SpinState {
  const { scan, branch } = candidate;
  const multiplicities = new Set(Array.from(scan.ground, (g) => scan.ids[g]!.multiplicity));
  if (multiplicities.size < 2) return 'no-choice';
  return branch.multiplicity === Math.max(...multiplicities) ? 'high-spin' : 'low-spin';
}

/** Class transitions above the assumed ground at computed levels, cm-1. */
function classTransitionsOf(candidate: GridCandidate | DqOnlyCandidate, levels: LevelsResult): ClassTransition[] {
  const { scan, branch } = candidate;
  const groundKey = scan.ids[branch.ground]!.key;
  const byKey = new Map(levels.levels.map((l) => [levelIdentityKey(l), l.energy]));
  const zero = byKey.get(groundKey) ?? 0;
  const two = twoElectronLevels(scan, branch.ground);
  return primaryClass(branch).levels.map((k) => ({
    level: k, term: scan.ids[k]!.term, label: scan.ids[k]!.label,
    energy: (byKey.get(scan.ids[k]!.key) ?? Number.NaN) - zero,
    twoElectron: two[k] === 1,
  }));
}

/** χ² of calculated against observed positions with the σ² + σm² + σ_C² weights (σ_C: per observation, default none). */
export function chiSquareOf(
  observations: ReadonlyArray<{ position: number; sigma: number }>,
  calculated: Float64Array,
  sigmaFromC?: Float64Array,
): number {
  let chi2 = 0;
  observations.forEach((o, i) => {
    chi2 += effectiveWeight(o.position, o.sigma, sigmaFromC?.[i] ?? 0) * (calculated[i]! - o.position) ** 2;
  });
  return chi2;
}

/**
 * The B range a refinement may search: where the β prior is within about six
 * of its σ of the plausible range (β 0.15–1.25, or 60–1500 cm-1 without B0);
 * beyond it a least-squares optimum is an artefact (two bands fitted by an
 * absurd B), not a result.
 */
export function bRangeOf(settings: FitSettings): [number, number] {
  return settings.b0 !== null ? [0.15 * settings.b0, 1.25 * settings.b0] : [60, 1500];
}

export function evaluateGridCandidate(
  candidate: GridCandidate,
  settings: FitSettings,
  sorted: SortedObservations,
  maxEvaluations = 60,
  from?: FieldParameters,
): Evaluated {
  const { scan, branch, variant, grid } = candidate;
  const observations = variant.observations;
  const groundKey = scan.ids[branch.ground]!.key;
  const levelKeys = Array.from(candidate.levels, (k) => scan.ids[k]!.key);
  const start: FieldParameters = from ?? {
    dq: grid.x * grid.b, b: grid.b, c: settings.mode === 'fixed' ? settings.cFixed : scan.cOverB * grid.b,
    ...(settings.alpha !== 0 ? { alpha: settings.alpha } : {}),
  };
  // σ_C (c-sensitivity.ts) at the start weighs the refinement; recomputed at its result for the χ².
  const cSd = assumedCOverBSd(settings);
  const derivativesAt = (p: FieldParameters) => (cSd > 0
    ? transitionCDerivatives(settings.d, settings.geometry, p, groundKey, levelKeys)
    : new Float64Array(observations.length));
  const startDerivatives = derivativesAt(start);
  const startSigmaC = sigmaFromCOf(startDerivatives, start.b, cSd);
  const weighted = sorted.weighted || anyWidened(startSigmaC);
  const problem: RefineProblem = {
    d: settings.d, geometry: settings.geometry, mode: settings.mode, cOverB: scan.cOverB, cFixed: settings.cFixed,
    groundKey, levelKeys,
    observed: float64Of(observations, (o) => o.position),
    sigma: float64Of(observations, (o, i) => leastSquaresSigma(o.sigma, startSigmaC[i]!, weighted)),
    bRange: bRangeOf(settings),
    ...(settings.treesUsed ? { alpha: settings.alpha, alphaFree: settings.alphaFree } : {}),
  };
  const refined = refineSolution(problem, start, maxEvaluations);
  let { params, levels, calculated } = refined;
  const notes: string[] = [];
  const keptGrid = !refined.selfConsistent;
  if (keptGrid) {
    // The optimum of this assignment lies across the spin crossover: keep the best self-consistent grid point.
    params = start;
    levels = computeLevels(settings.d, settings.geometry, start);
    calculated = new Float64Array(observations.length);
    assignedEnergies(levels, problem.groundKey, problem.levelKeys, calculated);
    notes.push('the least-squares optimum of this assignment lies across the spin crossover; the best self-consistent grid point is kept');
  }
  const derivatives = cSd > 0 && !keptGrid ? derivativesAt(params) : startDerivatives;
  const sigmaFromC = sigmaFromCOf(derivatives, params.b, cSd);
  let ssr = 0;
  let wSum = 0;
  observations.forEach((o, i) => {
    const w = leastSquaresSigma(o.sigma, startSigmaC[i]!, weighted) ** -2;
    ssr += w * (calculated[i]! - o.position) ** 2;
    wSum += w;
  });
  const skip = scoreTerms({
    candidate, settings, sorted, transitions: classTransitionsOf(candidate, levels), calculated, levels: candidate.levels,
    dq: params.dq, b: params.b, c: params.c, bDetermined: true,
  });
  const cPenalty = assumedCPenalty(observations, sigmaFromC, parameterCount(problem));
  const penalties = [...variant.penalties, ...skip.penalties, ...(cPenalty ? [cPenalty] : [])];
  const wrms = Math.sqrt(ssr / wSum);
  const chiSquare = chiSquareOf(observations, calculated, sigmaFromC);
  return {
    candidate, params, bDetermined: true, levels, groundTerm: levels.groundTerm, spinState: levels.spinState,
    calculated, levelIndices: candidate.levels, wrms, chiSquare, penalties,
    skipped: skip.skipped, coincident: skip.coincident, score: chiSquare + penaltyTotal(penalties),
    lsq: keptGrid ? null : refined.lsq, problem, keptGrid, notes, sigmaFromC,
    ...(cSd > 0 ? { assumedC: { derivatives, sigma: params.b * cSd } } : {}),
  };
}

/**
 * 10Dq from the one transition of a single-transition branch (d1, d9,
 * high-spin d4 and d6): its energy is B-independent, E = slope·Dq with the
 * slope read from the scan (10 for these cases). B is not determinable. A
 * branch with a spin crossover is kept only if it can be self-consistent
 * with a plausible B ≤ B0: Dq/B0 below the crossover.
 */
export function evaluateDqOnly(candidate: DqOnlyCandidate, settings: FitSettings, sorted: SortedObservations): Evaluated | undefined {
  const { scan, branch, variant, level } = candidate;
  const n = scan.ids.length;
  const j = branch.points[0]!;
  const slope = (scan.energies[j * n + level]! - scan.energies[j * n + branch.ground]!) / scan.x[j]!;
  const observation = variant.observations[0]!;
  const dq = observation.position / slope;
  const notes: string[] = [];
  const crossover = scan.ground.some((g) => g !== branch.ground)
    ? crossoverAt(settings.d, settings.geometry, scan.cOverB)
    : undefined;
  let b = settings.b0 ?? 1000;
  if (crossover !== undefined) {
    const bMin = dq / crossover;
    if (settings.b0 !== null && bMin >= settings.b0) return undefined;
    notes.push(`this spin state is self-consistent for B > ${Math.round(bMin)} cm-1 (Dq/B below the crossover at ${crossover.toFixed(2)})`);
    if (dq / b >= crossover) b = 1.5 * bMin;
  }
  const params = { dq, b, c: settings.mode === 'fixed' ? settings.cFixed : scan.cOverB * b };
  const levels = computeLevels(settings.d, settings.geometry, params);
  // Only the 10Dq prior: B is nominal, so neither β nor the other transitions' positions are known.
  const prior = scoreTerms({
    candidate, settings, sorted, transitions: [], calculated: Float64Array.of(observation.position), levels: Int32Array.of(level),
    dq, b, c: params.c, bDetermined: false,
  }).penalties.filter((p) => p.rule === 'ten-dq' || p.rule === 'intensity');
  const penalties = [...variant.penalties, ...prior];
  return {
    candidate, params, bDetermined: false, levels, groundTerm: levels.groundTerm, spinState: levels.spinState,
    calculated: Float64Array.of(observation.position),
    levelIndices: Int32Array.of(level), wrms: 0, chiSquare: 0, penalties, skipped: [], coincident: [[]],
    score: penaltyTotal(penalties), lsq: null, problem: null, keptGrid: false, notes,
  };
}
