/**
 * Step 4 of the model selection (fit-band-model.ts), the bands added to a
 * model: from the residual (residualCandidates, broadenedWeak), under the UV
 * edge (bandUnderEdge, unless a curved baseline does as well:
 * curvatureExplains), and a narrow line on a broad band restarted
 * (narrowLineRestart).
 */
import { edgeLike, gaussiansMerge, prune, xNearestIndex } from './band-model-rules.js';
import { BIC_MARGIN, type Context, type FitBandModelOptions, refine } from './band-model-trial.js';
import { type BandCandidate, xyFindBandCandidates } from './xy-find-band-candidates.js';
import { xPolynomialScale, xPolynomialValues, xyPolynomialFit } from './xy-polynomial.js';
import type { GaussianParameters, RefineBandsResult } from './xy-refine-bands.js';

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
export function residualCandidates(x: Float64Array, r: Float64Array, fit: RefineBandsResult, o: FitBandModelOptions): BandCandidate[] {
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
export function broadenedWeak(trial: RefineBandsResult, before: RefineBandsResult, extra: GaussianParameters, o: FitBandModelOptions): boolean {
  if (extra.fwhm >= 2 * o.narrowFwhm) return false;
  const added = trial.bands
    .filter((b) => before.bands.every((a) => Math.abs(a.position - b.position) > 0.15 * a.fwhm))
    .sort((a, b) => Math.abs(a.position - extra.position) - Math.abs(b.position - extra.position))[0];
  if (added === undefined || added.fwhm < 2 * o.narrowFwhm) return false;
  return added.height < (o.minAddedFraction ?? 0) * trial.bands.reduce((m, b) => Math.max(m, b.height), 0);
}

/**
 * Starting positions of a band hidden under the UV edge, in units of
 * broadFwhm below the top of the range: a shoulder of a d–d band on a
 * steep charge-transfer rise (the 3T1g(P) band of Ni(II) near 395 nm in a
 * 380–780 nm spectrum) shows no maximum and no curvature the candidate
 * search sees, and the edge's free width absorbs it. A few starts span the
 * last two band widths of the range.
 */
export const UNDER_EDGE_STARTS = [0.3, 0.6, 1, 1.5];

/**
 * A band under the edge trades its position against the edge's: it is kept
 * while its position deviation is under half its FWHM (the limit for noisy
 * data) even on smooth data, and reports that deviation as its
 * uncertainty, rather than being dropped and its place taken by the edge.
 */
export const UNDER_EDGE_UNCERTAIN = 0.5;

/** Broadest band under the edge, in units of broadFwhm: spin-allowed d–d bands are 2 000–5 000 cm-1 wide (common practice). */
export const UNDER_EDGE_BROADEST = 2;

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
export function bandUnderEdge(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
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
export function narrowLineRestart(ctx: Context, fit: RefineBandsResult): RefineBandsResult {
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
