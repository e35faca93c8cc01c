import { xNoiseStandardDeviation } from 'ml-spectra-processing';

/**
 * Standard deviation of white noise on a smooth signal, from its second
 * differences y[i−1] − 2y[i] + y[i+1] (variance 6σ² for white noise, the
 * smooth part nearly cancels). Robust: the differences' spread is taken as
 * a median absolute deviation (ml-spectra-processing's
 * xNoiseStandardDeviation), so a few spikes or steps do not inflate it.
 * Needs at least 3 points; returns 0 for fewer.
 */
export function xNoiseFromSecondDifferences(y: Float64Array): number {
  if (y.length < 3) return 0;
  const d2 = new Float64Array(y.length - 2);
  for (let i = 1; i < y.length - 1; i++) d2[i - 1] = (y[i - 1] as number) - 2 * (y[i] as number) + (y[i + 1] as number);
  return xNoiseStandardDeviation(d2).sd / Math.sqrt(6);
}

/**
 * Local noise standard deviation at each point: the median of |second
 * differences| in blocks of `window` points, / (0.6745 √6), interpolated
 * linearly between block centres. Noise on a resampled grid is not uniform
 * (averaged where the data were dense, interpolated where sparse), so
 * thresholds use this rather than one global value. Blocks rather than a
 * rolling window keep it O(n log window).
 */
export function xNoiseLocal(y: Float64Array, window = 41): Float64Array {
  const n = y.length;
  const out = new Float64Array(n);
  if (n < 3) return out;
  const abs = new Float64Array(n - 2);
  for (let i = 1; i < n - 1; i++) abs[i - 1] = Math.abs((y[i - 1] as number) - 2 * (y[i] as number) + (y[i + 1] as number));
  const blocks = Math.max(1, Math.round(abs.length / window));
  const centres: number[] = [];
  const values: number[] = [];
  for (let b = 0; b < blocks; b++) {
    const from = Math.floor((b * abs.length) / blocks);
    const to = Math.floor(((b + 1) * abs.length) / blocks);
    const part = abs.slice(from, to).sort();
    centres.push((from + to - 1) / 2 + 1);
    values.push((part[part.length >> 1] as number) / (0.6744897501960817 * Math.sqrt(6)));
  }
  let b = 0;
  for (let i = 0; i < n; i++) {
    while (b + 1 < centres.length && (centres[b + 1] as number) <= i) b++;
    const c0 = centres[b] as number;
    const c1 = centres[b + 1];
    if (c1 === undefined || i <= c0) out[i] = values[b] as number;
    else out[i] = (values[b] as number) + (((values[b + 1] as number) - (values[b] as number)) * (i - c0)) / (c1 - c0);
  }
  return out;
}
