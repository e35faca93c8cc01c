/**
 * The named terms of the score (likelihood.ts has the model and its
 * sources): the transitions an assignment leaves without a band (the
 * window), the intensities of the assigned bands, and the priors on β, C/B
 * and 10Dq. Each term is a deviance, −2·ln p ≥ 0, reported as a `Penalty`
 * with its rule and a sentence saying why.
 */
import type { Geometry } from '../ligand-field/types.js';
import { deviance, flatWithTails, LIKELIHOOD } from './likelihood.js';
import type { CMode, Penalty, SkippedTransition } from './types.js';

/**
 * The deviance constants, under the name the cm-1 penalties had (kept for
 * callers of the library): see LIKELIHOOD.
 */
export const PENALTY = LIKELIHOOD;

/** Thresholds that are not probabilities. */
export const LIMITS = {
  coincidence: LIKELIHOOD.coincidence,
  infrared: LIKELIHOOD.infrared,
  tetrahedralLowest: LIKELIHOOD.tetrahedralLowest,
  jahnTellerRatio: LIKELIHOOD.jahnTellerRatio,
  /** ε below this fraction of the largest d–d ε is weak. */
  weakEpsilonFraction: 0.2,
  /** Width below this fraction of the median d–d width is narrow. */
  narrowWidthFraction: 0.5,
  /**
   * Neighbours closer than max(this, splitBandFraction·mean) may be one split band, cm-1.
   * Spin–orbit and Jahn–Teller components of one parent band lie up to about
   * 2000 cm-1 apart (the 3T1g(F) doublet of hexaaqua Ni(II) about 1500–1600,
   * common practice); 1500 left that doublet's shoulder unexplained.
   */
  splitBandSeparation: 2000,
  splitBandFraction: 0.06,
  /** A β or C/B term above this (two σ) makes a solution that leaves bands out implausible. */
  implausible: 4,
} as const;

/** The largest separation, cm-1, at which two neighbouring bands near this mean position may be read as one split band. */
export function splitPairLimit(meanPosition: number): number {
  return Math.max(LIMITS.splitBandSeparation, LIMITS.splitBandFraction * meanPosition);
}

export interface ClassTransition {
  /** ids index. */
  level: number;
  term: string;
  label: string;
  energy: number;
  twoElectron: boolean;
  /** Electric-dipole forbidden by the tetrahedral orbital rule (orbital-selection.ts): weak. */
  orbitallyForbidden?: boolean;
}

export interface AssignedTransition {
  level: number;
  calculated: number;
  /** Band width, cm-1, if given. */
  width?: number;
}

/** The measured range, cm-1. */
export interface Window {
  min: number;
  max: number;
}

export interface SkipContext {
  geometry: Geometry;
  /** Transitions of the class the bands were assigned to, any order. */
  transitions: ClassTransition[];
  assigned: AssignedTransition[];
  classForbidden: boolean;
  /** Position of the lowest charge-transfer band given, if any. */
  ctOnset?: number;
  /** The measured range, if known. */
  window?: Window;
}

export interface SkipOutcome {
  penalties: Penalty[];
  skipped: SkippedTransition[];
  /** For each assigned transition (same order), the labels of transitions under it. */
  coincident: string[][];
}

/** The chance p that a transition of this kind, inside the measured range, shows no band. */
function missInside(t: ClassTransition, classForbidden: boolean): { p: number; why: string } {
  if (classForbidden) return { p: LIKELIHOOD.missForbiddenClass, why: 'is weak (spin-forbidden class)' };
  if (t.twoElectron) return { p: LIKELIHOOD.missTwoElectron, why: 'is a two-electron jump, expected weak' };
  if (t.orbitallyForbidden) return { p: LIKELIHOOD.missOrbitallyForbidden, why: 'is orbitally forbidden in Td, expected weak' };
  return { p: LIKELIHOOD.missAllowed, why: 'is a strong spin-allowed transition' };
}

