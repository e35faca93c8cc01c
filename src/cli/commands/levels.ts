import { invalidArgument } from '../../errors.js';
import {
  computeFieldLevels, computeLevels, fieldLevelsDocument, GEOMETRIES, levelsDocument, type FieldLevelsResult, type LevelsResult,
} from '../../ligand-field/index.js';
import type { ResolvedParameters } from '../../ligand-field/field-levels.js';
import type { Command } from '../command.js';
import { checkParameterRange } from '../../ligand-field/parameter-bounds.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';
import { spinStateSentence } from '../../report/spin-state-wording.js';
import { textTableLines } from '../../report/text-table.js';

/**
 * `fieldgap levels`: the ligand-field levels of one d^n ion at given Dq, B
 * and C, as a table (cm-1 and nm) or as JSON.
 */
const USAGE = `Usage: fieldgap levels --d N --dq DQ --b B (--c C | --c-over-b R) [--geometry G]
                      [--ds DS] [--dt DT] [--zeta Z] [--json]

Energy levels of a d^n ion in a cubic or tetragonal ligand field, with or
without spin–orbit coupling, from the ground level up.

Options:
  --d N            number of d electrons, 0 to 10 (required)
  --geometry G     octahedral or tetrahedral (default octahedral)
  --dq DQ          ligand-field parameter Dq in cm-1, ≥ 0 (10Dq = 10 × DQ) (required)
  --b B            Racah B in cm-1, > 0 (required)
  --c C            Racah C in cm-1, ≥ 0
  --c-over-b R     C given as the ratio C/B instead of --c (one of the two is required)
  --ds DS          tetragonal Ds in cm-1 (default 0; octahedral only)
  --dt DT          tetragonal Dt in cm-1 (default 0; octahedral only). One-electron
                   energies: a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt,
                   b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt
                   (positive Ds, Dt: elongated along z)
  --zeta Z         one-electron spin–orbit constant ζ in cm-1, ≥ 0 (default 0: off);
                   levels are then labelled by the double group (Γ6, Γ7, Γ8, …)
  --json           print the result as JSON instead of a table

Example: fieldgap levels --d 3 --dq 1740 --b 725 --c 2900
         fieldgap levels --d 9 --dq 1200 --b 1000 --c 4000 --ds 1500 --dt 300 --zeta 830
`;

/**
 * "--dq -5" would read as two options; joined to "--dq=-5" it reaches the
 * range check, which names the option and the allowed range in one line.
 */
export function joinNegativeValues(argv: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    const next = argv[i + 1];
    if (arg.startsWith('--') && !arg.includes('=') && next !== undefined && /^-\d|^-\.\d/.test(next)) {
      out.push(`${arg}=${next}`);
      i++;
    } else {
      out.push(arg);
    }
  }
  return out;
}

/** Dq, B, C with tetragonal Ds, Dt and spin–orbit ζ in cm-1 (Ds, Dt, ζ 0 when not given). */
interface LevelsArgs extends ResolvedParameters {
  d: number;
  geometry: (typeof GEOMETRIES)[number];
  /** True when any of --ds, --dt, --zeta was given: the result beyond the cubic field. */
  beyondCubic: boolean;
  json: boolean;
}

/** Reads and checks the options; every failure names its option. */
export function parseLevelsArgs(argv: string[]): LevelsArgs {
  const { values } = parseCommandArgs(joinNegativeValues(argv), {
    d: { type: 'string' },
    geometry: { type: 'string' },
    dq: { type: 'string' },
    b: { type: 'string' },
    c: { type: 'string' },
    'c-over-b': { type: 'string' },
    ds: { type: 'string' },
    dt: { type: 'string' },
    zeta: { type: 'string' },
    json: { type: 'boolean' },
  });
  const d = numberOption('d', values.d, { required: true, min: 0, max: 10, integer: true })!;
  const geometry = choiceOption('geometry', values.geometry, GEOMETRIES, 'octahedral');
  const dq = numberOption('dq', values.dq, { required: true })!;
  if (dq < 0) throw invalidArgument('--dq', '--dq must be ≥ 0 cm-1 (the geometry sets the sign of the field)');
  const b = numberOption('b', values.b, { required: true })!;
  if (b <= 0) throw invalidArgument('--b', '--b: Racah B must be greater than 0 cm-1');
  if (values.c !== undefined && values['c-over-b'] !== undefined) {
    throw invalidArgument('--c-over-b', 'give either --c or --c-over-b, not both');
  }
  const c =
    values.c !== undefined
      ? numberOption('c', values.c)!
      : values['c-over-b'] !== undefined
        ? numberOption('c-over-b', values['c-over-b'])! * b
        : undefined;
  if (c !== undefined && c < 0) {
    const name = values.c !== undefined ? '--c' : '--c-over-b';
    throw invalidArgument(name, `${name} must be ≥ 0`);
  }
  if (c === undefined) throw invalidArgument('--c', '--c (Racah C in cm-1) or --c-over-b is required');
  checkParameterRange('dq', dq, '--dq');
  checkParameterRange('b', b, '--b');
  if (values['c-over-b'] !== undefined) checkParameterRange('cOverB', c / b, '--c-over-b');
  else checkParameterRange('c', c, '--c');
  const { ds, dt, zeta, beyondCubic } = parseFieldOptions(values, geometry);
  return { d, geometry, dq, b, c, ds, dt, zeta, beyondCubic, json: values.json ?? false };
}

