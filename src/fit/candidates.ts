/**
 * Grid candidates: every assignment of the bands on one scan, each at its
 * grid optimum, with an approximate score (grid rms + penalties) used to
 * choose which few to refine with the full engine.
 *
 * Per reduction of the band list (reductions.ts: bands left unexplained,
 * close pairs read as one split band) and spin branch (see enumerate.ts):
 * - a branch with a single transition in its class (d1, d9, high-spin d4
 *   and d6) takes two or three unflagged bands within a ratio of 1.6 of each
 *   other as Jahn–Teller components of that one transition, at their
 *   intensity-weighted centroid (observations.ts; only when no band was
 *   left out or merged);
 * - one unflagged band and nothing else gives a "Dq only" candidate when the
 *   branch has a transition at exactly 10Dq (dqOnlyLevel): 10Dq from the
 *   band, B not determinable; not from a reduction that left out or merged
 *   unflagged bands (only flagged ones may be left for it).
 */
import type { Branch } from './enumerate.js';
import { enumerateAssignments, isLowSpinBranch, primaryClass, scanBranches, type AssignmentTable } from './enumerate.js';
import { averageObservations, type Observation, type SortedObservations } from './observations.js';
import type { Reduction } from './reductions.js';
import { LIMITS, penaltyTotal, type ClassTransition } from './penalties.js';
import { deviance, effectiveWeight, LIKELIHOOD } from './likelihood.js';
import { gridOptimum, type GridSolution } from './profile.js';
import type { LevelScan } from './scan.js';
import { scoreTerms } from './score-terms.js';
import { twoElectronLevels } from './two-electron.js';
import type { FitSettings } from './settings.js';
import type { Penalty } from './types.js';
import { float64Of } from './float64-of.js';

/** Grid stride of the first pass for reduced band lists (profile.ts gridOptimum). */
export const REDUCED_GRID_STRIDE = 3;
/** Largest ratio of Jahn–Teller components averaged as one band. */
export const JAHN_TELLER_MAX_RATIO = 1.6;

export interface Variant {
  /** Observations in table-column order: primary (sorted), then flagged (sorted). */
  observations: Observation[];
  nPrimary: number;
  classForbidden: boolean;
  /** Bands left unexplained. */
  dropped: Observation[];
  /** Pairs of bands read as one split band (averaged). */
  merged: Observation[][];
  /** Unflagged bands were left out or merged: the fit must then be plausible on its own (fit-ligand-field.ts). */
  touchesUnflagged: boolean;
  /** Components averaged into the one primary observation, if any. */
  jahnTeller: Observation[] | null;
  /** Penalties fixed by the variant itself (unexplained bands, Jahn–Teller pair). */
  penalties: Penalty[];
}

export interface GridCandidate {
  kind: 'grid';
  scan: LevelScan;
  branch: Branch;
  variant: Variant;
  levels: Int32Array;
  grid: GridSolution;
  /** Grid χ² (σ² + σm², likelihood.ts) plus the variant's own terms: a lower bound of approxScore. */
  wrms: number;
  /** NaN until approximateScore() computes it. */
  approxScore: number;
  /** Identity across scans: branch ground, levels and bands. */
  key: string;
}

export interface DqOnlyCandidate {
  kind: 'dq-only';
  scan: LevelScan;
  branch: Branch;
  variant: Variant;
  /** ids index of the one transition. */
  level: number;
}

function jahnTellerPenalty(components: Observation[]): Penalty {
  const ratio = components[components.length - 1]!.position / components[0]!.position;
  const amount = deviance(LIKELIHOOD.jahnTellerPair) + (10 * Math.max(0, ratio - LIMITS.jahnTellerRatio)) ** 2;
  const list = components.map((o) => Math.round(o.position)).join(' and ');
  return { rule: 'jahn-teller-pair', amount, detail: `${list} cm-1 averaged as Jahn–Teller components of one transition` };
}

