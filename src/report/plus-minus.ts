/**
 * The one "value ± uncertainty" formatter. The uncertainty is one standard
 * deviation in the value's unit; a missing or non-finite uncertainty (and,
 * unless `showZero`, a zero one) shows the value alone.
 */

/** Digits after the point that show an uncertainty to two significant figures (0 for a missing one). */
export function decimalsForUncertainty(uncertainty: number | null | undefined): number {
  if (uncertainty === null || uncertainty === undefined || !Number.isFinite(uncertainty) || uncertainty <= 0) return 0;
  return Math.max(0, 1 - Math.floor(Math.log10(uncertainty)));
}

export interface PlusMinusOptions {
  /** Digits after the point, or 'two-significant': as many as show the uncertainty to two significant figures. Default 0. */
  digits?: number | 'two-significant';
  /** With 'two-significant': at least this many digits (also for a value shown alone). Default 0. */
  minDigits?: number;
  /** With 'two-significant': at most this many digits. Default 20. */
  maxDigits?: number;
  /** Show a zero uncertainty as "± 0" instead of the value alone. Default false. */
  showZero?: boolean;
  /** How a number is written at those digits. Default `toFixed`. */
  number?: (value: number, digits: number) => string;
}

/** "17400 ± 150": both at the same digits; "17400" when there is no uncertainty. */
export function formatPlusMinus(value: number, uncertainty: number | null | undefined, options: PlusMinusOptions = {}): string {
  const { digits = 0, minDigits = 0, maxDigits = 20, showZero = false, number = (v, d) => v.toFixed(d) } = options;
  const known = uncertainty !== null && uncertainty !== undefined && Number.isFinite(uncertainty) && (uncertainty > 0 || (showZero && uncertainty === 0));
  const d = digits === 'two-significant' ? Math.max(minDigits, Math.min(maxDigits, decimalsForUncertainty(uncertainty))) : digits;
  return known ? `${number(value, d)} ± ${number(uncertainty, d)}` : number(value, d);
}
