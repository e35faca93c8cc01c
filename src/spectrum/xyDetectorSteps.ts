/**
 * Steps at a lamp or detector change-over: the absorbance jumps between two
 * neighbouring points by far more than the noise while the points on each
 * side run smoothly (typically near 350 nm, or 800–900 nm).
 */

export interface DetectorStep {
  /** The jump lies between point `index` and `index + 1` (ascending wavenumber order). */
  index: number;
  /** Size of the jump after removing the local slope, y[index+1] − y[index] − slope. */
  size: number;
  /** Wavenumber midway across the jump, cm-1. */
  position: number;
}

export interface FindDetectorStepsOptions {
  /** Noise standard deviation of y (per point). */
  noise: number;
  /** A jump must exceed this many noise deviations of a difference. @default 10 */
  threshold?: number;
  /** A jump must also exceed this fraction of y's range (ignores rounding steps). @default 0.003 */
  minRelativeSize?: number;
  /** Most steps reported. @default 3 */
  maxSteps?: number;
}

/**
 * Finds steps in y over ascending x. A step is a first difference whose
 * excess over the local slope (the median of the 6 neighbouring
 * differences) exceeds `threshold` × √2 × noise and the relative floor, and
 * is at least 4 times the excess of each neighbouring difference (a
 * single-point spike gives two large differences and is not a step).
 */
export function xyFindDetectorSteps(x: Float64Array, y: Float64Array, options: FindDetectorStepsOptions): DetectorStep[] {
  const { noise, threshold = 10, minRelativeSize = 0.003, maxSteps = 3 } = options;
  const n = y.length;
  if (n < 8) return [];
  const d = new Float64Array(n - 1);
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const v = y[i] as number;
    if (i < n - 1) d[i] = (y[i + 1] as number) - v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const excess = new Float64Array(n - 1);
  const neighbours: number[] = [];
  for (let i = 0; i < n - 1; i++) {
    neighbours.length = 0;
    for (let k = i - 3; k <= i + 3; k++) if (k !== i && k >= 0 && k < n - 1) neighbours.push(d[k] as number);
    neighbours.sort((a, b) => a - b);
    excess[i] = (d[i] as number) - (neighbours[neighbours.length >> 1] as number);
  }
  const floor = Math.max(threshold * Math.SQRT2 * noise, minRelativeSize * (max - min));
  const steps: DetectorStep[] = [];
  for (let i = 1; i < n - 2; i++) {
    const e = Math.abs(excess[i] as number);
    if (e > floor && e > 4 * Math.abs(excess[i - 1] as number) && e > 4 * Math.abs(excess[i + 1] as number)) {
      steps.push({ index: i, size: excess[i] as number, position: ((x[i] as number) + (x[i + 1] as number)) / 2 });
    }
  }
  steps.sort((a, b) => Math.abs(b.size) - Math.abs(a.size));
  return steps.slice(0, maxSteps).sort((a, b) => a.index - b.index);
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
