/**
 * The band model's trial fit and its score, shared by every step of the
 * model selection (fit-band-model.ts): the options, one refinement of a
 * trial model at the trial tolerance, the BIC that compares two trials, and
 * the residual a trial leaves.
 */
import { gaussianValue } from './gaussian.js';
import type { BandCandidate } from './xy-find-band-candidates.js';
import { xPolynomialValues } from './xy-polynomial.js';
import { type GaussianParameters, type RefineBandsResult, xyRefineBands } from './xy-refine-bands.js';
import { median } from '../numeric/median.js';

export interface FitBandModelOptions {
  candidates: BandCandidate[];
  edge: GaussianParameters | null;
  baselineGuess: Float64Array;
  baselineOrder: number;
  /** Local noise deviation at each x: the fit's σ (measurement noise and the band model's shape error). */
  noise: Float64Array;
  /**
   * The measurement noise alone at each x (no shape error). A broad band
   * left in the residual (step 4) is sought against it as well: the shape
   * error is smooth, and counted as white noise it sets the curvature
   * threshold of the candidate search many times too high where the signal
   * is large (under a charge-transfer rise), so a lost band as tall as the
   * others went unseen (see residualCandidates). @default noise
   */
  whiteNoise?: Float64Array;
  broadFwhm: number;
  narrowFwhm: number;
  /** Most bands kept. */
  maxBands: number;
  /** Weights 1/σ_i of the fit. @default 1 / noise */
  weights?: Float64Array;
  /** 'auto': the edge is tried on and off; true: always (as given); false: never. @default 'auto' */
  edgeMode?: 'auto' | boolean;
  /**
   * Smallest height of a broad band added from the residual (step 4), as a
   * fraction of the tallest band. On smooth data a broad residual of a few
   * per cent is the band model's shape error (real bands are not
   * Gaussian), so smooth data set this to 0.1; narrow bands (spin-forbidden
   * lines) are not held to it. @default 0
   */
  minAddedFraction?: number;
  /** A band whose position deviation exceeds this fraction of its FWHM is undetermined and dropped. @default 0.5 */
  uncertainFraction?: number;
  /** How far below the low end a band centre may lie, fraction of its FWHM (RefineBandsOptions). @default 0 */
  beyondLowEnd?: number;
  /**
   * The data below the low end were read and masked (negative absorbance, a
   * detector step: kept-window.ts), so no band has its maximum there: a band
   * within FWHM/4 of the low end (no maximum of its own in the kept data) is
   * dropped by rule, not by the criterion. @default false
   */
  closedLowEnd?: boolean;
  /** Polynomial of baselineGuess (see RefineBandsOptions); fitBandModel fits it once for all its trial models. */
  baselineStart?: Float64Array;
}

/** BIC difference a more complex model must win by. */
export const BIC_MARGIN = 10;

/** BIC with known noise: χ² + p ln n (the fit is weighted by 1/σ_i). */
export function bandFitBic(fit: RefineBandsResult, n: number): number {
  return fit.chiSquare + fit.parameters * Math.log(n);
}

/** Iterations of a trial fit: a model that needs more is usually degenerate (two components on one band) and is simplified next. */
const TRIAL_ITERATIONS = 40;

/**
 * χ² gain per step below which a trial fit stops. Trials are only compared
 * with each other at a margin of BIC_MARGIN; a degenerate component (an
 * edge traded against the baseline) crawls along its valley at a few tenths
 * per step for dozens of steps, changing no decision. The chosen model is
 * then refined to the strict default.
 */
const TRIAL_CHI_SQUARE_TOLERANCE = 0.1;

export function refine(
  x: Float64Array, y: Float64Array, bands: GaussianParameters[], edge: GaussianParameters | null, o: FitBandModelOptions,
  { maxIterations = TRIAL_ITERATIONS, chiSquareTolerance = TRIAL_CHI_SQUARE_TOLERANCE } = {},
): RefineBandsResult {
  return xyRefineBands(x, y, {
    bands, edge, baselineGuess: o.baselineGuess, baselineOrder: o.baselineOrder, ...(o.baselineStart ? { baselineStart: o.baselineStart } : {}),
    weights: o.weights ?? weightsFromNoise(o.noise), maxIterations, chiSquareTolerance, beyondLowEnd: o.beyondLowEnd ?? 0,
  });
}

const weightCache = new WeakMap<Float64Array, Float64Array>();

/** 1/σ_i, floored at a tenth of the median σ so that no point dominates. */
export function weightsFromNoise(noise: Float64Array): Float64Array {
  let w = weightCache.get(noise);
  if (w === undefined) {
    const floor = 0.1 * xMedian(noise);
    w = Float64Array.from(noise, (s) => 1 / Math.max(s, floor, 1e-300));
    weightCache.set(noise, w);
  }
  return w;
}

export function residual(x: Float64Array, y: Float64Array, fit: RefineBandsResult): Float64Array {
  const base = xPolynomialValues(x, fit.baselineCoefficients, fit.scale);
  const out = new Float64Array(x.length);
  const components = fit.edge === null ? fit.bands : [...fit.bands, fit.edge];
  for (let i = 0; i < x.length; i++) {
    let v = (y[i] as number) - (base[i] as number);
    for (const c of components) v -= gaussianValue(x[i] as number, c.position, c.height, c.fwhm);
    out[i] = v;
  }
  return out;
}

export interface Context {
  x: Float64Array;
  y: Float64Array;
  o: FitBandModelOptions;
  sigma: number;
  score: (fit: RefineBandsResult) => number;
  mode: 'auto' | boolean;
}

/** The median (src/numeric/median.ts), 0 for no values. */
export function xMedian(values: Float64Array): number {
  return values.length === 0 ? 0 : median(values);
}
