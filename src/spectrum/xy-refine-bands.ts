/**
 * Least-squares refinement of bands (Gaussians in energy), an optional UV
 * absorption edge (the low-energy tail of a Gaussian centred above the
 * range) and a low-order polynomial baseline, all fitted together, so a
 * broad weak band is not flattened into the baseline nor the baseline into
 * a band. Bounded Levenberg–Marquardt on the normal equations of the
 * analytic Jacobian (band-model.ts: sparse, the edge parametrised by its
 * value at the top of the range); uncertainties from the covariance
 * s²(JᵀJ)⁻¹ of the full model at the solution, s² = RSS / (n − p).
 *
 * (ml-spectra-fitting's `optimize` fits sums of peaks only, without a
 * baseline, and with a numerical Jacobian; it serves as the reference for
 * band-only fits in tests/reference.)
 */
import { type BandModelLayout, bandModelParameterCount, xBandModelValues, xyBandModelCost, xyBandModelNormal } from './band-model.js';
import { reusedBandModelWork } from './band-model-work-reuse.js';
import { FOUR_LN2, gaussianValue } from './gaussian.js';
import { choleskySolveInPlace, levenbergMarquardtNormal } from './levenberg-marquardt.js';
import { type PolynomialScale, xPolynomialScale, xyPolynomialFit } from './xy-polynomial.js';

export interface GaussianParameters {
  position: number;
  height: number;
  fwhm: number;
}

export interface RefineBandsOptions {
  /** Starting bands. */
  bands: GaussianParameters[];
  /** Starting edge, or null for none. */
  edge: GaussianParameters | null;
  /** Starting baseline values at each x (e.g. a lower hull). */
  baselineGuess: Float64Array;
  /** Polynomial order of the baseline. @default 1 */
  baselineOrder?: number;
  /**
   * The baseline's starting coefficients when the caller already has them
   * (xyPolynomialFit of baselineGuess with this order, in xPolynomialScale(x)),
   * so many refinements of one spectrum fit the guess once.
   */
  baselineStart?: Float64Array;
  /** Narrowest and broadest FWHM a band may take, cm-1. @default [250, 10000] */
  fwhmLimits?: [number, number];
  /** How far a band may move from its start, cm-1: max(its starting FWHM, this). @default 1500 */
  positionFreedom?: number;
  /**
   * How far below the low-energy end of the range a band's centre may lie,
   * as a fraction of its starting FWHM (a band whose maximum is beyond the
   * red end of a visible spectrum). @default 0
   */
  beyondLowEnd?: number;
  /** Levenberg–Marquardt iterations. @default 100 */
  maxIterations?: number;
  /** Weight of each point, 1/σ_i (so the fit is maximum likelihood under uneven noise). @default all 1 */
  weights?: Float64Array;
  /**
   * With weights: converged when one step lowers χ² by less than this.
   * @default 0.01 (far below anything the model selection or the
   * uncertainties see); a trial fit that only has to be compared with
   * another may stop coarser.
   */
  chiSquareTolerance?: number;
  /**
   * Band centres held fixed (cm-1; NaN or absent: free), by band index: a
   * profile of one centre (xy-profile-band-centre.ts) refits everything
   * else with that centre fixed. @default none
   */
  fixedPositions?: ArrayLike<number>;
  /** Band FWHMs held fixed (cm-1; NaN or absent: free), by band index. @default none */
  fixedFwhms?: ArrayLike<number>;
}

export interface RefineBandsResult {
  bands: GaussianParameters[];
  edge: GaussianParameters | null;
  /** Baseline polynomial (in the scaled variable of `scale`). */
  baselineCoefficients: Float64Array;
  scale: PolynomialScale;
  /** Standard deviation of each band's position, cm-1 (NaN when the covariance is singular). */
  positionSd: Float64Array;
  /** Root-mean-square residual (unweighted), signal unit. */
  rms: number;
  /** Weighted sum of squares Σ (w_i r_i)² (χ² when the weights are 1/σ_i). */
  chiSquare: number;
  /** Free parameters: 3 per band, 3 for an edge, order + 1 for the baseline. */
  parameters: number;
  iterations: number;
  converged: boolean;
}

