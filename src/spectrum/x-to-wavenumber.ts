import { FieldgapError } from '../errors.js';
import type { XUnit } from './types.js';
import { valueToWavenumber } from './units.js';

/**
 * Converts an x array in `unit` to wavenumbers (cm-1), point by point, in the
 * same order. Every resulting wavenumber must be finite and > 0 (a zero or
 * negative wavelength is a unit mistake): else parse-error at `path`.
 */
export function xToWavenumber(x: Float64Array, unit: XUnit, path = ''): Float64Array {
  const out = new Float64Array(x.length);
  for (let i = 0; i < x.length; i++) {
    const v = valueToWavenumber(x[i] as number, unit);
    if (!(v > 0) || !Number.isFinite(v)) {
      throw new FieldgapError(
        'parse-error',
        `x value ${x[i]} (point ${i + 1}) is not a positive ${unit} value`,
        path,
      );
    }
    out[i] = v;
  }
  return out;
}
