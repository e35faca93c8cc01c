import type { YUnit } from './types.js';

/**
 * Converts y values to decadic absorbance: A = −log10 T for transmittance
 * (T as a fraction; percent is divided by 100 first). Absorbance and ε pass
 * through unchanged (ε stays ε: the caller knows which it has).
 *
 * T ≤ 0 has no finite absorbance: it becomes +Infinity, which the masking
 * stage treats as saturated.
 */
export function yToAbsorbance(y: Float64Array, unit: YUnit): Float64Array {
  const out = new Float64Array(y.length);
  const scale = unit === 'transmittance-percent' ? 0.01 : 1;
  for (let i = 0; i < y.length; i++) {
    const v = y[i] as number;
    if (unit === 'absorbance' || unit === 'epsilon') out[i] = v;
    else out[i] = v * scale > 0 ? -Math.log10(v * scale) : Number.POSITIVE_INFINITY;
  }
  return out;
}
