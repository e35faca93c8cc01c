import { betaSdOf } from '../fit/uncertainty.js';
import type { FitResult } from '../fit/types.js';
import type { FitSummary, StoredResult } from './types.js';

/**
 * Reads the numbers the library keeps in columns from an AnalyzeResult's
 * `fit` (src/fit/types.ts FitResult). A record saved by an older fieldgap
 * may lack the fit or a field added since: each number is read as "finite,
 * else null", so the library keeps whatever was stored.
 *
 * betaSd is the fit's own (FitResult.betaSd); a result stored before the fit
 * carried it gets it from the same rule (betaSdOf).
 */
export function summarizeResult(result: StoredResult): FitSummary {
  const fit: Partial<FitResult> = result.fit ?? {};
  const uncertainty: Partial<FitResult['uncertainty']> = fit.uncertainty ?? {};
  const bSd = finite(uncertainty.b);
  return {
    tenDq: finite(fit.tenDq),
    tenDqSd: finite(uncertainty.tenDq),
    b: finite(fit.b),
    bSd,
    c: finite(fit.c),
    beta: finite(fit.beta),
    betaSd: finite(fit.betaSd) ?? betaSdOf(bSd, finite(fit.freeIonB)),
    spinState: text(fit.spinState),
    rmsResidual: finite(fit.rmsResidual),
    status: text(fit.status),
  };
}

/** The ion a result was fitted for, if its fit names one. */
export function ionOfResult(result: StoredResult): string | null {
  return text(result.fit?.ion);
}

/** A stored number as the summary keeps it: finite, else null (a field an older record lacks). */
function finite(value: number | null | undefined): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function text(value: string | null | undefined): string | null {
  return typeof value === 'string' && value !== '' ? value : null;
}
