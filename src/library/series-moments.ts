/**
 * The sums a mean with its uncertainty is made of, so that src/series's
 * `combine` over thousands of samples can be had from sums the database
 * takes (series-queries.ts) instead of from the samples themselves. Sums
 * over samples x with σ: n, how many have σ (known) and σ > 0 (positive),
 * Σx, Σx², and over σ > 0: Σ 1/σ², Σ x/σ². `onlySigma` is the σ of the one
 * sample when n = 1 (null when it has none).
 *
 * The results equal combine's up to rounding (the sums are taken in another
 * order, and the plain variance as Σx² − n·mean²): tests compare them to
 * 1e-9 relative.
 */
export interface Moments {
  n: number;
  known: number;
  positive: number;
  s1: number;
  s2: number;
  w: number;
  wx: number;
  onlySigma: number | null;
}

export const NO_MOMENTS: Moments = { n: 0, known: 0, positive: 0, s1: 0, s2: 0, w: 0, wx: 0, onlySigma: null };

/** The moments of v = a·x − r with σ_v = a·σ (a > 0): what the factor fit makes of 10Dq or 1 − β. */
export function affineMoments(m: Moments, a: number, r: number): Moments {
  return {
    n: m.n, known: m.known, positive: m.positive,
    s1: a * m.s1 - m.n * r,
    s2: a * a * m.s2 - 2 * a * r * m.s1 + m.n * r * r,
    w: m.w / (a * a),
    wx: (a * m.wx - r * m.w) / (a * a),
    onlySigma: m.onlySigma === null ? null : a * m.onlySigma,
  };
}

/** The moments of two sets of samples together. */
export function addMoments(x: Moments, y: Moments): Moments {
  return {
    n: x.n + y.n, known: x.known + y.known, positive: x.positive + y.positive,
    s1: x.s1 + y.s1, s2: x.s2 + y.s2, w: x.w + y.w, wx: x.wx + y.wx,
    onlySigma: x.n === 0 ? y.onlySigma : x.onlySigma,
  };
}

/** combine's answer from the moments: the weighted mean when every σ > 0, else the plain mean with σ of the mean (one sample: its σ). */
export function meanOfMoments(m: Moments): { value: number; sigma: number | undefined } {
  if (m.n > 0 && m.positive === m.n) return { value: m.wx / m.w, sigma: 1 / Math.sqrt(m.w) };
  const mean = m.s1 / m.n;
  if (m.n < 2) return { value: mean, sigma: m.onlySigma ?? undefined };
  // Rounding can leave a zero spread a hair below zero.
  const variance = Math.max(0, m.s2 - m.n * mean * mean) / (m.n - 1);
  return { value: mean, sigma: Math.sqrt(variance / m.n) };
}
