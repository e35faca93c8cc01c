/**
 * The energy-level (Tanabe–Sugano) diagram as a PlotSpec: E/B of each level
 * against Dq/B at the fitted C/B, energies from the ground level. Levels of
 * the ground multiplicity at the fitted Dq/B are drawn strong, the others
 * faint; a vertical line marks the fitted Dq/B and each observed band sits
 * as a point on the level it is assigned to.
 */
import type { Assignment, Diagram, DiagramLine } from '../types.js';
import type { Mark, PlotSpec, SeriesSpec } from './spec.js';
import { PALETTE } from './spectrum-spec.js';

/** A Dq/B range that shows the fitted point with room to spare. */
export function diagramRangeFor(dqOverB: number): number {
  if (!Number.isFinite(dqOverB) || dqOverB <= 0) return 4;
  return Math.max(2, Math.ceil(dqOverB * 1.5));
}

/** 2S+1 from a term such as "4T1g". */
export function multiplicityOf(term: string): number {
  const match = /^(\d+)/.exec(term);
  return match === null ? 0 : Number(match[1]);
}

/** Index of the step nearest to x in an ascending grid. */
export function nearestIndex(grid: readonly number[], x: number): number {
  let best = 0;
  for (let i = 1; i < grid.length; i++) if (Math.abs(grid[i]! - x) < Math.abs(grid[best]! - x)) best = i;
  return best;
}

export function lineFor(lines: readonly DiagramLine[], a: Assignment): DiagramLine | undefined {
  return lines.find((line) => line.term === a.term && line.parent === a.parent) ?? lines.find((line) => line.term === a.term);
}

export interface DiagramSpecInput {
  diagram: Diagram;
  /** Fitted Dq/B, or null to draw the diagram alone. */
  dqOverB: number | null;
  /** cm-1, to turn observed positions into E/B. */
  b: number | null;
  assignments: readonly Assignment[];
}

export function diagramSpec(input: DiagramSpecInput): PlotSpec {
  const { diagram, dqOverB, b, assignments } = input;
  const at = dqOverB === null ? 0 : nearestIndex(diagram.dqOverB, dqOverB);
  const groundMultiplicity = multiplicityOf(diagram.groundTerms[at] ?? diagram.lines[0]?.term ?? '');
  const assignedTerms = new Set(assignments.map((a) => `${a.term}|${a.parent}`));
  let strongCount = 0;
  const series: SeriesSpec[] = diagram.lines.map((line) => {
    const strong = line.multiplicity === groundMultiplicity;
    const assigned = assignedTerms.has(`${line.term}|${line.parent}`);
    const color = strong ? PALETTE[strongCount++ % PALETTE.length]! : '#b8bec7';
    return { label: line.label, color, width: assigned ? 2.4 : strong ? 1.6 : 0.8, quiet: true };
  });
  const ys = diagram.lines.map((line) => line.energies);
  const marks: Mark[] = [];
  const last = diagram.dqOverB.length - 1;
  const xMax = diagram.dqOverB[last] ?? 1;
  diagram.lines.forEach((line, i) => {
    if (line.multiplicity !== groundMultiplicity) return;
    const y = line.energies[last];
    if (y === undefined) return;
    marks.push({ kind: 'text', x: xMax, y, text: line.label, color: series[i]!.color, rise: 2, align: 'right' });
  });
  if (dqOverB !== null) {
    marks.push({ kind: 'vline', x: dqOverB, color: '#b91c1c', text: `Dq/B = ${dqOverB.toFixed(2)}` });
    if (b !== null && b > 0) {
      for (const a of assignments) {
        const line = lineFor(diagram.lines, a);
        marks.push({
          kind: 'point',
          x: dqOverB,
          y: a.observed / b,
          color: '#b91c1c',
          text: line === undefined ? `${a.term}?` : line.label,
        });
      }
    }
  }
  let yMax = 0;
  for (let i = 0; i < diagram.lines.length; i++) {
    const values = diagram.lines[i]!.energies;
    if (diagram.lines[i]!.multiplicity === groundMultiplicity) yMax = Math.max(yMax, ...values);
  }
  if (b !== null && b > 0) for (const a of assignments) yMax = Math.max(yMax, (a.observed / b) * 1.15);
  return {
    title: `Energy levels of d${diagram.d} (${diagram.geometry}), C/B = ${diagram.cOverB.toFixed(2)}`,
    xLabel: 'Dq/B',
    yLabel: 'E/B',
    x: diagram.dqOverB,
    ys,
    series,
    marks,
    // Headroom for the captions of the top line.
    yRange: [0, yMax > 0 ? yMax * 1.12 : 1],
  };
}