export function skippedTransitionPenalties(context: SkipContext): SkipOutcome {
  const { transitions, assigned, geometry, window } = context;
  const penalties: Penalty[] = [];
  const skipped: SkippedTransition[] = [];
  const coincident: string[][] = assigned.map(() => []);
  const taken = new Set(assigned.map((a) => a.level));
  const calcs = assigned.map((a) => a.calculated);
  const highest = Math.max(...calcs);
  const lowest = Math.min(...calcs);
  const lowestOfClass = Math.min(...transitions.map((t) => t.energy));
  let aboveCharged = false;
  for (const t of [...transitions].sort((a, b) => a.energy - b.energy)) {
    if (taken.has(t.level)) continue;
    const add = (reason: string, p: number) => {
      skipped.push({ energy: t.energy, term: t.term, label: t.label, reason });
      const amount = deviance(p);
      if (amount > 0) penalties.push({ rule: 'skipped-transition', amount, detail: `${t.label} at ${Math.round(t.energy)} cm-1 ${reason}` });
    };
    const near = assigned.findIndex((a) => Math.abs(a.calculated - t.energy) <= Math.max(LIMITS.coincidence, (a.width ?? 0) / 2));
    if (near >= 0) {
      coincident[near]!.push(t.label);
    } else if (window && (t.energy < window.min || t.energy > window.max)) {
      add(`lies outside the measured range (${Math.round(window.min)}–${Math.round(window.max)} cm-1)`, 1);
    } else if (context.ctOnset !== undefined && t.energy >= context.ctOnset) {
      add('lies under the charge-transfer band', 1);
    } else if (!window && t.energy > highest) {
      add('lies above the highest band (outside the range, or under charge transfer)', 1);
    } else if (window && t.energy > highest) {
      // Above the highest band the rising charge-transfer tail may hide it: the lowest such transition is charged
      // (weakly), the ones above it are hidden if it is.
      const first = !aboveCharged;
      aboveCharged = true;
      const miss = missInside(t, context.classForbidden);
      add(first ? `${miss.why} but no band is assigned to it (above the highest band: perhaps under a charge-transfer tail)` : 'lies above another transition missing above the highest band', first ? Math.max(miss.p, LIKELIHOOD.missAboveHighest) : 1);
    } else if (window || t.energy > lowest) {
      const miss = missInside(t, context.classForbidden);
      add(`${miss.why} but no band is assigned to it${window ? ' within the measured range' : ' between the observed bands'}`, miss.p);
    } else if (t.twoElectron) {
      add('is a two-electron jump, expected weak', LIKELIHOOD.missTwoElectron);
    } else if (t.orbitallyForbidden) {
      add('is orbitally forbidden in Td, expected weak', LIKELIHOOD.missOrbitallyForbidden);
    } else if (t.energy < LIMITS.infrared) {
      add('lies in the infrared, below the measured range', geometry === 'tetrahedral' ? 1 : LIKELIHOOD.missInfraredOctahedral);
    } else if (geometry === 'tetrahedral' && t.energy < LIMITS.tetrahedralLowest) {
      // Not only the lowest: ν2 of tetrahedral Co(II) (4T1(F), 5 000–7 000 cm-1) lies as far in the near infrared.
      add(t.energy === lowestOfClass ? "is a tetrahedral ion's lowest band, near the infrared" : 'lies in the near infrared, below the lowest band, where tetrahedral ions have their low bands', LIKELIHOOD.missTetrahedralLowest);
    } else {
      add('lies below the lowest band but in the usual range', context.classForbidden ? LIKELIHOOD.missForbiddenClass : LIKELIHOOD.missBelowOctahedral);
    }
  }
  return { penalties, skipped, coincident };
}

/** What the priors need, fixed per fit (settings.ts builds it). */
export interface PriorSettings {
  /** Free-ion B0, or null. */
  b0: number | null;
  /** Centre of the C/B prior. */
  cOverB: number;
  /** 10Dq expected from the ligands (Jørgensen f·g, ×4/9 tetrahedral), or null. */
  tenDqExpected: number | null;
  /**
   * σ of ln 10Dq around tenDqExpected when wider than likelihood.ts's 15%: √(0.15² + (σg/g)²) when g is an
   * estimate (settings.ts); absent otherwise.
   */
  tenDqSigma?: number;
  /** The range 10Dq shows with common ligands, or null without g. */
  tenDqRange: [number, number] | null;
  /** β expected from the ligands (1 − h·k), or null. */
  betaExpected: number | null;
  /** How the ligand expectations were made, for the details. */
  ligandNote: string | null;
}

export interface PlausibilityContext {
  b: number;
  c: number;
  mode: CMode;
  /** Dq, cm-1; the 10Dq prior is skipped without it. */
  dq?: number;
  priors: PriorSettings;
  /** The solution's ground is the strong-field (low-spin) one: a wider 10Dq tail above (likelihood.ts). */
  lowSpin?: boolean;
}

