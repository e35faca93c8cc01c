/**
 * Steps at a lamp or detector change-over: the absorbance jumps between two
 * neighbouring points by far more than the noise while the points on each
 * side run smoothly (typically near 350 nm, or 800–900 nm).
 */
import { xNoiseLocal } from './x-noise.js';
import { median } from '../numeric/median.js';

export interface DetectorStep {
  /** The jump lies between point `index` and `index + 1` (ascending wavenumber order). */
  index: number;
  /** Size of the jump, y after minus y before, with the local slope removed. */
  size: number;
  /** Wavenumber midway across the jump, cm-1. */
  position: number;
  /** |size| in noise deviations of the jump. */
  significance: number;
}

export interface FindDetectorStepsOptions {
  /**
   * A jump must exceed this many of its own noise deviations: a correction
   * changes the user's data, so only overwhelming evidence counts. @default 12
   */
  threshold?: number;
  /** Lower bound of the noise deviation of one point (the rounding noise q/√12 of rounded data). @default 0 */
  noiseFloor?: number;
  /** The noise deviation of every point when known (rounded smooth data: q/√12); else estimated locally (xNoiseLocal). */
  pointNoise?: number;
  /** A jump must also be at least this large (several rounding steps: one step of the rounding is no evidence). @default 0 */
  minSize?: number;
  /** A jump must also exceed this fraction of y's range (ignores rounding steps). @default 0.003 */
  minRelativeSize?: number;
  /** Points in the straight line fitted on each side. @default 8 */
  side?: number;
  /** Most steps reported. @default 3 */
  maxSteps?: number;
}

/**
 * Finds steps in y over ascending x. At each junction a straight line is
 * fitted to `side` points on either side and both are extrapolated to the
 * junction: their difference is the jump, and its noise follows from the
 * local noise (xNoiseLocal) and the two fits' leverage. A step is a jump
 * over `threshold` deviations (and the relative floor) that is the largest
 * within `side` points, happens between the two points themselves (their
 * difference, less the local slope times their spacing, carries at least
 * half of it) and remains when those two
 * points are left out of the side fits, and is not undone by a jump of the
 * other sign within 3 × side points: a steep but smooth rise, a band edge,
 * a narrow band or a one-point spike fails one of these. The deviation of
 * a jump is the larger of what the local noise predicts and the robust
 * spread of all the jumps of the spectrum (smoothed noise wanders in
 * stretches that the point-to-point noise does not show).
 */
