/**
 * One band whose energy depends on B as well as on 10Dq: B (and C/B) fixed
 * at the prior, 10Dq fitted (issue 13, item 5: a parameter the data cannot
 * fix is fixed at its prior, and the result says so).
 *
 * One band cannot fix two parameters. Refusing leaves the chemist with
 * nothing, though the band still says much: which spin state can put a
 * transition there with a plausible B, and roughly where 10Dq lies. So each
 * spin branch and each transition of its class is tried with B fixed at the
 * prior's centre (bPriorOf), the band fitted exactly by Dq alone, and the
 * solutions scored like every other (likelihood.ts: the window, the
 * intensity, the 10Dq prior); the posterior then chooses the transition
 * and the spin state. The uncertainty of 10Dq carries the prior's spread of
 * B (uncertainty.ts), so a 10Dq that rests on B says so in its ±.
 *
 * Solving: on the scan (E/B against Dq/B at the C/B in use) the band's
 * energy over B is matched between neighbouring points of the branch (so
 * every root is self-consistent: the branch's ground level is the ground
 * level there), by linear interpolation; the few best are then polished
 * with the engine by Newton steps in Dq (refinePriorB).
 */
import { levelsAt } from './engine.js';
import { cOverBPriorSd, sigmaFromCOf, transitionCDerivatives } from './c-sensitivity.js';
import { branchSpinState, type Evaluated } from './evaluate.js';
import { primaryClass, type Branch } from './enumerate.js';
import type { DqOnlyCandidate, Variant } from './candidates.js';
import { LIKELIHOOD } from './likelihood.js';
import { penaltyTotal, type ClassTransition } from './penalties.js';
import { levelIdentityKey, type LevelScan } from './scan.js';
import { scoreTerms } from './score-terms.js';
import type { FitSettings } from './settings.js';
import type { SortedObservations } from './observations.js';
import { twoElectronLevels } from './two-electron.js';
import type { FieldParameters } from '../ligand-field/types.js';

/** B fixed at its prior: the value, its spread (one σ) and where it comes from. */
export interface BPrior {
  /** cm-1. */
  b: number;
  /** Standard deviation of the prior, cm-1. */
  sigma: number;
  source: string;
}

/**
 * The prior's centre of B and its σ (likelihood.ts priors):
 * - ligands given (β expected from Jørgensen's 1 − h·k): that β × B0, σ 0.1·B0;
 * - else the middle of the flat β prior, (0.35 + 1.0)/2 ≈ 0.68, × B0, σ that
 *   of the flat prior, (1.0 − 0.35)/√12 ≈ 0.19, × B0;
 * - without B0: the middle of the flat B prior (150–1250 cm-1), σ its width/√12.
 */
export function bPriorOf(settings: FitSettings): BPrior {
  const L = LIKELIHOOD;
  const { b0, priors } = settings;
  if (b0 !== null && priors.betaExpected !== null) {
    return {
      b: priors.betaExpected * b0, sigma: L.betaLigandSigma * b0,
      source: `β = ${priors.betaExpected.toFixed(2)} expected from the ligands (${priors.ligandNote}) × free-ion B0 = ${Math.round(b0)} cm-1`,
    };
  }
  if (b0 !== null) {
    const beta = (L.betaMin + L.betaMax) / 2;
    return {
      b: beta * b0, sigma: ((L.betaMax - L.betaMin) / Math.sqrt(12)) * b0,
      source: `β = ${beta.toFixed(2)}, the middle of the β prior ${L.betaMin.toFixed(2)}–${L.betaMax.toFixed(2)} (no ligands given), × free-ion B0 = ${Math.round(b0)} cm-1`,
    };
  }
  return {
    b: (L.bMinWithoutIon + L.bMaxWithoutIon) / 2, sigma: (L.bMaxWithoutIon - L.bMinWithoutIon) / Math.sqrt(12),
    source: `the middle of the B prior ${L.bMinWithoutIon}–${L.bMaxWithoutIon} cm-1 (no free-ion B0 known)`,
  };
}

/**
 * B fixed at its prior in a solution, with the slopes of the assigned
 * transition at it (cm-1 per cm-1; NaN until polished with the engine):
 * ∂E/∂Dq, and ∂E/∂B with C following B (ratio and free modes) or held
 * (fixed mode). uncertainty.ts carries σ(B) into σ(10Dq) through them.
 */
