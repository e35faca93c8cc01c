import { priorStrainOf, priorStrainText } from '../src/report/prior-strain.js';
import type { FitResult } from './types.js';

/**
 * The probability card's words for a poor absolute fit: the core's reason
 * (src/fit/goodness-of-fit.ts: χ² against the bands' σ, no exact solution
 * with 0 degrees of freedom, β not physical), or the p-value where an older
 * answer carries no reason. null when the fit is good or not judged.
 */
export function poorFitText(gof: FitResult['goodnessOfFit']): string | null {
  if (gof?.verdict !== 'poor') return null;
  return `poorly fitted: ${gof.reason ?? `χ² p = ${gof.pValue.toPrecision(2)}`}`;
}

/** The CLI's IMPLAUSIBLE sentence (src/report/prior-strain.ts) when the chosen reading breaks its priors, else null. */
export function priorStrainNote(fit: Pick<FitResult, 'penalties'>): string | null {
  const strain = priorStrainOf(fit.penalties);
  return strain === null ? null : priorStrainText(strain);
}
