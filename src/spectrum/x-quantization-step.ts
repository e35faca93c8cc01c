/**
 * The step to which y values were rounded (0.01 for an export with two
 * decimals), or 0 when they were not. Instrument exports often round the
 * absorbance; the rounding, not the detector, is then the noise: a uniform
 * error of ±q/2, standard deviation q/√12. On rounded smooth data the second
 * differences are mostly exactly zero and a median-based noise estimate says
 * 0, so this floor is what keeps the noise model honest.
 *
 * q is the smallest nonzero difference between neighbouring values; the
 * data count as rounded to q when at least `share` of the values lie within
 * `tolerance`·q of a multiple of q and at least `share` of the nonzero
 * differences are whole multiples of q. Needs 20 finite values.
 */
export interface QuantizationOptions {
  /** Fraction of values (and of nonzero differences) that must fit the grid of q. @default 0.98 */
  share?: number;
  /** Distance from a multiple of q allowed, as a fraction of q. @default 0.01 */
  tolerance?: number;
}

export function xQuantizationStep(y: Float64Array, options: QuantizationOptions = {}): number {
  const { share = 0.98, tolerance = 0.01 } = options;
  const values = y.filter(Number.isFinite);
  const n = values.length;
  if (n < 20) return 0;
  let scale = 0;
  for (const v of values) scale = Math.max(scale, Math.abs(v));
  const tiny = 1e-9 * Math.max(scale, 1e-300);
  let q = Number.POSITIVE_INFINITY;
  const differences: number[] = [];
  for (let i = 1; i < n; i++) {
    const d = Math.abs((values[i] as number) - (values[i - 1] as number));
    if (d > tiny) {
      differences.push(d);
      if (d < q) q = d;
    }
  }
  if (!Number.isFinite(q) || differences.length === 0) return 0;
  const onGrid = (v: number) => Math.abs(v / q - Math.round(v / q)) <= tolerance;
  let fit = 0;
  for (const v of values) if (onGrid(v)) fit++;
  if (fit < share * n) return 0;
  let whole = 0;
  for (const d of differences) if (onGrid(d)) whole++;
  return whole >= share * differences.length ? q : 0;
}
