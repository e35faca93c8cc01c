/**
 * Assembling the plain-JSON FitResult from the chosen solution and the others.
 *
 * Probabilities: exp(−score/2) over the distinct solutions evaluated
 * (likelihood.ts), for the chosen one, each alternative and each spin state.
 * Alternatives: the other refined solutions at least 1/1000 as probable as
 * the winner (score within −2·ln 1e-6 ≈ 27.6), at most
 * options.maxAlternatives (default 4), skipping relabelings of the winner
 * (same calculated energies within 1 cm-1: degenerate levels such as
 * 4A1g/4Eg(G) of d5). Each says why it lost (`reason`).
 * Near spin crossover: within 10% of the crossover Dq/B.
 */
import { cOverBPriorSd } from './c-sensitivity.js';
import { spinStateChoice } from '../ligand-field/index.js';
import { crossoverAt, levelsAt as computeLevels } from './engine.js';
import { deviance, LIKELIHOOD, probabilitiesOf } from './likelihood.js';
import { twoElectronLevels } from './two-electron.js';
import type { LevelsResult } from '../ligand-field/types.js';
import type { Evaluated } from './evaluate.js';
import { primaryClass } from './enumerate.js';
import { ligandFieldStabilisation, spinOnlyMoment } from './lfse.js';
import { intensityWeights, type SortedObservations } from './observations.js';
import { levelIdentityKey } from './scan.js';
import type { FitSettings } from './settings.js';
import { betaSdOf, fitUncertainty } from './uncertainty.js';
import { assignmentGroupOf } from './assignment-groups.js';
import { assignmentSpreadOf } from './assignment-spread.js';
import { describeSingle, restingOnWeakBands } from './resting-on-weak-bands.js';
import { EXACT_CHI_SQUARE, goodnessOfFitOf, goodnessWarnings, pValueText, type GoodnessOfFit } from './goodness-of-fit.js';
import type {
  Alternative, AssignedBand, CrossoverInfo, FitOptions, FitResult, FitStatus, Penalty, PredictedTransition,
} from './types.js';

/** |fitted − crossover| / crossover below this is "near spin crossover". */
export const NEAR_CROSSOVER_FRACTION = 0.1;

/** Alternatives are shown when their score is at most this for a winner's score: probability ratio ≥ LIKELIHOOD.alternativeRatio. */
export function alternativeMargin(bestScore: number): number {
  return bestScore + deviance(LIKELIHOOD.alternativeRatio);
}

// + 0: a residual that rounds to zero from below is 0, not −0 (JSON and structured clone would disagree).
const round = (v: number, digits = 1) => Math.round(v * 10 ** digits) / 10 ** digits + 0;

function assignmentRows(best: Evaluated): AssignedBand[] {
  const { scan, branch, variant } = best.candidate;
  return variant.observations
    .map((o, i): AssignedBand => {
      const id = scan.ids[best.levelIndices[i]!]!;
      return {
        observed: round(o.position), calculated: round(best.calculated[i]!), residual: round(best.calculated[i]! - o.position),
        term: id.term, parent: id.parent, label: id.label, multiplicity: id.multiplicity,
        spinAllowed: id.multiplicity === branch.multiplicity, bands: o.bands, flags: o.flags,
        coincident: best.coincident[i] ?? [],
        ...((best.sigmaFromC?.[i] ?? 0) > 0 ? { sigmaFromC: round(best.sigmaFromC![i]!, 0) } : {}),
      };
    })
    .sort((a, b) => a.observed - b.observed);
}

/** Transitions below the limit at the result; for a Dq-only solution only those that do not depend on B. */
function predictedTransitions(best: Evaluated, settings: FitSettings, limit: number): PredictedTransition[] {
  const { scan, branch } = best.candidate;
  const two = twoElectronLevels(scan, branch.ground);
  let other: LevelsResult | undefined;
  if (!best.bDetermined) other = computeLevels(settings.d, settings.geometry, { ...best.params, b: best.params.b * 1.2, c: best.params.c * 1.2 });
  const otherEnergy = new Map(other?.levels.map((l) => [levelIdentityKey(l), l.energy]) ?? []);
  const levels = best.levels!;
  const groundMultiplicity = levels.levels[0]!.multiplicity;
  return levels.levels
    .filter((l) => l.energy > 0 && l.energy <= limit)
    .filter((l) => !other || Math.abs((otherEnergy.get(levelIdentityKey(l)) ?? Number.NaN) - l.energy) < 1e-6 * l.energy)
    .map((l) => ({
      energy: round(l.energy), term: l.term, label: l.label, parent: l.parent, multiplicity: l.multiplicity,
      spinAllowed: l.multiplicity === groundMultiplicity,
      twoElectron: two[scan.index.get(levelIdentityKey(l)) ?? -1] === 1 && l.multiplicity === groundMultiplicity,
    }));
}

