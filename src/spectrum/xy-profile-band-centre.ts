/**
 * The profile of one band centre: the band model refitted with that centre
 * held at each of a row of positions (every other parameter free: the
 * band's height and width, the other bands, the edge, the baseline), and
 * the weighted χ² of each refit. Used for a band whose maximum lies beyond
 * an end of the window (process-spectrum.ts): its centre is extrapolated
 * from one flank, the covariance of the best fit only says how sharply the
 * Gaussian model locates it, and the profile says which centres the data
 * allow once the band may trade its width and height against its
 * neighbours' flanks.
 *
 * Positions in cm-1; χ² in the fit's weights (1/σ_i).
 */
import { gaussianValue } from './gaussian.js';
import { xPolynomialValues } from './xy-polynomial.js';
import { type GaussianParameters, type RefineBandsResult, xyRefineBands } from './xy-refine-bands.js';

export interface CentreProfileOptions {
  weights: Float64Array;
  baselineGuess: Float64Array;
  baselineOrder: number;
  /** Fraction of a band's FWHM its centre may lie below the low end (RefineBandsOptions). */
  beyondLowEnd: number;
  /** Where the window lies from the band: +1 above it (a band beyond the red end), −1 below it (beyond the blue end). */
  towards: 1 | -1;
  /** Broadest FWHM the profiled band may take, cm-1. */
  maxFwhm: number;
  /** Step between held positions, cm-1. */
  step: number;
  /** The walk on each side stops once Δχ² exceeds this (or after maxSteps). */
  limit: number;
  /** Most refits on each side. */
  maxSteps: number;
}

export interface CentreProfile {
  /** Held positions (ascending, the best fit's centre among them) and Δχ² from the best fit at each. */
  positions: Float64Array;
  deltaChiSquare: Float64Array;
  /**
   * Where Δχ² crosses `limit` on each side (linear between held positions),
   * cm-1; ±Infinity where the walk ended (maxSteps, or a failed refit)
   * below the limit: the data do not bound the centre on that side.
   */
  low: number;
  high: number;
}

/**
 * Refits `fit` (bands, edge, baseline) with band `index`'s centre held at
 * positions `step` apart on both sides of its best value, until Δχ²
 * exceeds `limit`. Each side is walked outward from the best fit, each
 * refit starting from its neighbour's solution (continuation), so a refit
 * far out does not start from a band it cannot reach.
 */
export function xyProfileBandCentre(x: Float64Array, y: Float64Array, fit: RefineBandsResult, index: number, options: CentreProfileOptions): CentreProfile {
  const { step, limit, maxSteps } = options;
  const best = fit.bands[index] as GaussianParameters;
  const fixed = new Float64Array(fit.bands.length).fill(Number.NaN);
  const walk = (direction: 1 | -1): { points: Array<[number, number]>; crossing: number } => {
    const points: Array<[number, number]> = [];
    let previous: RefineBandsResult = fit;
    let last: [number, number] = [best.position, 0];
    for (let k = 1; k <= maxSteps; k++) {
      const at = best.position + direction * k * step;
      fixed[index] = at;
      const bands = previous.bands.map((b, j): GaussianParameters => (j === index ? movedBand(b, at, options.towards) : { ...b }));
      const r = xyRefineBands(x, y, {
        bands, edge: previous.edge, baselineGuess: options.baselineGuess, baselineOrder: options.baselineOrder,
        baselineStart: previous.baselineCoefficients, weights: options.weights, beyondLowEnd: options.beyondLowEnd,
        fixedPositions: fixed, maxIterations: 60,
        fwhmLimits: [250, options.maxFwhm], positionFreedom: k * step + 1500,
      });
      if (!Number.isFinite(r.chiSquare)) break;
      // A refit can only do as well as the best fit (which is among its options): a lower χ² is the best fit's
      // own convergence tolerance, not a better centre.
      const delta = Math.max(r.chiSquare - fit.chiSquare, 0);
      points.push([at, delta]);
      if (delta > limit) return { points, crossing: last[0] + ((limit - last[1]) / (delta - last[1])) * (at - last[0]) };
      last = [at, delta];
      previous = r;
    }
    return { points, crossing: direction * Number.POSITIVE_INFINITY };
  };
  const down = walk(-1);
  const up = walk(1);
  const all = [...down.points.reverse(), [best.position, 0] as [number, number], ...up.points];
  return {
    positions: Float64Array.from(all, (p) => p[0]),
    deltaChiSquare: Float64Array.from(all, (p) => p[1]),
    low: down.crossing,
    high: up.crossing,
  };
}

/**
 * A Gaussian moved from its centre to `at` that keeps its half-height point
 * on the far side (the one facing the window) where it was: the flank the
 * data show stays put while the centre moves.
 */
function movedBand(b: GaussianParameters, at: number, towards: 1 | -1): GaussianParameters {
  const half = towards * (b.position + 0.5 * towards * b.fwhm - at);
  return { position: at, height: b.height, fwhm: Math.max(250, 0.3 * b.fwhm, 2 * half) };
}

