/**
 * Steps 2 and 3 of the model selection (fit-band-model.ts): simplify (the
 * UV edge for bands at the top of the range, bands at the low end, two close
 * bands as one, the edge on or off) and a broad band replaced by one more
 * order of the baseline.
 */
import { gaussianValue } from './gaussian.js';
import { UNDER_EDGE_BROADEST } from './band-model-additions.js';
import { atLowEnd, edgeLike, edgeStart, gaussiansMerge } from './band-model-rules.js';
import { BIC_MARGIN, type Context, type FitBandModelOptions, refine, residual } from './band-model-trial.js';
import { xPolynomialScale, xyPolynomialFit } from './xy-polynomial.js';
import type { GaussianParameters, RefineBandsResult } from './xy-refine-bands.js';

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
export function simplify(ctx: Context, initial: RefineBandsResult): RefineBandsResult {
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
export function broadBandsToBaseline(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
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