function crossoverOf(best: Evaluated, settings: FitSettings): CrossoverInfo | null {
  if (!best.bDetermined || !spinStateChoice(settings.d, settings.geometry)) return null;
  const { dq, b, c } = best.params;
  const at = crossoverAt(settings.d, settings.geometry, c / b);
  if (at === undefined) return null;
  const fitted = dq / b;
  const percent = (100 * (fitted - at)) / at;
  return {
    dqOverB: round(at, 4), fittedDqOverB: round(fitted, 4), difference: round(fitted - at, 4), percent: round(percent, 2),
    near: Math.abs(percent) < 100 * NEAR_CROSSOVER_FRACTION,
  };
}

/** Parameters fitted to the positions: 1 (Dq) for a one-band solution, else 2 or 3. */
function fittedParameterCount(best: Evaluated): number {
  if (best.bPrior || !best.bDetermined) return 1;
  return best.problem?.mode === 'free' ? 3 : 2;
}

function statusOf(best: Evaluated, fit: GoodnessOfFit): { status: FitStatus; message: string; evaluations: number } {
  const m = best.candidate.variant.observations.length;
  if (best.bPrior) {
    return { status: 'exact', message: `10Dq from the one band with B fixed at its prior (${Math.round(best.params.b)} cm-1): one band cannot fix both`, evaluations: 0 };
  }
  if (!best.bDetermined) {
    const single = primaryClass(best.candidate.branch).levels.length === 1;
    const message = single
      ? '10Dq from the one spin-allowed transition; B is not determinable from it'
      : '10Dq from the one band, assigned to the transition at exactly 10Dq; B is not determinable from it';
    return { status: 'exact', message, evaluations: 0 };
  }
  if (!best.lsq) {
    return { status: 'not-converged', message: best.notes[0] ?? 'no refinement', evaluations: 0 };
  }
  const p = best.problem!.mode === 'free' ? 3 : 2;
  const evaluations = best.lsq.evaluations;
  if (!best.lsq.success) return { status: 'not-converged', message: `not converged: ${best.lsq.message} (${evaluations} evaluations)`, evaluations };
  const how = `${best.lsq.message} after ${evaluations} evaluations`;
  // "exact" means the bands are reproduced; m = p bands that no parameters reproduce are a least-squares compromise.
  if (m === p && fit.chiSquare <= EXACT_CHI_SQUARE) return { status: 'exact', message: `exact: ${m} bands determine the ${p} parameters; converged (${how})`, evaluations };
  if (m === p) {
    return { status: 'converged', message: `not exact: no parameters reproduce the ${m} bands (χ² = ${fit.chiSquare.toFixed(1)}, ${pValueText(fit.pValue)}); least-squares compromise (${how})`, evaluations };
  }
  return { status: 'converged', message: `converged: ${how}`, evaluations };
}

/**
 * The same solution, or a relabeling of it: on every band the other takes
 * the same level or one that lies under the winner's band (degenerate, such
 * as 4A1g/4Eg(G) of d5).
 */
function sameSolution(other: Evaluated, best: Evaluated): boolean {
  if (other.calculated.length !== best.calculated.length || other.candidate.branch.ground !== best.candidate.branch.ground) return false;
  if (other.candidate.variant.observations.some((o, i) => o.bands.join() !== best.candidate.variant.observations[i]!.bands.join())) return false;
  const ids = best.candidate.scan.ids;
  return Array.from(other.levelIndices).every((k, i) => {
    const label = other.candidate.scan.ids[k]!.label;
    return label === ids[best.levelIndices[i]!]!.label || (best.coincident[i] ?? []).includes(label);
  });
}

