import { FieldgapError, invalidArgument, isFieldgapError } from '../../errors.js';
import { fitBands, parseBandList, type FitInput, type FitResult } from '../../fit/index.js';
import { GEOMETRIES } from '../../ligand-field/index.js';
import type { Command } from '../command.js';
import { checkFitBandCount } from '../../fit/band-count.js';
import { checkParameterRange } from '../../ligand-field/parameter-bounds.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';

/**
 * `fieldgap fit`: 10Dq, Racah B and C from observed band maxima, with the
 * assignment chosen automatically, as a readable report or as JSON.
 */
const USAGE = `Usage: fieldgap fit (--ion ION | --d N) --bands LIST [--geometry G]
                    [--c-over-b R | --c C | --free-c] [--json]

Fits 10Dq, Racah B (and C) to observed d-d band maxima. The bands are assigned
automatically to transitions from the ground level, trying both spin states
where the ion has a choice; the report shows the assignment, the runners-up
and why they lost, uncertainties, spin state, moment, LFSE and the predicted
transitions below 50000 cm-1. A band no transition takes (a spurious or split
maximum) is left unexplained, or two close maxima are averaged as one band,
with a warning; one band of d3/d8 octahedral or d2/d7 tetrahedral gives 10Dq
alone.

Options:
  --ion ION        the metal ion: Cr3+, Cr(III), Co2+, ... (gives d, and B0, C0 for beta)
  --d N            the d-electron count 1 to 9 instead of --ion (beta is then null)
  --geometry G     octahedral or tetrahedral (default octahedral)
  --bands LIST     band maxima, separated by commas (required); each one
                     POSITION[UNIT][±UNCERTAINTY][:FLAG]...
                   UNIT: cm-1 (default), nm, um or eV            625nm
                   ±U: standard uncertainty (also +- or +/-)     17400±200, 625nm±5
                   :sh shoulder   :sf spin-forbidden   :ct charge-transfer (not fitted)
                   :e=EPS molar absorption coefficient   :w=WIDTH band width (FWHM)
  --c-over-b R     fix C/B at R (default: the free ion's C0/B0, else 4.5)
  --c C            fix Racah C at C cm-1 instead
  --free-c         fit C too (needs at least 3 d-d bands that depend on C)
  --json           print the result as JSON

Example: fieldgap fit --ion Cr3+ --bands 17400,24600
         fieldgap fit --ion Co2+ --geometry tetrahedral --bands "5800±100, 14700±150, 40000:ct"
`;

/** Field paths of fitBands errors → the option that supplied them. */
const OPTION_OF_FIELD: ReadonlyArray<[RegExp, string]> = [
  [/^ion/, '--ion'],
  [/^d$/, '--d'],
  [/^geometry/, '--geometry'],
  [/^bands/, '--bands'],
  [/^cOverB/, '--c-over-b'],
  [/^c$/, '--c'],
  [/^freeC/, '--free-c'],
];

function toOptionError(error: FieldgapError): FieldgapError {
  const option = OPTION_OF_FIELD.find(([pattern]) => pattern.test(error.path))?.[1];
  if (!option) return error;
  const message = error.message.startsWith(`${error.path}: `) ? error.message.slice(error.path.length + 2) : error.message;
  return new FieldgapError(error.code, message, option);
}