/** The β prior's deviance at B (flat with tails; without B0 on B itself). */
export function betaPriorDeviance(b: number, priors: PriorSettings): number {
  const L = LIKELIHOOD;
  const reference = priors.b0 ?? L.bMaxWithoutIon;
  const lo = priors.b0 === null ? L.bMinWithoutIon / reference : L.betaMin;
  // The lower tail's σ is a tenth of the floor (0.035 for β's 0.35; 15 cm-1 for B's 150 cm-1 without B0).
  let term = flatWithTails(b / reference, lo, L.betaMax, 0.1 * lo, L.betaSigmaHigh);
  if (priors.betaExpected !== null && priors.b0 !== null) term += ((b / priors.b0 - priors.betaExpected) / L.betaLigandSigma) ** 2;
  return term;
}

/** σ of ln 10Dq around the ligands' expectation: 15%, wider when g is an estimate (PriorSettings.tenDqSigma). */
function tenDqSigmaOf(priors: PriorSettings): number {
  return priors.tenDqSigma ?? LIKELIHOOD.tenDqSigma;
}

/** σ of ln 10Dq above the expectation or range: wider for a low-spin solution (likelihood.ts). */
function tenDqSigmaAbove(lowSpin: boolean, sigma: number = LIKELIHOOD.tenDqSigma): number {
  return lowSpin ? Math.max(LIKELIHOOD.tenDqSigmaLowSpinHigh, sigma) : sigma;
}

/** The 10Dq prior's deviance at Dq; `lowSpin`: the solution's ground is the strong-field one. */
export function tenDqPriorDeviance(dq: number, priors: PriorSettings, lowSpin = false): number {
  if (!(dq > 0)) return 0;
  const L = LIKELIHOOD;
  const above = tenDqSigmaAbove(lowSpin);
  if (priors.tenDqExpected !== null) {
    const r = Math.log((10 * dq) / priors.tenDqExpected);
    return (r / (r > 0 ? tenDqSigmaAbove(lowSpin, tenDqSigmaOf(priors)) : tenDqSigmaOf(priors))) ** 2;
  }
  if (priors.tenDqRange) return flatWithTails(Math.log(10 * dq), Math.log(priors.tenDqRange[0]), Math.log(priors.tenDqRange[1]), L.tenDqSigma, above);
  return 0;
}