/**
 * How a branch takes the bands of one reduction (reductions.ts): the class
 * that takes the unflagged bands, and, for a single-transition class, the
 * unflagged bands averaged as Jahn–Teller components. None when a
 * single-transition class would get more than three bands or a spread above
 * JAHN_TELLER_MAX_RATIO, or when the reduction left a band out or merged
 * two.
 */
export function branchVariant(branch: Branch, reduction: Reduction): Variant | undefined {
  const { sorted } = reduction;
  const cls = primaryClass(branch);
  let primary = sorted.primary;
  let flagged = sorted.flagged;
  if (cls.forbidden) {
    primary = [...primary, ...flagged].sort((a, b) => a.position - b.position);
    flagged = [];
  }
  let jahnTeller: Observation[] | null = null;
  const penalties: Penalty[] = [...reduction.penalties];
  if (cls.levels.length === 1 && primary.length >= 2) {
    const ratio = primary[primary.length - 1]!.position / primary[0]!.position;
    // Averaging components after leaving bands out stacks one repair on another: not a fit of what was measured.
    if (primary.length > 3 || ratio > JAHN_TELLER_MAX_RATIO || reduction.penalty > 0) return undefined;
    jahnTeller = primary;
    penalties.push(jahnTellerPenalty(primary));
    primary = [averageObservations(primary)];
  }
  return {
    observations: [...primary, ...flagged], nPrimary: primary.length, classForbidden: cls.forbidden,
    dropped: reduction.dropped, merged: reduction.merged, touchesUnflagged: reduction.touchesUnflagged, jahnTeller, penalties,
  };
}

/**
 * The class level whose energy above the ground is 10Dq whatever B and C
 * (ν1 of d3 and d8 octahedral, d2 and d7 tetrahedral; the one transition of
 * d1, d9, high-spin d4 and d6), or undefined. Read from the scan: the
 * lowest class level at every point of the branch, with E/B proportional
 * to Dq/B through the origin.
 */
export function dqOnlyLevel(scan: LevelScan, branch: Branch): number | undefined {
  const cls = primaryClass(branch);
  if (cls.levels.length === 1) return cls.levels[0];
  const n = scan.ids.length;
  let level: number | undefined;
  let slope = Number.NaN;
  for (const j of branch.points) {
    let lowest = -1;
    for (const k of cls.levels) {
      if (lowest < 0 || scan.energies[j * n + k]! < scan.energies[j * n + lowest]!) lowest = k;
    }
    if (level === undefined) level = lowest;
    if (lowest !== level) return undefined;
    const s = (scan.energies[j * n + lowest]! - scan.energies[j * n + branch.ground]!) / scan.x[j]!;
    if (Number.isNaN(slope)) slope = s;
    if (Math.abs(s - slope) > 1e-9 * Math.abs(slope)) return undefined;
  }
  return level;
}

/** Transitions of the branch's primary class at grid point j and scale b, in cm-1. */
export function classTransitionsAt(scan: LevelScan, branch: Branch, j: number, b: number): ClassTransition[] {
  const n = scan.ids.length;
  const two = twoElectronLevels(scan, branch.ground);
  return primaryClass(branch).levels.map((k) => ({
    level: k, term: scan.ids[k]!.term, label: scan.ids[k]!.label,
    energy: b * (scan.energies[j * n + k]! - scan.energies[j * n + branch.ground]!),
    twoElectron: two[k] === 1,
  }));
}

/**
 * The grid optima of every assignment of one (branch, variant), in typed
 * arrays: materialising thousands of candidate objects would cost more than
 * computing them. wrms (grid rms plus the variant's own penalties) is a lower
 * bound of the score.
 */
export interface CandidateGroup {
  scan: LevelScan;
  branch: Branch;
  variant: Variant;
  table: AssignmentTable;
  wrms: Float64Array;
  point: Int32Array;
  b: Float64Array;
  ssr: Float64Array;
}

