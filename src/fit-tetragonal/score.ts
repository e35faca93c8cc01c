import { jorgensenG } from '../chemistry/jorgensen.js';
import { effectiveWeight, flatWithTails, LIKELIHOOD } from '../fit/likelihood.js';
import {
  betaPriorDeviance, skippedTransitionPenalties, splitPairLimit, tenDqPriorDeviance, type ClassTransition, type PriorSettings,
} from '../fit/penalties.js';
import type { TetragonalPenalty } from './types.js';
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
 * - the β prior (B/B0) when B is fitted and the ion's B0 is known;
 * - the 10Dq prior of likelihood.ts (flat over 0.7·g … 1.75·g, Jørgensen's
 *   g of the ion, ×4/9 tetrahedral, 15 % tails) when the ion has g; the
 *   cubic part Dq of a tetragonal field is the average environment's;
 * - a ζ prior when ζ is fitted and the free ion's ζ0 is tabulated: ζ/ζ0
 *   flat on [0.5, 1.0], half-Gaussian tails of σ 0.05 above and 0.1 below
 *   (common practice: covalency reduces ζ in complexes to some 60–90 % of
 *   the free ion's, never above it).
 * Lower is better; probabilities exp(−score/2) normalised over the distinct
 * assignments fitted (probabilitiesOf).
 */
export function scoreTrial(s: FitSettings, trial: RefinedTrial): { score: number; penalties: TetragonalPenalty[] } {
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
  const out: TetragonalPenalty[] = [...penalties];
  const p = s.toParameters(s.full(trial.solve.x, trial.base));
  const g = s.ion ? jorgensenG(s.ion) : undefined;
  const t = s.geometry === 'tetrahedral' ? LIKELIHOOD.tetrahedralFactor : 1;
  const priors: PriorSettings = {
    b0: s.b0, cOverB: s.cOverB, tenDqExpected: null, tenDqRange: g === undefined ? null : [LIKELIHOOD.fLow * g * t, LIKELIHOOD.fHigh * g * t],
    betaExpected: null, ligandNote: null,
  };
  if (s.freeParams.includes(3) && s.bMatters) {
    const amount = betaPriorDeviance(p.b, priors);
    if (amount > 0) out.push({ rule: 'beta', amount, detail: `B = ${p.b.toFixed(0)} cm-1${s.b0 === null ? '' : ` (β = ${(p.b / s.b0).toFixed(2)})`} lies outside the usual range` });
  }
  const tenDq = tenDqPriorDeviance(p.dq, priors);
  if (tenDq > 0) out.push({ rule: 'ten-dq', amount: tenDq, detail: `10Dq = ${(10 * p.dq).toFixed(0)} cm-1 lies outside the range ${s.ion?.label ?? 'the ion'} shows with common ligands` });
  if (s.zetaMode === 'free' && s.tabulatedZeta) {
    const ratio = p.zeta / s.tabulatedZeta.zeta;
    const amount = flatWithTails(ratio, ZETA_PRIOR.low, ZETA_PRIOR.high, ZETA_PRIOR.sigmaLow, ZETA_PRIOR.sigmaHigh);
    if (amount > 0) out.push({ rule: 'zeta', amount, detail: `ζ = ${p.zeta.toFixed(0)} cm-1 is ${(100 * ratio).toFixed(0)} % of the free ion's ${s.tabulatedZeta.zeta} cm-1 (complexes: 50–100 %)` });
  }
  return { score: chi2 + out.reduce((sum, q) => sum + q.amount, 0), penalties: out };
}

/** ζ/ζ0 in complexes (common practice): flat on [low, high], half-Gaussian tails. */
export const ZETA_PRIOR = { low: 0.5, high: 1.0, sigmaLow: 0.1, sigmaHigh: 0.05 } as const;
