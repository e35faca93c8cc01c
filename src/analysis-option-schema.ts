/**
 * The analysis options as ONE zod schema, in the pipeline's names
 * (AnalyzeOptions of src/analysis.ts): each option's type, range and
 * description once. The REST fields are the same schema under their REST
 * names (src/analysis-option-names.ts: conc, path, ...); the CLI parser reads
 * its strings into the pipeline's options and checks them against the same
 * schema, so `--conc 50` and `?conc=50` are refused alike. The core
 * (analyzeSpectrum) keeps only the chemistry checks.
 *
 * Used at the edges only (the CLI and the service); the page sends the names
 * of src/analysis-option-names.ts and lets the service check the values.
 */
import { z } from 'zod';
import type { AnalyzeOptions } from './analysis.js';
import { ANALYSIS_OPTION_NAMES, checkOneCMode, type AnalysisOptionKey } from './analysis-option-names.js';
import { FieldgapError } from './errors.js';
import { PARAMETER_BOUNDS } from './ligand-field/parameter-bounds.js';
import { OVERLAP_CRITERIA } from './series/types.js';
import { X_UNITS, Y_UNITS } from './spectrum/types.js';

const positive = (description: string) => z.number().positive().finite().meta({ description });

/** The metal ion as written, e.g. "Cr3+" or "Co(II)". */
export const ionField = z.string().trim().min(1).max(40).meta({
  description: 'Metal ion with its charge, e.g. "Cr3+" or "Co(II)"; instead of d.',
  examples: ['Cr3+'],
});
export const dCountField = z.number().int().min(0).max(10).meta({ description: 'Number of d electrons (d^n).' });
export const geometryField = z.enum(['octahedral', 'tetrahedral']).meta({
  description: 'Coordination geometry: sets the sign of the cubic field.',
});
export const cOverBField = positive('Fixed C/B ratio for the fit.').max(20);
export const cField = positive('Fixed Racah C in cm-1.').max(PARAMETER_BOUNDS.c.max);
/** The complex's formula, for the fit's ligand priors (and the ion and a geometry guess when not given). */
export const formulaField = z.string().trim().min(1).max(200).meta({
  description: 'The complex, e.g. "[Co(H2O)6]2+": ligand priors of the assignment (10Dq, β); the ion and a geometry guess when not given.',
  examples: ['[Co(H2O)6]2+'],
});
/** Ligands for the fit's priors. */
export const ligandsField = z
  .union([z.string().trim().min(1).max(200), z.array(z.string().trim().min(1).max(40)).max(12)])
  .meta({ description: 'Ligands for the 10Dq and β priors: "H2O", "NH3,Cl" or a list.', examples: ['H2O'] });

/** A series's overlap criterion (`fieldgap series --criterion`, GET /series?criterion=). */
export const criterionField = z.enum(OVERLAP_CRITERIA).meta({
  description: 'When neighbours count as not resolved: |Δ| < k·sqrt(σ1² + σ2²) with k = 1 (default) or 2.',
});

/** Every analysis option a caller may give, in the pipeline's names; all optional. */
export const ANALYSIS_OPTION_FIELDS = {
  ion: ionField.optional(),
  d: dCountField.optional(),
  geometry: geometryField.optional(),
  // Physically meaningful ranges: a concentration of 1e-300 mol/L turns every band into "charge transfer".
  concentration: positive('Concentration in mol/L (for molar absorption coefficients), 1e-7 to 20.').min(1e-7).max(20).optional(),
  pathLength: positive('Path length in cm (default 1), 1e-4 to 100.').min(1e-4).max(100).optional(),
  xUnit: z.enum(X_UNITS).optional().meta({ description: 'Unit of the x column when the file does not say.' }),
  yUnit: z.enum(Y_UNITS).optional().meta({ description: 'Unit of the y column when the file does not say.' }),
  column: z
    .union([z.number().int().min(1), z.string().trim().min(1).max(80)])
    .optional()
    .meta({ description: 'Which y column to use: its 1-based number or its header.' }),
  cOverB: cOverBField.optional(),
  c: cField.optional(),
  freeC: z.boolean().optional().meta({ description: 'Fit C as a free parameter.' }),
  formula: formulaField.optional(),
  ligands: ligandsField.optional(),
  curves: z.boolean().optional().meta({
    description: 'Also return the curves on the energy grid (signal, baseline, model, components) for plotting.',
  }),
  stepCorrection: z.boolean().optional().meta({
    description: 'Correct detector change-over steps (default true; only on overwhelming evidence, each listed with its size in spectrum.stepCorrections). false leaves the data as read.',
  }),
} satisfies Partial<Record<keyof AnalyzeOptions, z.ZodType>>;

