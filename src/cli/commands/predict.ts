import { invalidArgument, isFieldgapError } from '../../errors.js';
import { findLigand } from '../../chemistry/ligands.js';
import { parseFormula } from '../../chemistry/formula.js';
import { predictComplex, type Prediction, type PredictGeometry, type PredictOptions } from '../../series/predict.js';
import { ownFactorsFromFit } from '../../series/predict-library.js';
import type { Command, CliIo } from '../command.js';
import { numberOption, parseCommandArgs } from '../options.js';
import { withLibrary } from './library.js';
import { comparisonReport, predictionReport } from './predict-report.js';

export { predictionReport } from './predict-report.js';

/** Geometries `--geometry` accepts. */
export const PREDICT_GEOMETRIES: readonly PredictGeometry[] = ['octahedral', 'tetrahedral', 'square-planar'];

/**
 * `fieldgap predict FORMULA`: ligand-field parameters and spin state of a
 * complex estimated from its formula alone (Jørgensen's factorisations and the
 * free-ion Racah parameters, then the ligand-field engine). No file access.
 */
const USAGE = `Usage: fieldgap predict FORMULA [--vs FORMULA2] [--geometry G] [--library]
                        [--g G] [--k K] [--f LIGAND=F]... [--h LIGAND=H]... [--json]

Estimates 10Dq, beta, Racah B and C, the spin state (with its probability, or
the rule of the trade that decides it), unpaired electrons, the orbital
occupation, the LFSE and the spin-only moment of a complex from its formula
alone. Every number is an estimate from tabulated factors (10Dq = f·g,
1 - beta = h·k), not a measurement.

FORMULA is a complex or a salt, quoted for the shell:
  "[Co(NH3)6]3+"  "[Ni(NH3)6]Cl2"  "K3[Fe(C2O4)3]"  "[Co(en)2Cl2]+"  "CoCl4 2-"

Options:
  --vs FORMULA2    a second complex side by side (same metal, another ligand);
                   --json then prints { "complexes": [first, second] }
  --geometry G     octahedral, tetrahedral or square-planar (default: from the
                   coordination number and the rules of the trade, stated)
  --library        use the ligand factors fitted from your library's analyses
                   of the same metal ion (they win over the tables)
  --data DIR       library folder (default $FIELDGAP_DATA, else ./fieldgap-data)
  --g G            the metal's g in cm-1 (default: Jørgensen's table)
  --k K            the metal's k (default: Jørgensen's table)
  --f LIGAND=F     your own f for a ligand, e.g. --f NH3=1.24 (repeatable)
  --h LIGAND=H     your own h for a ligand (repeatable)
  --json           print the prediction as JSON

Example: fieldgap predict "[Cr(NH3)6]3+"
`;

/** Reads and checks the options; every failure names its option. */
export function parsePredictArgs(argv: string[]): { formula: string; vs: string | undefined; options: PredictOptions; json: boolean; library: boolean; data: string | undefined } {
  const { values, positionals } = parseCommandArgs(
    argv,
    {
      geometry: { type: 'string' },
      g: { type: 'string' },
      k: { type: 'string' },
      f: { type: 'string', multiple: true },
      h: { type: 'string', multiple: true },
      json: { type: 'boolean' },
      library: { type: 'boolean' },
      data: { type: 'string' },
      vs: { type: 'string' },
    },
    true,
  );
  if (positionals.length === 0) throw invalidArgument('formula', 'give the formula of a complex, e.g. fieldgap predict "[Co(NH3)6]3+"');
  const options: PredictOptions = {};
  if (values.geometry !== undefined) {
    const geometry = values.geometry.trim().toLowerCase().replace(/[\s_]+/g, '-') as PredictGeometry;
    if (!PREDICT_GEOMETRIES.includes(geometry)) throw invalidArgument('--geometry', `--geometry: expected one of ${PREDICT_GEOMETRIES.join(', ')}, got "${values.geometry}"`);
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
  if (values.data !== undefined && !values.library) throw invalidArgument('--data', '--data names the library folder: give it with --library');
  if (values.vs !== undefined && values.vs.trim() === '') throw invalidArgument('--vs', '--vs: give the formula of the second complex, e.g. --vs "[Fe(CN)6]4-"');
  return { formula: positionals.join(' '), vs: values.vs, options, json: values.json ?? false, library: values.library ?? false, data: values.data };
}

/** The JSON document of `predict --json`: the contract fields first (do not rename), then the rest. */
export function predictionJson(p: Prediction): object {
  const { ion, d, oxidationState, ligands, tenDq, b, spinState, unpairedElectrons, spinOnlyMoment, ...rest } = p;
  const ligandsOut = ligands.map((l) => ({ ...l, h: l.h ?? null }));
  return { ion, d, oxidationState, ligands: ligandsOut, tenDq, b, spinState, unpairedElectrons, spinOnlyMoment, ...rest };
}

/** JSON text with float noise trimmed (12 significant digits: 591.8000000000001 → 591.8). */
function jsonText(doc: object): string {
  return `${JSON.stringify(doc, (_key, value: unknown) => (typeof value === 'number' && Number.isFinite(value) ? Number(value.toPrecision(12)) : value), 2)}\n`;
}

/** `predict --json` text of one prediction. */
export function predictionJsonText(p: Prediction): string {
  return jsonText(predictionJson(p));
}

export const predictCommand: Command = {
  name: 'predict',
  summary: "estimate 10Dq, B, beta and the spin state of a complex from its formula (Jørgensen's factors)",
  usage: USAGE,
  async run(argv, io) {
    const { formula, vs, options, json, library, data } = parsePredictArgs(argv);
    if (vs !== undefined) {
      const second: PredictOptions = { ...options };
      if (library) {
        await addLibraryFactors(formula, options, data, io);
        await addLibraryFactors(vs, second, data, io);
      }
      const a = predictComplex(formula, options);
      const b = predictComplex(vs, second);
      io.stdout(json ? jsonText({ complexes: [predictionJson(a), predictionJson(b)] }) : comparisonReport(a, b));
      return 0;
    }
    if (library) await addLibraryFactors(formula, options, data, io);
    const prediction = predictComplex(formula, options);
    io.stdout(json ? predictionJsonText(prediction) : predictionReport(prediction));
    return 0;
  },
};

/**
 * Puts the factors fitted from the library's analyses of the formula's metal
 * ion under the user's own --f/--h (which still win). A library with no
 * usable analyses of that ion leaves the tables in charge, with a note on stderr.
 */
async function addLibraryFactors(formula: string, options: PredictOptions, data: string | undefined, io: CliIo): Promise<void> {
  const ion = parseFormula(formula).metal.label;
  const { librarySeries } = await import('../../library/series.js');
  const fit = await withLibrary(data, io, async (library) => {
    try {
      return (await librarySeries(library, ion)).factors;
    } catch (error) {
      if (isFieldgapError(error) && error.code === 'not-found') return null;
      throw error;
    }
  });
  if (!fit || fit.factors.length === 0) {
    io.stderr(`fieldgap predict: note: the library has no fitted ligand factors for ${ion}; Jørgensen's tables used\n`);
    return;
  }
  const own = ownFactorsFromFit(fit);
  for (const [key, given] of Object.entries(options.factors ?? {})) own[key] = { ...own[key], ...given, source: 'given by the user' };
  options.factors = own;
}
