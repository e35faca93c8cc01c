import type { XUnit } from '../types.js';

/**
 * Guesses the x unit of a UV-vis-NIR spectrum from the range of its values,
 * for files that do not say. Ranges (common practice for such instruments):
 * nm 100–4000; cm-1 above 4000 (up to ~10^5); eV when values reach above
 * 3.5 or start at 0.8 or more (0.4–12 eV); µm when values lie within
 * 0.1–3.5 and start below 0.8. Returns null when the range fits none.
 */
export function inferXUnit(min: number, max: number): XUnit | null {
  if (!(min > 0) || !Number.isFinite(max)) return null;
  if (min >= 100 && max <= 4000) return 'nm';
  if (min >= 2000 && max > 4000 && max <= 200000) return 'cm-1';
  if (max <= 12 && min >= 0.1) {
    if (max <= 3.5 && min < 0.8) return 'um';
    if (min >= 0.4) return 'eV';
  }
  return null;
}
