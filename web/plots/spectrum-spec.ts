/**
 * PlotSpecs for a spectrum: the measured signal, the baseline, each fitted
 * band on the baseline and their sum, each band labelled with its
 * assignment; the residual of the band model; and an overlay of several
 * spectra. Data arrive in cm-1; the nm axis is made here by the core's 10^7/x (src/spectrum/units.ts) and a
 * reversal so x stays ascending.
 */
import type { Assignment, Curves, FitResult, MaskedRange } from '../types.js';
import type { EditableBand } from '../state.js';
import type { Mark, PlotSpec, SeriesSpec } from './spec.js';
import { levelLabel } from '../format.js';
import { valueToWavenumber, wavenumberToValue } from '../../src/spectrum/units.js';
import { splitPairLimit } from '../../src/fit/penalties.js';
import { ASSIGNED_KIND_NOTE, assignedKindOf } from '../../src/report/band-assigned-kind.js';
import { dataRange } from './spec.js';

export type AxisUnit = 'cm-1' | 'nm';

export const PALETTE = ['#1f5fa8', '#c2410c', '#15803d', '#7e22ce', '#a16207', '#0e7490', '#be185d', '#4d7c0f', '#9f1239', '#334155'];
const SIGNAL = '#111827';
const BASELINE = '#6b7280';
const SUM = '#b91c1c';
const MUTED = '#c7cbd1';

export function axisLabel(unit: AxisUnit): string {
  return unit === 'nm' ? 'wavelength / nm' : 'wavenumber / cm⁻¹';
}

/** x values in the chosen unit, and the permutation that keeps them ascending. */
export function axisValues(gridCm: readonly number[], unit: AxisUnit): { x: number[]; order: number[] } {
  const order = gridCm.map((_, i) => i);
  if (unit === 'cm-1') return { x: [...gridCm], order };
  order.reverse();
  return { x: order.map((i) => toAxis(gridCm[i]!, unit)), order };
}

/** A wavenumber (cm-1) on the axis, and back: the core's conversions (src/spectrum/units.ts). */
export function toAxis(wavenumber: number, unit: AxisUnit): number {
  return wavenumberToValue(wavenumber, unit);
}

export function fromAxis(value: number, unit: AxisUnit): number {
  return valueToWavenumber(value, unit);
}

/**
 * The assignment whose observed position is this band's, within 1 cm-1; else
 * the split pair (an assignment of two bands, observed at their mean) this
 * band is a component of: within half the fit's split limit of the mean.
 */
export function assignmentForBand(position: number, assignments: readonly Assignment[]): Assignment | undefined {
  let best: Assignment | undefined;
  let bestGap = 1;
  for (const a of assignments) {
    const gap = Math.abs(a.observed - position);
    if (gap <= bestGap) {
      best = a;
      bestGap = gap;
    }
  }
  if (best !== undefined) return best;
  let pairGap = Infinity;
  for (const a of assignments) {
    const gap = Math.abs(a.observed - position);
    if ((a.bands?.length ?? 0) > 1 && gap <= 0.5 * splitPairLimit(a.observed) + 1 && gap < pairGap) {
      best = a;
      pairGap = gap;
    }
  }
  return best;
}

/** The fit a band's kind is read from (src/report/band-assigned-kind.ts). */
export type KindContext = Pick<FitResult, 'd' | 'geometry' | 'groundTerm' | 'cOverB'>;

/**
 * What a band is called on the plot and in tables. An assigned band is
 * called by its transition's kind (spin-forbidden, two-electron), the one
 * rule the CLI and the JSON use, when `fit` is given and the assignment
 * carries its spin; otherwise by the band's own kind, as the user set it.
 */
export function bandCaption(band: EditableBand, assignments: readonly Assignment[], fit: KindContext | null = null): string {
  if (!band.included) return 'removed';
  if (band.kind === 'charge-transfer') return 'charge transfer';
  const a = assignmentForBand(band.position, assignments);
  const name = a === undefined ? 'unassigned' : levelLabel(a.term, a.parent, a.label);
  if (a !== undefined && fit !== null && a.spinAllowed !== undefined && a.multiplicity !== undefined) {
    const note = ASSIGNED_KIND_NOTE[assignedKindOf({ spinAllowed: a.spinAllowed, multiplicity: a.multiplicity, term: a.term }, fit)];
    return note === null ? name : `${name} (${note})`;
  }
  return band.kind === 'spin-forbidden' ? `${name} (spin-forbidden)` : name;
}

/** Linear interpolation in an ascending grid; null outside it or next to a gap. */
export function linearAt(grid: readonly number[], values: readonly (number | null)[], x: number): number | null {
  if (grid.length === 0) return null;
  let lo = 0;
  let hi = grid.length - 1;
  if (x <= grid[lo]!) return values[lo] ?? null;
  if (x >= grid[hi]!) return values[hi] ?? null;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (grid[mid]! <= x) lo = mid;
    else hi = mid;
  }
  const a = values[lo];
  const b = values[hi];
  if (a === null || a === undefined || b === null || b === undefined) return null;
  const t = (x - grid[lo]!) / (grid[hi]! - grid[lo]!);
  return a * (1 - t) + b * t;
}

/** The y-axis name for a signal unit. */
export function signalLabel(signalUnit: string | undefined): string {
  return signalUnit === 'epsilon' ? 'ε / L mol⁻¹ cm⁻¹' : 'absorbance';
}

