/**
 * Each band's maximum as the data show it. A Gaussian fitted to a real,
 * asymmetric band (log-normal, skewed to high energy; common practice) has
 * its centre between the band's maximum and its mean, up to about a tenth
 * of the FWHM toward the high-energy tail (~150–400 cm-1 for the skew
 * 1.2–1.3 of d–d bands and the multiplets of tetrahedral Co(II)); the
 * transition energy is the maximum.
 *
 * The band's own signal is the data less the baseline and every other band.
 * A least-squares parabola through it within ±`window` FWHM of the fitted
 * centre (the top of a band is a parabola there to about 1 %; many points,
 * so noise averages out) has its vertex at the band's maximum. The vertex
 * stands when the parabola opens downward and its vertex lies within
 * ±`shift` FWHM of the centre; otherwise (a shoulder on a slope, a band at
 * an end of the range, masked or too few points) the fitted centre stands.
 * Its σ, from the parabola's covariance (residual variance, delta method),
 * is returned for the caller to add to the position's uncertainty.
 *
 * Defaults: window 0.25, shift 0.15 FWHM. A Gaussian fitted to a log-normal
 * band of skew up to 1.5 has its centre within about 0.1 FWHM of the
 * maximum; a wider reach lets a narrow feature on the flank that no band
 * models (the 1Eg line on the 3T1g(F) band of Ni(II)) move the maximum.
 */
import { gaussianValue } from './gaussian.js';
import type { GaussianParameters } from './xyRefineBands.js';

export interface BandDataMaximaOptions {
  /** Half-width of the parabola's stretch, fraction of the band's FWHM. @default 0.25 */
  window?: number;
  /** Largest accepted distance of the vertex from the fitted centre, fraction of the FWHM. @default 0.15 */
  shift?: number;
}

export interface BandDataMaxima {
  /** Maximum of each band, cm-1 (the fitted centre where none is found). */
  positions: Float64Array;
  /** σ of each maximum from the parabola, cm-1 (0 where the centre stands). */
  sd: Float64Array;
}

/** Maxima of each band's own signal on an ascending grid; `signal` NaN where masked. */
export function xyBandDataMaxima(
  grid: Float64Array, signal: Float64Array, baseline: Float64Array, bands: readonly GaussianParameters[], options: BandDataMaximaOptions = {},
): BandDataMaxima {
  const { window = 0.25, shift = 0.15 } = options;
  const positions = Float64Array.from(bands, (b) => b.position);
  const sd = new Float64Array(bands.length);
  bands.forEach((band, k) => {
    const xs: number[] = [];
    const ys: number[] = [];
    for (let i = 0; i < grid.length; i++) {
      const x = grid[i] as number;
      if (Math.abs(x - band.position) > window * band.fwhm) continue;
      if (!Number.isFinite(signal[i] as number)) return;
      let v = (signal[i] as number) - (baseline[i] as number);
      for (let j = 0; j < bands.length; j++) {
        if (j !== k) v -= gaussianValue(x, bands[j]!.position, bands[j]!.height, bands[j]!.fwhm);
      }
      xs.push((x - band.position) / band.fwhm);
      ys.push(v);
    }
    const vertex = xyParabolaVertex(xs, ys);
    if (vertex === null || Math.abs(vertex.t) > shift) return;
    positions[k] = band.position + vertex.t * band.fwhm;
    sd[k] = vertex.sd * band.fwhm;
  });
  return { positions, sd };
}

/**
 * Vertex t = −b/(2c) of the least-squares parabola a + b t + c t² through
 * (t, y), with its σ by the delta method from s²(XᵀX)⁻¹, s² = RSS/(n − 3);
 * null with fewer than 7 points, a singular system or c ≥ 0 (no maximum).
 */
export function xyParabolaVertex(t: readonly number[], y: readonly number[]): { t: number; sd: number } | null {
  const n = t.length;
  if (n < 7) return null;
  const s = new Float64Array(5);
  const r = new Float64Array(3);
  for (let i = 0; i < n; i++) {
    let p = 1;
    for (let k = 0; k < 5; k++) {
      s[k] = (s[k] as number) + p;
      if (k < 3) r[k] = (r[k] as number) + p * (y[i] as number);
      p *= t[i] as number;
    }
  }
  const m = [[s[0]!, s[1]!, s[2]!], [s[1]!, s[2]!, s[3]!], [s[2]!, s[3]!, s[4]!]];
  const inv = inverse3(m);
  if (inv === null) return null;
  const coef = [0, 1, 2].map((i) => inv[i]![0]! * r[0]! + inv[i]![1]! * r[1]! + inv[i]![2]! * r[2]!) as [number, number, number];
  const [a, b, c] = coef;
  if (!(c < 0)) return null;
  let rss = 0;
  for (let i = 0; i < n; i++) rss += ((y[i] as number) - (a + b * (t[i] as number) + c * (t[i] as number) ** 2)) ** 2;
  const s2 = rss / (n - 3);
  const vertex = -b / (2 * c);
  // ∂t/∂b = −1/(2c), ∂t/∂c = b/(2c²)
  const gb = -1 / (2 * c);
  const gc = b / (2 * c * c);
  const variance = s2 * (gb * gb * inv[1]![1]! + 2 * gb * gc * inv[1]![2]! + gc * gc * inv[2]![2]!);
  return { t: vertex, sd: Math.sqrt(Math.max(variance, 0)) };
}

function inverse3(m: number[][]): number[][] | null {
  const [[a, b, c], [d, e, f], [g, h, i]] = m as [[number, number, number], [number, number, number], [number, number, number]];
  const A = e * i - f * h;
  const B = -(d * i - f * g);
  const C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return null;
  return [
    [A / det, -(b * i - c * h) / det, (b * f - c * e) / det],
    [B / det, (a * i - c * g) / det, -(a * f - c * d) / det],
    [C / det, -(a * h - b * g) / det, (a * e - b * d) / det],
  ];
}