/** Grid optima of every assignment of one reduction of the bands on one scan, and its Dq-only candidates. */
export function candidateGroups(
  scan: LevelScan,
  reduction: Reduction,
  p: number,
  prior?: (b: number, dq: number, lowSpin?: boolean) => number,
): { groups: CandidateGroup[]; dqOnly: DqOnlyCandidate[] } {
  // Reduced band lists are many and only need to find a winner: a coarse pass over the grid first.
  const stride = reduction.penalty > 0 ? REDUCED_GRID_STRIDE : 1;
  const groups: CandidateGroup[] = [];
  const dqOnly: DqOnlyCandidate[] = [];
  for (const branch of scanBranches(scan)) {
    const variant = branchVariant(branch, reduction);
    if (variant) {
      const strongField = isLowSpinBranch(scan, branch);
      const branchPrior = prior && ((b: number, dq: number) => prior(b, dq, strongField));
      const m = variant.observations.length;
      if (m === 0) continue;
      if (m < p) {
        // One band fits exactly: leaving unflagged bands out to get there would explain nothing.
        const level = variant.nPrimary === 1 && m === 1 && !reduction.touchesUnflagged ? dqOnlyLevel(scan, branch) : undefined;
        if (level !== undefined) dqOnly.push({ kind: 'dq-only', scan, branch, variant, level });
        continue;
      }
      const table = enumerateAssignments(scan, branch, variant.nPrimary, m - variant.nPrimary);
      const o = float64Of(variant.observations, (obs) => obs.position);
      // χ² weights: the band's σ and the model error (likelihood.ts).
      const w = float64Of(variant.observations, (obs) => effectiveWeight(obs.position, obs.sigma));
      const variantPenalty = penaltyTotal(variant.penalties);
      const group: CandidateGroup = {
        scan, branch, variant, table, wrms: new Float64Array(table.count).fill(Infinity),
        point: new Int32Array(table.count), b: new Float64Array(table.count), ssr: new Float64Array(table.count),
      };
      const work = new Float64Array(m);
      for (let a = 0; a < table.count; a++) {
        const solution = gridOptimum(scan, branch, table, a, o, w, work, stride, branchPrior);
        if (!solution) continue;
        group.wrms[a] = solution.ssr + variantPenalty;
        group.point[a] = solution.point;
        group.b[a] = solution.b;
        group.ssr[a] = solution.ssr;
      }
      groups.push(group);
    }
  }
  return { groups, dqOnly };
}

/** The candidate object of assignment a of a group. */
export function candidateAt(group: CandidateGroup, a: number): GridCandidate {
  const { scan, branch, variant, table } = group;
  const m = table.width;
  const levels = table.levels.subarray(a * m, (a + 1) * m);
  const bandsKey = variant.observations.map((obs) => obs.bands.join('+')).join(',');
  return {
    kind: 'grid', scan, branch, variant, levels,
    grid: { assignment: a, point: group.point[a]!, x: scan.x[group.point[a]!]!, b: group.b[a]!, ssr: group.ssr[a]! },
    wrms: group.wrms[a]!, approxScore: Number.NaN,
    key: `${scan.ids[branch.ground]!.key}|${Array.from(levels, (k) => scan.ids[k]!.key).join(',')}|${bandsKey}`,
  };
}

/** Grid χ² plus every term of the score at the grid optimum (cached on the candidate). */
export function approximateScore(candidate: GridCandidate, settings: FitSettings, sorted: SortedObservations): number {
  if (!Number.isNaN(candidate.approxScore)) return candidate.approxScore;
  const { scan, branch, variant, grid: solution, levels } = candidate;
  const transitions = classTransitionsAt(scan, branch, solution.point, solution.b);
  const n = scan.ids.length;
  const zero = scan.energies[solution.point * n + branch.ground]!;
  const calculated = float64Of(levels, (k) => solution.b * (scan.energies[solution.point * n + k]! - zero));
  const c = settings.mode === 'fixed' ? settings.cFixed : scan.cOverB * solution.b;
  const terms = scoreTerms({
    candidate, settings, sorted, transitions, calculated, levels: levels.subarray(0, variant.observations.length),
    dq: solution.x * solution.b, b: solution.b, c, bDetermined: true,
  });
  candidate.approxScore = candidate.wrms + penaltyTotal(terms.penalties);
  return candidate.approxScore;
}