function reasonAgainst(alt: Evaluated, best: Evaluated): string {
  const parts: string[] = [];
  if (alt.spinState !== best.spinState) parts.push(`${alt.spinState} ground level ${alt.groundTerm}`);
  if (alt.wrms > best.wrms + 1) parts.push(`rms ${Math.round(alt.wrms)} vs ${Math.round(best.wrms)} cm-1`);
  const bestDetails = new Set(best.penalties.map((p) => p.detail));
  for (const p of alt.penalties) if (!bestDetails.has(p.detail)) parts.push(`${p.detail} (+${p.amount.toFixed(1)})`);
  const missing = best.penalties.filter((p) => !alt.penalties.some((q) => q.detail === p.detail));
  if (missing.length) parts.push(`though the chosen one has: ${missing.map((p) => p.detail).join('; ')}`);
  const ratio = Math.exp(-(alt.score - best.score) / 2);
  const verdict = alt.score - best.score < 0.1 ? 'equally good' : `score ${alt.score.toFixed(1)} vs ${best.score.toFixed(1)} (${ratio < 0.001 ? '< 1/1000' : `${(100 * ratio).toPrecision(2)}%`} as probable)`;
  return `${verdict}${parts.length ? `: ${parts.join('; ')}` : ''}`;
}

function alternativeOf(alt: Evaluated, best: Evaluated, settings: FitSettings, probability: number, inChosenGroup = false): Alternative {
  const rows = assignmentRows(alt);
  const b = alt.bDetermined ? alt.params.b : null;
  return {
    assignments: rows,
    rmsResidual: round(alt.wrms), chiSquare: round(alt.chiSquare, 2), score: round(alt.score, 2), probability: round(probability, 4), penalties: roundPenalties(alt.penalties),
    dq: round(alt.params.dq, 2), tenDq: round(10 * alt.params.dq), b: b === null ? null : round(b),
    c: b === null ? null : round(alt.params.c), beta: b !== null && settings.b0 ? round(b / settings.b0, 4) : null,
    groundTerm: alt.groundTerm, groundLabel: alt.candidate.scan.ids[alt.candidate.branch.ground]!.label,
    spinState: alt.spinState, reason: reasonAgainst(alt, best), inChosenGroup,
  };
}

export interface BuildInput {
  settings: FitSettings;
  sorted: SortedObservations;
  best: Evaluated;
  others: Evaluated[];
  warnings: string[];
  /** Notes from the settings and the choice of C mode. */
  notes?: string[];
  undetermined?: FitResult['undetermined'];
  options: FitOptions;
}

function roundPenalties(penalties: readonly Penalty[]): Penalty[] {
  return penalties.map((p) => ({ ...p, amount: round(p.amount, 2) }));
}

/** The distinct solutions (relabelings of one another dropped), the winner first. */
function distinctSolutions(best: Evaluated, others: readonly Evaluated[]): Evaluated[] {
  const list: Evaluated[] = [best];
  for (const o of others) if (!list.some((k) => sameSolution(o, k))) list.push(o);
  return list;
}

