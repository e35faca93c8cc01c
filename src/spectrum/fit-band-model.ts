/**
 * From candidates to a refined set of bands (model selection). Each model is
 * scored by the Bayesian information criterion with the measured noise,
 * BIC = RSS/σ² + p ln n (σ the median noise of the grid, p free
 * parameters, n points); a more complex model is kept only when its BIC is
 * lower by more than BIC_MARGIN (10, "very strong" evidence), so a
 * component the data do not need goes. The steps:
 * 1. refine the candidates; drop bands that are weak, undetermined or
 *    duplicates (prune);
 * 2. simplify: bands within one FWHM of the top of the range that show no
 *    maximum of their own (centre above the top − FWHM/10) or are broader than
 *    3 × broadFwhm are the UV
 *    edge, not bands: they are replaced by the edge model (unless the edge
 *    is switched off); a band within FWHM/4 of the bottom of the range is
 *    dropped unless the BIC demands it; two bands closer than half the
 *    larger FWHM are tried as one (moment-merged) band;
 * 3. the edge (in 'auto' mode) is tried off when present and on when
 *    absent, kept by the same criterion;
 * 4. a band is added where the residual still shows one (not at the range
 *    boundaries; a broad band the first fit lost is sought against the white
 *    noise too: residualCandidates), kept only by the criterion; then step 2–3 again; a band
 *    under the edge is tried (bandUnderEdge), kept only when one more
 *    baseline order cannot do as well; a narrow maximum of the data that
 *    the model has no line for, on a broad band, restarts that band and its
 *    narrowest neighbour as one broad band and a line (narrowLineRestart);
 * 5. the chosen model is refined to convergence and pruned once more (a
 *    band undetermined only at convergence is dropped), so no reported band
 *    has a position deviation over half its FWHM.
 */
import { gaussianValue } from './gaussian.js';
import { type BandCandidate, xyFindBandCandidates } from './xy-find-band-candidates.js';
import { xPolynomialScale, xPolynomialValues, xyPolynomialFit } from './xy-polynomial.js';
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