export interface BeyondWindowSdOptions extends Omit<CentreProfileOptions, 'step' | 'limit' | 'maxSteps' | 'maxFwhm'> {
  /** A FWHM the band's siblings inside the window show (cm-1), or null. */
  siblingFwhm: number | null;
  /** Points per walk on each side, at FWHM/10: the reach is maxSteps · FWHM/10. @default 25 */
  maxSteps?: number;
}

export interface BeyondWindowSd {
  /** Standard uncertainty of the centre, cm-1 (see xyBeyondWindowSd). */
  sd: number;
  /** The profile's 95 % interval, cm-1 (±Infinity: not bounded within the reach on that side). */
  low: number;
  high: number;
  /** Variance inflation of the residuals' serial correlation, (1 + ρ)/(1 − ρ) ≥ 1. */
  correlation: number;
  /** The Δχ² of the 95 % bound, 4 · F · s². */
  limit: number;
}

/**
 * The standard uncertainty of a band centre outside the window, from its
 * profile: Δχ² ≤ 4 · F · s² bounds a 95 % interval (4 = 2², a two-σ
 * profile bound: common practice), where s² = max(1, χ²/(n − p)) takes up
 * a misfit larger than the fit's σ, and F = (1 + ρ)/(1 − ρ) the serial
 * correlation ρ (lag one) of the weighted residuals: the misfit of a
 * Gaussian to a real band is smooth, so neighbouring points do not count as
 * independent evidence (the variance inflation of an AR(1) series: common
 * practice). The σ reported is half the larger distance from the best
 * centre to a bound, so a profile that rises slowly on the far side (the
 * band traded against a neighbour's flank) widens it, as a Gaussian σ from
 * the curvature at the best fit cannot. Unbounded within the reach: the
 * whole reach. The band may widen to MAX_WIDENING times its FWHM on the
 * way.
 */
export function xyBeyondWindowSd(x: Float64Array, y: Float64Array, fit: RefineBandsResult, index: number, options: BeyondWindowSdOptions): BeyondWindowSd {
  const n = x.length;
  const band = fit.bands[index] as GaussianParameters;
  const weighted = weightedResiduals(x, y, fit, options.weights);
  let s0 = 0;
  let s1 = 0;
  for (let i = 0; i < n; i++) {
    s0 += (weighted[i] as number) ** 2;
    if (i > 0) s1 += (weighted[i] as number) * (weighted[i - 1] as number);
  }
  const rho = s0 > 0 ? Math.min(Math.max(s1 / s0, 0), MAX_CORRELATION) : 0;
  const correlation = (1 + rho) / (1 - rho);
  const s2 = Math.max(1, n > fit.parameters ? fit.chiSquare / (n - fit.parameters) : 1);
  const step = band.fwhm / 10;
  const maxSteps = options.maxSteps ?? 25;
  const limit = 4 * correlation * s2;
  const maxFwhm = MAX_WIDENING * Math.max(band.fwhm, options.siblingFwhm ?? 0);
  const profile = xyProfileBandCentre(x, y, fit, index, { ...options, step, limit, maxSteps, maxFwhm });
  const reach = maxSteps * step;
  const far = Math.max(
    Number.isFinite(profile.low) ? band.position - profile.low : reach,
    Number.isFinite(profile.high) ? profile.high - band.position : reach,
  );
  const bounded = Number.isFinite(profile.low) && Number.isFinite(profile.high);
  return { sd: bounded ? far / 2 : far, low: profile.low, high: profile.high, correlation, limit };
}

/**
 * Largest lag-one correlation counted (F ≤ 19): on noise-free rounded data
 * the residuals are the model's smooth misfit alone, ρ → 1, and F would
 * grow without bound while the data still bound the centre.
 */
const MAX_CORRELATION = 0.9;

/**
 * A band held away from its best centre may widen to this multiple of its
 * fitted FWHM (or of its siblings', the larger): a spin-allowed d–d band is
 * a few thousand cm-1 broad (common practice), and a Gaussian centred far
 * out and broad enough would put a straight flank anywhere.
 */
const MAX_WIDENING = 2;

/** w_i (y_i − model_i) of a fit. */
function weightedResiduals(x: Float64Array, y: Float64Array, fit: RefineBandsResult, weights: Float64Array): Float64Array {
  const base = xPolynomialValues(x, fit.baselineCoefficients, fit.scale);
  const parts = fit.edge === null ? fit.bands : [...fit.bands, fit.edge];
  return Float64Array.from(x, (v, i) => {
    let r = (y[i] as number) - (base[i] as number);
    for (const b of parts) r -= gaussianValue(v, b.position, b.height, b.fwhm);
    return r * (weights[i] as number);
  });
}

export interface BeyondWindowCentre extends BeyondWindowSd {
  /** The centre with the band held at its siblings' width (cm-1), or null (no siblings, or the data reject that width). */
  siblingWidthPosition: number | null;
}

