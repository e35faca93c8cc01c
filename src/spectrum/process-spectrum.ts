/**
 * Processing one spectrum: to an energy axis, masking, a uniform grid,
 * noise, band finding, a joint fit of bands, UV edge and baseline, and
 * classification. Pure; deterministic for given input.
 *
 * The grid: at most maxGridPoints (400) points; a grid value is the mean of
 * the data within ±step/2, moved along the local slope from the points'
 * mean wavenumber to the grid value (else interpolated).
 *
 * The noise model: the local noise of the data (second differences), never
 * below the rounding noise q/√12 of a rounded export (xQuantizationStep),
 * combined with a band-shape error of 3 % of the band signal, since real
 * bands are not Gaussian: noisy or smooth, a Gaussian's misfit to an
 * asymmetric band is there, and only noise larger than it hides it (the
 * two add in quadrature, so on noisy data the noise dominates). On
 * smooth data (no more noise than the rounding, or under 2·10⁻⁴ of the
 * range: smoothed or computed data) broad bands are added from the
 * residual only above a tenth of the tallest. Detector steps are corrected only on strong evidence (8 σ of
 * the jump, at least 4 rounding steps, not undone nearby: xyDetectorSteps),
 * each listed in stepCorrections with its size; correctSteps false leaves
 * the data as read.
 *
 * The window: a band whose maximum lies at or beyond the red (low-energy)
 * end is proposed from the falling data there and may have its centre up
 * to 0.6 FWHM outside the range; a maximum close to the blue end is
 * proposed as a band, so the UV edge (a CT band centred above the range)
 * cannot take its place. Each band reports its window
 * (inside / near-… / beyond-…) against the data kept: a stretch masked at
 * an end moves that end inward (keptRange), and a red end masked as
 * negative or at a step is closed, no band centred in or on it
 * (kept-window.ts); a centre outside the range carries an
 * extrapolation error of a tenth of its FWHM in its uncertainty, and a
 * centre outside it or within half its FWHM of an end is profiled: its σ
 * is at least half the distance to where the refit with the centre held is
 * clearly worse, and at least the shift to the centre at the width of the
 * bands inside the window (xy-profile-band-centre.ts).
 *
 * The fit is weighted by σ (1/σ_i) and the model is chosen by
 * the Bayesian information criterion with that noise, χ² + p ln n; a model
 * with more components is kept only when it wins by more than 10 (fit-band-model.ts):
 * - a candidate band is dropped when weaker than 3 σ (5 σ for narrow bands),
 *   when its position is undetermined (σ_position > FWHM/2), or when it
 *   duplicates a stronger one;
 * - two bands closer than half the larger FWHM are tried as one band (area,
 *   mean and variance kept) and stay two only if the data demand it; so a
 *   band is not split in two, nor a narrow band put on a broad maximum;
 * - a band within one FWHM of the top of the range whose centre lies above
 *   top − FWHM/10 (no maximum of its own) or that is broader than
 *   3 × broadFwhm is the UV edge: it is replaced by the edge model (rule,
 *   no test), unless uvEdge is false; a band within FWHM/4 of the bottom is
 *   dropped unless the criterion keeps it;
 * - uvEdge 'auto': the edge (a Gaussian tail centred 1500–40 000 cm-1 above
 *   the range) starts on when the end of the range rises, and is then tried
 *   off (when on) or on (when off), kept by the same criterion;
 * - a band is added where the residual still shows one, by the criterion.
 *
 * What is reported: a narrow band lower than five times the fit's residual
 * beside it is noise, smoothed by the instrument so that second differences
 * missed it (bandsAboveResidual); fitted components of one envelope (an
 * unresolved multiplet, or a main band and the weaker high-energy component
 * a fit makes of one skewed band) are one band
 * (gaussiansGroupMultiplets); each band with a maximum of its own is reported
 * at that maximum of the data (xyBandMaximum), since an asymmetric band's
 * Gaussian centre lies toward its tail; `components` keeps the Gaussians.
 */