/** The prior terms at (Dq, B, C): β (and β from the ligands), C/B when fitted, 10Dq. Only non-zero terms. */
export function plausibilityPenalties({ b, c, mode, dq, priors, lowSpin = false }: PlausibilityContext): Penalty[] {
  const penalties: Penalty[] = [];
  const L = LIKELIHOOD;
  const b0 = priors.b0;
  const reference = b0 ?? L.bMaxWithoutIon;
  const beta = b / reference;
  const name = b0 === null ? `B = ${Math.round(b)} cm-1` : `β = ${beta.toFixed(2)}`;
  const lo = b0 === null ? L.bMinWithoutIon / reference : L.betaMin;
  const betaTerm = flatWithTails(beta, lo, L.betaMax, 0.1 * lo, L.betaSigmaHigh);
  if (betaTerm > 0) {
    const detail = beta > L.betaMax
      ? `${name} ${b0 === null ? `is above ${L.bMaxWithoutIon} cm-1 (higher than any free ion's)` : "> 1: B above the free ion's"}`
      : `${name} is implausibly small`;
    penalties.push({ rule: 'beta', amount: betaTerm, detail });
  }
  if (priors.betaExpected !== null && b0 !== null) {
    const term = ((beta - priors.betaExpected) / L.betaLigandSigma) ** 2;
    if (term > 0) penalties.push({ rule: 'ligands', amount: term, detail: `β = ${beta.toFixed(2)} against ${priors.betaExpected.toFixed(2)} expected from the ligands (${priors.ligandNote})` });
  }
  if (mode === 'free') {
    const ratio = c / b;
    const sigma = ratio < priors.cOverB ? L.cOverBSigmaLow : L.cOverBSigmaHigh;
    const term = ((ratio - priors.cOverB) / sigma) ** 2;
    if (term > 0) penalties.push({ rule: 'c-over-b', amount: term, detail: `C/B = ${ratio.toFixed(2)} against ${priors.cOverB.toFixed(2)} expected` });
  }
  if (dq !== undefined && dq > 0) {
    const tenDq = 10 * dq;
    if (priors.tenDqExpected !== null) {
      const r = Math.log(tenDq / priors.tenDqExpected);
      const term = (r / (r > 0 ? tenDqSigmaAbove(lowSpin, tenDqSigmaOf(priors)) : tenDqSigmaOf(priors))) ** 2;
      if (term > 0) penalties.push({ rule: 'ten-dq', amount: term, detail: `10Dq = ${Math.round(tenDq)} cm-1 against ${Math.round(priors.tenDqExpected)} expected from the ligands (${priors.ligandNote})` });
    } else if (priors.tenDqRange) {
      const [lo10, hi10] = priors.tenDqRange;
      const term = flatWithTails(Math.log(tenDq), Math.log(lo10), Math.log(hi10), L.tenDqSigma, tenDqSigmaAbove(lowSpin));
      if (term > 0) penalties.push({ rule: 'ten-dq', amount: term, detail: `10Dq = ${Math.round(tenDq)} cm-1 is outside ${Math.round(lo10)}–${Math.round(hi10)} cm-1, the range this ion shows with common ligands` });
    }
  }
  return penalties;
}

export interface IntensityContext {
  geometry: Geometry;
  /** Per assigned band: its ε (undefined when not given), whether its transition is spin-allowed and two-electron. */
  bands: Array<{ position: number; epsilon: number | undefined; spinAllowed: boolean; twoElectron: boolean; orbitallyForbidden?: boolean }>;
  /** Every band of the assignment is spin-forbidden (high-spin d5). */
  allForbidden: boolean;
}

/** The intensity terms of the bands that carry ε: ((ln ε − ln ε_μ)/1.3)². */
export function intensityPenalties({ geometry, bands, allForbidden }: IntensityContext): Penalty[] {
  const L = LIKELIHOOD;
  const penalties: Penalty[] = [];
  const allowedEps = bands.filter((b) => b.spinAllowed && b.epsilon !== undefined && b.epsilon > 0).map((b) => b.epsilon!);
  const strongest = allowedEps.length ? Math.max(...allowedEps) : undefined;
  // The strongest one-electron spin-allowed band: the yardstick of the weak classes (likelihood.ts).
  const oneElectronEps = bands.filter((b) => b.spinAllowed && !b.twoElectron && b.orbitallyForbidden !== true && b.epsilon !== undefined && b.epsilon > 0)
    .map((b) => b.epsilon!);
  const strongestOneElectron = oneElectronEps.length ? Math.max(...oneElectronEps) : undefined;
  const allowedMu = geometry === 'tetrahedral' ? L.epsilonTetrahedral : L.epsilonOctahedral;
  for (const band of bands) {
    if (band.epsilon === undefined || !(band.epsilon > 0)) continue;
    let mu: number;
    let kind: string;
    let sigma: number = L.logEpsilonSigma;
    if (band.spinAllowed) {
      const weak = band.twoElectron || band.orbitallyForbidden === true;
      const factor = band.twoElectron ? L.epsilonTwoElectronFactor : L.epsilonOrbitallyForbiddenFactor;
      // A weak class is weak beside the strong bands of the same spectrum: relative to them when one is assigned.
      const relative = weak && strongestOneElectron !== undefined;
      mu = !weak ? allowedMu : relative ? strongestOneElectron * factor : allowedMu * factor;
      kind = band.twoElectron ? 'a two-electron band' : weak ? 'a band orbitally forbidden in Td' : `a spin-allowed ${geometry} band`;
      if (relative) kind += ` beside a one-electron band of ε ${strongestOneElectron.toPrecision(3)}`;
    } else if (strongest !== undefined && !allForbidden) {
      mu = strongest * L.forbiddenRelative;
      kind = 'a spin-forbidden band beside the spin-allowed ones';
    } else {
      mu = geometry === 'tetrahedral' ? L.epsilonForbiddenTetrahedral : L.epsilonForbiddenOctahedral;
      kind = 'a spin-forbidden band';
      sigma = L.logEpsilonSigmaAllForbidden;
    }
    const term = (Math.log(band.epsilon / mu) / sigma) ** 2;
    if (term > 0.01) {
      penalties.push({
        rule: 'intensity', amount: term,
        detail: `ε = ${band.epsilon.toPrecision(3)} at ${Math.round(band.position)} cm-1 for ${kind} (typically about ${mu.toPrecision(2)})`,
      });
    }
  }
  return penalties;
}

/** Sum of penalty amounts. */
export function penaltyTotal(penalties: readonly Penalty[]): number {
  return penalties.reduce((s, p) => s + p.amount, 0);
}
