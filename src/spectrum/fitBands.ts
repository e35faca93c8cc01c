/**
 * From candidates to a refined set of bands: refine, drop bands the data
 * do not support, and add a band where the residual still shows one (kept
 * only if it lowers the Bayesian information criterion).
 */
import { gaussianValue } from './gaussian.js';
import { type BandCandidate, xyFindBandCandidates } from './xyFindBandCandidates.js';
import { xPolynomialValues } from './xyPolynomial.js';
import { type GaussianParameters, type RefineBandsResult, xyRefineBands } from './xyRefineBands.js';

export interface FitBandsOptions {
  candidates: BandCandidate[];
  edge: GaussianParameters | null;
  baselineGuess: Float64Array;
  baselineOrder: number;
  /** Local noise deviation at each x. */
  noise: Float64Array;
  broadFwhm: number;
  narrowFwhm: number;
  /** Most bands kept. */
  maxBands: number;
}

/** BIC of a Gaussian-error fit: n ln(RSS/n) + p ln n. */
function bic(fit: RefineBandsResult, n: number): number {
  return n * Math.log(Math.max(fit.rms * fit.rms, 1e-300)) + fit.parameters * Math.log(n);
}

function refine(x: Float64Array, y: Float64Array, bands: GaussianParameters[], edge: GaussianParameters | null, o: FitBandsOptions): RefineBandsResult {
  return xyRefineBands(x, y, { bands, edge, baselineGuess: o.baselineGuess, baselineOrder: o.baselineOrder });
}

/** Index of the x nearest to v (x ascending). */
export function xNearestIndex(x: Float64Array, v: number): number {
  let lo = 0;
  let hi = x.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((x[mid] as number) < v) lo = mid;
    else hi = mid;
  }
  return Math.abs((x[lo] as number) - v) <= Math.abs((x[hi] as number) - v) ? lo : hi;
}

/**
 * Bands too weak (height under 3 local noise deviations, 5 for narrow
 * bands, which noise mimics more easily), too uncertain (position
 * deviation over half the FWHM), or duplicates of a stronger neighbour.
 * Returns the kept bands, or null when all are kept.
 */
function prune(fit: RefineBandsResult, x: Float64Array, noise: Float64Array, narrowFwhm: number): GaussianParameters[] | null {
  const keep: GaussianParameters[] = [];
  let changed = false;
  const order = fit.bands.map((b, k) => ({ b, sd: fit.positionSd[k] as number })).sort((p, q) => q.b.height - p.b.height);
  for (const { b, sd } of order) {
    const sigma = noise[xNearestIndex(x, b.position)] as number;
    const weak = b.height < (b.fwhm < 2 * narrowFwhm ? 5 : 3) * sigma;
    const undetermined = Number.isFinite(sd) && sd > 0.5 * b.fwhm;
    const duplicate = keep.some((k) => Math.abs(k.position - b.position) < 0.2 * Math.max(k.fwhm, b.fwhm) && Math.abs(Math.log(k.fwhm / b.fwhm)) < 0.7);
    if (weak || undetermined || duplicate) changed = true;
    else keep.push(b);
  }
  return changed ? keep.sort((p, q) => p.position - q.position) : null;
}

function residual(x: Float64Array, y: Float64Array, fit: RefineBandsResult): Float64Array {
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

/**
 * Fits over (x, y): uniform, ascending x without gaps in the fitted part
 * (masked points removed). Returns the last accepted fit.
 */
export function fitBands(x: Float64Array, y: Float64Array, o: FitBandsOptions): RefineBandsResult {
  const start = o.candidates.slice(0, o.maxBands).map((c) => ({ position: c.position, height: c.height, fwhm: c.fwhm }));
  let fit = refine(x, y, start, o.edge, o);
  for (let loop = 0; loop < 3; loop++) {
    const kept = prune(fit, x, o.noise, o.narrowFwhm);
    if (kept === null) break;
    fit = refine(x, y, kept, fit.edge, o);
  }
  for (let added = 0; added < 4 && fit.bands.length < o.maxBands; added++) {
    const r = residual(x, y, fit);
    const extra = xyFindBandCandidates(x, r, { noise: o.noise, broadFwhm: o.broadFwhm, narrowFwhm: o.narrowFwhm, significance: 5 })
      .filter((c) => fit.bands.every((b) => Math.abs(b.position - c.position) > 0.15 * b.fwhm))
      .sort((a, b) => b.height * Math.sqrt(b.fwhm) - a.height * Math.sqrt(a.fwhm))[0];
    if (extra === undefined) break;
    const trial = refine(x, y, [...fit.bands, { position: extra.position, height: extra.height, fwhm: extra.fwhm }].sort((a, b) => a.position - b.position), fit.edge, o);
    const pruned = prune(trial, x, o.noise, o.narrowFwhm);
    if (pruned !== null || bic(trial, x.length) >= bic(fit, x.length) - 10) break;
    fit = trial;
  }
  return fit;
}
