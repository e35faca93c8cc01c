import { FieldgapError, invalidArgument, isFieldgapError } from '../../errors.js';
import { fitLigandField, parseBandList, type FitInput, type FitResult } from '../../fit/index.js';
import { fitTetragonal, tetragonalFitReport, type TetragonalFitInput } from '../../fit-tetragonal/index.js';
import { valueToWavenumber, xUnitFromName } from '../../spectrum/units.js';
import type { Command } from '../command.js';
import { checkFitBandCount } from '../../fit/band-count.js';
import { normalizeBands } from '../../fit/bands.js';
import { splitBandSuggestion } from '../../fit/split-suggestion.js';
import { checkParameterRange } from '../../ligand-field/parameter-bounds.js';
import { choiceOption, numberOption, parseCommandArgs } from '../options.js';
import { geometryOption } from '../geometry-option.js';
import { formatPlusMinus } from '../../report/plus-minus.js';
import { percentText } from '../../report/probability.js';
import { priorStrainOf, priorStrainText } from '../../report/prior-strain.js';
import { spinStateSentence } from '../../report/spin-state-wording.js';
import { textTableLines } from '../../report/text-table.js';

/**
 * `fieldgap fit`: 10Dq, Racah B and C from observed band maxima, with the
 * assignment chosen automatically, as a readable report or as JSON.
 */
const USAGE = `Usage: fieldgap fit (--ion ION | --d N | --formula F) --bands LIST [--geometry G]
                    [--c-over-b R | --c C | --free-c] [--trees ALPHA|free]
                    [--ligands L] [--window RANGE] [--json]

Fits 10Dq, Racah B (and C) to observed d-d band maxima. The bands are assigned
automatically to transitions from the ground level, trying both spin states
where the ion has a choice; the report shows the assignment, the runners-up
and why they lost, uncertainties, spin state, moment, LFSE and the predicted
transitions below 50000 cm-1. Each assignment is scored by its probability
(band positions, intensities, the measured range, and priors on beta, C/B and
10Dq); the report gives the probability of the chosen assignment, of each
runner-up and of each spin state. A band no transition takes (a spurious or
split maximum) is left unexplained, or two close maxima are averaged as one
band, with a warning; one band of d3/d8 octahedral or d2/d7 tetrahedral gives
10Dq alone. A parameter the bands cannot fix is fixed at its prior and said so.

Options:
  --ion ION        the metal ion: Cr3+, Cr(III), Co2+, ... (gives d, and B0, C0 for beta)
  --d N            the d-electron count 1 to 9 instead of --ion (beta is then null)
  --geometry G     octahedral or tetrahedral (also Oh, Td; default octahedral)
  --bands LIST     band maxima, separated by commas (required); each one
                     POSITION[UNIT][±UNCERTAINTY][:FLAG]...
                   UNIT: cm-1 (default), nm, um or eV            625nm
                   ±U: standard uncertainty (also +- or +/-)     17400±200, 625nm±5
                   :sh shoulder   :sf spin-forbidden   :ct charge-transfer (not fitted)
                   :e=EPS molar absorption coefficient   :w=WIDTH band width (FWHM)
  --c-over-b R     fix C/B at R (default: the free ion's C0/B0, else 4.5)
  --c C            fix Racah C at C cm-1 instead
  --free-c         fit C too (needs at least 3 d-d bands that depend on C)
  --trees ALPHA    add the Trees correction alpha·L(L+1) with alpha fixed at
                     ALPHA cm-1, or fitted with --trees free (default: none,
                     the cubic model of most published analyses)
  --symmetry S     cubic (default) or tetragonal: fit Dq, Ds, Dt (and B) with the
                   D4h convention a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt,
                   b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt
  --zeta Z         spin–orbit constant ζ fixed at Z cm-1, or free-ion (the ion's
                   tabulated value); default 0 (off)
  --free-zeta      fit ζ as well
  --formula F      the complex, e.g. "[Co(H2O)6]2+": gives the ion (if --ion is
                     not given), a geometry guess (if --geometry is not given)
                     and the ligands for the 10Dq and beta priors
  --ligands L      ligands for the priors, comma-separated: H2O, "NH3,Cl"
  --window RANGE   the measured range, e.g. 380-780nm or 12800-26300 (cm-1):
                     a strong transition predicted inside it must show a band
  --json           print the result as JSON

Example: fieldgap fit --ion Cr3+ --bands 17400,24600
         fieldgap fit --ion Co2+ --geometry tetrahedral --bands "5800±100, 14700±150, 40000:ct"
`;