import { FieldgapError, invalidArgument } from '../errors.js';
import { defaultThresholds, type ClassificationThresholds } from './band-classify.js';
import { bandsFromFit } from './bands-from-fit.js';
import { bandsAboveResidual } from './bands-above-residual.js';
import { fitBandModel } from './fit-band-model.js';
import { gaussiansGroupMultiplets } from './gaussians-group-multiplets.js';
import { gaussianValue } from './gaussian.js';
import { keptWindow } from './kept-window.js';
import { spectrumToEnergy } from './spectrum-to-energy.js';
import type { MaskReason, ProcessedSpectrum, Spectrum, StepCorrection } from './types.js';
import { xNoiseFromSecondDifferences, xNoiseLocal } from './x-noise.js';
import { xQuantizationStep } from './x-quantization-step.js';
import { xyBandMaximum, type BandMaximum } from './xy-band-maximum.js';
import { xyCorrectDetectorSteps, xyFindDetectorSteps } from './xy-detector-steps.js';
import { xyFindBandCandidates } from './xy-find-band-candidates.js';
import { xyHighEndBandCandidate, xyLowEndBandCandidate, xyNearLowEndBandCandidate } from './xy-end-band-candidates.js';
import { xyLowerHull } from './xy-lower-hull.js';
import { maskAroundStep, xyMaskedRegions, xyMaskPoints } from './xy-mask.js';
import { xPolynomialValues } from './xy-polynomial.js';
import { beyondWindowBands, beyondWindowWidthNote } from './xy-profile-band-centre.js';
import { weightsFromNoise } from './band-model-trial.js';
import { xChooseGridStep, xUniformGrid, xyResampleUniformWithCounts } from './xy-resample.js';
import { median as medianOf } from '../numeric/median.js';
import type { GaussianParameters } from './xy-refine-bands.js';

export interface ProcessSpectrumOptions {
  /** mol/L; with it, heights become ε (Beer–Lambert). @default unknown */
  concentration?: number;
  /** cm. @default 1 */
  pathLength?: number;
  /** Sets the classification thresholds (spin-allowed ε up to 100 octahedral, 1000 tetrahedral). @default tetrahedral-tolerant (1000) */
  geometry?: 'octahedral' | 'tetrahedral';
  /** Absorbance above which points are masked as saturated. @default 3 */
  saturationLimit?: number;
  /** Absorbance below −negativeLimit is masked. @default max(5 × noise, 0.01) */
  negativeLimit?: number;
  /** Correct detector change-over steps (and mask around them). @default true */
  correctSteps?: boolean;
  /** Baseline polynomial order, 0–3. @default 1 */
  baselineOrder?: number;
  /** Model a UV absorption edge: 'auto' tries it on and off and keeps what the data need; true always; false never. @default 'auto' */
  uvEdge?: 'auto' | boolean;
  /** Typical spin-allowed FWHM, cm-1 (band-finding window). @default 2500 */
  broadFwhm?: number;
  /** Narrowest FWHM sought, cm-1. @default 600 */
  narrowFwhm?: number;
  /** Most bands fitted. @default 8 */
  maxBands?: number;
  /** Most grid points (sets the coarsest grid step). @default 400 */
  maxGridPoints?: number;
  /**
   * Relative shape error of the Gaussian band model: real bands are
   * asymmetric and carry unresolved components, so the fit's σ at each
   * point is the noise combined with this fraction of the band signal there
   * (the data above the lower hull), on noisy data as on smooth: at a noise
   * of 0.002 a band of absorbance 0.5 misfits a Gaussian by more than the
   * noise. On smooth data (rounded, smoothed or noise-free: see isSmooth) a
   * band whose position is uncertain by more than a fifth of its FWHM (not
   * half) is dropped too. It is what keeps a band's asymmetry from being
   * read as extra bands. @default 0.03
   */
  shapeError?: number;
  /**
   * The metal has no d–d transitions (d0 such as MnO4- or CrO4 2-, or d10):
   * every band is charge transfer (or ligand). @default false
   */
  chargeTransferOnly?: boolean;
  /** Override classification thresholds. @default defaultThresholds(geometry) */
  thresholds?: Partial<ClassificationThresholds>;
}

