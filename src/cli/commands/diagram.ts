import { invalidArgument } from '../../errors.js';
import {
  computeDiagram, computeFieldDiagram, crossoverDqOverB, DIAGRAM_DEFAULTS, diagramDocument, FIELD_DIAGRAM_AXES, fieldDiagramDocument,
  GEOMETRIES, type Diagram, type FieldDiagram, type FieldDiagramAxis,
} from '../../ligand-field/index.js';
import type { Command } from '../command.js';
import { checkParameterRange } from '../../ligand-field/parameter-bounds.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';
import { joinNegativeValues, parseFieldOptions } from './levels.js';
import { csvText } from '../../report/csv.js';
import { textTableLines } from '../../report/text-table.js';

/**
 * `fieldgap diagram`: a Tanabe–Sugano-type diagram (E/B against Dq/B) as a
 * summary table, JSON or CSV.
 */
const USAGE = `Usage: fieldgap diagram --d N [--geometry G] [--c-over-b R] [--max-dq-over-b X] [--steps K] [--json | --csv]

E/B of every level against Dq/B from 0 to X at fixed C/B, energies from the
ground level at each point (lines kink at a spin crossover).

Options:
  --d N               number of d electrons, 0 to 10 (required)
  --geometry G        octahedral or tetrahedral (default octahedral)
  --c-over-b R        C/B, ≥ 0 (default ${DIAGRAM_DEFAULTS.cOverB})
  --max-dq-over-b X   right end of the Dq/B axis, > 0 (default ${DIAGRAM_DEFAULTS.maxDqOverB})
  --steps K           number of intervals, 1 to 20000: K + 1 points (default ${DIAGRAM_DEFAULTS.steps})
  --json              the whole diagram as JSON (one energy array per line)
  --csv               one row per point: dq_over_b, ground_term, then E/B of each line

Beyond the cubic field (any of --axis, --ds, --dt, --zeta given):
  --axis A            dq (E/B against Dq/B at fixed Ds, Dt, ζ; default),
                      distortion (against Ds/B: (Ds, Dt) grow together from 0 to --ds, --dt
                      at fixed --dq), or zeta (against ζ/B from 0 to --zeta at fixed --dq, --ds, --dt)
  --b B               Racah B in cm-1, the energy unit (default 1000)
  --dq DQ             fixed Dq in cm-1 on the distortion and zeta axes
  --ds DS, --dt DT    tetragonal Ds, Dt in cm-1 (octahedral only; default 0)
  --zeta Z            spin–orbit constant ζ in cm-1, ≥ 0 (default 0)
  Lines follow a level's identity; with ζ > 0 they are the double-group
  levels (a cubic Γ8 is two coinciding lines), labelled at the last point.

Without --json or --csv: a table of E/B at nine evenly spaced points.
`;

interface DiagramArgs {
  d: number;
  geometry: (typeof GEOMETRIES)[number];
  cOverB: number;
  maxDqOverB: number;
  steps: number;
  format: 'table' | 'json' | 'csv';
  /** Set when the diagram goes beyond the cubic field. */
  field?: { axis: FieldDiagramAxis; b: number; dq: number; ds: number; dt: number; zeta: number };
}

