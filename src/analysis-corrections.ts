/**
 * A user's corrections to an analysis, kept with it so the stored record is
 * what the user saw and can be made again from the original file:
 *
 * - `bands`: the band list the ligand-field fit uses instead of the bands the
 *   finder gave (bands removed are left out, added ones are in, a band
 *   reclassified carries its new flag: "spin-forbidden", "charge-transfer",
 *   "shoulder"); positions in cm-1, as POST /api/v1/fit takes them;
 * - `alternative`: the assignment chosen instead of the best one, as its
 *   0-based index in the fit's `alternatives`.
 *
 * C/B, a fixed C and a free C are analysis options of their own (cOverB, c,
 * freeC) and are stored with the options. The spectrum itself (baseline,
 * found bands) is never changed by a correction: `result.bands` stays what
 * the finder gave, `result.fit` is the corrected fit, and
 * `result.corrections` repeats the corrections it was made with.
 */
import { goodnessOfFitOf } from './fit/goodness-of-fit.js';
import { SPREAD_RULE, spreadFromRange } from './fit/assignment-spread.js';
import { invalidArgument } from './errors.js';
import { normalizeBands, type BandInput } from './fit/bands.js';
import { ligandFieldStabilisation, spinOnlyMoment } from './fit/lfse.js';
import type { FitResult } from './fit/types.js';

export interface AnalysisCorrections {
  bands?: BandInput[];
  alternative?: number;
}

/** Most bands a correction may list (the fit's own limits apply too). */
export const MAX_CORRECTED_BANDS = 40;

/**
 * Checks corrections given as JSON (an object, or its text) and returns them
 * with only the known fields; errors name the field ("corrections.bands[2].position").
 */
export function checkCorrections(value: unknown, path = 'corrections'): AnalysisCorrections {
  let parsed = value;
  if (typeof value === 'string') {
    try {
      parsed = JSON.parse(value) as unknown;
    } catch {
      throw invalidArgument(path, `${path}: expected a JSON object such as {"bands":[{"position":17400}]}`);
    }
  }
  if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) {
    throw invalidArgument(path, `${path}: expected an object with "bands" and/or "alternative"`);
  }
  const record = parsed as Record<string, unknown>;
  for (const key of Object.keys(record)) {
    if (key !== 'bands' && key !== 'alternative') throw invalidArgument(`${path}.${key}`, `${path}.${key}: not a correction (known: bands, alternative)`);
  }
  const out: AnalysisCorrections = {};
  if (record['bands'] !== undefined) {
    const bands = record['bands'];
    if (!Array.isArray(bands) || bands.length === 0) throw invalidArgument(`${path}.bands`, `${path}.bands: expected a list of at least one band`);
    if (bands.length > MAX_CORRECTED_BANDS) throw invalidArgument(`${path}.bands`, `${path}.bands: at most ${MAX_CORRECTED_BANDS} bands, got ${bands.length}`);
    // The fit's own checks (positions in range, known flags), with this path.
    normalizeBands(bands, `${path}.bands`);
    out.bands = bands.map((b: unknown) => bandInputOf(b as BandInput));
  }
  if (record['alternative'] !== undefined) {
    const index = record['alternative'];
    if (typeof index !== 'number' || !Number.isInteger(index) || index < 0 || index > 20) {
      throw invalidArgument(`${path}.alternative`, `${path}.alternative: expected the index of an alternative assignment (0, 1, ...)`);
    }
    out.alternative = index;
  }
  return out;
}

/** Only the fields of a band the fit reads, in a fixed order (stored JSON that compares equal when equal). */
function bandInputOf(band: BandInput | number): BandInput {
  if (typeof band === 'number') return { position: band };
  const out: BandInput = { position: band.position };
  if (band.uncertainty !== undefined) out.uncertainty = band.uncertainty;
  if (band.epsilon !== undefined) out.epsilon = band.epsilon;
  if (band.width !== undefined) out.width = band.width;
  if (band.flags !== undefined && band.flags.length > 0) out.flags = [...band.flags];
  return out;
}

/** Unpaired electrons from a term's multiplicity 2S+1 (n = 2S); null for a label without one. */
export function unpairedFromTerm(term: string): number | null {
  const match = /^(\d+)/.exec(term);
  return match === null ? null : Number(match[1]) - 1;
}