export interface PriorBFix extends BPrior {
  dEdDq: number;
  dEdB: number;
  /** C is the user's fixed C (not C/B·B). */
  cHeld: boolean;
}

/** A root on the scan: between branch points j0 and j1 = next, at fraction t. */
interface ScanRoot {
  j0: number;
  j1: number;
  t: number;
}

/**
 * Where the level's energy above the branch ground, in units of B, equals
 * `target` = position/B: every crossing between neighbouring branch points
 * (consecutive grid indices), by linear interpolation.
 */
export function scanRoots(scan: LevelScan, branch: Branch, level: number, target: number): ScanRoot[] {
  const n = scan.ids.length;
  const e = (j: number) => scan.energies[j * n + level]! - scan.energies[j * n + branch.ground]!;
  const roots: ScanRoot[] = [];
  const points = branch.points;
  for (let i = 0; i + 1 < points.length; i++) {
    const j0 = points[i]!;
    const j1 = points[i + 1]!;
    if (j1 !== j0 + 1) continue;
    const f0 = e(j0) - target;
    const f1 = e(j1) - target;
    if (f0 === 0 || f0 * f1 < 0) roots.push({ j0, j1, t: f0 === f1 ? 0 : f0 / (f0 - f1) });
  }
  return roots;
}

/** Energy (cm-1) of scan level k above the branch ground at a root, B given. */
function energyAt(scan: LevelScan, branch: Branch, k: number, root: ScanRoot, b: number): number {
  const n = scan.ids.length;
  const at = (j: number) => scan.energies[j * n + k]! - scan.energies[j * n + branch.ground]!;
  return b * ((1 - root.t) * at(root.j0) + root.t * at(root.j1));
}

/** The C that goes with B in the fit's C mode (free C: the prior's ratio, C being no better fixed than B). */
function cFor(settings: FitSettings, scan: LevelScan, b: number): number {
  return settings.mode === 'fixed' ? settings.cFixed : scan.cOverB * b;
}

/**
 * Every prior-B solution of a one-observation variant on one branch, scored
 * on the scan (no engine call): one per transition of the class and root.
 */
export function priorBOnScan(
  scan: LevelScan, branch: Branch, variant: Variant, settings: FitSettings, sorted: SortedObservations, prior: BPrior,
): Evaluated[] {
  const observation = variant.observations[0]!;
  const cls = primaryClass(branch);
  const two = twoElectronLevels(scan, branch.ground);
  const out: Evaluated[] = [];
  for (const level of cls.levels) {
    for (const root of scanRoots(scan, branch, level, observation.position / prior.b)) {
      const x = (1 - root.t) * scan.x[root.j0]! + root.t * scan.x[root.j1]!;
      const params: FieldParameters = { dq: x * prior.b, b: prior.b, c: cFor(settings, scan, prior.b) };
      const transitions: ClassTransition[] = cls.levels.map((k) => ({
        level: k, term: scan.ids[k]!.term, label: scan.ids[k]!.label, energy: energyAt(scan, branch, k, root, prior.b), twoElectron: two[k] === 1,
      }));
      const candidate: DqOnlyCandidate = { kind: 'dq-only', scan, branch, variant, level };
      out.push(scored(candidate, settings, sorted, prior, params, transitions, null));
    }
  }
  return out;
}

function scored(
  candidate: DqOnlyCandidate, settings: FitSettings, sorted: SortedObservations, prior: BPrior, params: FieldParameters,
  transitions: ClassTransition[], levels: Evaluated['levels'], slopes = { dEdDq: Number.NaN, dEdB: Number.NaN },
): Evaluated {
  const { scan, branch, variant, level } = candidate;
  const observation = variant.observations[0]!;
  const terms = scoreTerms({
    candidate, settings, sorted, transitions, calculated: Float64Array.of(observation.position), levels: Int32Array.of(level),
    dq: params.dq, b: params.b, c: params.c, bDetermined: true,
  });
  const penalties = [...variant.penalties, ...terms.penalties];
  return {
    candidate, params, bDetermined: true, bPrior: { ...prior, dEdDq: slopes.dEdDq, dEdB: slopes.dEdB, cHeld: settings.mode === 'fixed' }, levels,
    groundTerm: levels?.groundTerm ?? scan.ids[branch.ground]!.term, spinState: levels?.spinState ?? branchSpinState(candidate),
    calculated: Float64Array.of(observation.position), levelIndices: Int32Array.of(level), wrms: 0, chiSquare: 0, penalties,
    skipped: terms.skipped, coincident: terms.coincident, score: penaltyTotal(penalties), lsq: null, problem: null, keptGrid: false,
    notes: [],
  };
}