type Fields = typeof ANALYSIS_OPTION_FIELDS;
type RestName<K extends keyof Fields> = K extends AnalysisOptionKey ? (typeof ANALYSIS_OPTION_NAMES)[K]['rest'] : K;
/** The same fields under their REST names. */
export type RestAnalysisShape = { [K in keyof Fields as RestName<K>]: Fields[K] };

function restName(key: keyof Fields): string {
  return key in ANALYSIS_OPTION_NAMES ? ANALYSIS_OPTION_NAMES[key as AnalysisOptionKey].rest : key;
}

/** The analysis options as REST query or form fields (conc, path, ...): the one schema, renamed. */
export const REST_ANALYSIS_FIELDS = Object.fromEntries(
  (Object.keys(ANALYSIS_OPTION_FIELDS) as (keyof Fields)[]).map((key) => [restName(key), ANALYSIS_OPTION_FIELDS[key]]),
) as RestAnalysisShape;

export type RestAnalysisFields = z.output<z.ZodObject<RestAnalysisShape>>;

/** The REST fields → the pipeline's options; absent fields stay absent; C fixed one way at most. */
export function analyzeOptionsFromRest(fields: Partial<RestAnalysisFields>): AnalyzeOptions {
  const options: Record<string, unknown> = {};
  for (const key of Object.keys(ANALYSIS_OPTION_FIELDS) as (keyof Fields)[]) {
    const value = (fields as Record<string, unknown>)[restName(key)];
    if (value !== undefined) options[key] = key === 'ligands' && Array.isArray(value) ? [...(value as string[])] : value;
  }
  checkOneCMode(options, 'rest');
  return options as AnalyzeOptions;
}

const pipelineSchema = z.strictObject(ANALYSIS_OPTION_FIELDS);

/**
 * Checks options read from the command line against the one schema; an
 * error names the option as the user typed it ("--conc").
 */
export function checkCliAnalysisOptions(options: AnalyzeOptions): AnalyzeOptions {
  const { fileName: _fileName, corrections: _corrections, ...checked } = options;
  const result = pipelineSchema.safeParse(checked);
  if (!result.success) {
    const issue = result.error.issues[0]!;
    const key = String(issue.path[0] ?? '');
    const name = key in ANALYSIS_OPTION_NAMES ? `--${ANALYSIS_OPTION_NAMES[key as AnalysisOptionKey].cli}` : key;
    throw new FieldgapError('invalid-argument', `${name}: ${issue.message.replace(/^Invalid input: /, '')}`, name);
  }
  checkOneCMode(options, 'cli');
  return options;
}

/**
 * Checks one command-line option that has a field of its own in this schema
 * (--formula, --ligands, --criterion) against that field, as the REST field
 * of the same name is checked; an error names the option as typed ("--formula").
 */
export function checkCliOption<T>(field: z.ZodType<T>, value: unknown, name: string): T {
  const result = field.safeParse(value);
  if (result.success) return result.data;
  const message = result.error.issues[0]?.message.replace(/^Invalid (input|option): /, '') ?? 'not a valid value';
  throw new FieldgapError('invalid-argument', `--${name}: ${message}, got ${JSON.stringify(value)}`, `--${name}`);
}