/**
 * A band centre outside the window and its σ. From one flank a Gaussian's
 * centre and width trade off (a narrower band closer in, or a broader one
 * further out, fit the same flank nearly as well; on overlapping bands the
 * free width follows the neighbour's flank, and the centre with it). The
 * spin-allowed d–d bands of one complex have similar widths (common
 * practice), so when bands inside the window give a width (`siblingFwhm`,
 * the mean FWHM of the broad bands measured there), the band is refitted
 * at that width, its centre free. The best fit's centre stands (on the
 * test spectra neither width is the better guess); the σ is the profile's
 * (xyBeyondWindowSd) and at least the distance to the sibling-width centre
 * where the data allow that width (its Δχ² within the profile's limit):
 * the sensitivity to the width assumed.
 */
export function xyBeyondWindowCentre(x: Float64Array, y: Float64Array, fit: RefineBandsResult, index: number, options: BeyondWindowSdOptions): BeyondWindowCentre {
  const free = fit.bands[index] as GaussianParameters;
  const profile = xyBeyondWindowSd(x, y, fit, index, options);
  const sibling = options.siblingFwhm;
  if (sibling === null || !(sibling > 0)) return { ...profile, siblingWidthPosition: null };
  const widths = new Float64Array(fit.bands.length).fill(Number.NaN);
  widths[index] = sibling;
  const refit = xyRefineBands(x, y, {
    bands: fit.bands.map((b, j) => (j === index ? movedWidth(b, sibling, options.towards) : { ...b })),
    edge: fit.edge, baselineGuess: options.baselineGuess, baselineOrder: options.baselineOrder, baselineStart: fit.baselineCoefficients,
    weights: options.weights, beyondLowEnd: options.beyondLowEnd, fixedFwhms: widths, maxIterations: 200,
    fwhmLimits: [250, 20000], positionFreedom: 2 * Math.max(free.fwhm, sibling),
  });
  const at = (refit.bands[index] as GaussianParameters).position;
  if (!Number.isFinite(refit.chiSquare) || refit.chiSquare - fit.chiSquare > profile.limit) return { ...profile, siblingWidthPosition: null };
  return { ...profile, sd: Math.max(profile.sd, Math.abs(at - free.position)), siblingWidthPosition: at };
}

/** A Gaussian at a new width whose half-height point facing the window stays put. */
function movedWidth(b: GaussianParameters, fwhm: number, towards: 1 | -1): GaussianParameters {
  return { position: b.position + 0.5 * towards * (b.fwhm - fwhm), height: b.height, fwhm };
}

/** For a band outside the window: where it would lie at the width of the bands inside the window. */
export function beyondWindowWidthNote(position: number, beyond: ReadonlyArray<{ position: number; siblingWidthPosition: number | null }>): string {
  const b = beyond.find((o) => o.siblingWidthPosition !== null && Math.abs(o.position - position) < 1);
  return b === undefined ? '' : `; at the width of the bands inside the window it would lie at ${b.siblingWidthPosition!.toFixed(0)} cm-1, and the ± includes that`;
}

/**
 * The bands of `fit` centred outside the window or within half their FWHM
 * of an end, each given its σ by
 * xyBeyondWindowCentre (profiled at the fit's own baseline order, which the
 * model selection may have raised; the width of the broad bands inside the
 * window, twice narrowFwhm or more, as its siblings' width). Returns every
 * band's position σ, and for each band outside the window its centre at
 * the siblings' width.
 */
export function beyondWindowBands(
  x: Float64Array, y: Float64Array, fit: RefineBandsResult,
  o: { weights: Float64Array; baselineGuess: Float64Array; window: [number, number]; redEndOpen: boolean; narrowFwhm: number },
): { positionSd: Float64Array; beyond: Array<{ position: number; siblingWidthPosition: number | null }> } {
  const [low, high] = o.window;
  const inside = fit.bands.filter((b) => b.position >= low + 0.5 * b.fwhm && b.position <= high - 0.5 * b.fwhm && b.fwhm >= 2 * o.narrowFwhm);
  const siblingFwhm = inside.length === 0 ? null : inside.reduce((s, b) => s + b.fwhm, 0) / inside.length;
  const positionSd = Float64Array.from(fit.positionSd);
  const beyond: Array<{ position: number; siblingWidthPosition: number | null }> = [];
  fit.bands.forEach((b, k) => {
    // Near an end (within half its FWHM, bandWindow's 'near-…') the far side is not measured either.
    const towards = b.position < low + 0.5 * b.fwhm ? 1 : b.position > high - 0.5 * b.fwhm ? -1 : 0;
    if (towards === 0) return;
    const r = xyBeyondWindowCentre(x, y, fit, k, {
      weights: o.weights, baselineGuess: o.baselineGuess, baselineOrder: fit.baselineCoefficients.length - 1,
      beyondLowEnd: o.redEndOpen ? BEYOND_LOW_END_PROFILE : 0, towards, siblingFwhm,
    });
    const sd = fit.positionSd[k] as number;
    positionSd[k] = Math.max(Number.isFinite(sd) ? sd : 0, r.sd);
    beyond.push({ position: b.position, siblingWidthPosition: r.siblingWidthPosition });
  });
  return { positionSd, beyond };
}

/**
 * How far beyond the red end a held or refitted centre may go in a profile, fraction of its FWHM: far enough that
 * the profile, not the bound, ends the interval.
 */
const BEYOND_LOW_END_PROFILE = 10;