export function processSpectrum(spectrum: Spectrum, options: ProcessSpectrumOptions = {}): ProcessedSpectrum {
  const {
    concentration, pathLength = 1, geometry, saturationLimit = 3, correctSteps = true, baselineOrder = 1, uvEdge = 'auto',
    broadFwhm = 2500, narrowFwhm = 600, maxBands = 8, maxGridPoints = 400, shapeError = 0.03,
  } = options;
  checkOptions(options, baselineOrder, pathLength);
  if (spectrum.metadata['jcampForm'] === 'PEAK TABLE') {
    throw new FieldgapError(
      'unsupported-format',
      'a JCAMP-DX PEAK TABLE lists peak positions, not a spectrum: there are no band shapes or baseline to fit; give the positions to the fit directly',
      `${spectrum.name}:##PEAK TABLE`,
    );
  }
  const warnings: string[] = [];
  const energy = spectrumToEnergy(spectrum, concentration, pathLength);
  const { x } = energy;
  let signal = energy.signal;
  // Rounded exports: the rounding step sets a floor under the noise (before any step correction moves values off its grid).
  const quantum = xQuantizationStep(signal);
  const rawNoise = xNoiseFromSecondDifferences(signal.filter(Number.isFinite));
  const negativeLimit = options.negativeLimit ?? Math.max(5 * rawNoise, 0.01);
  const maskOf = (absorbance: Float64Array | null, negative: number): Array<MaskReason | null> => (absorbance === null
    ? new Array<MaskReason | null>(x.length).fill(null)
    : xyMaskPoints(absorbance, { saturationLimit, negativeLimit: negative }));
  if (energy.absorbance === null) warnings.push('ε without a concentration: saturation and negative absorbance were not checked');
  // Steps are sought before negative values are masked: a downward step near a zero baseline makes the data beyond it negative.
  let absorbance = energy.absorbance;
  const stepCorrections: StepCorrection[] = [];
  const stepIndices: number[] = [];
  if (correctSteps) {
    const saturated = maskOf(absorbance, Number.POSITIVE_INFINITY);
    const finite = saturated.map((r, i) => r === null && Number.isFinite(signal[i] as number));
    // On data whose only noise is the rounding, a point's noise is q/√12 (a median of the discrete second differences says twice that).
    const roundingOnly = quantum > 0 && rawNoise <= 2.5 * quantum / Math.sqrt(12);
    const steps = xyFindDetectorSteps(x, signal.map((v, i) => (finite[i] ? v : 0)), {
      noiseFloor: quantum / Math.sqrt(12), minSize: 4 * quantum, ...(roundingOnly && { pointNoise: quantum / Math.sqrt(12) }),
    });
    const real = steps.filter((s) => finite[s.index] && finite[s.index + 1]);
    if (real.length > 0) {
      const toAbsorbance = absorbance === null || absorbance === signal ? 1 : concentration! * pathLength;
      signal = xyCorrectDetectorSteps(signal, real);
      if (absorbance !== null) absorbance = absorbance === energy.signal ? signal : xyCorrectDetectorSteps(absorbance, real.map((s) => ({ ...s, size: s.size * toAbsorbance })));
      for (const s of real) {
        stepIndices.push(s.index);
        stepCorrections.push({ position: s.position, wavelength: 1e7 / s.position, size: s.size, significance: s.significance });
        warnings.push(`corrected a step of ${s.size.toPrecision(3)} at ${s.position.toFixed(0)} cm-1 (${(1e7 / s.position).toFixed(1)} nm), a lamp or detector change-over (${s.significance.toFixed(0)} noise deviations; step correction can be switched off)`);
      }
    }
  }
  const reasons = maskOf(absorbance, negativeLimit);
  for (const index of stepIndices) maskAroundStep(reasons, index);
  const masked = xyMaskedRegions(x, reasons);
  const kept = Uint8Array.from(reasons, (r, i) => (r === null && Number.isFinite(signal[i] as number) ? 1 : 0));
  const step = xChooseGridStep(x, maxGridPoints);
  const grid = xUniformGrid(x[0] as number, x[x.length - 1] as number, step);
  const { y: onGrid, counts } = xyResampleUniformWithCounts(x, signal, kept, grid, { slopeCorrected: true });
  const fx = grid.filter((_, i) => Number.isFinite(onGrid[i] as number));
  const fy = onGrid.filter(Number.isFinite);
  const measuredNoise = gridNoise(x, signal, kept, grid, onGrid, counts);
  const localNoise = measuredNoise.map((s) => Math.hypot(s, quantum / Math.sqrt(12)));
  const noise = median(localNoise);
  const range: [number, number] = [x[0] as number, x[x.length - 1] as number];
  // The data used: a masked stretch at an end (negative, saturated, a step) moves that end of the band window inward.
  const used = keptWindow(range, masked, fx.length > 0 ? fx : Float64Array.of(range[0], range[1]));
  const empty = (): ProcessedSpectrum => ({
    points: spectrum.x.length, range, keptRange: used.window, xUnit: spectrum.xUnit, yUnit: spectrum.yUnit, masked, grid, signal: onGrid,
    baseline: new Float64Array(grid.length), model: new Float64Array(grid.length), signalUnit: energy.signalUnit, bands: [], components: [],
    edge: null, noise, quantization: quantum, stepCorrections, fit: { points: fx.length, parameters: 0, rms: 0, iterations: 0, converged: true }, warnings,
  });
  if (fx.length < 10) {
    warnings.push(`only ${fx.length} grid points left after masking: no bands fitted`);
    return empty();
  }
  if (fx.length < 0.5 * grid.length) warnings.push(`${Math.round(100 * (1 - fx.length / grid.length))}% of the range is masked`);
  const hull = xyLowerHull(fx, fy);
  const lifted = Float64Array.from(fy, (v, i) => v - (hull[i] as number));
  const edge = chooseEdge(fx, fy, hull, noise, uvEdge);
  const lowest = fy.reduce((m, v) => Math.min(m, v), Number.POSITIVE_INFINITY);
  // A band whose maximum lies at or beyond the red end has no maximum of its own to find: it is proposed, and the baseline starts under it.
  const lowEnd = used.redEndOpen ? xyLowEndBandCandidate(fx, fy, { noise: localNoise }) : null;
  const baselineGuess = lowEnd === null
    ? hull
    : Float64Array.from(hull, (h, i) => Math.max(Math.min(h, (fy[i] as number) - gaussianValue(fx[i] as number, lowEnd.position, lowEnd.height, lowEnd.fwhm)), lowest));
  // The fit's σ: measurement and rounding noise, and the shape error of a Gaussian band model on real bands.
  const smooth = isSmooth(median(measuredNoise), quantum, fy);
  const sigma = Float64Array.from(localNoise, (s, i) => Math.hypot(s, shapeError * Math.max((fy[i] as number) - (baselineGuess[i] as number), 0)));
  // Candidates are judged by their curvature against the white noise; the shape error is smooth and enters the fit only.
  const candidates = xyFindBandCandidates(fx, lifted, { noise: localNoise, broadFwhm, narrowFwhm, narrow: false });
  if (lowEnd !== null && candidates.every((c) => c.position > (fx[0] as number) + 0.5 * lowEnd.fwhm)) candidates.unshift({ ...lowEnd, pass: 'broad' });
  // A maximum close to the blue end is a band, not part of the UV edge; one close to the red end is a band too.
  for (const end of [xyHighEndBandCandidate(fx, fy, { noise: localNoise }), lowEnd === null ? xyNearLowEndBandCandidate(fx, fy, { noise: localNoise }) : null]) {
    if (end !== null && candidates.every((c) => Math.abs(c.position - end.position) > 0.5 * end.fwhm)) candidates.push({ ...end, pass: 'broad' });
  }
  candidates.sort((a, b) => a.position - b.position);
  if (candidates.length === 0 && edge === null) {
    warnings.push('no band stands out of the noise');
    return empty();
  }
  const fitted = fitBandModel(fx, fy, { candidates, edge, baselineGuess, baselineOrder, noise: sigma, whiteNoise: localNoise, beyondLowEnd: used.redEndOpen ? BEYOND_LOW_END : 0, closedLowEnd: !used.redEndOpen, uncertainFraction: smooth ? 0.2 : 0.5, minAddedFraction: smooth ? 0.1 : 0, broadFwhm, narrowFwhm, maxBands, edgeMode: uvEdge });
  // A centre outside the window is extrapolated from one flank: its σ from the profile and from the width assumed
  // (model error and all), not from the curvature at the best fit (xy-profile-band-centre.ts).
  const fit = fitted;
  const { positionSd, beyond } = beyondWindowBands(fx, fy, fit, {
    weights: weightsFromNoise(sigma), baselineGuess, window: used.window, redEndOpen: used.redEndOpen, narrowFwhm,
  });
  const polynomial = (xs: Float64Array) => xPolynomialValues(xs, fit.baselineCoefficients, fit.scale);
  const baseline = polynomial(grid);
  if (fit.edge !== null) for (let i = 0; i < grid.length; i++) baseline[i] = (baseline[i] as number) + gaussianValue(grid[i] as number, fit.edge.position, fit.edge.height, fit.edge.fwhm);
  const model = Float64Array.from(baseline);
  for (const b of fit.bands) for (let i = 0; i < grid.length; i++) model[i] = (model[i] as number) + gaussianValue(grid[i] as number, b.position, b.height, b.fwhm);
  const epsilonPerSignal = energy.signalUnit === 'epsilon' ? 1 : concentration === undefined ? null : 1 / (concentration * pathLength);
  const thresholds = { ...defaultThresholds(geometry), ...options.thresholds };
  const edgeAt = (v: number) => (fit.edge === null ? 0 : gaussianValue(v, fit.edge.position, fit.edge.height, fit.edge.fwhm));
  // The fit's residual on the kept points: what the model leaves, smoothed noise and all.
  const residualAt = Float64Array.from(fy, (v, i) => v - (polynomial(fx.subarray(i, i + 1))[0] as number) - edgeAt(fx[i] as number)
    - fit.bands.reduce((sum, b) => sum + gaussianValue(fx[i] as number, b.position, b.height, b.fwhm), 0));
  const significant = bandsAboveResidual(fit.bands, fx, residualAt, narrowFwhm);
  // One band per envelope: a multiplet (spin–orbit, Jahn–Teller) or an asymmetric band fitted by two Gaussians is one band.
  const grouped = gaussiansGroupMultiplets(significant.map((k) => fit.bands[k] as GaussianParameters), Float64Array.from(significant, (k) => positionSd[k] as number), {
    // Only broad candidates say how many broad bands the data show (a narrow one, a line or smoothed noise, says nothing).
    minFwhm: thresholds.narrowFwhm, dataBands: candidates.filter((c) => c.fwhm >= 2 * narrowFwhm).map((c) => c.position),
  });
  const { bands: found, relative } = bandsFromFit(grouped.bands, {
    epsilonPerSignal, positionSd: grouped.positionSd, noise, gridStep: step, thresholds, range: used.window,
    baselineAt: (v) => (polynomial(Float64Array.of(v))[0] as number) + edgeAt(v),
    maxima: bandMaxima(grid, onGrid, baseline, grouped.bands, grouped.components),
  });
  grouped.components.forEach((parts, k) => {
    if (parts.length < 2) return;
    warnings.push(`fitted components at ${parts.map((b) => b.position.toFixed(0)).join(', ')} cm-1 overlap without a maximum or shoulder of their own: reported as one band at ${found[k]!.position.toFixed(0)} cm-1: a split (spin–orbit or Jahn–Teller) band at its components' centroid, or an asymmetric band at its maximum`);
  });
  const bands = options.chargeTransferOnly === true ? found.map((b) => ({ ...b, kind: 'charge-transfer' as const })) : found;
  if (!fit.converged) warnings.push(`the band fit stopped after ${fit.iterations} iterations without converging: treat the band parameters with care`);
  if (relative && bands.length > 0 && options.chargeTransferOnly !== true) warnings.push('no concentration given: bands classified by relative intensity and width only');
  for (const b of bands) {
    if (b.window === 'inside') continue;
    const red = b.window.endsWith('red-end');
    const mask = red ? used.lowEndMask : used.highEndMask;
    const end = `${red ? 'red (low-energy)' : 'blue (high-energy)'} end${mask === null ? '' : ' of the data kept'}, ${Math.round(used.window[red ? 0 : 1])} cm-1${mask === null ? '' : ` (beyond it masked: ${mask})`}`;
    warnings.push(b.maximumInWindow
      ? `the band at ${b.position.toFixed(0)} cm-1 (${b.wavelength.toFixed(0)} nm) has its maximum near the ${end}: its far side is not measured, so its centre is less certain (± ${b.positionUncertainty.toFixed(0)} cm-1)`
      : `the band at ${b.position.toFixed(0)} cm-1 (${b.wavelength.toFixed(0)} nm) has its maximum outside the measured range, beyond the ${end}: its centre is estimated from its flank (± ${b.positionUncertainty.toFixed(0)} cm-1, from how far the centre can move before the fit is clearly worse)${beyondWindowWidthNote(b.position, beyond)}`);
  }
  if (fit.edge !== null) warnings.push(`a UV absorption edge was modelled (a Gaussian tail centred at ${fit.edge.position.toFixed(0)} cm-1, above the measured range)`);
  return {
    points: spectrum.x.length, range, keptRange: used.window, xUnit: spectrum.xUnit, yUnit: spectrum.yUnit, masked, grid, signal: onGrid, baseline, model,
    signalUnit: energy.signalUnit, bands, components: grouped.bands.map((b) => ({ position: b.position, height: b.height, fwhm: b.fwhm })),
    edge: fit.edge, noise, quantization: quantum, stepCorrections,
    fit: { points: fx.length, parameters: fit.parameters, rms: fit.rms, iterations: fit.iterations, converged: fit.converged }, warnings,
  };
}

