import { FieldgapError } from '../errors.js';
import { spinAllowedCandidates, spinFreePlans, spinOrbitPlans, startingPoints } from './enumerate.js';
import { refinePlan } from './refine.js';
import { buildResult } from './result.js';
import { scoreTrial } from './score.js';
import { fitSettings } from './settings.js';
import type { TetragonalFitInput, TetragonalFitResult, Trial } from './types.js';

export type { TetragonalAssignment, TetragonalFitInput, TetragonalFitResult, ParentComponents } from './types.js';

/**
 * Fit of Dq, Ds, Dt (and B, and ζ when asked) to observed band maxima, in a
 * tetragonal field (`--symmetry tetragonal`) or in a cubic one with
 * spin–orbit coupling (`--zeta` > 0 without --symmetry tetragonal), in four
 * steps, one file each:
 *   settings.ts   the input read once (ion, bands, free parameters);
 *   enumerate.ts  starts, candidate levels, plans (bands → levels);
 *   refine.ts     each plan fitted (Levenberg–Marquardt, solve.ts);
 *   score.ts      each fit scored by the likelihood of src/fit/likelihood.ts;
 *   result.ts     the winner reported: determinacy, uncertainties, split
 *                 parents, runners-up with probabilities.
 * Ranking: fits whose ground level kept the spin the candidates assumed
 * first, then the score, then fewer skipped candidates. Each assigned level
 * shows its octahedral parent, and parents with two or more bands on their
 * components are listed (`components`): the two components of a split 4T1g
 * band read as 4Eg[4T1g(F)] and 4A2g[4T1g(F)], one parent.
 */
export function fitTetragonal(input: TetragonalFitInput): TetragonalFitResult {
  const s = fitSettings(input);
  const trials: Trial[] = [];
  /** Plans already fitted (the same assignment reached from another start is fitted once). */
  const fittedPlans = new Set<string>();
  for (const x0 of startingPoints(s)) {
    const { groundMultiplicity, candidates } = spinAllowedCandidates(s, x0);
    const plans = s.setting.spinOrbit ? spinOrbitPlans(s, x0) : spinFreePlans(s, x0, candidates);
    for (const plan of plans) {
      if (s.setting.spinOrbit) {
        const id = plan.chosen.join();
        if (fittedPlans.has(id)) continue;
        fittedPlans.add(id);
      }
      const refined = refinePlan(s, plan, groundMultiplicity);
      const { score, penalties } = scoreTrial(s, refined);
      trials.push({
        solve: refined.solve, chosen: refined.chosen, skipped: refined.skipped, base: refined.base, keepsGround: refined.keepsGround, score, penalties,
      });
    }
  }
  if (trials.length === 0) {
    throw new FieldgapError('unexplained', `${s.fitted.length} bands but fewer spin-allowed transitions from the ground level of d${s.d}: flag extra bands (:sf, :ct) or check the ion`, 'bands');
  }
  // A fit whose ground level changed spin from the one its candidates assumed is not self-consistent: last.
  trials.sort((x, y) => Number(y.keepsGround) - Number(x.keepsGround) || x.score - y.score || x.skipped - y.skipped);
  return buildResult(s, trials);
}
