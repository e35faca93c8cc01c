/**
 * The rules of the band model that need no trial fit: which bands start
 * (strongestBands), which go (prune: weak, duplicate, undetermined), which
 * are the UV edge or sit on the low end of the range, and two bands as one
 * (gaussiansMerge). Used by the steps of fit-band-model.ts.
 */
import { gaussianValue } from './gaussian.js';
import type { GaussianParameters, RefineBandsResult } from './xy-refine-bands.js';

/** The `count` bands of largest area (height × FWHM), in ascending position; all of them when there are no more. */
export function strongestBands<T extends GaussianParameters>(bands: readonly T[], count: number): T[] {
  if (bands.length <= count) return [...bands];
  return [...bands].sort((p, q) => q.height * q.fwhm - p.height * p.fwhm).slice(0, count).sort((p, q) => p.position - q.position);
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
 * bands, which noise mimics more easily), duplicates of a stronger
 * neighbour, or too uncertain (position deviation over half the FWHM).
 * Uncertain bands go one at a time, the weakest (by area) first: two
 * components sharing one band are both uncertain, and one of them is
 * needed. Returns the kept bands, or null when all are kept.
 */
export function prune(fit: RefineBandsResult, x: Float64Array, noise: Float64Array, narrowFwhm: number, uncertainFraction = 0.5): GaussianParameters[] | null {
  const keep: GaussianParameters[] = [];
  const uncertain: GaussianParameters[] = [];
  let changed = false;
  const order = fit.bands.map((b, k) => ({ b, sd: fit.positionSd[k] as number })).sort((p, q) => q.b.height - p.b.height);
  for (const { b, sd } of order) {
    const sigma = noise[xNearestIndex(x, b.position)] as number;
    const weak = b.height < (b.fwhm < 2 * narrowFwhm ? 5 : 3) * sigma;
    const duplicate = keep.some((k) => Math.abs(k.position - b.position) < 0.2 * Math.max(k.fwhm, b.fwhm) && Math.abs(Math.log(k.fwhm / b.fwhm)) < 0.7);
    if (weak || duplicate) changed = true;
    else {
      keep.push(b);
      if (Number.isFinite(sd) && sd > uncertainFraction * b.fwhm) uncertain.push(b);
    }
  }
  if (!changed && uncertain.length > 0) {
    const weakest = uncertain.reduce((w, b) => (b.height * b.fwhm < w.height * w.fwhm ? b : w));
    keep.splice(keep.indexOf(weakest), 1);
    changed = true;
  }
  return changed ? keep.sort((p, q) => p.position - q.position) : null;
}

/**
 * A band whose centre lies more than this fraction of its FWHM inside the top of the range has a maximum of its
 * own there and is a band, not the UV edge (the edge, a CT band above the range, may not take a d–d maximum inside
 * it: the 3T1g(P) band of Ni(II) at 395 nm in a 380–780 nm spectrum).
 */
export const EDGE_INSIDE = 0.1;
/** A band whose centre is within one FWHM of the top of the range and that shows no maximum inside it (centre above top − EDGE_INSIDE·FWHM) or is too broad for a d–d band. */
export function edgeLike(b: GaussianParameters, xMax: number, broadFwhm: number): boolean {
  return b.position > xMax - b.fwhm && (b.position > xMax - EDGE_INSIDE * b.fwhm || b.fwhm > 3 * broadFwhm);
}

export function atLowEnd(b: GaussianParameters, xMin: number): boolean {
  return b.position < xMin + 0.25 * b.fwhm;
}

/** One band with the area, mean and variance of two (Gaussian moments). */
export function gaussiansMerge(p: GaussianParameters, q: GaussianParameters): GaussianParameters {
  const ap = p.height * p.fwhm;
  const aq = q.height * q.fwhm;
  const area = Math.max(ap + aq, 1e-300);
  const position = (ap * p.position + aq * q.position) / area;
  const variance = (ap * (p.fwhm ** 2 / (8 * Math.LN2) + (p.position - position) ** 2) + aq * (q.fwhm ** 2 / (8 * Math.LN2) + (q.position - position) ** 2)) / area;
  const fwhm = Math.sqrt(8 * Math.LN2 * variance);
  return { position, fwhm, height: area / fwhm };
}

/** An edge start whose value at the top of the range is `atEnd`. */
export function edgeStart(xMax: number, atEnd: number): GaussianParameters {
  const position = xMax + 6000;
  const fwhm = 12000;
  return { position, fwhm, height: Math.max(atEnd, 0) / gaussianValue(xMax, position, 1, fwhm) };
}