/** Field paths of fitLigandField errors → the option that supplied them. */
const OPTION_OF_FIELD: ReadonlyArray<[RegExp, string]> = [
  [/^ion/, '--ion'],
  [/^d$/, '--d'],
  [/^geometry/, '--geometry'],
  [/^bands/, '--bands'],
  [/^cOverB/, '--c-over-b'],
  [/^c$/, '--c'],
  [/^freeC/, '--free-c'],
  [/^trees/, '--trees'],
  [/^zeta/, '--zeta'],
  [/^formula/, '--formula'],
  [/^ligands/, '--ligands'],
  [/^window/, '--window'],
];

function toOptionError(error: FieldgapError): FieldgapError {
  const option = OPTION_OF_FIELD.find(([pattern]) => pattern.test(error.path))?.[1];
  if (!option) return error;
  const message = error.message.startsWith(`${error.path}: `) ? error.message.slice(error.path.length + 2) : error.message;
  return new FieldgapError(error.code, message, option);
}

/** An argument as a shell word: quoted when it holds anything but plain characters. */
function shellWord(arg: string): string {
  return /^[\w@%+=:,./-]+$/.test(arg) ? arg : `'${arg.replace(/'/g, "'\\''")}'`;
}

/**
 * The refusal with the ready command line of its split-band suggestion
 * (src/fit/split-suggestion.ts), when the fit made one: the same arguments
 * with --bands replaced by the centroid reading.
 */
function withSplitCommand(error: FieldgapError, argv: string[], input: FitInput): FieldgapError {
  const split = splitBandSuggestion(normalizeBands(input.bands, 'bands'), (next) => {
    fitLigandField({ ...input, bands: next });
    return true;
  });
  if (!split) return error;
  const list = split.bands.map((b) => Math.round(b.position)).join(',');
  const args: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--bands') {
      args.push('--bands', list);
      i++;
    } else if (arg.startsWith('--bands=')) {
      args.push('--bands', list);
    } else {
      args.push(arg);
    }
  }
  return new FieldgapError(error.code, `${error.message}. Ready to run: fieldgap fit ${args.map(shellWord).join(' ')}`, error.path);
}