export function parseDiagramArgs(argv: string[]): DiagramArgs {
  const { values } = parseCommandArgs(joinNegativeValues(argv), {
    d: { type: 'string' },
    geometry: { type: 'string' },
    'c-over-b': { type: 'string' },
    'max-dq-over-b': { type: 'string' },
    steps: { type: 'string' },
    json: { type: 'boolean' },
    csv: { type: 'boolean' },
    axis: { type: 'string' },
    b: { type: 'string' },
    dq: { type: 'string' },
    ds: { type: 'string' },
    dt: { type: 'string' },
    zeta: { type: 'string' },
  });
  const d = numberOption('d', values.d, { required: true, min: 0, max: 10, integer: true })!;
  const geometry = choiceOption('geometry', values.geometry, GEOMETRIES, 'octahedral');
  const cOverB = numberOption('c-over-b', values['c-over-b']) ?? DIAGRAM_DEFAULTS.cOverB;
  if (cOverB < 0) throw invalidArgument('--c-over-b', '--c-over-b must be ≥ 0');
  const maxDqOverB = numberOption('max-dq-over-b', values['max-dq-over-b']) ?? DIAGRAM_DEFAULTS.maxDqOverB;
  if (maxDqOverB <= 0) throw invalidArgument('--max-dq-over-b', '--max-dq-over-b must be greater than 0');
  checkParameterRange('cOverB', cOverB, '--c-over-b');
  checkParameterRange('maxDqOverB', maxDqOverB, '--max-dq-over-b');
  const steps = numberOption('steps', values.steps, { min: 1, max: 20000, integer: true }) ?? DIAGRAM_DEFAULTS.steps;
  if (values.json && values.csv) throw invalidArgument('--csv', 'give either --json or --csv, not both');
  const format = values.json ? 'json' : values.csv ? 'csv' : 'table';
  const { ds, dt, zeta, beyondCubic } = parseFieldOptions(values, geometry);
  if (!beyondCubic && values.axis === undefined) {
    for (const name of ['b', 'dq'] as const) {
      if (values[name] !== undefined) throw invalidArgument(`--${name}`, `--${name} belongs to diagrams with --axis, --ds, --dt or --zeta`);
    }
    return { d, geometry, cOverB, maxDqOverB, steps, format };
  }
  const axis = choiceOption('axis', values.axis, FIELD_DIAGRAM_AXES, 'dq');
  const b = numberOption('b', values.b) ?? 1000;
  if (b <= 0) throw invalidArgument('--b', '--b: Racah B must be greater than 0 cm-1');
  const dq = numberOption('dq', values.dq, { required: axis !== 'dq' }) ?? 0;
  if (dq < 0) throw invalidArgument('--dq', '--dq must be ≥ 0 cm-1');
  if (axis === 'distortion' && ds === 0 && dt === 0) throw invalidArgument('--ds', '--axis distortion needs --ds or --dt (the end of the axis)');
  if (axis === 'zeta' && zeta === 0) throw invalidArgument('--zeta', '--axis zeta needs --zeta > 0 (the end of the axis)');
  if (steps > 2000) throw invalidArgument('--steps', '--steps: at most 2000 beyond the cubic field');
  return { d, geometry, cOverB, maxDqOverB, steps, format, field: { axis, b, dq, ds, dt, zeta } };
}

/** Column names for CSV: the line labels, with " #2", " #3" on repeats of a label. */
export function uniqueLineNames(diagram: Diagram): string[] {
  const seen = new Map<string, number>();
  const total = new Map<string, number>();
  for (const line of diagram.lines) total.set(line.label, (total.get(line.label) ?? 0) + 1);
  return diagram.lines.map((line) => {
    const index = (seen.get(line.label) ?? 0) + 1;
    seen.set(line.label, index);
    return total.get(line.label)! > 1 ? `${line.label} #${index}` : line.label;
  });
}

const round = (value: number): number => Math.round(value * 1e6) / 1e6;

export function diagramCsv(diagram: Diagram): string {
  const rows = diagram.dqOverB.map((x, i) => [round(x), diagram.groundTerms[i]!, ...diagram.lines.map((line) => round(line.energies[i]!))]);
  return csvText(['dq_over_b', 'ground_term', ...uniqueLineNames(diagram)], rows, { newline: '\n' });
}

export function diagramTable(diagram: Diagram, crossover: number | undefined): string {
  const points = diagram.dqOverB.length;
  const columns = [...new Set(Array.from({ length: 9 }, (_, j) => Math.round((j * (points - 1)) / 8)))];
  const names = uniqueLineNames(diagram);
  const header = ['level \\ Dq/B', ...columns.map((i) => diagram.dqOverB[i]!.toFixed(2))];
  const rows = diagram.lines.map((line, l) => [names[l]!, ...columns.map((i) => line.energies[i]!.toFixed(2))]);
  rows.push(['ground term', ...columns.map((i) => diagram.groundTerms[i]!)]);
  const [head, ...body] = textTableLines([header, ...rows], { align: header.map((_, col) => (col === 0 ? 'left' : 'right')) });
  const lines = [
    `d${diagram.d} ${diagram.geometry}, C/B = ${diagram.cOverB}: E/B above the ground level (B units), ${points} points computed`,
    crossover === undefined
      ? 'No spin crossover on this Dq/B range.'
      : `Spin crossover at Dq/B = ${crossover.toFixed(3)}.`,
    '',
    head!,
    ...body,
    '',
    'Use --csv or --json for every point.',
  ];
  return `${lines.join('\n')}\n`;
}

