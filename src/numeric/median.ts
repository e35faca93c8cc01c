import { xMedian } from 'ml-spectra-processing';

/**
 * The one median of fieldgap: the middle value of the sorted values, or the
 * mean of the two middle ones for an even count (ml-spectra-processing's
 * xMedian with `exact`); NaN for no values. The input is not changed.
 */
export function median(values: ArrayLike<number>): number {
  if (values.length === 0) return Number.NaN;
  return xMedian(Array.from(values), { exact: true });
}