/** Reads and checks the options; every failure names its option. */
export function parseFitArgs(argv: string[]): { input: FitInput; json: boolean; tetragonal?: TetragonalFitInput } {
  const { values } = parseCommandArgs(argv, {
    ion: { type: 'string' },
    d: { type: 'string' },
    geometry: { type: 'string' },
    bands: { type: 'string' },
    'c-over-b': { type: 'string' },
    c: { type: 'string' },
    'free-c': { type: 'boolean' },
    trees: { type: 'string' },
    formula: { type: 'string' },
    ligands: { type: 'string' },
    window: { type: 'string' },
    json: { type: 'boolean' },
    symmetry: { type: 'string' },
    zeta: { type: 'string' },
    'free-zeta': { type: 'boolean' },
  });
  if (values.ion === undefined && values.d === undefined && values.formula === undefined) {
    throw invalidArgument('--ion', '--ion (e.g. Cr3+), --d (the d-electron count) or --formula is required');
  }
  if (values.bands === undefined) throw invalidArgument('--bands', '--bands is required, e.g. --bands 17400,24600');
  const given = (['c-over-b', 'c', 'free-c'] as const).filter((name) => values[name] !== undefined);
  if (given.length > 1) throw invalidArgument(`--${given[1]}`, `give only one of --c-over-b, --c and --free-c (got --${given.join(' and --')})`);
  const bands = parseBandList(values.bands, { path: '--bands' });
  checkFitBandCount(bands.length, '--bands');
  const input: FitInput = { bands };
  // Without --geometry a formula's guess (or octahedral) is used by the fit.
  if (values.geometry !== undefined || values.formula === undefined) {
    input.geometry = geometryOption(values.geometry);
  }
  if (values.formula !== undefined) input.formula = values.formula;
  if (values.ligands !== undefined) input.ligands = values.ligands;
  if (values.window !== undefined) input.window = parseWindow(values.window);
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
  if (values.trees !== undefined) input.trees = values.trees === 'free' ? 'free' : numberOption('trees', values.trees, { min: -500, max: 500 })!;
  const symmetry = choiceOption('symmetry', values.symmetry, ['cubic', 'tetragonal'] as const, 'cubic');
  if (symmetry === 'cubic' && values.zeta === undefined && !values['free-zeta']) return { input, json: values.json ?? false };
  // Beyond the cubic field: the fit of src/fit-tetragonal/.
  if (values.trees !== undefined) throw invalidArgument('--trees', '--trees is not available with --symmetry tetragonal or --zeta');
  if (values['free-c']) throw invalidArgument('--free-c', '--free-c is not available with --symmetry tetragonal or --zeta (C/B stays fixed)');
  if (values.c !== undefined) throw invalidArgument('--c', '--c is not available with --symmetry tetragonal or --zeta: give --c-over-b');
  const tetragonal: TetragonalFitInput = { bands: input.bands, geometry: input.geometry ?? 'octahedral', symmetry };
  if (input.ion !== undefined) tetragonal.ion = String(input.ion);
  if (input.d !== undefined) tetragonal.d = input.d;
  if (input.cOverB !== undefined) tetragonal.cOverB = input.cOverB;
  if (values.zeta !== undefined) tetragonal.zeta = values.zeta === 'free-ion' ? 'free-ion' : numberOption('zeta', values.zeta, { min: 0 })!;
  if (values['free-zeta']) tetragonal.freeZeta = true;
  return { input, json: values.json ?? false, tetragonal };
}

/**
 * "380-780nm", "380–780 nm", "12800-26300", "12800-26300cm-1", "1.6-3.3eV": a
 * measured range as { min, max } in cm-1.
 */
