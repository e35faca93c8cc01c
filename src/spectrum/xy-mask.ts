/**
 * Masking: points left out of the band analysis, and the regions they form.
 */
import type { MaskedRegion, MaskReason } from './types.js';

export interface MaskOptions {
  /** Absorbance above which the detector is saturated (or infinite, from T ≤ 0). @default 3 */
  saturationLimit?: number;
  /** Absorbance below −negativeLimit is a bad blank or a fault, not noise. */
  negativeLimit: number;
  /** Points masked on each side of a saturated run (readings there are unreliable). @default 2 */
  saturationMargin?: number;
}

/**
 * Marks points that are saturated (A > saturationLimit, or not finite) or
 * negative beyond noise (A < −negativeLimit). `absorbance` is y in
 * absorbance over ascending x. Returns per-point reasons (null = kept).
 */
export function xyMaskPoints(absorbance: Float64Array, options: MaskOptions): Array<MaskReason | null> {
  const { saturationLimit = 3, negativeLimit, saturationMargin = 2 } = options;
  const n = absorbance.length;
  const reasons: Array<MaskReason | null> = new Array<MaskReason | null>(n).fill(null);
  for (let i = 0; i < n; i++) {
    const a = absorbance[i] as number;
    if (!Number.isFinite(a) || a > saturationLimit) {
      for (let k = Math.max(0, i - saturationMargin); k <= Math.min(n - 1, i + saturationMargin); k++) reasons[k] = 'saturated';
    }
  }
  for (let i = 0; i < n; i++) if (reasons[i] === null && (absorbance[i] as number) < -negativeLimit) reasons[i] = 'negative';
  return reasons;
}

/** Masks `halfWidth` points on each side of position index|index+1 (a detector step), in place. */
export function maskAroundStep(reasons: Array<MaskReason | null>, index: number, halfWidth = 2): void {
  for (let k = Math.max(0, index - halfWidth + 1); k <= Math.min(reasons.length - 1, index + halfWidth); k++) {
    reasons[k] ??= 'detector-step';
  }
}

/**
 * Runs of equal reasons as regions in x units. A region reaches halfway to
 * the neighbouring kept points, so a single masked point still has from < to.
 */
export function xyMaskedRegions(x: Float64Array, reasons: Array<MaskReason | null>): MaskedRegion[] {
  const regions: MaskedRegion[] = [];
  const n = x.length;
  let i = 0;
  while (i < n) {
    const reason = reasons[i];
    if (reason === null || reason === undefined) {
      i++;
      continue;
    }
    let j = i;
    while (j + 1 < n && reasons[j + 1] === reason) j++;
    const from = i > 0 ? ((x[i - 1] as number) + (x[i] as number)) / 2 : (x[0] as number);
    const to = j < n - 1 ? ((x[j] as number) + (x[j + 1] as number)) / 2 : (x[n - 1] as number);
    regions.push({ from, to: to > from ? to : from + 1e-9, reason });
    i = j + 1;
  }
  return regions;
}
