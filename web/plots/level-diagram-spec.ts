/**
 * The Levels tab's diagram as a PlotSpec: E/B of every level of the field
 * diagram (GET /diagram with an axis) against the quantity that varies —
 * Dq/B (the cubic or tetragonal field growing at fixed Ds, Dt, ζ), the
 * distortion Ds/B (Ds and Dt growing together from the cube to the chosen
 * values; Dt/B when Ds is 0) or ζ/B (spin–orbit coupling growing from 0).
 * Energies from the ground level at each point, as the engine gives them.
 * The lines at the chosen parameters end at the right edge, where the
 * lowest are named; a vertical line marks the chosen Dq/B on the Dq axis.
 */
import type { FieldDiagram, FieldDiagramAxis } from '../../src/ligand-field/field-diagram.js';
import type { Mark, PlotSpec, SeriesSpec } from './spec.js';
import { PALETTE } from './spectrum-spec.js';

/** The diagram document as the service sends it (steps added, numbers rounded). */
export type FieldDiagramAnswer = FieldDiagram & { steps: number };

/** How many lines get a name at the right edge (the lowest, if they do not crowd each other). */
const MAX_NAMED = 10;

/** The x values and axis name: the distortion axis runs on Ds/B, or Dt/B where Ds is 0. */
export function levelDiagramAxis(diagram: FieldDiagramAnswer): { x: number[]; label: string } {
  const { axis, b } = diagram;
  if (axis === 'dq') return { x: diagram.x, label: 'Dq/B' };
  if (axis === 'zeta') return { x: diagram.x, label: 'ζ/B' };
  const dsEnd = diagram.ds[diagram.ds.length - 1] ?? 0;
  if (dsEnd !== 0) return { x: diagram.x, label: `Ds/B (Dt/Ds = ${((diagram.dt[diagram.dt.length - 1] ?? 0) / dsEnd).toFixed(2)} fixed)` };
  return { x: diagram.dt.map((dt) => dt / b), label: 'Dt/B (Ds = 0)' };
}

/** Words for the axis choice. */
export const AXIS_WORDS: Readonly<Record<FieldDiagramAxis, string>> = {
  dq: 'against Dq (field strength)',
  distortion: 'against the distortion (Ds, Dt from 0)',
  zeta: 'against ζ (spin–orbit from 0)',
};

export function levelDiagramSpec(diagram: FieldDiagramAnswer, chosenDq: number | null): PlotSpec {
  const axis = levelDiagramAxis(diagram);
  const label = axis.label;
  // A negative Ds or Dt runs the axis downwards; the plot wants x ascending, so such a path is drawn reversed.
  const reversed = axis.x.length > 1 && axis.x[axis.x.length - 1]! < axis.x[0]!;
  const x = reversed ? [...axis.x].reverse() : axis.x;
  const ys = diagram.lines.map((line) => (reversed ? [...line.energies].reverse() : line.energies));
  // The chosen parameters: the end of the path (the right edge, or the left one for a reversed path).
  const last = reversed ? 0 : x.length - 1;
  let yMax = 0;
  for (const values of ys) for (const v of values) if (Number.isFinite(v) && v > yMax) yMax = v;
  // Lines in the order of their energy at the chosen parameters (the right edge).
  const order = ys.map((values, i) => ({ i, end: values[last] ?? 0 })).sort((a, b) => a.end - b.end);
  const rank = new Map(order.map((o, r) => [o.i, r]));
  const series: SeriesSpec[] = diagram.lines.map((line, i) => ({
    label: line.label,
    color: PALETTE[(rank.get(i) ?? 0) % PALETTE.length]!,
    width: (rank.get(i) ?? 0) === 0 ? 2.2 : 1.4,
    quiet: true,
  }));
  const marks: Mark[] = [];
  const xEnd = x[last] ?? 1;
  const gap = 0.06 * (yMax > 0 ? yMax : 1);
  let previous = -Infinity;
  let named = 0;
  for (const { i, end } of order) {
    if (named >= MAX_NAMED) break;
    if (end - previous < gap) continue;
    marks.push({ kind: 'text', x: xEnd, y: end, text: diagram.lines[i]!.term, color: series[i]!.color, rise: 2, align: reversed ? 'left' : 'right' });
    previous = end;
    named++;
  }
  if (diagram.axis === 'dq' && chosenDq !== null && diagram.b > 0) {
    marks.push({ kind: 'vline', x: chosenDq / diagram.b, color: '#b91c1c', text: `Dq/B = ${(chosenDq / diagram.b).toFixed(2)}` });
  }
  return {
    title: `Energy levels of d${diagram.d} (${diagram.geometry}), B = ${Math.round(diagram.b)} cm⁻¹, C/B = ${diagram.cOverB.toFixed(2)}`,
    xLabel: label,
    yLabel: 'E/B',
    x,
    ys,
    series,
    marks,
    yRange: [0, yMax > 0 ? yMax * 1.1 : 1],
  };
}