export function parseWindow(text: string): { min: number; max: number } {
  const match = /^\s*([0-9.]+(?:e[+-]?\d+)?)\s*(?:-|–|\.\.|to)\s*([0-9.]+(?:e[+-]?\d+)?)\s*([a-zµμ^\-1⁻¹]*)\s*$/i.exec(text);
  const fail = () => invalidArgument('--window', `--window "${text}" is not a range such as 380-780nm or 12800-26300 (cm-1)`);
  if (!match) throw fail();
  const unit = match[3] === '' ? 'cm-1' : xUnitFromName(match[3]!);
  if (unit === null) throw invalidArgument('--window', `--window "${text}" has an unknown unit "${match[3]}" (use nm, cm-1, um or eV)`);
  const a = Number(match[1]);
  const b = Number(match[2]);
  if (!(a > 0 && b > 0) || a === b) throw fail();
  const ends = [valueToWavenumber(a, unit), valueToWavenumber(b, unit)].sort((x, y) => x - y) as [number, number];
  return { min: ends[0], max: ends[1] };
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
/** A value and its uncertainty (shown even when zero), at `digits`. */
const pm = (v: number, u: number | null, digits = 0) => formatPlusMinus(v, u, { digits, showZero: true });

function table(header: string[], rows: string[][]): string[] {
  return textTableLines([header, ...rows], { indent: '  ' });
}

/** The readable report of `fit`. */
export function fitReport(r: FitResult): string {
  const who = r.ion ? `${r.ion} (d${r.d})` : `d${r.d}`;
  const cMode = r.cMode === 'free' ? 'C fitted' : r.cMode === 'fixed' ? 'C fixed' : r.cOverB !== null ? `C/B fixed at ${fmt(r.cOverB, 2)}` : '';
  const fitted = r.assignments.reduce((n, a) => n + a.bands.length, 0);
  const lines = [`${who} ${r.geometry}: ${fitted} band${fitted === 1 ? '' : 's'} fitted${cMode ? `, ${cMode}` : ''}`, ''];
  lines.push(`  10Dq = ${pm(r.tenDq, r.uncertainty.tenDq)} cm-1   (Dq = ${fmt(r.dq, 1)} cm-1)`);
  if (r.b === null) {
    lines.push('  B    = not determinable from these bands');
  } else {
    const beta = r.beta === null ? 'β not available (no free-ion B0)' : `β = B/B0 = ${fmt(r.beta, 3)} (B0 = ${r.freeIonB} cm-1)`;
    lines.push(`  B    = ${pm(r.b, r.uncertainty.b)} cm-1   ${beta}`);
    lines.push(`  C    = ${pm(r.c!, r.uncertainty.c)} cm-1   C/B = ${fmt(r.cOverB!, 2)}`);
    if (r.alpha !== undefined) lines.push(`  α    = ${pm(r.alpha, r.uncertainty.alpha ?? null, 1)} cm-1   Trees correction α·L(L+1)${r.uncertainty.alpha === undefined ? ', fixed' : ''}`);
    if (r.correlation.bDq !== null) lines.push(`  correlation of B with Dq: ${fmt(r.correlation.bDq, 3)}`);
  }
  lines.push('');
  const spin = spinStateSentence(r.spinState, r.d, r.geometry);
  lines.push(`Ground level ${r.groundLabel}, ${spin}; ${r.unpairedElectrons} unpaired electron${r.unpairedElectrons === 1 ? '' : 's'}, spin-only moment ${fmt(r.spinOnlyMoment, 2)} μB`);
  if (r.crossover) {
    lines.push(`Spin crossover at Dq/B = ${fmt(r.crossover.dqOverB, 2)}; fitted Dq/B = ${fmt(r.crossover.fittedDqOverB, 2)} (${r.crossover.percent >= 0 ? '+' : ''}${fmt(r.crossover.percent, 1)}%)`);
  }
  lines.push(`LFSE = ${r.lfse.dq} Dq = ${fmt(r.lfse.cm1)} cm-1 (${r.lfse.configuration}; ${r.lfse.extraPairs} pair${r.lfse.extraPairs === 1 ? '' : 's'} beyond the free ion, pairing energy not included)`);
  lines.push(`Fit: ${r.message}; rms residual ${fmt(r.rmsResidual)} cm-1`);
  const spinChoice = Object.entries(r.spinStateProbabilities).filter(([key]) => key !== 'no-choice');
  lines.push(`Probability of this assignment: ${percentText(r.probability)}${spinChoice.length ? `; spin state: ${spinChoice.map(([key, p]) => `${key} ${percentText(p ?? 0)}`).join(', ')}` : ''} (score ${fmt(r.score, 1)} = −2 ln p + const; relative to the other assignments tried)`);
  // Probability is relative; a reading far outside its own priors says so here (src/report/prior-strain.ts, AUDIT3 finding 2).
  const strain = priorStrainOf(r.penalties as FitResult['penalties'] | undefined);
  if (strain) lines.push(priorStrainText(strain));
  const group = r.assignmentGroup as FitResult['assignmentGroup'] | undefined;
  if (group && group.members > 1) {
    const range = (x: [number, number]) => (Math.round(x[0]) === Math.round(x[1]) ? fmt(x[0]) : `${fmt(x[0])}–${fmt(x[1])}`);
    lines.push(`Probability of the spin-allowed assignment and parameters: ${percentText(group.probability)} (${group.members} solutions differing only in weak-band labels; 10Dq ${range(group.tenDqRange)}${group.bRange ? `, B ${range(group.bRange)}` : ''} cm-1)`);
  }
  // The spread over the weak-band labellings (src/fit/assignment-spread.ts), already inside the ± above; older results lack it.
  const spread = r.assignmentSpread as FitResult['assignmentSpread'] | undefined;
  if (spread?.widened) {
    const range = (x: [number, number]) => `${fmt(x[0])}–${fmt(x[1])}`;
    const fitSd = (v: number | null) => (v === null ? 'not fitted' : `± ${fmt(v)}`);
    lines.push(`Uncertainty from the weak-band labellings: 10Dq ${range(spread.tenDqRange)} cm-1 (fit alone ${fitSd(spread.fitUncertainty.tenDq)})${spread.bRange && r.b !== null ? `, B ${range(spread.bRange)} cm-1 (fit alone ${fitSd(spread.fitUncertainty.b)})` : ''}; the ± above is √(σ_fit² + Δ²), Δ the largest distance from the value to an end of that range`);
  }
  // The absolute check (src/fit/goodness-of-fit.ts): older stored results lack it.
  const g = r.goodnessOfFit as FitResult['goodnessOfFit'] | undefined;
  if (g) lines.push(`Goodness of fit: ${g.verdict === 'poor' ? 'POOR' : 'good'}: χ² = ${fmt(g.chiSquare, 1)} for ${g.degreesOfFreedom} degree${g.degreesOfFreedom === 1 ? '' : 's'} of freedom (p = ${g.pValue < 1e-6 ? '< 1e-6' : g.pValue.toPrecision(2)})${g.reason ? `; ${g.reason}` : g.betaPhysical === false ? '; β outside 0.3–1.1, not physical' : ''}`);
  for (const u of r.undetermined) lines.push(`Not determined by these bands: ${u.parameter === 'tenDq' ? '10Dq' : u.parameter.toUpperCase()} (${u.reason}); ${u.action}`);
  if (r.window) lines.push(`Measured range: ${fmt(r.window.min)}–${fmt(r.window.max)} cm-1 (${fmt(1e7 / r.window.max)}–${fmt(1e7 / r.window.min)} nm)`);
  lines.push('', 'Assignment (cm-1):');
  lines.push(...table(['observed', 'calculated', 'residual', 'transition'], r.assignments.map((a) => [
    fmt(a.observed), fmt(a.calculated), fmt(a.residual),
    `${r.groundLabel} → ${a.label}${a.coincident.length ? ` (with ${a.coincident.join(', ')})` : ''}${a.spinAllowed ? '' : ', spin-forbidden'}${a.bands.length > 1 ? ', mean of components' : ''}`,
  ])));
  for (const u of r.unassigned) lines.push(`  ${fmt(u.observed)} not fitted: ${u.reason}`);
  if (r.alternatives.length) {
    lines.push('', 'Runners-up:');
    for (const alt of r.alternatives) {
      const params = `10Dq ${fmt(alt.tenDq)}${alt.b === null ? '' : `, B ${fmt(alt.b)}`}`;
      lines.push(`  ${alt.assignments.map((a) => a.label).join(', ')}: ${params}, ${alt.spinState === 'no-choice' ? '' : `${alt.spinState}, `}rms ${fmt(alt.rmsResidual)} cm-1, probability ${percentText(alt.probability)}${alt.inChosenGroup ? ' (same spin-allowed assignment and parameters)' : ''}`, `    not chosen: ${alt.reason}`);
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
    const { input, json, tetragonal } = parseFitArgs(argv);
    if (tetragonal) {
      let fitted;
      try {
        fitted = fitTetragonal(tetragonal);
      } catch (error) {
        throw isFieldgapError(error) ? toOptionError(error) : error;
      }
      io.stdout(json ? `${JSON.stringify(fitted, null, 2)}\n` : tetragonalFitReport(fitted));
      return 0;
    }
    let result: FitResult;
    try {
      result = fitLigandField(input);
    } catch (error) {
      if (isFieldgapError(error) && error.code === 'unexplained') throw toOptionError(withSplitCommand(error, argv, input));
      throw isFieldgapError(error) ? toOptionError(error) : error;
    }
    io.stdout(json ? `${JSON.stringify(fitJson(result), null, 2)}\n` : fitReport(result));
    return 0;
  },
};