/** Reads and checks the options; every failure names its option. */
export function parseFitArgs(argv: string[]): { input: FitInput; json: boolean } {
  const { values } = parseCommandArgs(argv, {
    ion: { type: 'string' },
    d: { type: 'string' },
    geometry: { type: 'string' },
    bands: { type: 'string' },
    'c-over-b': { type: 'string' },
    c: { type: 'string' },
    'free-c': { type: 'boolean' },
    json: { type: 'boolean' },
  });
  if (values.ion === undefined && values.d === undefined) {
    throw invalidArgument('--ion', '--ion (e.g. Cr3+) or --d (the d-electron count) is required');
  }
  if (values.bands === undefined) throw invalidArgument('--bands', '--bands is required, e.g. --bands 17400,24600');
  const given = (['c-over-b', 'c', 'free-c'] as const).filter((name) => values[name] !== undefined);
  if (given.length > 1) throw invalidArgument(`--${given[1]}`, `give only one of --c-over-b, --c and --free-c (got --${given.join(' and --')})`);
  const bands = parseBandList(values.bands, { path: '--bands' });
  checkFitBandCount(bands.length, '--bands');
  const input: FitInput = {
    bands,
    geometry: choiceOption('geometry', values.geometry, GEOMETRIES, 'octahedral'),
  };
  if (values.ion !== undefined) input.ion = values.ion;
  const d = numberOption('d', values.d, { min: 1, max: 9, integer: true });
  if (d !== undefined) input.d = d;
  const cOverB = numberOption('c-over-b', values['c-over-b'], { min: 0, max: 20 });
  if (cOverB !== undefined) {
    if (cOverB <= 0) throw invalidArgument('--c-over-b', '--c-over-b must be greater than 0');
    input.cOverB = cOverB;
  }
  const c = numberOption('c', values.c, { min: 0 });
  if (c !== undefined) {
    if (c <= 0) throw invalidArgument('--c', '--c: Racah C must be greater than 0 cm-1');
    checkParameterRange('c', c, '--c');
    input.c = c;
  }
  if (values['free-c']) input.freeC = true;
  return { input, json: values.json ?? false };
}

/** The JSON document of `fit --json`: the contract fields first, then the extras. */
export function fitJson(result: FitResult): object {
  const {
    d, ion, geometry, dq, tenDq, b, c, cOverB, beta, freeIonB, groundTerm, spinState, unpairedElectrons,
    spinOnlyMoment, lfse, rmsResidual, status, uncertainty, assignments, alternatives, predicted, warnings, ...rest
  } = result;
  return {
    d, ion, geometry, dq, tenDq, b, c, cOverB, beta, freeIonB, groundTerm, spinState, unpairedElectrons,
    spinOnlyMoment, lfse, rmsResidual, status, uncertainty, assignments, alternatives, predicted, warnings, ...rest,
  };
}

const fmt = (v: number, digits = 0) => v.toFixed(digits);
const pm = (v: number | null, digits = 0) => (v === null ? '' : ` ± ${fmt(v, digits)}`);

function table(header: string[], rows: string[][]): string[] {
  const widths = header.map((h, col) => Math.max(h.length, ...rows.map((r) => (r[col] ?? '').length)));
  const render = (cells: string[]) =>
    cells.map((cell, col) => (col === cells.length - 1 ? cell : cell.padEnd(widths[col]!))).join('  ').trimEnd();
  return [render(header), ...rows.map(render)].map((line) => `  ${line}`);
}

