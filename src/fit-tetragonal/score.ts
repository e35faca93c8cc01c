import { effectiveWeight } from '../fit/likelihood.js';
import { betaPriorDeviance, skippedTransitionPenalties, splitPairLimit, type ClassTransition } from '../fit/penalties.js';
import type { Penalty } from '../fit/types.js';
import type { FieldLevel } from '../ligand-field/field-levels.js';
import { groundKeyOf } from './enumerate.js';
import type { RefinedTrial } from './refine.js';
import type { FitSettings } from './settings.js';

/**
 * The score of a fitted assignment: the deviance of the cubic fit
 * (src/fit/likelihood.ts, called, not copied), so that tetragonal and
 * spin–orbit assignments are chosen by the same probabilistic rules:
 * - positions: Σ (o − c)²/(σ² + σm²), σm the model error of likelihood.ts;
 * - every spin-allowed transition of the ground level's multiplicity left
 *   without a band, except a component of a parent that has a band on
 *   another component within splitPairLimit (penalties.ts: spin–orbit and
 *   Jahn–Teller components of one band lie up to ~2000 cm-1 apart), which
 *   is that band's unresolved part: −2·ln p by skippedTransitionPenalties:
 *   none for one within the half width (or 300 cm-1) of an assigned
 *   transition, which hides under that band (the unresolved component of a
 *   split parent), none above the highest band or under a charge-transfer
 *   band, p = 0.003 between the observed bands, and so on;
 * - the β prior (B/B0) when B is fitted and the ion's B0 is known.
 * Lower is better; probabilities exp(−score/2) normalised over the distinct
 * assignments fitted (probabilitiesOf).
 */
export function scoreTrial(s: FitSettings, trial: RefinedTrial): { score: number; penalties: Penalty[] } {
  const { energies, byKey, chosen } = trial;
  let chi2 = 0;
  s.fitted.forEach((band, i) => {
    const r = energies.get(chosen[i]!)! - band.position;
    chi2 += effectiveWeight(band.position, s.sigmas[i]!) * r * r;
  });
  const ground = byKey.get(groundKeyOf(energies))!;
  // Assigned components per parent, to recognise the unresolved ones of the same band.
  const assignedByParent = new Map<string, number[]>();
  for (const key of chosen) {
    const parent = byKey.get(key)!.parent;
    assignedByParent.set(parent, [...(assignedByParent.get(parent) ?? []), energies.get(key)!]);
  }
  // One transition per labelled level (a cubic Γ8 is two keys with one level).
  const indexOf = new Map<FieldLevel, number>();
  const transitions: ClassTransition[] = [];
  for (const [key, energy] of [...energies].sort((x, y) => x[1] - y[1])) {
    const level = byKey.get(key)!;
    if (level === ground || energy <= 0 || level.multiplicity !== ground.multiplicity || indexOf.has(level)) continue;
    // A component of a parent that has a band, within the split limit of that band's component: the same band's
    // envelope (an unresolved tetragonal or spin–orbit component), not a transition that should show on its own.
    const siblings = assignedByParent.get(level.parent);
    if (siblings && !chosen.includes(key) && siblings.some((e) => Math.abs(e - energy) <= splitPairLimit((e + energy) / 2))) continue;
    indexOf.set(level, transitions.length);
    transitions.push({ level: transitions.length, term: level.term, label: level.label, energy, twoElectron: false });
  }
  const assigned = chosen.map((key, i) => {
    const band = s.fitted[i]!;
    return { level: indexOf.get(byKey.get(key)!) ?? -1, calculated: energies.get(key)!, ...(band.width === undefined ? {} : { width: band.width }) };
  });
  const { penalties } = skippedTransitionPenalties({
    geometry: s.geometry, transitions, assigned, classForbidden: false, ...(s.ctOnset === undefined ? {} : { ctOnset: s.ctOnset }),
  });
  if (s.freeParams.includes(3) && s.bMatters) {
    const b = s.toParameters(s.full(trial.solve.x, trial.base)).b;
    const amount = betaPriorDeviance(b, { b0: s.b0, cOverB: s.cOverB, tenDqExpected: null, tenDqRange: null, betaExpected: null, ligandNote: null });
    if (amount > 0) penalties.push({ rule: 'beta', amount, detail: `B = ${b.toFixed(0)} cm-1${s.b0 === null ? '' : ` (β = ${(b / s.b0).toFixed(2)})`} lies outside the usual range` });
  }
  return { score: chi2 + penalties.reduce((sum, p) => sum + p.amount, 0), penalties };
}
