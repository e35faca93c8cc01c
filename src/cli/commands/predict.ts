import { invalidArgument } from '../../errors.js';
import { GEOMETRIES, type Geometry } from '../../ligand-field/index.js';
import { findLigand } from '../../chemistry/ligands.js';
import { parseIon, romanOxidationState } from '../../chemistry/ions.js';
import { predictComplex, type Estimate, type Prediction, type PredictOptions } from '../../series/predict.js';
import type { Command } from '../command.js';
import { numberOption, parseCommandArgs } from '../options.js';

/**
 * `fieldgap predict FORMULA`: ligand-field parameters and spin state of a
 * complex estimated from its formula alone (Jørgensen's factorisations and the
 * free-ion Racah parameters, then the ligand-field engine). No file access.
 */
const USAGE = `Usage: fieldgap predict FORMULA [--geometry G] [--g G] [--k K] [--f LIGAND=F]... [--h LIGAND=H]... [--json]

Estimates 10Dq, beta, Racah B and C, the spin state, unpaired electrons and the
spin-only moment of a complex from its formula alone. Every number is an
estimate from tabulated factors (10Dq = f·g, 1 - beta = h·k), not a measurement.

FORMULA is a complex or a salt, quoted for the shell:
  "[Co(NH3)6]3+"  "[Ni(NH3)6]Cl2"  "K3[Fe(C2O4)3]"  "[Co(en)2Cl2]+"  "CoCl4 2-"

Options:
  --geometry G     octahedral or tetrahedral (default: guessed, 6 → octahedral, 4 → tetrahedral)
  --g G            the metal's g in cm-1 (default: Jørgensen's table)
  --k K            the metal's k (default: Jørgensen's table)
  --f LIGAND=F     your own f for a ligand, e.g. --f NH3=1.24 (repeatable)
  --h LIGAND=H     your own h for a ligand (repeatable)
  --json           print the prediction as JSON

Example: fieldgap predict "[Cr(NH3)6]3+"
`;

/** Reads and checks the options; every failure names its option. */
export function parsePredictArgs(argv: string[]): { formula: string; options: PredictOptions; json: boolean } {
  const { values, positionals } = parseCommandArgs(
    argv,
    {
      geometry: { type: 'string' },
      g: { type: 'string' },
      k: { type: 'string' },
      f: { type: 'string', multiple: true },
      h: { type: 'string', multiple: true },
      json: { type: 'boolean' },
    },
    true,
  );
  if (positionals.length === 0) throw invalidArgument('formula', 'give the formula of a complex, e.g. fieldgap predict "[Co(NH3)6]3+"');
  const options: PredictOptions = {};
  if (values.geometry !== undefined) {
    const geometry = values.geometry.trim().toLowerCase() as Geometry;
    if (!GEOMETRIES.includes(geometry)) throw invalidArgument('--geometry', `--geometry: expected one of ${GEOMETRIES.join(', ')}, got "${values.geometry}"`);
    options.geometry = geometry;
  }
  const g = numberOption('g', values.g, { min: 0 });
  if (g !== undefined) {
    if (g === 0) throw invalidArgument('--g', '--g: g must be greater than 0 cm-1');
    options.g = g;
  }
  const k = numberOption('k', values.k, { min: 0, max: 1 });
  if (k !== undefined) options.k = k;
  const factors: NonNullable<PredictOptions['factors']> = {};
  for (const which of ['f', 'h'] as const) {
    for (const raw of values[which] ?? []) {
      const m = /^\s*([^=]+?)\s*=\s*(.+)$/.exec(raw);
      if (!m) throw invalidArgument(`--${which}`, `--${which}: expected LIGAND=VALUE, e.g. --${which} NH3=1.25, got "${raw}"`);
      const key = findLigand(m[1] as string)?.key ?? (m[1] as string);
      const value = numberOption(which, m[2], { min: 0 }) as number;
      factors[key] = { ...factors[key], [which]: value };
    }
  }
  if (Object.keys(factors).length > 0) options.factors = factors;
  // Words are joined so that an unquoted `CoCl4 2-` reads as the one formula it is.
  return { formula: positionals.join(' '), options, json: values.json ?? false };
}