function levelEnergyAt(settings: FitSettings, groundKey: string, levelKey: string, params: FieldParameters): number {
  const byKey = new Map(levelsAt(settings.d, settings.geometry, params).levels.map((l) => [levelIdentityKey(l), l.energy]));
  return (byKey.get(levelKey) ?? Number.NaN) - (byKey.get(groundKey) ?? Number.NaN);
}

/** Newton steps in Dq at most. */
const NEWTON_STEPS = 8;

/**
 * A scan solution polished with the engine: Dq such that the assigned
 * level lies at the band (B and C fixed), by Newton steps with a forward
 * difference; undefined when the engine's ground level is not the branch's
 * there (not self-consistent) or the level cannot reach the band.
 */
export function refinePriorB(e: Evaluated, settings: FitSettings, sorted: SortedObservations): Evaluated | undefined {
  const candidate = e.candidate as DqOnlyCandidate;
  const { scan, branch, variant, level } = candidate;
  const prior = e.bPrior!;
  const target = variant.observations[0]!.position;
  const groundKey = scan.ids[branch.ground]!.key;
  const levelKey = scan.ids[level]!.key;
  const { b, c } = e.params;
  const energy = (dq: number) => {
    const levels = levelsAt(settings.d, settings.geometry, { dq, b, c });
    const byKey = new Map(levels.levels.map((l) => [levelIdentityKey(l), l.energy]));
    return { levels, value: (byKey.get(levelKey) ?? Number.NaN) - (byKey.get(groundKey) ?? Number.NaN) };
  };
  let dq = e.params.dq;
  let at = energy(dq);
  let slope = Number.NaN;
  for (let step = 0; step < NEWTON_STEPS; step++) {
    const h = 1e-5 * Math.max(dq, 1);
    slope = (energy(dq + h).value - at.value) / h;
    if (!Number.isFinite(slope) || slope === 0) return undefined;
    if (Math.abs(at.value - target) <= 1e-3) break;
    dq = Math.max(1e-6, dq - (at.value - target) / slope);
    at = energy(dq);
  }
  if (!(Math.abs(at.value - target) <= 1)) return undefined;
  // ∂E/∂B: with C = (C/B)·B, Euler's relation for E homogeneous of degree 1 in (Dq, B, C) gives (E − Dq·∂E/∂Dq)/B
  // (refine.ts); with C held, one more engine call.
  const dEdB = settings.mode === 'fixed'
    ? (levelEnergyAt(settings, groundKey, levelKey, { dq, b: b * (1 + 1e-5), c }) - at.value) / (1e-5 * b)
    : (at.value - dq * slope) / b;
  const ground = at.levels.levels.find((l) => l.energy === 0);
  if (!ground || levelIdentityKey(ground) !== groundKey) return undefined;
  const zero = at.levels.levels.find((l) => levelIdentityKey(l) === groundKey)!.energy;
  const two = twoElectronLevels(scan, branch.ground);
  const byKey = new Map(at.levels.levels.map((l) => [levelIdentityKey(l), l.energy]));
  const transitions: ClassTransition[] = primaryClass(branch).levels.map((k) => ({
    level: k, term: scan.ids[k]!.term, label: scan.ids[k]!.label, energy: (byKey.get(scan.ids[k]!.key) ?? Number.NaN) - zero, twoElectron: two[k] === 1,
  }));
  const polished = scored(candidate, settings, sorted, prior, { dq, b, c }, transitions, at.levels, { dEdDq: slope, dEdB });
  // The band's spread from the C/B it assumes (c-sensitivity.ts; a free C is held at the ratio here too): into 10Dq's ± (uncertainty.ts).
  const cSd = settings.mode === 'fixed' || settings.cOverBGiven ? 0 : cOverBPriorSd();
  if (cSd > 0) polished.sigmaFromC = sigmaFromCOf(transitionCDerivatives(settings.d, settings.geometry, { dq, b, c }, groundKey, [levelKey]), b, cSd);
  polished.notes.push(`B fixed at its prior ${Math.round(b)} cm-1 (${prior.source}); 10Dq from the one band with it`);
  return polished;
}
