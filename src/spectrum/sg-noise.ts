/**
 * Noise carried into a Savitzky–Golay second derivative. For a window of
 * 2m + 1 points and a quadratic or cubic fit, the second derivative at the
 * centre is 2 Σ (k² − M) y_k / (h² Σ (k² − M)²), M = m(m + 1)/3, so white
 * noise of deviation σ becomes 2σ / (h² √Σ (k² − M)²).
 */
export function sgSecondDerivativeNoise(windowSize: number, step: number, sigma: number): number {
  const m = (windowSize - 1) / 2;
  const mean = (m * (m + 1)) / 3;
  let s = 0;
  for (let k = -m; k <= m; k++) s += (k * k - mean) ** 2;
  return (2 * sigma) / (step * step * Math.sqrt(s));
}
