import { invalidArgument } from '../../errors.js';
import { computeDiagram, crossoverDqOverB, DIAGRAM_DEFAULTS, diagramDocument, GEOMETRIES, type Diagram } from '../../ligand-field/index.js';
import type { Command } from '../command.js';
import { checkParameterRange } from '../../ligand-field/parameter-bounds.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';
import { joinNegativeValues } from './levels.js';

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

Without --json or --csv: a table of E/B at nine evenly spaced Dq/B values.
`;

interface DiagramArgs {
  d: number;
  geometry: (typeof GEOMETRIES)[number];
  cOverB: number;
  maxDqOverB: number;
  steps: number;
  format: 'table' | 'json' | 'csv';
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
  return { d, geometry, cOverB, maxDqOverB, steps, format };
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
  const rows = [['dq_over_b', 'ground_term', ...uniqueLineNames(diagram)].join(',')];
  diagram.dqOverB.forEach((x, i) => {
    rows.push([round(x), diagram.groundTerms[i]!, ...diagram.lines.map((line) => round(line.energies[i]!))].join(','));
  });
  return `${rows.join('\n')}\n`;
}

export function diagramTable(diagram: Diagram, crossover: number | undefined): string {
  const points = diagram.dqOverB.length;
  const columns = [...new Set(Array.from({ length: 9 }, (_, j) => Math.round((j * (points - 1)) / 8)))];
  const names = uniqueLineNames(diagram);
  const header = ['level \\ Dq/B', ...columns.map((i) => diagram.dqOverB[i]!.toFixed(2))];
  const rows = diagram.lines.map((line, l) => [names[l]!, ...columns.map((i) => line.energies[i]!.toFixed(2))]);
  rows.push(['ground term', ...columns.map((i) => diagram.groundTerms[i]!)]);
  const widths = header.map((h, col) => Math.max(h.length, ...rows.map((r) => r[col]!.length)));
  const render = (cells: string[]): string =>
    cells.map((cell, col) => (col === 0 ? cell.padEnd(widths[col]!) : cell.padStart(widths[col]!))).join('  ');
  const lines = [
    `d${diagram.d} ${diagram.geometry}, C/B = ${diagram.cOverB}: E/B above the ground level (B units), ${points} points computed`,
    crossover === undefined
      ? 'No spin crossover on this Dq/B range.'
      : `Spin crossover at Dq/B = ${crossover.toFixed(3)}.`,
    '',
    render(header),
    ...rows.slice(0, -1).map(render),
    render(rows.at(-1)!),
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