/** Fits over (x, y): x ascending (masked points removed), y the signal. */
export function xyRefineBands(x: Float64Array, y: Float64Array, options: RefineBandsOptions): RefineBandsResult {
  const { baselineOrder = 1, fwhmLimits = [250, 10000], positionFreedom = 1500, maxIterations = 100, chiSquareTolerance = 0.01, beyondLowEnd = 0 } = options;
  const n = x.length;
  const xMin = x[0] as number;
  const xMax = x[n - 1] as number;
  const scale = xPolynomialScale(x);
  let yMax = 0;
  for (let i = 0; i < n; i++) yMax = Math.max(yMax, Math.abs(y[i] as number));
  yMax = Math.max(yMax, 1e-12);
  const layout: BandModelLayout = { bands: options.bands.length, edge: options.edge !== null, polynomialLength: baselineOrder + 1, scale, xEnd: xMax };
  const p = bandModelParameterCount(layout);
  const initial = new Float64Array(p);
  const lower = new Float64Array(p).fill(Number.NEGATIVE_INFINITY);
  const upper = new Float64Array(p).fill(Number.POSITIVE_INFINITY);
  options.bands.forEach((c, j) => {
    const freedom = Math.max(c.fwhm, positionFreedom);
    initial.set([c.position, c.height, c.fwhm], 3 * j);
    lower.set([Math.max(Math.min(xMin, c.position) - beyondLowEnd * c.fwhm, c.position - freedom), 0, fwhmLimits[0]], 3 * j);
    upper.set([Math.min(xMax, c.position + freedom), 3 * yMax, fwhmLimits[1]], 3 * j);
    const fixed = options.fixedPositions?.[j];
    if (fixed !== undefined && Number.isFinite(fixed)) {
      initial[3 * j] = fixed;
      lower[3 * j] = fixed;
      upper[3 * j] = fixed;
    }
    const width = options.fixedFwhms?.[j];
    if (width !== undefined && Number.isFinite(width)) {
      initial[3 * j + 2] = width;
      lower[3 * j + 2] = width;
      upper[3 * j + 2] = width;
    }
  });
  const e0 = 3 * options.bands.length;
  if (options.edge !== null) {
    const d = Math.min(Math.max(options.edge.position - xMax, EDGE_LIMITS.distance[0]), EDGE_LIMITS.distance[1]);
    const w = Math.min(Math.max(options.edge.fwhm, EDGE_LIMITS.fwhm[0]), EDGE_LIMITS.fwhm[1]);
    initial.set([gaussianValue(xMax, xMax + d, options.edge.height, w), d, w], e0);
    lower.set([0, EDGE_LIMITS.distance[0], EDGE_LIMITS.fwhm[0]], e0);
    upper.set([10 * yMax, EDGE_LIMITS.distance[1], EDGE_LIMITS.fwhm[1]], e0);
  }
  const b0 = e0 + (layout.edge ? 3 : 0);
  initial.set(options.baselineStart ?? xyPolynomialFit(x, options.baselineGuess, baselineOrder, scale), b0);
  // Work arrays reused between fits of a thread (band-model-work-reuse.ts).
  const work = reusedBandModelWork(n, p);
  const weights = options.weights ?? null;
  const fit = levenbergMarquardtNormal(
    {
      normal: (v, a, g) => xyBandModelNormal(x, y, weights, layout, v, a, g, work),
      cost: (v) => xyBandModelCost(x, y, weights, layout, v, work.residuals),
    },
    { initial, lower, upper, maxIterations, tolerance: 1e-8, absoluteTolerance: weights === null ? 0 : chiSquareTolerance },
  );
  const v = fit.parameters;
  const bands = options.bands.map((_, j) => ({ position: v[3 * j] as number, height: v[3 * j + 1] as number, fwhm: v[3 * j + 2] as number }));
  let edge: GaussianParameters | null = null;
  if (layout.edge) {
    const d = v[e0 + 1] as number;
    const w = v[e0 + 2] as number;
    edge = { position: xMax + d, fwhm: w, height: (v[e0] as number) * Math.exp((FOUR_LN2 * d * d) / (w * w)) };
  }
  const a = new Float64Array(p * p);
  const cost = xyBandModelNormal(x, y, weights, layout, v, a, new Float64Array(p), work);
  const model = xBandModelValues(x, layout, v, new Float64Array(n));
  let rss = 0;
  for (let i = 0; i < n; i++) rss += ((y[i] as number) - (model[i] as number)) ** 2;
  const sd = xSymmetricInverseDiagonal(a, p, options.bands.map((_, j) => 3 * j));
  const s2 = n > p ? cost / (n - p) : Number.NaN;
  return {
    bands,
    edge,
    baselineCoefficients: v.slice(b0),
    scale,
    positionSd: Float64Array.from(sd, (d) => (d >= 0 && Number.isFinite(d * s2) ? Math.sqrt(d * s2) : Number.NaN)),
    rms: Math.sqrt(rss / Math.max(n, 1)),
    chiSquare: cost,
    parameters: p,
    iterations: fit.iterations,
    converged: fit.converged,
  };
}

/** Bounds of the edge: its centre 1500–40 000 cm-1 above the range, FWHM 5000–40 000 cm-1. */
const EDGE_LIMITS = { distance: [1500, 40000], fwhm: [5000, 40000] } as const;

/**
 * Diagonal entries (A⁻¹)_jj of a symmetric positive definite p × p matrix
 * for the listed j, by Cholesky solves against unit vectors; NaN when A is
 * not positive definite. `a` is left unchanged.
 */
export function xSymmetricInverseDiagonal(a: Float64Array, p: number, indices: number[]): Float64Array {
  const out = new Float64Array(indices.length).fill(Number.NaN);
  const rhs = new Float64Array(p);
  const sol = new Float64Array(p);
  for (let k = 0; k < indices.length; k++) {
    const j = indices[k] as number;
    rhs.fill(0);
    rhs[j] = 1;
    if (!choleskySolveInPlace(Float64Array.from(a), rhs, p, sol)) return out;
    out[k] = sol[j] as number;
  }
  return out;
}
