/**
 * Uncertainties of Dq, B and C from the Jacobian of the refined fit.
 *
 * - Bands with uncertainties (weighted fit): cov = s·(JᵀJ)⁻¹ with J the
 *   Jacobian of (calc − obs)/σ and s = max(1, χ²/(m − p)): the given σ are
 *   trusted unless the fit misses the bands by more than they allow.
 * - No uncertainties, m > p: cov = s²·(JᵀJ)⁻¹, s² = Σ(calc − obs)²/(m − p),
 *   the residual variance.
 * - No uncertainties, m = p (exactly determined): each band is given the
 *   default σ = max(100 cm-1, 1% of its position) (observations.ts), and
 *   cov = (J_σᵀJ_σ)⁻¹: the spread of the exact solution under that noise.
 * With C/B fixed, σ(C) = (C/B)·σ(B); with C fixed it is null.
 * - A band whose position rests on an assumed C/B (c-sensitivity.ts) has
 *   σ_eff = √(σ² + σ_C²) in the fit's weights, and the fit is then
 *   weighted, every band taking its σ (given or default); the covariance is
 *   that of this estimator under the bands' own σ and one shared C error
 *   (sandwichCovariance).
 * - One band with B fixed at its prior (prior-b.ts): σ(B) is the prior's σ,
 *   and 10Dq carries both the band's σ and B's: with E(Dq, B) = ν,
 *   σ²(Dq) = (σν/E_Dq)² + (E_B/E_Dq)²·σB², cov(Dq, B) = −(E_B/E_Dq)·σB²;
 *   σν² includes σ_C² where the band rests on the assumed C/B.
 */
import { anyWidened } from './c-sensitivity.js';
import { covarianceCorrelation, jacobianCovariance } from './covariance.js';
import type { Evaluated } from './evaluate.js';
import { parameterCount } from './refine.js';
import type { FitResult } from './types.js';

export interface FitUncertainty {
  uncertainty: FitResult['uncertainty'];
  correlation: FitResult['correlation'];
  /** How the covariance was scaled, for the notes. */
  basis: string;
}

const NONE: FitUncertainty = {
  uncertainty: { tenDq: null, dq: null, b: null, c: null },
  correlation: { bDq: null, cDq: null, cB: null },
  basis: 'not available',
};

export function fitUncertainty(best: Evaluated, weighted: boolean): FitUncertainty {
  const observations = best.candidate.variant.observations;
  if (!best.bDetermined) {
    // 10Dq = 10·E/slope with slope 10 for the single transition: σ(10Dq) = σ(E).
    const sigma = observations[0]!.sigma * ((10 * best.params.dq) / observations[0]!.position);
    return { ...NONE, uncertainty: { tenDq: sigma, dq: sigma / 10, b: null, c: null }, basis: 'the band position uncertainty' };
  }
  if (best.bPrior) return priorBUncertainty(best);
  if (!best.lsq || !best.problem) return NONE;
  // A fit with a band widened by an assumed C/B was weighted (likelihood.ts leastSquaresSigma).
  weighted = weighted || anyWidened(best.sigmaFromC);
  const m = observations.length;
  const p = parameterCount(best.problem);
  const dof = m - p;
  let jacobian = best.lsq.jacobian;
  let scale: number;
  let basis: string;
  if (weighted) {
    const chi2 = 2 * best.lsq.cost;
    scale = dof > 0 ? Math.max(1, chi2 / dof) : 1;
    basis = scale > 1 ? `the band uncertainties, scaled by χ²/(m − p) = ${scale.toFixed(2)}` : 'the band uncertainties';
  } else if (dof > 0) {
    scale = (2 * best.lsq.cost) / dof;
    basis = `the residual variance (${dof} degree${dof === 1 ? '' : 's'} of freedom)`;
  } else {
    jacobian = Float64Array.from(jacobian, (v, index) => v / observations[Math.floor(index / p)]!.sigma);
    scale = 1;
    basis = 'the default band uncertainty max(100 cm-1, 1% of the position), the fit being exact';
  }
  let cov = jacobianCovariance(jacobian, m, p, { scale });
  if (!cov) return { ...NONE, basis: 'singular: the bands do not determine every parameter' };
  if (best.assumedC && anyWidened(best.sigmaFromC)) {
    cov = sandwichCovariance(jacobian, m, p, scale, best);
    basis += ', and the spread of the assumed C/B (one C shifting every band that depends on it)';
  }
  const corr = covarianceCorrelation(cov, p);
  const sd = (j: number) => Math.sqrt(Math.max(cov[j * p + j]!, 0));
  const ratio = best.params.c / best.params.b;
  const cFree = best.problem.mode === 'free';
  const sigmaC = cFree ? sd(2) : best.problem.mode === 'ratio' ? ratio * sd(1) : null;
  const finite = (v: number) => (Number.isFinite(v) ? v : null);
  return {
    uncertainty: { tenDq: 10 * sd(0), dq: sd(0), b: sd(1), c: sigmaC, ...(best.problem.alphaFree ? { alpha: sd(p - 1) } : {}) },
    correlation: {
      bDq: finite(corr[1]!),
      cDq: cFree ? finite(corr[2]!) : null,
      cB: cFree ? finite(corr[p + 2]!) : null,
    },
    basis,
  };
}