/**
 * Each reported band's position where it is not its Gaussian's centre:
 * its maximum as the data show it (xyBandMaximum) on the grid, the top of
 * the signal (NaN where masked) less the baseline (with the edge) and the
 * fitted components of every other band. The same rule for a lone Gaussian
 * and a joined group, from its centre (a group's: the area-weighted mean of
 * its components): a maximum on the low-energy side is an asymmetric band's
 * and stands; a top above the centre means unresolved components of unequal
 * height, and then a group stands at its components' mean, their
 * intensity-weighted centroid (the unsplit transition energy of a
 * Jahn–Teller or spin–orbit multiplet: common practice), and a lone
 * Gaussian at its centre, which approximates it. On the corpus
 * (tests/accuracy/) reporting a group at the maximum of its components'
 * sum instead cost cu2-ammine/uvvis-smooth (10Dq +5.3 %, now −0.3 %).
 */
function bandMaxima(grid: Float64Array, signal: Float64Array, baseline: Float64Array, bands: GaussianParameters[], groups: GaussianParameters[][]): Array<BandMaximum | null> {
  const rest = Float64Array.from(signal, (v, i) => v - (baseline[i] as number));
  for (const parts of groups) for (const b of parts) for (let i = 0; i < grid.length; i++) rest[i] = (rest[i] as number) - gaussianValue(grid[i] as number, b.position, b.height, b.fwhm);
  return bands.map((band, k) => {
    const parts = groups[k] as GaussianParameters[];
    const own = Float64Array.from(rest, (v, i) => parts.reduce((sum, b) => sum + gaussianValue(grid[i] as number, b.position, b.height, b.fwhm), v));
    if (parts.length === 1) return xyBandMaximum(grid, own, band.position, band.fwhm);
    const area = parts.reduce((sum, b) => sum + b.height * b.fwhm, 0);
    const mean = parts.reduce((sum, b) => sum + b.height * b.fwhm * b.position, 0) / area;
    return xyBandMaximum(grid, own, mean, band.fwhm) ?? { position: mean, sd: 0 };
  });
}