export function xyFindDetectorSteps(x: Float64Array, y: Float64Array, options: FindDetectorStepsOptions = {}): DetectorStep[] {
  const { threshold = 8, minRelativeSize = 0.003, side = 8, maxSteps = 3, noiseFloor = 0, minSize = 0 } = options;
  const n = y.length;
  if (n < 2 * side + 2) return [];
  const noise = options.pointNoise === undefined ? xNoiseLocal(y) : new Float64Array(n).fill(options.pointNoise);
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const v of y) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const jump = new Float64Array(n - 1);
  const score = new Float64Array(n - 1);
  const theory = new Float64Array(n - 1);
  for (let i = side - 1; i < n - side; i++) {
    const xm = ((x[i] as number) + (x[i + 1] as number)) / 2;
    const left = lineAt(x, y, i - side + 1, i + 1, xm);
    const right = lineAt(x, y, i + 1, i + side + 1, xm);
    const sigma = Math.max(noise[i] as number, noise[i + 1] as number, noiseFloor, 1e-300);
    jump[i] = right.value - left.value;
    theory[i] = sigma * Math.sqrt(left.leverage + right.leverage);
  }
  // Smoothed (correlated) noise moves whole stretches: its second differences are small, its jumps are not. The jumps'
  // own robust spread over the spectrum is a floor under their deviation.
  const spread = xRobustSpread(jump.subarray(side - 1, n - side));
  for (let i = side - 1; i < n - side; i++) score[i] = Math.abs(jump[i] as number) / Math.max(theory[i] as number, spread);
  const floor = Math.max(minRelativeSize * (max - min), minSize);
  const steps: DetectorStep[] = [];
  for (let i = side - 1; i < n - side; i++) {
    const j = jump[i] as number;
    if ((score[i] as number) < threshold || Math.abs(j) < floor) continue;
    let isPeak = true;
    for (let k = Math.max(0, i - side); k <= Math.min(n - 2, i + side) && isPeak; k++) if (k !== i && (score[k] as number) > (score[i] as number)) isPeak = false;
    // The jump must happen between the two points: their difference, less what the local slope explains (a steep band flank has large differences and no step).
    const xm0 = ((x[i] as number) + (x[i + 1] as number)) / 2;
    const slope = 0.5 * (lineAt(x, y, i - side + 1, i + 1, xm0).slope + lineAt(x, y, i + 1, i + side + 1, xm0).slope);
    const difference = (y[i + 1] as number) - (y[i] as number) - slope * ((x[i + 1] as number) - (x[i] as number));
    if (!isPeak || Math.sign(difference) !== Math.sign(j) || Math.abs(difference) < 0.5 * Math.abs(j)) continue;
    // A spike moves one point only: without the two points at the junction the jump must remain.
    const xm = ((x[i] as number) + (x[i + 1] as number)) / 2;
    const outer = i - side >= 0 && i + side + 2 <= n
      ? lineAt(x, y, i + 2, i + side + 2, xm).value - lineAt(x, y, i - side, i, xm).value
      : j;
    // A narrow band rises and falls within a few points: a jump of the other sign close by makes it a band, not a step.
    let returns = false;
    for (let k = Math.max(side - 1, i - 3 * side); k <= Math.min(n - side - 1, i + 3 * side) && !returns; k++) {
      if (k !== i && Math.sign(jump[k] as number) === -Math.sign(j) && Math.abs(jump[k] as number) >= 0.5 * Math.abs(j)) returns = true;
    }
    if (!returns && Math.sign(outer) === Math.sign(j) && Math.abs(outer) >= 0.5 * Math.abs(j)) {
      steps.push({ index: i, size: j, position: ((x[i] as number) + (x[i + 1] as number)) / 2, significance: score[i] as number });
    }
  }
  steps.sort((a, b) => Math.abs(b.size) - Math.abs(a.size));
  return steps.slice(0, maxSteps).sort((a, b) => a.index - b.index);
}

/** 1.4826 × the median absolute deviation from the median (σ of normal data, robust to the few real jumps and band flanks). */
function xRobustSpread(values: Float64Array): number {
  if (values.length === 0) return 0;
  const centre = median(values);
  return 1.4826 * median(Float64Array.from(values, (v) => Math.abs(v - centre)));
}

/** Least-squares line through points [from, to) evaluated at xm, with its leverage 1/k + (xm − x̄)²/Sxx. */
function lineAt(x: Float64Array, y: Float64Array, from: number, to: number, xm: number): { value: number; leverage: number; slope: number } {
  const k = to - from;
  let sx = 0;
  let sy = 0;
  for (let i = from; i < to; i++) {
    sx += x[i] as number;
    sy += y[i] as number;
  }
  const mx = sx / k;
  const my = sy / k;
  let sxx = 0;
  let sxy = 0;
  for (let i = from; i < to; i++) {
    const dx = (x[i] as number) - mx;
    sxx += dx * dx;
    sxy += dx * ((y[i] as number) - my);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  return { value: my + slope * (xm - mx), leverage: 1 / k + (sxx > 0 ? (xm - mx) ** 2 / sxx : 0), slope };
}

/**
 * Removes steps by shifting the low-energy side of each (points 0..index)
 * by the step size, so the high-energy (UV-visible) side keeps its values.
 * Returns a new array.
 */
export function xyCorrectDetectorSteps(y: Float64Array, steps: DetectorStep[]): Float64Array {
  const out = Float64Array.from(y);
  for (const step of steps) for (let i = 0; i <= step.index; i++) out[i] = (out[i] as number) + step.size;
  return out;
}
