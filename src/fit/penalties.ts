/**
 * The score of an assignment: its (weighted) rms residual in cm-1 plus the
 * penalties below, also in cm-1. The lowest score wins. Two bands and two
 * parameters always fit exactly, so between such fits the penalties alone
 * decide: they encode what a chemist checks by eye.
 *
 * Skipped transitions of the class the bands are assigned to (a transition
 * lower than the highest assigned one that no band takes):
 * - above the highest band: free (outside the measured range or under
 *   charge transfer; listed in `skipped`);
 * - within 300 cm-1 (or half the band width, if larger) of an assigned
 *   transition: free, it lies under that band (`coincident`);
 * - a two-electron jump (two or more electrons change orbital set, e.g.
 *   4T1g → 4A2g in high-spin d7): 150, expected weak;
 * - at or above the onset of a charge-transfer band given in the input: free;
 * - below the lowest band and below 5000 cm-1 (the infrared): free in a
 *   tetrahedral complex, whose lowest band usually lies there; 400 in an
 *   octahedral one (its lowest band is normally the strong, measured ν1);
 *   a tetrahedral ion's lowest transition below 7000 cm-1: 50; else 800;
 * - between assigned bands: 1500 (500 when the class is spin-forbidden, as in
 *   high-spin d5, whose quartet bands are weak).
 * Spin-forbidden transitions skipped by bands flagged :sf cost nothing.
 *
 * Physical plausibility:
 * - β = B/B0 above 1.05: 1500 + 20 000·(β − 1.05); below 0.4 (rare even for
 *   cyanides): 300 + 10 000·(0.4 − β).
 *   Without a free-ion B0 (a bare d-count) the same rules use B0 = 1250 cm-1
 *   for the upper side (no first-row ion is higher) and 150 cm-1 as the floor.
 * - C/B (free C) outside 3.0–6.5: 1000 + 2000 per unit outside.
 * - a band left unexplained: 1000 each, less for a shoulder, a weak, a
 *   narrow or a spin-forbidden-flagged band (reductions.ts), never below 150.
 * - two close bands read as one split band: 250 + 0.25·separation
 *   (reductions.ts).
 * - Jahn–Teller pair averaged: 300, plus 2000·(ratio − 1.3) above a ratio of 1.3.
 */
import type { Geometry } from '../ligand-field/types.js';
import type { CMode, Penalty, SkippedTransition } from './types.js';

export const PENALTY = {
  gap: 1500,
  gapForbidden: 500,
  belowRange: 800,
  infraredOctahedral: 400,
  tetrahedralLowest: 50,
  twoElectron: 150,
  unexplainedBand: 1000,
  unexplainedMin: 150,
  splitBand: 250,
  splitBandPerCm: 0.25,
  betaHigh: 1500,
  betaLow: 300,
  cOverB: 1000,
  jahnTellerPair: 300,
} as const;

export const LIMITS = {
  coincidence: 300,
  infrared: 5000,
  tetrahedralLowest: 7000,
  betaMax: 1.05,
  betaMin: 0.4,
  bMaxWithoutIon: 1250,
  bMinWithoutIon: 150,
  cOverBMin: 3.0,
  cOverBMax: 6.5,
  jahnTellerRatio: 1.3,
  unexplainedFlaggedFactor: 0.3,
  unexplainedShoulderFactor: 0.5,
  unexplainedWeakFactor: 0.5,
  unexplainedNarrowFactor: 0.5,
  /** ε below this fraction of the largest d–d ε is weak. */
  weakEpsilonFraction: 0.2,
  /** Width below this fraction of the median d–d width is narrow. */
  narrowWidthFraction: 0.5,
  /** Neighbours closer than max(this, splitBandFraction·mean) may be one split band, cm-1. */
  splitBandSeparation: 1500,
  splitBandFraction: 0.06,
} as const;

export interface ClassTransition {
  /** ids index. */
  level: number;
  term: string;
  label: string;
  energy: number;
  twoElectron: boolean;
}

export interface AssignedTransition {
  level: number;
  calculated: number;
  /** Band width, cm-1, if given. */
  width?: number;
}

export interface SkipContext {
  geometry: Geometry;
  /** Transitions of the class the bands were assigned to, any order. */
  transitions: ClassTransition[];
  assigned: AssignedTransition[];
  classForbidden: boolean;
  /** Position of the lowest charge-transfer band given, if any. */
  ctOnset?: number;
}