function refine(
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
function weightsFromNoise(noise: Float64Array): Float64Array {
  let w = weightCache.get(noise);
  if (w === undefined) {
    const floor = 0.1 * xMedian(noise);
    w = Float64Array.from(noise, (s) => 1 / Math.max(s, floor, 1e-300));
    weightCache.set(noise, w);
  }
  return w;
}

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
function prune(fit: RefineBandsResult, x: Float64Array, noise: Float64Array, narrowFwhm: number, uncertainFraction = 0.5): GaussianParameters[] | null {
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
export function fitBandModel(x: Float64Array, y: Float64Array, options: FitBandModelOptions): RefineBandsResult {
  const n = x.length;
  const o: FitBandModelOptions = { ...options, baselineStart: options.baselineStart ?? xyPolynomialFit(x, options.baselineGuess, options.baselineOrder, xPolynomialScale(x)) };
  const sigma = xMedian(o.noise);
  const ctx: Context = { x, y, o, sigma, score: (f) => bandFitBic(f, n), mode: o.edgeMode ?? 'auto' };
  const xMax = x[n - 1] as number;
  // Candidates at the top of the range are the edge's rise, not bands (the edge is tried on later). Beyond maxBands the
  // largest (by area, height × FWHM) start, not the lowest in energy: on noisy data narrow noise candidates crowd one
  // stretch, and a strong band at the far end must not be left out (v2-aqua/nir of tests/accuracy/ lost its 4T1g(P)).
  const start = strongestBands(o.candidates.filter((c) => ctx.mode === false || !edgeLike(c, xMax, o.broadFwhm)), o.maxBands)
    .map((c) => ({ position: c.position, height: c.height, fwhm: c.fwhm }));
  const edge0 = ctx.mode === false ? null : o.edge;
  let fit = refine(x, y, start, edge0, o);
  for (let loop = 0; loop < 3; loop++) {
    const kept = prune(fit, x, o.noise, o.narrowFwhm, o.uncertainFraction);
    if (kept === null) break;
    fit = refine(x, y, kept, fit.edge, o);
  }
  fit = simplify(ctx, fit);
  let added = 0;
  for (; added < 3 && fit.bands.length < o.maxBands; added++) {
    const r = residual(x, y, fit);
    const xMin = x[0] as number;
    const extra = residualCandidates(x, r, fit, o)
      .filter((c) => fit.bands.every((b) => Math.abs(b.position - c.position) > 0.15 * b.fwhm))
      .filter((c) => !atLowEnd(c, xMin) && !(ctx.mode !== false && edgeLike(c, xMax, o.broadFwhm)))
      .filter((c) => c.fwhm < 2 * o.narrowFwhm || c.height >= (o.minAddedFraction ?? 0) * fit.bands.reduce((m, b) => Math.max(m, b.height), 0))
      .sort((a, b) => b.height * Math.sqrt(b.fwhm) - a.height * Math.sqrt(a.fwhm))[0];
    if (extra === undefined) break;
    const trial = refine(x, y, [...fit.bands, { position: extra.position, height: extra.height, fwhm: extra.fwhm }].sort((a, b) => a.position - b.position), fit.edge, o);
    if (prune(trial, x, o.noise, o.narrowFwhm, o.uncertainFraction) !== null || ctx.score(trial) >= ctx.score(fit) - BIC_MARGIN) break;
    if (broadenedWeak(trial, fit, extra, o)) break;
    fit = trial;
  }
  if (added > 0) fit = simplify(ctx, fit);
  fit = bandUnderEdge(ctx, fit);
  fit = broadBandsToBaseline(ctx, fit);
  fit = narrowLineRestart(ctx, fit);
  // The chosen model is refined to convergence (its trial stopped at the coarser tolerance, or early).
  let final = refine(x, y, fit.bands, fit.edge, ctx.o, { maxIterations: 200, chiSquareTolerance: 0.01 });
  // Converged, a band may have drifted where its position is undetermined (a broad band taking up the baseline's
  // curvature at the end of the range): pruned at the lenient limit a band under the edge is held to.
  for (let loop = 0; loop < 3; loop++) {
    const pruned = prune(final, x, o.noise, o.narrowFwhm, Math.max(o.uncertainFraction ?? 0.5, UNDER_EDGE_UNCERTAIN));
    // At a closed low end a band that drifted onto it (its maximum in the masked data) goes too.
    const kept = o.closedLowEnd === true && final.bands.some((b) => atLowEnd(b, x[0] as number))
      ? (pruned ?? final.bands).filter((b) => !atLowEnd(b, x[0] as number)) : pruned;
    if (kept === null || kept.length === 0) break;
    final = refine(x, y, kept, final.edge, ctx.o, { maxIterations: 200, chiSquareTolerance: 0.01 });
  }
  return final;
}

/** Height, as a fraction of the tallest band, from which a broad band in the residual is sought against the white noise. */
const LOST_BAND_FRACTION = 0.1;

/**
 * Bands the residual `r` of `fit` still shows: candidates whose curvature
 * stands 5 σ above the fit's σ (`noise`), and broad ones (FWHM at least
 * 2 × narrowFwhm) whose curvature stands 5 σ above the white noise, at
 * least LOST_BAND_FRACTION of the tallest band high and 5 fit σ above the
 * residual: a band the first fit lost (collapsed to zero height under a
 * charge-transfer rise, where the shape error dominates σ: the 4T1g(P)
 * band of V(II) near 29 000 cm-1 in a 250–2500 nm spectrum, tests/spectrum/
 * lost-band.test.ts). The shape error is smooth and the criterion that
 * keeps a band is the fit's, so the white-noise search only proposes.
 */
function residualCandidates(x: Float64Array, r: Float64Array, fit: RefineBandsResult, o: FitBandModelOptions): BandCandidate[] {
  const search = { broadFwhm: o.broadFwhm, narrowFwhm: o.narrowFwhm, significance: 5 };
  const found = xyFindBandCandidates(x, r, { ...search, noise: o.noise });
  if (o.whiteNoise === undefined) return found;
  const tallest = fit.bands.reduce((m, b) => Math.max(m, b.height), 0);
  const lost = xyFindBandCandidates(x, r, { ...search, noise: o.whiteNoise, narrow: false })
    .filter((c) => c.fwhm >= 2 * o.narrowFwhm && c.height >= LOST_BAND_FRACTION * tallest && c.height > 5 * (o.noise[xNearestIndex(x, c.position)] as number))
    .filter((c) => found.every((f) => Math.abs(f.position - c.position) > 0.5 * c.fwhm))
    // Only where the data showed a band at the start (a broad candidate) that no fitted band now covers: a lost band.
    .filter((c) => o.candidates.some((k) => k.fwhm >= 2 * o.narrowFwhm && Math.abs(k.position - c.position) < 0.5 * k.fwhm
      && fit.bands.every((b) => Math.abs(b.position - k.position) > 0.5 * Math.max(b.fwhm, k.fwhm))));
  return [...found, ...lost];
}

/**
 * A narrow residual candidate (a spin-forbidden line, exempt from
 * minAddedFraction) that the refinement broadened past 2 × narrowFwhm is no
 * longer a line: it is taking up a broad misfit (the heavy tail of an
 * asymmetric band, a scattering baseline's curvature between bands) and is
 * held, like any broad added band, to minAddedFraction of the tallest band.
 */
function broadenedWeak(trial: RefineBandsResult, before: RefineBandsResult, extra: GaussianParameters, o: FitBandModelOptions): boolean {
  if (extra.fwhm >= 2 * o.narrowFwhm) return false;
  const added = trial.bands
    .filter((b) => before.bands.every((a) => Math.abs(a.position - b.position) > 0.15 * a.fwhm))
    .sort((a, b) => Math.abs(a.position - extra.position) - Math.abs(b.position - extra.position))[0];
  if (added === undefined || added.fwhm < 2 * o.narrowFwhm) return false;
  return added.height < (o.minAddedFraction ?? 0) * trial.bands.reduce((m, b) => Math.max(m, b.height), 0);
}

interface Context {
  x: Float64Array;
  y: Float64Array;
  o: FitBandModelOptions;
  sigma: number;
  score: (fit: RefineBandsResult) => number;
  mode: 'auto' | boolean;
}

/**
 * A band whose centre lies more than this fraction of its FWHM inside the top of the range has a maximum of its
 * own there and is a band, not the UV edge (the edge, a CT band above the range, may not take a d–d maximum inside
 * it: the 3T1g(P) band of Ni(II) at 395 nm in a 380–780 nm spectrum).
 */
const EDGE_INSIDE = 0.1;
/** A band whose centre is within one FWHM of the top of the range and that shows no maximum inside it (centre above top − EDGE_INSIDE·FWHM) or is too broad for a d–d band. */
function edgeLike(b: GaussianParameters, xMax: number, broadFwhm: number): boolean {
  return b.position > xMax - b.fwhm && (b.position > xMax - EDGE_INSIDE * b.fwhm || b.fwhm > 3 * broadFwhm);
}

function atLowEnd(b: GaussianParameters, xMin: number): boolean {
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
function edgeStart(xMax: number, atEnd: number): GaussianParameters {
  const position = xMax + 6000;
  const fwhm = 12000;
  return { position, fwhm, height: Math.max(atEnd, 0) / gaussianValue(xMax, position, 1, fwhm) };
}

/**
 * At a closed low end (closedLowEnd) the bands on it go by rule. What they
 * took up is mostly the baseline's curvature there (a scattering baseline
 * bends, the data beside a masked negative stretch are the upper part of
 * their noise), so the model without them is tried with the baseline as it
 * is and one order higher (up to 3), the better kept; ctx.o's order changes
 * when the higher one is.
 */
function withoutLowEndBands(ctx: Context, fit: RefineBandsResult, low: GaussianParameters[]): RefineBandsResult {
  const { x, y, o } = ctx;
  const bands = fit.bands.filter((b) => !low.includes(b));
  const same = refine(x, y, bands, fit.edge, o);
  if (o.baselineOrder >= 3) return same;
  const order = o.baselineOrder + 1;
  const raised: FitBandModelOptions = { ...o, baselineOrder: order, baselineStart: xyPolynomialFit(x, o.baselineGuess, order, xPolynomialScale(x)) };
  const curved = refine(x, y, bands, fit.edge, raised);
  if (ctx.score(curved) >= ctx.score(same)) return same;
  ctx.o = raised;
  return curved;
}

/** Steps 2 and 3 of the model selection (see the file's docstring). */
function simplify(ctx: Context, initial: RefineBandsResult): RefineBandsResult {
  const { x, y, o } = ctx;
  const xMin = x[0] as number;
  const xMax = x[x.length - 1] as number;
  let fit = initial;
  const tryModel = (bands: GaussianParameters[], edge: GaussianParameters | null, margin: number): boolean => {
    const trial = refine(x, y, bands, edge, o);
    if (ctx.score(trial) < ctx.score(fit) + margin) {
      fit = trial;
      return true;
    }
    return false;
  };
  for (let round = 0; round < 8; round++) {
    const bands = fit.bands;
    if (ctx.mode !== false) {
      const edgeBands = bands.filter((b) => edgeLike(b, xMax, o.broadFwhm));
      if (edgeBands.length > 0) {
        const atEnd = edgeBands.reduce((s, b) => s + gaussianValue(xMax, b.position, b.height, b.fwhm), 0);
        // A rule, not a test: a band at the top of the range is the edge.
        tryModel(bands.filter((b) => !edgeBands.includes(b)), fit.edge ?? edgeStart(xMax, atEnd), Number.POSITIVE_INFINITY);
        continue;
      }
    }
    const low = bands.filter((b) => atLowEnd(b, xMin));
    if (low.length > 0 && o.closedLowEnd === true) {
      fit = withoutLowEndBands(ctx, fit, low);
      continue;
    }
    if (low.length > 0 && tryModel(bands.filter((b) => !low.includes(b)), fit.edge, BIC_MARGIN)) continue;
    let merged = false;
    const pairs: Array<[number, number]> = [];
    for (let j = 0; j + 1 < bands.length; j++) {
      const p = bands[j] as GaussianParameters;
      const q = bands[j + 1] as GaussianParameters;
      if (Math.abs(q.position - p.position) < 0.5 * Math.max(p.fwhm, q.fwhm)) pairs.push([j, Math.abs(q.position - p.position) / Math.max(p.fwhm, q.fwhm)]);
    }
    pairs.sort((a, b) => a[1] - b[1]);
    for (const [j] of pairs) {
      const one = gaussiansMerge(bands[j] as GaussianParameters, bands[j + 1] as GaussianParameters);
      if (tryModel([...bands.slice(0, j), one, ...bands.slice(j + 2)], fit.edge, BIC_MARGIN)) {
        merged = true;
        break;
      }
    }
    if (!merged) break;
  }
  if (ctx.mode === 'auto') {
    if (fit.edge !== null) tryModel(fit.bands, null, BIC_MARGIN);
    else {
      const r = residual(x, y, fit);
      let tail = 0;
      const k = Math.max(3, Math.floor(0.03 * x.length));
      for (let i = x.length - k; i < x.length; i++) tail += (r[i] as number) / k;
      tryModel(fit.bands, edgeStart(xMax, Math.max(tail, 3 * ctx.sigma)), -BIC_MARGIN);
    }
  }
  return fit;
}

/** A band broader than this many typical band widths, away from the top of the range, is scattering or baseline. */
const BASELINE_BROAD = 3;

/**
 * A band broader than BASELINE_BROAD × broadFwhm (7 500 cm-1 by default;
 * spin-allowed d–d bands are 2 000–5 000 cm-1 wide, common practice)
 * inside the range is the curvature of a scattering baseline (1/λ⁴ is ν⁴),
 * which the straight baseline cannot follow: it is tried replaced by one
 * more order of the baseline polynomial (up to 3) and the model
 * simplified so when the criterion does not prefer the broad band by more
 * than BIC_MARGIN (a simpler model, as in the merge of two bands). Where
 * the data show a maximum under the broad band (a band candidate of d–d
 * width within its half width: the 3T1g(P) band of Ni(II) beside a steep
 * charge-transfer onset), that band restarts from the candidate instead of
 * going with the curvature.
 * Changes ctx.o's baseline order when it succeeds. Only where the model
 * keeps another band: a lone band is never taken for the baseline.
 */
function broadBandsToBaseline(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
  const { x, y, o } = ctx;
  const broad = fit.bands.filter((b) => b.fwhm > BASELINE_BROAD * o.broadFwhm);
  if (broad.length === 0 || broad.length === fit.bands.length || o.baselineOrder >= 3) return fit;
  const order = o.baselineOrder + 1;
  const scale = xPolynomialScale(x);
  const raised: FitBandModelOptions = { ...o, baselineOrder: order, baselineStart: xyPolynomialFit(x, o.baselineGuess, order, scale) };
  // A broad band over a maximum the data show (a band candidate of d–d width within its half width) has taken up the
  // baseline's curvature beside a real band: that band restarts from the candidate, rather than going with the curvature.
  const restarted = broad.flatMap((b) => o.candidates
    .filter((c) => c.fwhm <= UNDER_EDGE_BROADEST * o.broadFwhm && Math.abs(c.position - b.position) < 0.5 * b.fwhm)
    .filter((c) => fit.bands.every((k) => broad.includes(k) || Math.abs(k.position - c.position) > 0.5 * k.fwhm))
    .map((c) => ({ position: c.position, height: c.height, fwhm: c.fwhm })));
  const trial = refine(x, y, [...fit.bands.filter((b) => !broad.includes(b)), ...restarted].sort((a, b) => a.position - b.position), fit.edge, raised);
  if (ctx.score(trial) >= ctx.score(fit) + BIC_MARGIN) return fit;
  ctx.o = raised;
  return trial;
}

/**
 * Starting positions of a band hidden under the UV edge, in units of
 * broadFwhm below the top of the range: a shoulder of a d–d band on a
 * steep charge-transfer rise (the 3T1g(P) band of Ni(II) near 395 nm in a
 * 380–780 nm spectrum) shows no maximum and no curvature the candidate
 * search sees, and the edge's free width absorbs it. A few starts span the
 * last two band widths of the range.
 */
const UNDER_EDGE_STARTS = [0.3, 0.6, 1, 1.5];

/**
 * A band under the edge trades its position against the edge's: it is kept
 * while its position deviation is under half its FWHM (the limit for noisy
 * data) even on smooth data, and reports that deviation as its
 * uncertainty, rather than being dropped and its place taken by the edge.
 */
const UNDER_EDGE_UNCERTAIN = 0.5;

/** Broadest band under the edge, in units of broadFwhm: spin-allowed d–d bands are 2 000–5 000 cm-1 wide (common practice). */
const UNDER_EDGE_BROADEST = 2;

/**
 * With an edge in the model, tries one more band under it near the top of
 * the range, from each start of UNDER_EDGE_STARTS (height a third of the
 * data above the baseline there, FWHM broadFwhm); the best trial is kept
 * when it wins by BIC_MARGIN, its band has a maximum inside the range (not
 * edge-like), stands apart from the other bands by a FWHM (not a split
 * of one of them), is no broader than UNDER_EDGE_BROADEST band widths nor
 * weaker than minAddedFraction of the tallest band, and no band of it is weak, a duplicate or undetermined
 * (prune, with position deviations up to UNDER_EDGE_UNCERTAIN of the
 * FWHM). So the edge may not take a d–d band's place; where the data have
 * only the edge, the extra band does not pay for its parameters.
 */
function bandUnderEdge(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
  const { x, y, o } = ctx;
  if (fit.edge === null || ctx.mode === false || fit.bands.length >= o.maxBands) return fit;
  const xMax = x[x.length - 1] as number;
  const base = xPolynomialValues(x, fit.baselineCoefficients, fit.scale);
  let best: RefineBandsResult | null = null;
  for (const k of UNDER_EDGE_STARTS) {
    const position = xMax - k * o.broadFwhm;
    if (position <= (x[0] as number) || fit.bands.some((b) => Math.abs(b.position - position) < 0.5 * b.fwhm)) continue;
    const i = xNearestIndex(x, position);
    const height = ((y[i] as number) - (base[i] as number)) / 3;
    if (!(height > 0)) continue;
    const bands = [...fit.bands, { position, height, fwhm: o.broadFwhm }].sort((a, b) => a.position - b.position);
    const trial = refine(x, y, bands, fit.edge, o);
    if (best === null || ctx.score(trial) < ctx.score(best)) best = trial;
  }
  if (best === null || ctx.score(best) >= ctx.score(fit) - BIC_MARGIN) return fit;
  // The new band is the one not in the old model: it must stand apart from the old bands (not split one of them) and be
  // no broader than UNDER_EDGE_BROADEST × broadFwhm (broader, it is a piece of the charge-transfer tail itself).
  const added = best.bands.find((b) => fit.bands.every((a) => Math.abs(a.position - b.position) > 0.25 * a.fwhm));
  if (added === undefined || added.fwhm > UNDER_EDGE_BROADEST * o.broadFwhm) return fit;
  // Like a band added from the residual: on smooth data a weak broad residual is the band model's shape error.
  if (added.height < (o.minAddedFraction ?? 0) * best.bands.reduce((m, b) => Math.max(m, b.height), 0)) return fit;
  if (best.bands.some((b) => b !== added && Math.abs(b.position - added.position) < Math.max(b.fwhm, added.fwhm))) return fit;
  if (best.bands.some((b) => edgeLike(b, xMax, o.broadFwhm)) || prune(best, x, o.noise, o.narrowFwhm, Math.max(o.uncertainFraction ?? 0.5, UNDER_EDGE_UNCERTAIN)) !== null) return fit;
  if (curvatureExplains(ctx, fit, best)) return fit;
  if (skewExplains(ctx, fit, best, added)) return fit;
  return best;
}

/**
 * Where a skewed band's high-energy side meets the edge (the start of the
 * skew component, in FWHM of the band above its centre; its width, in the
 * band's FWHM): the heavy high-energy half of a d–d band (skewness 1.2–1.6).
 */
const SKEW_COMPONENT = { offset: 0.6, fwhm: 0.8, height: 0.3 } as const;

/** Largest distance, cm-1, between the two components of one skewed band: the span gaussians-group-multiplets.ts joins over. */
const SKEW_SPAN = 2000;

/**
 * Widest to narrowest component of one skewed band: two Gaussians drawing a
 * band of skewness up to 1.6 differ in width by about 1.5 (measured here on
 * split-Gaussian bands); a much broader "component" is a tail reaching for
 * another band.
 */
const SKEW_WIDTH_RATIO = 1.6;

/**
 * Whether the band below the one added under the edge, given a second
 * component on its high-energy side (the way a sum of Gaussians draws a
 * skewed band; gaussians-group-multiplets.ts joins such a pair back into one
 * band), explains the data about as well as the added band: its score is
 * not worse by more than BIC_MARGIN (both add three parameters). A d–d band
 * skewed to high energy (the vibronic envelope, common practice) under a
 * charge-transfer rise leaves a broad misfit between its maximum and the
 * rise that the edge's Gaussian cannot take, and a band "under the edge"
 * took it: a false shoulder (tests/spectrum/skewed-band-on-ct-tail.test.ts).
 * A real band under the edge, well above the band below it (the 3T1g(P)
 * band of Ni(II) near 395 nm, 11 000 cm-1 above 3T1g(F)), is not drawn by
 * a component on that band's flank.
 */
function skewExplains(ctx: Context, without: RefineBandsResult, withBand: RefineBandsResult, added: GaussianParameters): boolean {
  const { x, y, o } = ctx;
  const below = without.bands.filter((b) => b.position < added.position).sort((a, b) => b.position - a.position)[0];
  if (below === undefined) return false;
  const component = { position: below.position + SKEW_COMPONENT.offset * below.fwhm, height: SKEW_COMPONENT.height * below.height, fwhm: SKEW_COMPONENT.fwhm * below.fwhm };
  const skewed = refine(x, y, [...without.bands, component].sort((a, b) => a.position - b.position), without.edge, o);
  // Still one skewed band: the two components within SKEW_SPAN of each other (the span a multiplet is joined over),
  // not a component that wandered off to be the band under the edge itself.
  const near = skewed.bands.filter((b) => Math.abs(b.position - below.position) < below.fwhm).sort((a, b) => a.position - b.position);
  const widths = near.map((b) => b.fwhm);
  const oneBand = near.length >= 2 && (near[near.length - 1]!.position - near[0]!.position) <= SKEW_SPAN
    && Math.max(...widths) <= SKEW_WIDTH_RATIO * Math.min(...widths)
    && skewed.bands.every((b) => b.position < added.position - 0.5 * added.fwhm);
  if (!oneBand) return false;
  // The band is needed when it still wins by BIC_MARGIN over the skewed band, with the skew component beside it.
  // Two starts (the skewed band with the added one, the added band's model with the component): the better counts.
  const starts = [
    refine(x, y, [...skewed.bands, added].sort((a, b) => a.position - b.position), skewed.edge, o),
    refine(x, y, [...withBand.bands, component].sort((a, b) => a.position - b.position), withBand.edge, o),
  ];
  const both = ctx.score(starts[0]!) <= ctx.score(starts[1]!) ? starts[0]! : starts[1]!;
  return ctx.score(skewed) <= Math.min(ctx.score(withBand), ctx.score(both)) + BIC_MARGIN;
}

/**
 * Whether one more order of the baseline polynomial (up to 3), with no new
 * band, explains the data about as well as `withBand`: its score is not
 * worse than the band model's by more than BIC_MARGIN, the margin a model
 * with more components must win by (the band adds three parameters, the
 * order one). Below a charge-transfer edge the data bend smoothly: the
 * edge's Gaussian is a stand-in for a CT band of unknown shape, a
 * scattering baseline (1/λ⁴ is ν⁴) curves up, and the high-energy tails
 * of asymmetric d–d bands are heavier than Gaussians; the broad misfit they
 * leave is what a band under the edge would take up: a band the data do
 * not have, beside the one d9 band of [Cu(NH3)4(H2O)2]2+ in a 380–780 nm
 * spectrum (tests/accuracy/, cu2-ammine/vis). A real band under the edge
 * (the 3T1g(P) band of Ni(II) near 395 nm) is a shoulder that a
 * polynomial cannot follow.
 */
function curvatureExplains(ctx: Context, without: RefineBandsResult, withBand: RefineBandsResult): boolean {
  const { x, y, o } = ctx;
  if (o.baselineOrder >= 3) return false;
  const order = o.baselineOrder + 1;
  const raised: FitBandModelOptions = { ...o, baselineOrder: order, baselineStart: xyPolynomialFit(x, o.baselineGuess, order, xPolynomialScale(x)) };
  const curved = refine(x, y, without.bands, without.edge, raised);
  return ctx.score(curved) <= ctx.score(withBand) + BIC_MARGIN;
}

/**
 * A narrow line on a broad band can settle on the wrong side of it: started
 * from the line's own maximum, the two trade roles in the refinement (the
 * broad band's start is narrower than the band, the line's start is on its
 * flank), and the model ends with a narrower component on the band's
 * low-energy flank and the band, too narrow, centred between the two (the
 * 3T1g(F) band of [Ni(H2O)6]2+ with the 1Eg line on its high-energy side:
 * a band reported 700 cm-1 high, tests/accuracy/, ni2-aqua/vis-2). So for
 * each narrow band candidate of the data (FWHM under 2 × narrowFwhm) that
 * no component of comparable width (under twice its FWHM) lies within a
 * FWHM of, on a broad component (the nearest over twice as wide, within
 * half its FWHM), the broad component and the narrowest other component
 * within its FWHM restart as the broad band with both components' area,
 * mean and variance (gaussiansMerge) and a line at the candidate; the
 * restart is kept when it wins by BIC_MARGIN (the same number of
 * parameters) and none of its bands is weak, a duplicate or undetermined
 * (prune).
 */
function narrowLineRestart(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
  const { x, y, o } = ctx;
  let best = fit;
  const lines = o.candidates.filter((c) => c.fwhm < 2 * o.narrowFwhm
    && fit.bands.every((b) => b.fwhm >= 2 * c.fwhm || Math.abs(b.position - c.position) >= c.fwhm));
  for (const c of lines) {
    const host = fit.bands
      .filter((b) => b.fwhm >= 2 * c.fwhm && Math.abs(b.position - c.position) < 0.5 * b.fwhm)
      .sort((p, q) => Math.abs(p.position - c.position) - Math.abs(q.position - c.position))[0];
    if (host === undefined) continue;
    const partner = fit.bands
      .filter((b) => b !== host && b.fwhm < host.fwhm && Math.abs(b.position - host.position) < host.fwhm)
      .sort((p, q) => p.fwhm - q.fwhm)[0];
    if (partner === undefined) continue;
    const others = fit.bands.filter((b) => b !== host && b !== partner);
    const bands = [...others, gaussiansMerge(partner, host), { position: c.position, height: c.height, fwhm: c.fwhm }].sort((p, q) => p.position - q.position);
    const trial = refine(x, y, bands, fit.edge, o);
    if (ctx.score(trial) < ctx.score(best) - BIC_MARGIN && prune(trial, x, o.noise, o.narrowFwhm, o.uncertainFraction) === null) best = trial;
  }
  return best;
}

/** The median (src/numeric/median.ts), 0 for no values. */
function xMedian(values: Float64Array): number {
  return values.length === 0 ? 0 : median(values);
}