/** The JSON document of `predict --json`: the contract fields first (do not rename), then the rest. */
export function predictionJson(p: Prediction): object {
  const { ion, d, oxidationState, ligands, tenDq, b, spinState, unpairedElectrons, spinOnlyMoment, ...rest } = p;
  const ligandsOut = ligands.map((l) => ({ ...l, h: l.h ?? null }));
  return { ion, d, oxidationState, ligands: ligandsOut, tenDq, b, spinState, unpairedElectrons, spinOnlyMoment, ...rest };
}

/** JSON text with float noise trimmed (12 significant digits: 591.8000000000001 → 591.8). */
export function predictionJsonText(p: Prediction): string {
  return `${JSON.stringify(predictionJson(p), (_key, value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? Number(value.toPrecision(12)) : value), 2)}\n`;
}

function fixed(value: number, digits: number): string {
  return value.toFixed(digits);
}

/** The readable report of `predict`, with units. */
export function predictionReport(p: Prediction): string {
  const metal = parseIon(p.ion);
  const metalName = `${metal.name ?? metal.symbol}(${romanOxidationState(p.oxidationState)})`;
  const ligands = p.ligands
    .map((l) => `${l.count} × ${l.key} (${l.name}, f = ${l.f}${l.h === undefined ? ', no h' : `, h = ${l.h}`})`)
    .join(', ');
  const rows: [string, string, string][] = [
    ['10Dq', `${fixed(p.tenDq.value, 0)} cm-1 (${fixed(1e7 / p.tenDq.value, 0)} nm)`, p.tenDq.method],
    ['beta', p.beta ? fixed(p.beta.value, 3) : 'not estimated', p.beta?.method ?? ''],
    ['Racah B', p.b ? `${fixed(p.b.value, 0)} cm-1` : 'not estimated', p.b?.method ?? ''],
    ['Racah C', p.c ? `${fixed(p.c.value, 0)} cm-1` : 'not estimated', p.c?.method ?? ''],
    ['spin state', spinWords(p.spinState), p.spinState.method],
    ['unpaired electrons', String(p.unpairedElectrons.value), ''],
    ['ground term', p.groundTerm.value, ''],
    ['spin-only moment', `${fixed(p.spinOnlyMoment.value, 2)} μB`, p.spinOnlyMoment.method],
  ];
  const width = Math.max(...rows.map((r) => r[0].length));
  const valueWidth = Math.max(...rows.map((r) => r[1].length));
  const lines = [
    `${p.complexIon}: ${metalName}, ${p.ion}, d${p.d}`,
    `Ligands: ${ligands}; coordination number ${p.coordinationNumber}`,
    `Geometry: ${p.geometry.value} (${p.geometry.method})`,
    '',
    'Estimates (from tabulated factors, not measurements):',
    ...rows.map(([label, value, method]) => `  ${label.padEnd(width)}  ${value.padEnd(valueWidth)}${method ? `  ${method}` : ''}`.trimEnd()),
  ];
  if (p.warnings.length > 0) lines.push('', 'Warnings:', ...p.warnings.map((w) => `  - ${w}`));
  lines.push('', 'Sources:', ...p.sources.map((s) => `  - ${s}`));
  return `${lines.join('\n')}\n`;
}

function spinWords(spin: Estimate<string>): string {
  return spin.value === 'no-choice' ? 'no high/low-spin choice' : spin.value;
}

export const predictCommand: Command = {
  name: 'predict',
  summary: "estimate 10Dq, B, beta and the spin state of a complex from its formula (Jørgensen's factors)",
  usage: USAGE,
  async run(argv, io) {
    const { formula, options, json } = parsePredictArgs(argv);
    const prediction = predictComplex(formula, options);
    io.stdout(json ? predictionJsonText(prediction) : predictionReport(prediction));
    return 0;
  },
};