export interface SkipOutcome {
  penalties: Penalty[];
  skipped: SkippedTransition[];
  /** For each assigned transition (same order), the labels of transitions under it. */
  coincident: string[][];
}

export function skippedTransitionPenalties(context: SkipContext): SkipOutcome {
  const { transitions, assigned, geometry } = context;
  const penalties: Penalty[] = [];
  const skipped: SkippedTransition[] = [];
  const coincident: string[][] = assigned.map(() => []);
  const taken = new Set(assigned.map((a) => a.level));
  const calcs = assigned.map((a) => a.calculated);
  const highest = Math.max(...calcs);
  const lowest = Math.min(...calcs);
  const lowestOfClass = Math.min(...transitions.map((t) => t.energy));
  for (const t of [...transitions].sort((a, b) => a.energy - b.energy)) {
    if (taken.has(t.level)) continue;
    const add = (reason: string, amount: number) => {
      skipped.push({ energy: t.energy, term: t.term, label: t.label, reason });
      if (amount > 0) penalties.push({ rule: 'skipped-transition', amount, detail: `${t.label} at ${Math.round(t.energy)} cm-1 ${reason}` });
    };
    const near = assigned.findIndex((a) => Math.abs(a.calculated - t.energy) <= Math.max(LIMITS.coincidence, (a.width ?? 0) / 2));
    if (t.energy > highest && near < 0) {
      add('lies above the highest band (outside the range, or under charge transfer)', 0);
    } else if (near >= 0) {
      coincident[near]!.push(t.label);
    } else if (t.twoElectron) {
      add('is a two-electron jump, expected weak', PENALTY.twoElectron);
    } else if (context.ctOnset !== undefined && t.energy >= context.ctOnset) {
      add('lies under the charge-transfer band', 0);
    } else if (t.energy < lowest) {
      if (t.energy < LIMITS.infrared) {
        add('lies in the infrared, below the measured range', geometry === 'tetrahedral' ? 0 : PENALTY.infraredOctahedral);
      } else if (geometry === 'tetrahedral' && t.energy === lowestOfClass && t.energy < LIMITS.tetrahedralLowest) {
        add("is a tetrahedral ion's lowest band, near the infrared", PENALTY.tetrahedralLowest);
      } else add('lies below the lowest band but in the usual range', PENALTY.belowRange);
    } else {
      add('lies between observed bands but no band is assigned to it', context.classForbidden ? PENALTY.gapForbidden : PENALTY.gap);
    }
  }
  return { penalties, skipped, coincident };
}

export interface PlausibilityContext {
  b: number;
  c: number;
  mode: CMode;
  /** Free-ion B0, or null for a bare d-count. */
  b0: number | null;
}

export function plausibilityPenalties({ b, c, mode, b0 }: PlausibilityContext): Penalty[] {
  const penalties: Penalty[] = [];
  const reference = b0 ?? LIMITS.bMaxWithoutIon;
  const beta = b / reference;
  const name = b0 === null ? `B = ${Math.round(b)} cm-1` : `β = ${beta.toFixed(2)}`;
  if (beta > LIMITS.betaMax) {
    const limit = b0 === null ? `above ${LIMITS.bMaxWithoutIon} cm-1 (higher than any free ion's)` : '> 1: B above the free ion\'s';
    penalties.push({ rule: 'beta', amount: PENALTY.betaHigh + 20_000 * (beta - LIMITS.betaMax), detail: `${name} ${limit}` });
  }
  const floor = b0 === null ? LIMITS.bMinWithoutIon / reference : LIMITS.betaMin;
  if (beta < floor) {
    penalties.push({ rule: 'beta', amount: PENALTY.betaLow + 10_000 * (floor - beta), detail: `${name} is implausibly small` });
  }
  if (mode === 'free') {
    const ratio = c / b;
    const outside = ratio < LIMITS.cOverBMin ? LIMITS.cOverBMin - ratio : ratio > LIMITS.cOverBMax ? ratio - LIMITS.cOverBMax : 0;
    // The edges of the scanned C/B range themselves are inside (rounding of c/b).
    if (outside > 1e-9) {
      penalties.push({
        rule: 'c-over-b',
        amount: PENALTY.cOverB + 2000 * outside,
        detail: `C/B = ${ratio.toFixed(2)} is outside the usual ${LIMITS.cOverBMin}–${LIMITS.cOverBMax}`,
      });
    }
  }
  return penalties;
}

/** Sum of penalty amounts. */
export function penaltyTotal(penalties: readonly Penalty[]): number {
  return penalties.reduce((s, p) => s + p.amount, 0);
}
