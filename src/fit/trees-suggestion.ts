/**
 * Whether the Trees correction α·L(L+1) would explain the bands of a fit made
 * without it markedly better: a note, never a change of the result.
 *
 * The fit leaves α out unless asked (`trees`): the published analyses the
 * usual check values come from use the cubic model without it, and with α
 * the same bands give other parameters (for the seven quartets of hexaaqua
 * Mn(II): 10Dq 7 630 against 8 500, B 823 against 671; tests/fit/trees.test.ts).
 * So the chosen assignment is refined once more with α free, and when that
 * lowers the deviance χ² (likelihood.ts, model error included) by more than
 * the BIC cost of the extra parameter, ln m, plus 2 ("positive evidence",
 * Kass & Raftery, J. Am. Stat. Assoc. 90 (1995) 773; common practice), the
 * note says so and gives that model's numbers.
 */
import type { Evaluated } from './evaluate.js';
import { chiSquareOf } from './evaluate.js';
import { parameterCount, refineSolution } from './refine.js';
import type { FitSettings } from './settings.js';

/** Deviance gain beyond ln m that earns the note. */
export const TREES_NOTE_MIN_GAIN = 2;

export function treesSuggestion(best: Evaluated, settings: FitSettings): string | undefined {
  if (settings.treesUsed || !best.problem || !best.lsq || !best.bDetermined || best.keptGrid || best.bPrior) return undefined;
  const observations = best.candidate.variant.observations;
  const m = observations.length;
  // α needs one band beyond the parameters, and one more to judge it by.
  if (m < parameterCount(best.problem) + 2) return undefined;
  // The gain cannot exceed the cubic fit's own χ²: below the bar no refinement is needed (and none is paid for).
  const plain = chiSquareOf(observations, best.calculated, best.sigmaFromC);
  if (!(plain - Math.log(m) > TREES_NOTE_MIN_GAIN)) return undefined;
  const refined = refineSolution({ ...best.problem, alphaFree: true, alpha: 0 }, { ...best.params, alpha: 0 }, 60);
  if (!refined.selfConsistent || !refined.lsq.success) return undefined;
  const gain = plain - chiSquareOf(observations, refined.calculated, best.sigmaFromC) - Math.log(m);
  if (!(gain > TREES_NOTE_MIN_GAIN)) return undefined;
  const rms = Math.sqrt(observations.reduce((s, o, i) => s + (refined.calculated[i]! - o.position) ** 2, 0) / m);
  const { dq, b, c, alpha = 0 } = refined.params;
  return `the Trees correction α·L(L+1) explains these bands markedly better (deviance lower by ${gain.toFixed(1)} beyond the extra parameter's cost): rms ${Math.round(rms)} cm-1 at α = ${alpha.toFixed(0)} cm-1, 10Dq ${Math.round(10 * dq)}, B ${Math.round(b)}, C ${Math.round(c)} cm-1; fit with trees "free" (--trees free) to use it (the result above is the cubic model without α, as most published analyses)`;
}