/** A band centre may lie up to this fraction of its FWHM below the low-energy end of the range. */
const BEYOND_LOW_END = 0.6;

/**
 * An edge is modelled when the last 10 % of the kept range rises by more
 * than 5 noise deviations, at more than twice the mean slope of the lower
 * hull (an upturn, not a sloping baseline). It starts as a Gaussian
 * 6000 cm-1 above the range, FWHM 12 000 cm-1, matching the rise at the end.
 */
function chooseEdge(x: Float64Array, y: Float64Array, hull: Float64Array, noise: number, mode: 'auto' | boolean): GaussianParameters | null {
  if (mode === false) return null;
  const n = x.length;
  const end = x[n - 1] as number;
  const position = end + 6000;
  const fwhm = 12000;
  const k = Math.max(2, Math.floor(0.1 * n));
  const rise = (y[n - 1] as number) - (y[n - 1 - k] as number);
  const endSlope = rise / (end - (x[n - 1 - k] as number));
  const meanSlope = ((hull[n - 1] as number) - (hull[0] as number)) / (end - (x[0] as number));
  if (mode === 'auto' && !(rise > 5 * noise && endSlope > 2 * Math.max(meanSlope, 0))) return null;
  const atEnd = Math.max(rise, 5 * noise);
  return { position, fwhm, height: atEnd / gaussianValue(end, position, 1, fwhm) };
}