const AXIS_NAMES: Readonly<Record<FieldDiagramAxis, string>> = { dq: 'Dq/B', distortion: 'Ds/B', zeta: 'ζ/B' };

/** Column names for CSV of a field diagram: labels, with " #2" on repeats. */
function fieldLineNames(diagram: FieldDiagram): string[] {
  const seen = new Map<string, number>();
  return diagram.lines.map((line) => {
    const index = (seen.get(line.label) ?? 0) + 1;
    seen.set(line.label, index);
    return index > 1 ? `${line.label} #${index}` : line.label;
  });
}

export function fieldDiagramCsv(diagram: FieldDiagram): string {
  const rows = diagram.x.map((x, i) => [round(x), diagram.groundTerms[i]!, ...diagram.lines.map((line) => round(line.energies[i]!))]);
  // The line names are always quoted, as this CSV has always written them.
  const quote = (value: unknown, column: number) => column >= 2 && typeof value === 'string';
  return csvText([`${diagram.axis}_over_b`, 'ground_term', ...fieldLineNames(diagram)], rows, { newline: '\n', quote });
}

export function fieldDiagramTable(diagram: FieldDiagram): string {
  const points = diagram.x.length;
  const columns = [...new Set(Array.from({ length: 9 }, (_, j) => Math.round((j * (points - 1)) / 8)))];
  const names = fieldLineNames(diagram);
  const header = [`level \\ ${AXIS_NAMES[diagram.axis]}`, ...columns.map((i) => diagram.x[i]!.toFixed(3))];
  const rows = diagram.lines.map((line, l) => [names[l]!, ...columns.map((i) => line.energies[i]!.toFixed(2))]);
  const table = textTableLines([header, ...rows], { align: header.map((_, col) => (col === 0 ? 'left' : 'right')) });
  const last = points - 1;
  const lines = [
    `d${diagram.d} ${diagram.geometry}, B = ${diagram.b} cm-1, C/B = ${diagram.cOverB}: E/B against ${AXIS_NAMES[diagram.axis]}; ` +
      `at the last point Dq = ${diagram.dq[last]}, Ds = ${diagram.ds[last]}, Dt = ${diagram.dt[last]}, ζ = ${diagram.zeta[last]} cm-1; ${points} points`,
    '',
    ...table,
    '',
    'Use --csv or --json for every point.',
  ];
  return `${lines.join('\n')}\n`;
}

export const diagramCommand: Command = {
  name: 'diagram',
  summary: 'Tanabe–Sugano-type diagram: E/B of every level against Dq/B (table, --json or --csv)',
  usage: USAGE,
  async run(argv, io) {
    const args = parseDiagramArgs(argv);
    if (args.field) {
      const field = computeFieldDiagram(args.d, args.geometry, {
        ...args.field, cOverB: args.cOverB, maxDqOverB: args.maxDqOverB, steps: args.steps,
      });
      io.stdout(args.format === 'json' ? `${JSON.stringify(fieldDiagramDocument(field))}\n` : args.format === 'csv' ? fieldDiagramCsv(field) : fieldDiagramTable(field));
      return 0;
    }
    const diagram = computeDiagram(args.d, args.geometry, {
      cOverB: args.cOverB, maxDqOverB: args.maxDqOverB, steps: args.steps,
    });
    const crossover =
      args.d > 0 && args.d < 10 ? crossoverDqOverB(args.d, args.geometry, args.cOverB, { maxDqOverB: args.maxDqOverB }) : undefined;
    if (args.format === 'json') {
      io.stdout(`${JSON.stringify(diagramDocument(args.d, args.geometry, { cOverB: args.cOverB, maxDqOverB: args.maxDqOverB, steps: args.steps }))}\n`);
    } else {
      io.stdout(args.format === 'csv' ? diagramCsv(diagram) : diagramTable(diagram, crossover));
    }
    return 0;
  },
};
