/**
 * First guesses of the bands, shoulders included, from ml-gsd (peaks at
 * minima of a Savitzky–Golay second derivative). Two passes: one whose
 * window follows the width of spin-allowed d–d bands (smooth enough that
 * noise makes no false bands), one whose window follows the narrowest
 * (spin-forbidden) bands, from which only narrow, significant peaks not
 * already found by the first are taken.
 */
// Cached Savitzky–Golay weights; the same peaks as ml-gsd's gsd (src/spectrum/gsd-cached-weights.ts).
import { gsdCachedWeights as gsd } from './gsd-cached-weights.js';
import { sgSecondDerivativeNoise } from './sg-noise.js';

export interface BandCandidate {
  position: number;
  height: number;
  fwhm: number;
  /** Which pass found it. */
  pass: 'broad' | 'narrow';
}

export interface FindBandCandidatesOptions {
  /** Noise standard deviation of y at each point (see xNoiseLocal). */
  noise: Float64Array;
  /** Typical FWHM of spin-allowed d–d bands, cm-1 (sets the broad window, half of it). @default 2500 */
  broadFwhm?: number;
  /** FWHM of the narrowest bands sought, cm-1 (sets the narrow window). @default 600 */
  narrowFwhm?: number;
  /** A candidate's second derivative and height must exceed this many noise deviations. @default 4 */
  significance?: number;
  /**
   * Also run the narrow pass. Its second derivative is significant only where
   * no broad band curves the spectrum, so it is meant for residuals of a fit
   * of the broad bands. @default true
   */
  narrow?: boolean;
}

/** gsd width is the distance between inflection points, 2σ for a Gaussian: FWHM = width · √(2 ln 2). */
const FWHM_PER_WIDTH = Math.sqrt(2 * Math.LN2);

/**
 * Candidates in y (baseline roughly removed, no NaN) over a uniform,
 * ascending x. Sorted by position.
 */
export function xyFindBandCandidates(x: Float64Array, y: Float64Array, options: FindBandCandidatesOptions): BandCandidate[] {
  const { noise, broadFwhm = 2500, narrowFwhm = 600, significance = 4, narrow: withNarrow = true } = options;
  const n = x.length;
  if (n < 7) return [];
  const step = (x[1] as number) - (x[0] as number);
  const broad = pass(x, y, windowFor(0.5 * broadFwhm, step, n), noise, significance, 'broad');
  // gsd's width of a narrow-window peak can be far too small (inflection points of a
  // blend): start such candidates no narrower than 3/4 of the narrowest width sought.
  if (!withNarrow) return broad.sort((a, b) => a.position - b.position);
  const narrow = pass(x, y, windowFor(0.6 * narrowFwhm, step, n), noise, significance, 'narrow')
    .filter((c) => c.fwhm < 2 * narrowFwhm)
    .map((c) => ({ ...c, fwhm: Math.max(c.fwhm, 0.75 * narrowFwhm) }));
  const out = [...broad];
  for (const c of narrow) {
    const near = out.findIndex((b) => Math.abs(b.position - c.position) < Math.max(c.fwhm, narrowFwhm));
    if (near < 0) out.push(c);
    else if ((out[near] as BandCandidate).fwhm < 2 * narrowFwhm) out[near] = c;
  }
  return out.sort((a, b) => a.position - b.position);
}

function windowFor(width: number, step: number, n: number): number {
  let w = Math.max(5, Math.round(width / step));
  if (w % 2 === 0) w++;
  const largest = n % 2 === 0 ? n - 1 : n - 2;
  return Math.max(5, Math.min(w, largest));
}

function pass(
  x: Float64Array, y: Float64Array, windowSize: number, noise: Float64Array, significance: number, name: BandCandidate['pass'],
): BandCandidate[] {
  const step = (x[1] as number) - (x[0] as number);
  let minNoise = Number.POSITIVE_INFINITY;
  for (const v of noise) if (v < minNoise) minNoise = v;
  const peaks = gsd({ x, y }, {
    sgOptions: { windowSize, polynomial: 3 },
    smoothY: true,
    noiseLevel: significance * minNoise,
    peakDetectionAlgorithm: 'second',
    minMaxRatio: 0.005,
  });
  return peaks
    .filter((p) => {
      const sigma = noise[p.index] as number;
      return -p.ddY > significance * sgSecondDerivativeNoise(windowSize, step, sigma) && p.y > significance * sigma;
    })
    .map((p) => ({ position: p.x, height: p.y, fwhm: Math.max(p.width * FWHM_PER_WIDTH, 2 * step), pass: name }));
}
