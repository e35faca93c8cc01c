import type { FieldLevel } from '../ligand-field/field-levels.js';
import { groundKeyOf } from './enumerate.js';
import { labelKeys, modelEnergies } from './model.js';
import type { FitSettings } from './settings.js';
import { levenbergMarquardt } from './solve.js';
import type { Plan, Trial } from './types.js';

/**
 * One plan fitted: Levenberg–Marquardt (solve.ts) on the weighted residuals
 * (calculated − observed)/σ, σ the band's uncertainty or max(100 cm-1, 1 %),
 * the free parameters moving from the plan's start. The chosen levels are
 * matched to the bands in ascending energy at every evaluation (sorted
 * energies are continuous, level identities need not be when two components
 * cross). The trial carries the labelled levels at its solution for scoring.
 */
export interface RefinedTrial extends Omit<Trial, 'score' | 'penalties'> {
  byKey: Map<string, FieldLevel>;
  energies: Map<string, number>;
}

export function refinePlan(s: FitSettings, plan: Plan, groundMultiplicity: number): RefinedTrial {
  const { chosen, x0 } = plan;
  const sortedChosen = (energies: Map<string, number>): string[] => [...chosen].sort((x, y) => energies.get(x)! - energies.get(y)!);
  const residuals = (freeX: Float64Array): Float64Array => {
    const energies = modelEnergies(s.setting, s.toParameters(s.full(freeX, x0)));
    const order = sortedChosen(energies);
    return Float64Array.from(s.fitted, (band, i) => (energies.get(order[i]!)! - band.position) / s.sigmas[i]!);
  };
  // With spin–orbit each evaluation is all C(10, n) states, and the start is already close (stage 1): fewer iterations.
  const solve = levenbergMarquardt(
    residuals, Float64Array.from(s.freeParams, (j) => x0[j]!), Float64Array.from(s.freeParams, (j) => s.steps[j]!), s.setting.spinOrbit ? 30 : 100,
  );
  const at = s.toParameters(s.full(solve.x, x0));
  const energies = modelEnergies(s.setting, at);
  const { byKey } = labelKeys(s.setting, at);
  const keepsGround = byKey.get(groundKeyOf(energies))!.multiplicity === groundMultiplicity;
  return { solve, chosen: sortedChosen(energies), skipped: plan.skipped, base: x0, keepsGround, byKey, energies };
}