export interface SpectrumSpecInput {
  title: string;
  curves: Curves;
  /** 'absorbance' or 'epsilon'. */
  signalUnit: string | undefined;
  bands: readonly EditableBand[];
  assignments: readonly Assignment[];
  /** The fit the assignments come from: names each band's kind by its transition (null: by the band's own kind). */
  fit?: KindContext | null;
  masked: readonly MaskedRange[];
  unit: AxisUnit;
}

export function spectrumSpec(input: SpectrumSpecInput): PlotSpec {
  const { curves, unit, bands, assignments } = input;
  const grid = curves.grid;
  const { x, order } = axisValues(grid, unit);
  const pick = <T>(values: readonly T[]): T[] => order.map((i) => values[i]!);
  const baseline = curves.baseline ?? grid.map(() => 0);
  const series: SeriesSpec[] = [{ label: 'measured', color: SIGNAL, width: 1.5 }];
  const ys: (number | null)[][] = [pick(curves.signal)];
  if (curves.baseline !== undefined) {
    series.push({ label: 'baseline', color: BASELINE, width: 1.2, dash: [5, 4] });
    ys.push(pick(baseline));
  }
  const components = curves.components ?? [];
  components.forEach((component, index) => {
    const band = bands.find((b) => b.sourceIndex === index);
    const removed = band !== undefined && (!band.included || band.kind === 'charge-transfer');
    series.push({
      label: `band ${index + 1}`,
      color: removed ? MUTED : PALETTE[index % PALETTE.length]!,
      width: 1.2,
      ...(removed ? { dash: [3, 3] } : {}),
      quiet: true,
    });
    ys.push(pick(component.map((v, k) => v + baseline[k]!)));
  });
  if (curves.model !== undefined) {
    series.push({ label: 'sum of bands', color: SUM, width: 1.6 });
    ys.push(pick(curves.model));
  }
  const marks: Mark[] = input.masked.map((m) => ({
    kind: 'shade',
    from: toAxis(m.from, unit),
    to: toAxis(m.to, unit),
    color: 'rgba(120, 120, 120, 0.13)',
    text: m.reason,
  }));
  const top = curves.model ?? curves.signal;
  const span = Math.abs((x[x.length - 1] ?? 1) - (x[0] ?? 0)) || 1;
  const placed: { x: number; row: number }[] = [];
  const labelled = [...bands].sort((a, b) => toAxis(a.position, unit) - toAxis(b.position, unit));
  for (const band of labelled) {
    const bx = toAxis(band.position, unit);
    const y = linearAt(grid, top, band.position) ?? 0;
    // Stagger captions of close bands into rows so they do not overprint.
    let row = 0;
    while (placed.some((p) => p.row === row && Math.abs(p.x - bx) < span * 0.09)) row += 1;
    placed.push({ x: bx, row });
    const color = band.included ? (band.kind === 'charge-transfer' ? '#6b7280' : '#111827') : '#9ca3af';
    if (band.origin === 'added') marks.push({ kind: 'vline', x: bx, color: '#7e22ce', dash: [2, 3] });
    marks.push({ kind: 'text', x: bx, y, text: bandCaption(band, assignments, input.fit ?? null), color, rise: 8 + row * 15 });
  }
  const [lo, hi] = dataRange(ys);
  return {
    title: input.title,
    xLabel: axisLabel(unit),
    yLabel: signalLabel(input.signalUnit),
    x,
    ys,
    series,
    marks,
    yRange: [lo - (hi - lo) * 0.04, hi + (hi - lo) * (0.12 + 0.06 * Math.max(0, ...placed.map((p) => p.row)))],
  };
}

/** measured − model (baseline plus bands) on the same grid; gaps where the data are masked. */
export function residualSpec(title: string, curves: Curves, unit: AxisUnit, signalUnit: string | undefined): PlotSpec | null {
  const model = curves.model;
  if (model === undefined) return null;
  const residual = curves.signal.map((v, k) => (v === null ? null : v - model[k]!));
  const { x, order } = axisValues(curves.grid, unit);
  return {
    title,
    xLabel: axisLabel(unit),
    yLabel: `residual, ${signalLabel(signalUnit)}`,
    x,
    ys: [order.map((i) => residual[i]!), x.map(() => 0)],
    series: [
      { label: 'measured − model', color: '#1f5fa8', width: 1.2 },
      { label: 'zero', color: BASELINE, width: 1, dash: [4, 4], quiet: true },
    ],
    marks: [],
  };
}

export interface OverlayItem {
  name: string;
  curves: Curves;
}

/**
 * Several spectra on one axis, each scaled to its own maximum (spectra of
 * different concentrations compare by shape), on the union of their grids.
 */
export function overlaySpec(items: readonly OverlayItem[], unit: AxisUnit): PlotSpec {
  const all = new Set<number>();
  for (const item of items) for (const g of item.curves.grid) all.add(Math.round(g));
  const gridCm = [...all].sort((a, b) => a - b);
  const { x, order } = axisValues(gridCm, unit);
  const ys = items.map((item) => {
    const max = Math.max(...item.curves.signal.map((v) => (v === null ? 0 : Math.abs(v)))) || 1;
    const first = item.curves.grid[0] ?? 0;
    const last = item.curves.grid[item.curves.grid.length - 1] ?? 0;
    return order.map((i) => {
      const g = gridCm[i]!;
      if (g < first || g > last) return null;
      const v = linearAt(item.curves.grid, item.curves.signal, g);
      return v === null ? null : v / max;
    });
  });
  return {
    title: 'Spectra compared',
    xLabel: axisLabel(unit),
    yLabel: 'signal / its maximum',
    x,
    ys,
    series: items.map((item, i) => ({ label: item.name, color: PALETTE[i % PALETTE.length]!, width: 1.5 })),
    marks: [],
  };
}