/** --ds, --dt, --zeta (cm-1) as levels and diagram read them; each failure names its option. */
export function parseFieldOptions(
  values: { ds?: string | boolean; dt?: string | boolean; zeta?: string | boolean },
  geometry: string,
): { ds: number; dt: number; zeta: number; beyondCubic: boolean } {
  const text = (v: string | boolean | undefined): string | undefined => (typeof v === 'string' ? v : undefined);
  const ds = numberOption('ds', text(values.ds)) ?? 0;
  const dt = numberOption('dt', text(values.dt)) ?? 0;
  const zeta = numberOption('zeta', text(values.zeta)) ?? 0;
  if (zeta < 0) throw invalidArgument('--zeta', '--zeta (the one-electron spin–orbit constant) must be ≥ 0 cm-1');
  if (geometry !== 'octahedral' && (ds !== 0 || dt !== 0)) {
    throw invalidArgument(ds !== 0 ? '--ds' : '--dt', '--ds and --dt describe a tetragonally distorted octahedron: use --geometry octahedral');
  }
  return { ds, dt, zeta, beyondCubic: values.ds !== undefined || values.dt !== undefined || values.zeta !== undefined };
}


function formatNumber(value: number, digits: number): string {
  return value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false });
}

/** The readable table of `levels`. */
export function levelsTable(result: LevelsResult): string {
  const { d, geometry, dq, b, c, levels } = result;
  const ground = levels[0]!;
  const lines = [
    `d${d} ${geometry}: Dq = ${dq} cm-1 (10Dq = ${formatNumber(10 * dq, 0)} cm-1), B = ${b} cm-1, C = ${formatNumber(c, 1).replace(/\.0$/, "")} cm-1 (C/B = ${formatNumber(c / b, 3)})`,
    `Ground level: ${ground.label}, ${result.unpairedElectrons} unpaired electron${result.unpairedElectrons === 1 ? '' : 's'}; ${
      spinStateSentence(result.spinState, d, geometry)
    }`,
    '',
  ];
  const header = ['level', 'energy / cm-1', 'wavelength / nm', 'E/B', 'degeneracy', ''];
  const rows = levels.map((level, i) => [
    level.label,
    formatNumber(level.energy, 0),
    i === 0 || level.energy === 0 ? '' : formatNumber(1e7 / level.energy, 0),
    formatNumber(level.energy / b, 2),
    String(level.degeneracy),
    i > 0 && level.multiplicity === ground.multiplicity ? '*' : '',
  ]);
  lines.push(...textTableLines([header, ...rows], { align: ['left', 'right', 'right', 'right', 'right', 'right'] }), '', '* spin-allowed from the ground level (same multiplicity)');
  for (const note of result.notes) lines.push(`Note: ${note}`);
  return `${lines.join('\n')}\n`;
}

/** The readable table of `levels` beyond the cubic field (tetragonal and/or spin–orbit). */
export function fieldLevelsTable(result: FieldLevelsResult): string {
  const { d, geometry, dq, b, c, ds, dt, zeta, group, levels } = result;
  const lines = [
    `d${d} ${geometry}: Dq = ${dq} cm-1, B = ${b} cm-1, C = ${formatNumber(c, 1).replace(/\.0$/, '')} cm-1, Ds = ${ds} cm-1, Dt = ${dt} cm-1, ζ = ${zeta} cm-1 (site group ${group})`,
    `Ground level: ${levels[0]!.label}`,
    '',
  ];
  const header = ['level', 'energy / cm-1', 'wavelength / nm', 'degeneracy', 'parent', result.spinOrbit ? 'weight' : ''];
  const rows = levels.map((level, i) => [
    level.term,
    formatNumber(level.energy, 1),
    i === 0 || level.energy === 0 ? '' : formatNumber(1e7 / level.energy, 0),
    String(level.degeneracy),
    level.parent,
    result.spinOrbit ? `${formatNumber(100 * level.parentWeight, 0)}%` : '',
  ]);
  lines.push(...textTableLines([header, ...rows], { align: ['left', 'right', 'right', 'right', 'left', 'right'] }), '');
  for (const note of result.notes) lines.push(`Note: ${note}`);
  return `${lines.join('\n')}\n`;
}

export const levelsCommand: Command = {
  name: 'levels',
  summary: 'energy levels of a d^n ion in an octahedral, tetrahedral or tetragonal field, optionally with spin–orbit (cm-1)',
  usage: USAGE,
  async run(argv, io) {
    const args = parseLevelsArgs(argv);
    if (args.beyondCubic) {
      const field = computeFieldLevels(args.d, args.geometry, { dq: args.dq, b: args.b, c: args.c, ds: args.ds, dt: args.dt, zeta: args.zeta });
      io.stdout(args.json ? `${JSON.stringify(fieldLevelsDocument(field), null, 2)}\n` : fieldLevelsTable(field));
      return 0;
    }
    const result = computeLevels(args.d, args.geometry, { dq: args.dq, b: args.b, c: args.c });
    io.stdout(args.json ? `${JSON.stringify(levelsDocument(result), null, 2)}\n` : levelsTable(result));
    return 0;
  },
};
