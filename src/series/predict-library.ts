import type { FactorFit } from './factors.js';
import type { OwnFactor } from './predict.js';

/**
 * The user's fitted ligand factors (fitLigandFactors over their library's
 * analyses of one metal ion) as predictComplex's own factors: f and h with
 * their standard deviations and a source naming how many analyses gave them.
 * Ligands whose f has no uncertainty (one analysis without σ) get 5% of f.
 */
export function ownFactorsFromFit(fit: FactorFit): Record<string, OwnFactor> {
  const own: Record<string, OwnFactor> = {};
  for (const factor of fit.factors) {
    const n = factor.fFrom.length;
    const entry: OwnFactor = {
      f: factor.f,
      fUncertainty: factor.fUncertainty ?? 0.05 * factor.f,
      source: `fitted from your library (${n} ${n === 1 ? 'analysis' : 'analyses'} of ${fit.ion}, g = ${fit.g} cm-1)`,
    };
    if (factor.h !== undefined) {
      entry.h = factor.h;
      if (factor.hUncertainty !== undefined) entry.hUncertainty = factor.hUncertainty;
    }
    own[factor.ligand] = entry;
  }
  return own;
}