/**
 * The fit with one of its alternative assignments in place of the best: a
 * complete FitResult whose every field is either the alternative's own or
 * honestly empty, never the best fit's. Its parameters, assignment rows,
 * ground level, spin state, score, χ², probability and penalties are the
 * alternative's; its magnetism and LFSE follow its own ground term and Dq
 * (spin-only μ = √(n(n+2)) μB); C/B is its C over its B. An alternative is
 * not refined for uncertainties, so uncertainty, betaSd and correlation are
 * null; its predicted, skipped and unassigned lists and its crossover are
 * not computed, so they are empty (null). The page shows an alternative
 * with this function (web/state.ts shownFit).
 */
export function fitWithAlternative(fit: FitResult, index: number, path = 'corrections.alternative'): FitResult {
  const alternative = fit.alternatives[index];
  if (alternative === undefined) {
    throw invalidArgument(path, `${path}: the fit has ${fit.alternatives.length} alternative assignment${fit.alternatives.length === 1 ? '' : 's'}, no number ${index + 1}`);
  }
  const n = unpairedFromTerm(alternative.groundTerm) ?? fit.unpairedElectrons;
  const lfse = ligandFieldStabilisation(fit.d, n, fit.geometry, alternative.dq);
  const b = alternative.b;
  const c = alternative.c;
  return {
    ...fit,
    dq: alternative.dq,
    tenDq: alternative.tenDq,
    b,
    c,
    cOverB: b !== null && c !== null && b > 0 ? Math.round((1000 * c) / b) / 1000 : null,
    beta: alternative.beta,
    groundTerm: alternative.groundTerm,
    groundLabel: alternative.groundLabel,
    spinState: alternative.spinState,
    unpairedElectrons: n,
    spinOnlyMoment: Math.round(1000 * spinOnlyMoment(n)) / 1000,
    lfse: { ...lfse, cm1: Math.round(10 * lfse.cm1) / 10 },
    rmsResidual: alternative.rmsResidual,
    message: 'an alternative assignment, chosen by the user',
    uncertainty: { tenDq: null, dq: null, b: null, c: null },
    betaSd: null,
    correlation: { bDq: null, cDq: null, cB: null },
    score: alternative.score,
    chiSquare: alternative.chiSquare,
    probability: alternative.probability,
    // The winner's absolute check and group do not describe the alternative: its own (src/fit/goodness-of-fit.ts, assignment-groups.ts).
    goodnessOfFit: goodnessOfFitOf(alternative.chiSquare, alternative.assignments.length, b === null ? 1 : fit.cMode === 'free' ? 3 : 2, alternative.beta),
    assignmentGroup: alternative.inChosenGroup && fit.assignmentGroup ? fit.assignmentGroup : {
      probability: alternative.probability, members: 1,
      spinAllowed: alternative.assignments.filter((a) => a.spinAllowed).map((a) => ({ observed: Math.round(a.observed), label: a.label })),
      tenDqRange: [alternative.tenDq, alternative.tenDq], bRange: b === null ? null : [b, b],
    },
    // Not refined: no σ to widen; the range is the alternative's group's when it shares the winner's, else its own value.
    assignmentSpread: ((tenDqRange: [number, number], bRange: [number, number] | null) => ({
      tenDqRange, bRange, spread: { tenDq: spreadFromRange(alternative.tenDq, tenDqRange), b: b === null || bRange === null ? null : spreadFromRange(b, bRange) },
      fitUncertainty: { tenDq: null, b: null }, widened: false, rule: SPREAD_RULE,
    }))(
      alternative.inChosenGroup && fit.assignmentGroup ? fit.assignmentGroup.tenDqRange : [alternative.tenDq, alternative.tenDq],
      b === null ? null : alternative.inChosenGroup && fit.assignmentGroup?.bRange ? fit.assignmentGroup.bRange : [b, b],
    ),
    undetermined: b === null ? [{ parameter: 'b', reason: 'the alternative assignment does not fix B', action: 'B, C and β are not reported (null)' }] : [],
    penalties: alternative.penalties,
    assignments: alternative.assignments,
    unassigned: [],
    skipped: [],
    alternatives: fit.alternatives,
    crossover: null,
    predicted: [],
    warnings: [`alternative assignment: ${alternative.reason}`],
    notes: ['an alternative assignment is not refined: no uncertainties, predicted transitions, skipped transitions or spin-crossover distance'],
  };
}