/**
 * The covariance of the estimator the fit used when bands were widened by an
 * assumed C/B: the weighted least-squares solution θ = A·obs, A =
 * (JᵀWJ)⁻¹JᵀW with W = 1/(σ² + σ_C²) per band (the widened weights), has
 * covariance A·Σ·Aᵀ under the errors Σ = scale·diag(σ²) + σ_C²·g·gᵀ, g the
 * signed ∂ΔE/∂C of each band: the bands' own errors are independent, but
 * one unknown C shifts every band that depends on it at once (the two
 * singlets of low-spin d6 together: 10Dq takes the whole of C's spread, B
 * none of it). Rows of `jacobian` are those of the weighted residuals.
 */
function sandwichCovariance(jacobian: Float64Array, m: number, p: number, scale: number, best: Evaluated): Float64Array {
  const inner = jacobianCovariance(jacobian, m, p)!;
  const { derivatives, sigma: sigmaC } = best.assumedC!;
  const sigmaLs = best.problem!.sigma;
  const observations = best.candidate.variant.observations;
  const cov = new Float64Array(p * p);
  const shift = new Float64Array(p);
  const column = new Float64Array(p);
  for (let i = 0; i < m; i++) {
    // Column i of A: (JᵀWJ)⁻¹ times row i of the weighted Jacobian, over σ_LS,i.
    for (let j = 0; j < p; j++) {
      let sum = 0;
      for (let k = 0; k < p; k++) sum += inner[j * p + k]! * jacobian[i * p + k]!;
      column[j] = sum / sigmaLs[i]!;
    }
    const variance = scale * observations[i]!.sigma ** 2;
    for (let j = 0; j < p; j++) {
      shift[j] = shift[j]! + column[j]! * derivatives[i]!;
      for (let k = 0; k < p; k++) cov[j * p + k] = cov[j * p + k]! + variance * column[j]! * column[k]!;
    }
  }
  for (let j = 0; j < p; j++) for (let k = 0; k < p; k++) cov[j * p + k] = cov[j * p + k]! + sigmaC * sigmaC * shift[j]! * shift[k]!;
  return cov;
}

/** The prior-B case of fitUncertainty (see the module docstring). */
function priorBUncertainty(best: Evaluated): FitUncertainty {
  const { sigma: sB, dEdDq, dEdB, cHeld } = best.bPrior!;
  if (!Number.isFinite(dEdDq) || !Number.isFinite(dEdB) || dEdDq === 0) return { ...NONE, basis: 'not available (the solution was not polished)' };
  // The band's σ with the spread it takes from the assumed C/B (c-sensitivity.ts), as in the score.
  const sigmaBand = Math.hypot(best.candidate.variant.observations[0]!.sigma, best.sigmaFromC?.[0] ?? 0);
  const k = dEdB / dEdDq;
  const sdDq = Math.sqrt((sigmaBand / dEdDq) ** 2 + (k * sB) ** 2);
  const corr = sdDq > 0 && sB > 0 ? (-k * sB * sB) / (sdDq * sB) : null;
  return {
    uncertainty: { tenDq: 10 * sdDq, dq: sdDq, b: sB, c: cHeld ? null : (best.params.c / best.params.b) * sB },
    correlation: { bDq: corr, cDq: null, cB: null },
    basis: "the band's uncertainty and the spread of B's prior (B fixed at it)",
  };
}

/**
 * Standard uncertainty of β = B/B0: sd(B)/B0, the fitted B's standard
 * deviation carried through the ratio (the free-ion B0 is a tabulated
 * constant). null where either is unknown. The one place this rule lives:
 * the fit result, the library summary and the page all read it from here.
 */
export function betaSdOf(bSd: number | null, freeIonB: number | null): number | null {
  return bSd !== null && freeIonB !== null && freeIonB > 0 ? bSd / freeIonB : null;
}
