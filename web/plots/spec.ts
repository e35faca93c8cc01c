/**
 * A plot described as data: the series, their looks and the marks drawn on
 * top. The same description drives the uPlot canvas and the SVG download, so
 * what is downloaded is what is seen.
 */

export interface SeriesSpec {
  label: string;
  color: string;
  /** CSS pixels. */
  width: number;
  dash?: number[];
  /** Draw markers only, no line. */
  pointsOnly?: boolean;
  /** Hide from the legend (e.g. the many lines of a level diagram). */
  quiet?: boolean;
}

export type Mark =
  /** A vertical line across the plot at x, with an optional caption at the top. */
  | { kind: 'vline'; x: number; color: string; text?: string; dash?: number[] }
  /** A filled circle at (x, y), with optional text beside it. */
  | { kind: 'point'; x: number; y: number; color: string; text?: string }
  /** Text anchored at (x, y) data coordinates, shifted up by `rise` CSS pixels. */
  | { kind: 'text'; x: number; y: number; text: string; color: string; rise?: number; align?: 'left' | 'center' | 'right' }
  /** A shaded x range (masked parts of a spectrum). */
  | { kind: 'shade'; from: number; to: number; color: string; text?: string }
  /** A vertical error bar from low to high at x, with caps. */
  | { kind: 'errorbar'; x: number; low: number; high: number; color: string };

export interface PlotSpec {
  /** Used as the SVG/PNG title and file name. */
  title: string;
  xLabel: string;
  yLabel: string;
  /** Ascending. */
  x: number[];
  /** One array per series, aligned with x; null leaves a gap. */
  ys: (number | null)[][];
  series: SeriesSpec[];
  marks: Mark[];
  /** Fixed y range, else fitted to the data. */
  yRange?: [number, number];
  /** Fixed x range, else the data's. */
  xRange?: [number, number];
  /** Named x positions (a categorical axis), instead of numeric ticks. */
  xTicks?: { value: number; label: string }[];
}

/** Range of the finite values of the given arrays; [0, 1] when there are none. */
export function dataRange(arrays: readonly (readonly (number | null)[])[]): [number, number] {
  let min = Infinity;
  let max = -Infinity;
  for (const values of arrays) {
    for (const value of values) {
      if (value === null || !Number.isFinite(value)) continue;
      if (value < min) min = value;
      if (value > max) max = value;
    }
  }
  if (min > max) return [0, 1];
  if (min === max) return [min - 1, max + 1];
  return [min, max];
}
