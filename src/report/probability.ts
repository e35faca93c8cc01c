/**
 * A probability (0..1) in words for a reader: one wording for the CLI and
 * the page, so an assignment or a spin state reads the same in both.
 */

/**
 * As a percentage: two significant figures ("97%", "3.1%"), three from
 * 0.995 up ("99.7%", so a near-certain result is not shown as "100%"), and
 * "< 0.1%" below 0.001. `space` puts a space before the % sign (the page's
 * typography: "97 %").
 */
export function percentText(p: number, options: { space?: boolean } = {}): string {
  const sign = options.space === true ? ' %' : '%';
  return p < 0.001 ? `< 0.1${sign}` : `${(100 * p).toPrecision(p >= 0.995 ? 3 : 2)}${sign}`;
}

/** "P = 0.87", and at the ends "P > 0.99", "P < 0.01" (two decimals cannot say more). */
export function probabilityText(p: number): string {
  if (p > 0.995) return 'P > 0.99';
  if (p < 0.005) return 'P < 0.01';
  return `P = ${p.toFixed(2)}`;
}
