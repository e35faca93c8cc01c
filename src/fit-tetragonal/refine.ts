import { flatWithTails } from '../fit/likelihood.js';
import type { FieldLevel } from '../ligand-field/field-levels.js';
import { groundKeyOf } from './enumerate.js';
import { labelKeys, modelEnergies } from './model.js';
import type { FitSettings } from './settings.js';
import { levenbergMarquardt } from './solve.js';
import { ZETA_PRIOR } from './score.js';
import type { Plan, Trial } from './types.js';

/**
 * One plan fitted: Levenberg–Marquardt (solve.ts) on the weighted residuals
 * (calculated − observed)/σ, σ the band's uncertainty or max(100 cm-1, 1 %),
 * the free parameters moving from the plan's start. The chosen levels are
 * matched to the bands in ascending energy at every evaluation (sorted
 * energies are continuous, level identities need not be when two components
 * cross). The trial carries the labelled levels at its solution for scoring.
 * With ζ fitted and ζ0 known, the ζ prior of score.ts is one more residual
 * (the Jacobian's last row; result.ts reads determinacy from the band rows).
 */
export interface RefinedTrial extends Omit<Trial, 'score' | 'penalties'> {
  byKey: Map<string, FieldLevel>;
  energies: Map<string, number>;
}

export function refinePlan(s: FitSettings, plan: Plan, groundMultiplicity: number): RefinedTrial {
  const { chosen, x0 } = plan;
  const sortedChosen = (energies: Map<string, number>): string[] => [...chosen].sort((x, y) => energies.get(x)! - energies.get(y)!);
  // A fitted ζ carries its prior (score.ts) as one more residual, so the fit maximises the score it is ranked by:
  // a multiplet's spread alone would otherwise push ζ anywhere the positions like.
  const zetaPrior = s.zetaMode === 'free' && s.tabulatedZeta ? s.tabulatedZeta.zeta : undefined;
  const residuals = (freeX: Float64Array): Float64Array => {
    const p = s.toParameters(s.full(freeX, x0));
    const energies = modelEnergies(s.setting, p);
    const order = sortedChosen(energies);
    const out = new Float64Array(s.fitted.length + (zetaPrior === undefined ? 0 : 1));
    s.fitted.forEach((band, i) => (out[i] = (energies.get(order[i]!)! - band.position) / s.sigmas[i]!));
    if (zetaPrior !== undefined) {
      const ratio = p.zeta / zetaPrior;
      out[s.fitted.length] = Math.sign(ratio - ZETA_PRIOR.high) * Math.sqrt(flatWithTails(ratio, ZETA_PRIOR.low, ZETA_PRIOR.high, ZETA_PRIOR.sigmaLow, ZETA_PRIOR.sigmaHigh));
    }
    return out;
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