export function buildFitResult({ settings, sorted, best, others, warnings, options, ...rest }: BuildInput): FitResult {
  const { predictedLimit = 50_000, maxAlternatives = 4 } = options;
  const { variant, scan, branch } = best.candidate;
  const notes = [...(rest.notes ?? []), ...best.notes];
  const undetermined = [...(rest.undetermined ?? [])];
  const solutions = distinctSolutions(best, others);
  const probabilities = probabilitiesOf(solutions.map((e) => e.score));
  const probabilityOf = new Map(solutions.map((e, i) => [e, probabilities[i]!]));
  const spinStateProbabilities: FitResult['spinStateProbabilities'] = {};
  if (spinStateChoice(settings.d, settings.geometry)) {
    spinStateProbabilities['high-spin'] = 0;
    spinStateProbabilities['low-spin'] = 0;
  }
  solutions.forEach((e, i) => {
    spinStateProbabilities[e.spinState] = (spinStateProbabilities[e.spinState] ?? 0) + probabilities[i]!;
  });
  for (const key of Object.keys(spinStateProbabilities) as Array<keyof typeof spinStateProbabilities>) {
    spinStateProbabilities[key] = round(spinStateProbabilities[key]!, 4);
  }
  const levels = best.levels!;
  const unpaired = levels.unpairedElectrons;
  const bFit = best.bDetermined ? best.params.b : null;
  const cFit = best.bDetermined ? best.params.c : null;
  const beta = bFit !== null && settings.b0 !== null ? bFit / settings.b0 : null;
  const { uncertainty, correlation, basis } = fitUncertainty(best, sorted.weighted);
  const goodnessOfFit = goodnessOfFitOf(best.chiSquare, variant.observations.length, fittedParameterCount(best), beta);
  const status = statusOf(best, goodnessOfFit);
  for (const u of restingOnWeakBands(best, settings)) {
    if (undetermined.some((v) => v.parameter === u.parameter)) continue;
    undetermined.push({ parameter: u.parameter, reason: u.reason, action: u.action });
    warnings.push(u.warning);
  }
  // A standard uncertainty as large as the value itself: the bands do not fix it, whatever the fit's status says.
  const loose: Array<['tenDq' | 'b' | 'c', number | null, number | null]> = [
    ['tenDq', 10 * best.params.dq, uncertainty.tenDq], ['b', bFit, uncertainty.b], ['c', settings.mode === 'free' ? cFit : null, uncertainty.c],
  ];
  for (const [parameter, value, sigma] of loose) {
    if (value === null || sigma === null || !(sigma >= 0.5 * Math.abs(value))) continue;
    if (undetermined.some((v) => v.parameter === parameter)) continue;
    const name = parameter === 'tenDq' ? '10Dq' : parameter.toUpperCase();
    undetermined.push({ parameter, reason: `its uncertainty (${sigma.toPrecision(2)} cm-1) is ${sigma >= Math.abs(value) ? 'larger than' : 'more than half'} the value`, action: 'reported, but not fixed by these bands' });
    warnings.push(`${name} = ${Math.round(value)} cm-1 is not determined by these bands: its uncertainty is ${sigma.toPrecision(2)} cm-1`);
  }
  const crossover = crossoverOf(best, settings);
  if (status.status === 'not-converged') warnings.push(status.message);
  if (crossover?.near) {
    warnings.push(
      `near spin crossover: Dq/B = ${crossover.fittedDqOverB.toFixed(2)} is ${Math.abs(crossover.percent).toFixed(1)}% ${crossover.percent >= 0 ? 'above' : 'below'} the crossover at ${crossover.dqOverB.toFixed(2)}`,
    );
  }
  // Small terms (expected-weak transitions skipped) are worth a note, large ones (p < 0.1) a warning.
  for (const p of best.penalties) {
    // The widened bands have a note of their own (below).
    if (p.rule === 'jahn-teller-pair' || p.rule === 'assumed-c-over-b') continue;
    // A band left out or merged always warrants a warning: the band list may hold a spurious band.
    const warn = p.amount >= deviance(0.1) || p.rule === 'unexplained-band' || p.rule === 'split-band';
    (warn ? warnings : notes).push(`${p.detail} (score +${p.amount.toFixed(1)})`);
  }
  if (!best.bDetermined) {
    undetermined.push({
      parameter: 'b',
      reason: primaryClass(branch).levels.length === 1 ? 'one spin-allowed transition, whose energy is 10Dq' : 'one band',
      action: 'B, C and β are not reported (null)',
    });
    if (primaryClass(branch).levels.length === 1) {
      warnings.push(`B is not determinable: ${describeSingle(settings, branch.multiplicity)} has one spin-allowed transition, whose energy is 10Dq`);
    } else {
      const id = scan.ids[best.levelIndices[0]!]!;
      warnings.push(
        `B is not determinable from one band: it is taken as ${scan.ids[branch.ground]!.label} → ${id.label}, which lies at exactly 10Dq for ${describeSingle(settings, branch.multiplicity)}; give a second spin-allowed band for B`,
      );
    }
  }
  if (best.bPrior) {
    const { b, c } = best.params;
    const prior = best.bPrior;
    const fixed = `B fixed at its prior ${Math.round(b)} ± ${Math.round(prior.sigma)} cm-1 (${prior.source})${prior.cHeld ? '' : `, C = ${(c / b).toFixed(2)}·B`}`;
    undetermined.push({ parameter: 'b', reason: 'one band cannot fix both 10Dq and B', action: fixed });
    warnings.push(`B is not determined by one band: ${fixed}; 10Dq rests on it (its ± carries B's)`);
  }
  if (variant.jahnTeller) {
    const weights = intensityWeights(variant.jahnTeller);
    const weighted = weights.some((w) => w !== 1);
    const centroid = best.candidate.variant.observations[0]!.position;
    // A warning, shown with the result (AUDIT3 finding 5): the value rests on a convention the ± does not carry.
    // Published analyses quote either the centroid or the stronger component's maximum (common practice).
    const stronger = variant.jahnTeller[weights.indexOf(Math.max(...weights))]!.position;
    const convention = weighted
      ? `; the other convention, the stronger component's maximum, gives ${Math.round(stronger)} cm-1 (${Math.round(Math.abs(stronger - centroid))} cm-1 away, a difference of convention the ± does not include)`
      : '';
    warnings.push(`${variant.jahnTeller.map((o) => Math.round(o.position)).join(' and ')} cm-1 are read as one Jahn–Teller-split transition at their ${weighted ? 'intensity-weighted centroid' : 'mean (no intensities given to weight them)'}, ${Math.round(centroid)} cm-1${convention}`);
  }
  if (bFit !== null) notes.push(`uncertainties from ${basis}`);
  if (settings.mode === 'ratio' && bFit !== null) notes.push(settings.cOverBSource);
  const widened = variant.observations.map((o, i) => ({ o, s: best.sigmaFromC?.[i] ?? 0 })).filter(({ s }) => s > 0);
  if (widened.length > 0) {
    const list = widened.map(({ o, s }) => `${Math.round(o.position)} cm-1 by ${Math.round(s)}`).join(', ');
    notes.push(`band${widened.length === 1 ? '' : 's'} whose energy depends on C, which is not fitted but assumed at C/B = ${settings.cOverB.toFixed(2)}: σ widened by the C/B prior's spread (±${cOverBPriorSd().toFixed(2)}) in quadrature, ${list}; ${widened.length === 1 ? 'it weighs' : 'they weigh'} that much less in the fit, the score and the uncertainties`);
  }
  if (settings.b0 === null && settings.ion === null) notes.push('beta is null: no ion was given (only d), so no free-ion B0');
  else if (settings.b0 === null) notes.push(`beta is null: no free-ion B0 is tabulated for ${settings.ion!.label}`);
  if (settings.freeIonSource) notes.push(`free-ion B0, C0: ${settings.freeIonSource}`);
  if (settings.treesUsed) {
    notes.push(`Trees correction α·L(L+1) ${settings.alphaFree ? 'fitted' : 'fixed'}: α = ${(best.params.alpha ?? settings.alpha).toFixed(1)} cm-1; B, C and 10Dq are those of that model (higher B, lower 10Dq than a fit without α)`);
  }
  const unassigned = [
    ...sorted.chargeTransfer.map((b) => ({ observed: round(b.position), band: b.index, reason: 'charge-transfer band: left out of the fit' })),
    ...variant.dropped.map((o) => ({ observed: round(o.position), band: o.bands[0]!, reason: 'left unexplained by the chosen assignment' })),
  ];
  const kept = solutions.slice(1).filter((o) => o.score <= alternativeMargin(best.score)).slice(0, maxAlternatives);
  const { group: assignmentGroup, inGroup } = assignmentGroupOf(solutions, probabilities, uncertainty);
  // The ± reported covers the weak-band labellings' spread (assignment-spread.ts); the group itself is judged on the fit's σ.
  const { spread: assignmentSpread, combined } = assignmentSpreadOf(assignmentGroup, { tenDq: 10 * best.params.dq, b: bFit }, uncertainty);
  const grouped = new Set(solutions.filter((_, i) => inGroup[i]));
  const alternatives = kept.map((o) => alternativeOf(o, best, settings, probabilityOf.get(o) ?? 0, grouped.has(o)));
  const probability = probabilities[0]!;
  // β already warned by its prior's penalty needs no second warning (goodnessOfFit.betaPhysical still says it).
  const betaWarned = best.penalties.some((p) => p.rule === 'beta' && p.amount >= deviance(0.1));
  warnings.push(...goodnessWarnings(goodnessOfFit, probability, betaWarned ? null : beta, best.wrms));
  if (assignmentGroup.probability < 0.5) {
    const of = assignmentGroup.members > 1 ? `; its spin-allowed assignment and parameters ${(100 * assignmentGroup.probability).toFixed(0)}%` : '';
    warnings.push(`the chosen assignment is not certain: probability ${(100 * probability).toFixed(0)}%${of} (see the alternatives)`);
  } else if (probability < 0.5) {
    // Only the labels of weak bands are in doubt (assignment-groups.ts): a note, not a warning.
    const range = (r: [number, number]) => (Math.round(r[0]) === Math.round(r[1]) ? `${Math.round(r[0])}` : `${Math.round(r[0])}–${Math.round(r[1])}`);
    notes.push(
      `the spin-allowed assignment and the parameters are ${(100 * assignmentGroup.probability).toFixed(0)}% probable over ${assignmentGroup.members} solutions `
      + `(10Dq ${range(assignmentGroup.tenDqRange)}${assignmentGroup.bRange ? `, B ${range(assignmentGroup.bRange)}` : ''} cm-1) that differ only in the labels of the spin-forbidden or unexplained bands; this labelling is ${(100 * probability).toFixed(0)}% probable`,
    );
  }
  return {
    d: settings.d, ion: settings.ion?.label ?? null, geometry: settings.geometry,
    dq: round(best.params.dq, 2), tenDq: round(10 * best.params.dq), b: bFit === null ? null : round(bFit),
    c: cFit === null ? null : round(cFit), cOverB: bFit === null ? null : round(cFit! / bFit, 3), cMode: settings.mode,
    beta: beta === null ? null : round(beta, 4), freeIonB: settings.b0, freeIonC: settings.c0, freeIonSource: settings.freeIonSource,
    groundTerm: levels.groundTerm, groundLabel: scan.ids[branch.ground]!.label, spinState: levels.spinState,
    unpairedElectrons: unpaired, spinOnlyMoment: round(spinOnlyMoment(unpaired), 3),
    lfse: (() => {
      const l = ligandFieldStabilisation(settings.d, unpaired, settings.geometry, best.params.dq);
      return { ...l, cm1: round(l.cm1) };
    })(),
    rmsResidual: round(best.wrms), status: status.status, message: status.message, evaluations: status.evaluations,
    ...(settings.treesUsed ? { alpha: round(best.params.alpha ?? settings.alpha, 1) } : {}),
    uncertainty: {
      tenDq: nullableRound(combined.tenDq), dq: nullableRound(combined.tenDq === null ? null : combined.tenDq / 10, 2),
      b: nullableRound(combined.b), c: nullableRound(uncertainty.c),
      ...(uncertainty.alpha !== undefined ? { alpha: nullableRound(uncertainty.alpha, 1) } : {}),
    },
    assignmentSpread: {
      ...assignmentSpread,
      spread: { tenDq: round(assignmentSpread.spread.tenDq), b: nullableRound(assignmentSpread.spread.b) },
      fitUncertainty: { tenDq: nullableRound(uncertainty.tenDq), b: nullableRound(uncertainty.b) },
    },
    betaSd: betaSdOf(nullableRound(combined.b), settings.b0),
    correlation: {
      bDq: nullableRound(correlation.bDq, 4), cDq: nullableRound(correlation.cDq, 4), cB: nullableRound(correlation.cB, 4),
    },
    score: round(best.score, 2), chiSquare: round(best.chiSquare, 2), probability: round(probability, 4), spinStateProbabilities,
    assignmentGroup: { ...assignmentGroup, probability: round(assignmentGroup.probability, 4) },
    goodnessOfFit: { ...goodnessOfFit, chiSquare: round(goodnessOfFit.chiSquare, 2), pValue: Number(goodnessOfFit.pValue.toPrecision(3)) },
    undetermined, window: settings.window ?? null, ligands: [...new Set(settings.ligands.map((l) => l.key))],
    penalties: roundPenalties(best.penalties), assignments: assignmentRows(best), unassigned,
    skipped: best.skipped.map((s) => ({ ...s, energy: round(s.energy) })), alternatives, crossover,
    predicted: predictedTransitions(best, settings, predictedLimit), warnings, notes,
  };
}

function nullableRound(v: number | null, digits = 1): number | null {
  return v === null ? null : round(v, digits);
}
