/**
 * Least-squares refinement of bands (Gaussians in energy), an optional UV
 * absorption edge (the low-energy tail of a Gaussian centred above the
 * range) and a low-order polynomial baseline, all fitted together, so a
 * broad weak band is not flattened into the baseline nor the baseline into
 * a band. Bounded Levenberg–Marquardt with the analytic Jacobian;
 * uncertainties from the covariance of the full model at the solution.
 *
 * (ml-spectra-fitting's `optimize` fits sums of peaks only, without a
 * baseline, and with a numerical Jacobian; it serves as the reference for
 * band-only fits in tests/reference.)
 */
import { levenbergMarquardt } from './levenbergMarquardt.js';
import { modelJacobianRow, xyModelCovariance } from './xyModelCovariance.js';
import { type PolynomialScale, xPolynomialScale, xyPolynomialFit } from './xyPolynomial.js';

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
  /** Narrowest and broadest FWHM a band may take, cm-1. @default [250, 10000] */
  fwhmLimits?: [number, number];
  /** How far a band may move from its start, cm-1: max(its starting FWHM, this). @default 1500 */
  positionFreedom?: number;
  /** Levenberg–Marquardt iterations. @default 100 */
  maxIterations?: number;
}

export interface RefineBandsResult {
  bands: GaussianParameters[];
  edge: GaussianParameters | null;
  /** Baseline polynomial (in the scaled variable of `scale`). */
  baselineCoefficients: Float64Array;
  scale: PolynomialScale;
  /** Standard deviation of each band's position, cm-1 (NaN when the covariance is singular). */
  positionSd: Float64Array;
  /** Root-mean-square residual. */
  rms: number;
  /** Free parameters: 3 per band, 3 for an edge, order + 1 for the baseline. */
  parameters: number;
  iterations: number;
  converged: boolean;
}

/** Fits over (x, y): x ascending (masked points removed), y the signal. */
export function xyRefineBands(x: Float64Array, y: Float64Array, options: RefineBandsOptions): RefineBandsResult {
  const { baselineOrder = 1, fwhmLimits = [250, 10000], positionFreedom = 1500, maxIterations = 100 } = options;
  const n = x.length;
  const xMin = x[0] as number;
  const xMax = x[n - 1] as number;
  const scale = xPolynomialScale(x);
  let yMax = 0;
  for (let i = 0; i < n; i++) yMax = Math.max(yMax, Math.abs(y[i] as number));
  yMax = Math.max(yMax, 1e-12);
  const components = options.edge === null ? options.bands : [...options.bands, options.edge];
  const k = components.length;
  const polyLength = baselineOrder + 1;
  const p = 3 * k + polyLength;
  const initial = new Float64Array(p);
  const lower = new Float64Array(p).fill(Number.NEGATIVE_INFINITY);
  const upper = new Float64Array(p).fill(Number.POSITIVE_INFINITY);
  components.forEach((c, j) => {
    initial.set([c.position, c.height, c.fwhm], 3 * j);
    if (j < options.bands.length) {
      const freedom = Math.max(c.fwhm, positionFreedom);
      lower.set([Math.max(xMin, c.position - freedom), 0, fwhmLimits[0]], 3 * j);
      upper.set([Math.min(xMax, c.position + freedom), 3 * yMax, fwhmLimits[1]], 3 * j);
    } else {
      lower.set([xMax + 1500, 0, 5000], 3 * j);
      upper.set([xMax + 40000, 1e4 * yMax, 40000], 3 * j);
    }
  });
  initial.set(xyPolynomialFit(x, options.baselineGuess, baselineOrder, scale), 3 * k);
  const list: GaussianParameters[] = components.map(() => ({ position: 0, height: 0, fwhm: 1 }));
  const toComponents = (v: Float64Array): GaussianParameters[] => {
    for (let j = 0; j < k; j++) {
      const c = list[j] as GaussianParameters;
      c.position = v[3 * j] as number;
      c.height = v[3 * j + 1] as number;
      c.fwhm = v[3 * j + 2] as number;
    }
    return list;
  };
  const row = new Float64Array(p);
  const fit = levenbergMarquardt(
    (v, residuals, jacobian) => {
      const cs = toComponents(v);
      for (let i = 0; i < n; i++) {
        let model = modelJacobianRow(x[i] as number, cs, polyLength, scale, row);
        for (let j = 0; j < polyLength; j++) model += (row[3 * k + j] as number) * (v[3 * k + j] as number);
        residuals[i] = (y[i] as number) - model;
        jacobian.set(row, i * p);
      }
    },
    { n, initial, lower, upper, maxIterations },
  );
  const solved = toComponents(fit.parameters).map((c) => ({ ...c }));
  const coefficients = fit.parameters.slice(3 * k);
  const { residualRms, sd } = xyModelCovariance(x, y, solved, coefficients, scale);
  const bands = solved.slice(0, options.bands.length);
  return {
    bands,
    edge: options.edge === null ? null : (solved[k - 1] as GaussianParameters),
    baselineCoefficients: coefficients,
    scale,
    positionSd: Float64Array.from(bands, (_, j) => sd[3 * j] as number),
    rms: residualRms,
    parameters: p,
    iterations: fit.iterations,
    converged: fit.converged,
  };
}
