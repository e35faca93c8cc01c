import { betaSdOf } from '../fit/uncertainty.js';
import type { FitSummary, StoredResult } from './types.js';

/**
 * Reads the numbers the library keeps in columns from an AnalyzeResult's
 * `fit` (the fitBands JSON). Tolerant by design: a result without a fit,
 * or a fit lacking a field, gives nulls rather than an error, because the
 * library must keep whatever the pipeline returned.
 *
 * betaSd is the fit's own (FitResult.betaSd); a result stored before the fit
 * carried it gets it from the same rule (betaSdOf).
 */
export function summarizeResult(result: StoredResult): FitSummary {
  const fit = field(result, 'fit');
  const uncertainty = field(fit, 'uncertainty');
  const bSd = finite(field(uncertainty, 'b'));
  const freeIonB = finite(field(fit, 'freeIonB'));
  return {
    tenDq: finite(field(fit, 'tenDq')),
    tenDqSd: finite(field(uncertainty, 'tenDq')),
    b: finite(field(fit, 'b')),
    bSd,
    c: finite(field(fit, 'c')),
    beta: finite(field(fit, 'beta')),
    betaSd: finite(field(fit, 'betaSd')) ?? betaSdOf(bSd, freeIonB),
    spinState: text(field(fit, 'spinState')),
    rmsResidual: finite(field(fit, 'rmsResidual')),
    status: text(field(fit, 'status')),
  };
}

/** The ion a result was fitted for, if its fit names one. */
export function ionOfResult(result: StoredResult): string | null {
  return text(field(field(result, 'fit'), 'ion'));
}

function field(value: unknown, key: string): unknown {
  return typeof value === 'object' && value !== null ? (value as Record<string, unknown>)[key] : undefined;
}

function finite(value: unknown): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

function text(value: unknown): string | null {
  return typeof value === 'string' && value !== '' ? value : null;
}