/** The readable report of `fit`. */
export function fitReport(r: FitResult): string {
  const who = r.ion ? `${r.ion} (d${r.d})` : `d${r.d}`;
  const cMode = r.cMode === 'free' ? 'C fitted' : r.cMode === 'fixed' ? 'C fixed' : r.cOverB !== null ? `C/B fixed at ${fmt(r.cOverB, 2)}` : '';
  const fitted = r.assignments.reduce((n, a) => n + a.bands.length, 0);
  const lines = [`${who} ${r.geometry}: ${fitted} band${fitted === 1 ? '' : 's'} fitted${cMode ? `, ${cMode}` : ''}`, ''];
  lines.push(`  10Dq = ${fmt(r.tenDq)}${pm(r.uncertainty.tenDq)} cm-1   (Dq = ${fmt(r.dq, 1)} cm-1)`);
  if (r.b === null) {
    lines.push('  B    = not determinable from these bands');
  } else {
    const beta = r.beta === null ? 'β not available (no free-ion B0)' : `β = B/B0 = ${fmt(r.beta, 3)} (B0 = ${r.freeIonB} cm-1)`;
    lines.push(`  B    = ${fmt(r.b)}${pm(r.uncertainty.b)} cm-1   ${beta}`);
    lines.push(`  C    = ${fmt(r.c!)}${pm(r.uncertainty.c)} cm-1   C/B = ${fmt(r.cOverB!, 2)}`);
    if (r.correlation.bDq !== null) lines.push(`  correlation of B with Dq: ${fmt(r.correlation.bDq, 3)}`);
  }
  lines.push('');
  const spin = r.spinState === 'no-choice' ? `no spin-state choice for d${r.d} ${r.geometry}` : r.spinState;
  lines.push(`Ground level ${r.groundLabel}, ${spin}; ${r.unpairedElectrons} unpaired electron${r.unpairedElectrons === 1 ? '' : 's'}, spin-only moment ${fmt(r.spinOnlyMoment, 2)} μB`);
  if (r.crossover) {
    lines.push(`Spin crossover at Dq/B = ${fmt(r.crossover.dqOverB, 2)}; fitted Dq/B = ${fmt(r.crossover.fittedDqOverB, 2)} (${r.crossover.percent >= 0 ? '+' : ''}${fmt(r.crossover.percent, 1)}%)`);
  }
  lines.push(`LFSE = ${r.lfse.dq} Dq = ${fmt(r.lfse.cm1)} cm-1 (${r.lfse.configuration}; ${r.lfse.extraPairs} pair${r.lfse.extraPairs === 1 ? '' : 's'} beyond the free ion, pairing energy not included)`);
  lines.push(`Fit: ${r.message}; rms residual ${fmt(r.rmsResidual)} cm-1`, '', 'Assignment (cm-1):');
  lines.push(...table(['observed', 'calculated', 'residual', 'transition'], r.assignments.map((a) => [
    fmt(a.observed), fmt(a.calculated), fmt(a.residual),
    `${r.groundLabel} → ${a.label}${a.coincident.length ? ` (with ${a.coincident.join(', ')})` : ''}${a.spinAllowed ? '' : ', spin-forbidden'}${a.bands.length > 1 ? ', mean of components' : ''}`,
  ])));
  for (const u of r.unassigned) lines.push(`  ${fmt(u.observed)} not fitted: ${u.reason}`);
  if (r.alternatives.length) {
    lines.push('', 'Runners-up:');
    for (const alt of r.alternatives) {
      const params = `10Dq ${fmt(alt.tenDq)}${alt.b === null ? '' : `, B ${fmt(alt.b)}`}`;
      lines.push(`  ${alt.assignments.map((a) => a.label).join(', ')}: ${params}, rms ${fmt(alt.rmsResidual)} cm-1`, `    not chosen: ${alt.reason}`);
    }
  }
  lines.push('', `Predicted transitions below 50000 cm-1 (* spin-allowed):`);
  lines.push(...table(['energy/cm-1', 'nm', 'level'], r.predicted.map((p) => [
    fmt(p.energy), fmt(1e7 / p.energy), `${p.spinAllowed ? '* ' : '  '}${p.label}${p.twoElectron ? ' (two-electron, weak)' : ''}`,
  ])));
  if (r.warnings.length) lines.push('', ...r.warnings.map((w) => `Warning: ${w}`));
  if (r.notes.length) lines.push('', ...r.notes.map((n) => `Note: ${n}`));
  return `${lines.join('\n')}\n`;
}

export const fitCommand: Command = {
  name: 'fit',
  summary: 'fit 10Dq, Racah B and C to observed band maxima (automatic assignment, spin state)',
  usage: USAGE,
  async run(argv, io) {
    const { input, json } = parseFitArgs(argv);
    let result: FitResult;
    try {
      result = fitBands(input);
    } catch (error) {
      throw isFieldgapError(error) ? toOptionError(error) : error;
    }
    io.stdout(json ? `${JSON.stringify(fitJson(result), null, 2)}\n` : fitReport(result));
    return 0;
  },
};