/**
 * Data are smooth when their measured noise is no more than the rounding
 * noise (1.5 q/√12), or, unrounded, under 2·10⁻⁴ of their range (smoothed
 * or computed data). On such data a broad residual of a few per cent is the
 * band model's shape error, not a band, and a band's position must be well
 * determined (a fifth of its FWHM) to stand.
 */
function isSmooth(measured: number, quantum: number, y: Float64Array): boolean {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const v of y) {
    min = Math.min(min, v);
    max = Math.max(max, v);
  }
  return measured <= Math.max(1.5 * quantum / Math.sqrt(12), 2e-4 * (max - min));
}

/**
 * Noise deviation of each kept grid value: the local noise of the data
 * (xNoiseLocal over the kept points) at the nearest data point, divided by
 * √(points averaged); interpolated values keep the data's noise.
 */
function gridNoise(x: Float64Array, y: Float64Array, kept: Uint8Array, grid: Float64Array, onGrid: Float64Array, counts: Uint16Array): Float64Array {
  const kx = x.filter((_, i) => kept[i] === 1);
  const local = xNoiseLocal(y.filter((_, i) => kept[i] === 1));
  const out: number[] = [];
  let j = 0;
  for (let g = 0; g < grid.length; g++) {
    if (!Number.isFinite(onGrid[g] as number)) continue;
    const v = grid[g] as number;
    while (j + 1 < kx.length && Math.abs((kx[j + 1] as number) - v) <= Math.abs((kx[j] as number) - v)) j++;
    out.push((local[j] as number) / Math.sqrt(Math.max(1, counts[g] as number)));
  }
  return Float64Array.from(out);
}

/** The median (src/numeric/median.ts), 0 for no values. */
function median(values: Float64Array): number {
  return values.length === 0 ? 0 : medianOf(values);
}

function checkOptions(o: ProcessSpectrumOptions, baselineOrder: number, pathLength: number): void {
  if (o.concentration !== undefined && !(o.concentration > 0 && Number.isFinite(o.concentration))) {
    throw invalidArgument('concentration', `concentration: expected a positive number of mol/L, got ${o.concentration}`);
  }
  if (!(pathLength > 0 && Number.isFinite(pathLength))) throw invalidArgument('pathLength', `pathLength: expected a positive number of cm, got ${pathLength}`);
  if (!Number.isInteger(baselineOrder) || baselineOrder < 0 || baselineOrder > 3) {
    throw invalidArgument('baselineOrder', `baselineOrder: expected 0, 1, 2 or 3, got ${baselineOrder}`);
  }
  if (o.saturationLimit !== undefined && !(o.saturationLimit > 0)) throw invalidArgument('saturationLimit', `saturationLimit: expected a positive absorbance, got ${o.saturationLimit}`);
}
