/**
 * The request schemas of the REST service: the one description of what each
 * endpoint accepts. The routes validate with them (after coerceFields for
 * text from query strings and forms), and openapi.ts builds the OpenAPI
 * document from them, so the two cannot drift apart. Energies in cm-1.
 *
 * These are the edge of the service: they check types and ranges a request
 * can get wrong on its own; the chemistry (is this ion a d^n ion, does a band
 * list make sense) is checked by the core, which answers with its own errors.
 */
import { z } from 'zod';
import { MAX_FIT_BANDS } from '../src/fit/band-count.js';
import { DIAGRAM_DEFAULTS } from '../src/ligand-field/index.js';
import { PARAMETER_BOUNDS as BOUNDS } from '../src/ligand-field/parameter-bounds.js';
import { REST_ANALYSIS_FIELDS, cField, cOverBField, dCountField, formulaField, geometryField, ionField, ligandsField } from '../src/analysis-option-schema.js';
import { X_UNITS, Y_UNITS } from '../src/spectrum/types.js';

// The analysis option fields are defined once, in src/analysis-option-schema.ts.
const geometry = geometryField;
const dCount = dCountField;
const ion = ionField;

const positive = (description: string) => z.number().positive().finite().meta({ description });

/** Limits that keep one request from occupying a worker for long. */
export const LIMITS = {
  maxSteps: 2000,
  maxDqOverB: 20,
  maxBands: MAX_FIT_BANDS,
  maxEnergy: 200_000,
} as const;

/**
 * Tetragonal Ds, Dt and spin–orbit ζ (cm-1), for levels and diagrams. Any of
 * them present switches to the result beyond the cubic field (see
 * src/ligand-field/field-levels.ts); absent, the cubic answer is unchanged.
 */
const fieldBeyondCubic = {
  ds: z.number().min(-LIMITS.maxEnergy).max(LIMITS.maxEnergy).optional().meta({
    description: 'Tetragonal Ds in cm-1 (octahedral only): a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt.',
  }),
  dt: z.number().min(-LIMITS.maxEnergy).max(LIMITS.maxEnergy).optional().meta({ description: 'Tetragonal Dt in cm-1 (octahedral only).' }),
  zeta: z.number().min(0).max(LIMITS.maxEnergy).optional().meta({
    description: 'One-electron spin–orbit constant ζ in cm-1; levels are then labelled by the double group.',
  }),
};

export const levelsQuery = z
  .strictObject({
    d: dCount,
    geometry: geometry.default('octahedral'),
    // Physically meaningful ranges (src/ligand-field/parameter-bounds.ts): B = 1e-150 or Dq = 1e300 is a typing error.
    dq: z.number().min(BOUNDS.dq.min).max(BOUNDS.dq.max).meta({ description: 'Dq in cm-1 (10Dq = 10·dq), ≥ 0.' }),
    b: z.number().min(BOUNDS.b.min).max(BOUNDS.b.max).meta({ description: 'Racah B in cm-1.' }),
    c: z.number().min(BOUNDS.c.min).max(BOUNDS.c.max).optional().meta({ description: 'Racah C in cm-1 (give c or cOverB).' }),
    cOverB: z.number().min(BOUNDS.cOverB.min).max(BOUNDS.cOverB.max).optional().meta({ description: 'C given as the ratio C/B instead of c.' }),
    ...fieldBeyondCubic,
  })
  .refine((q) => q.c !== undefined || q.cOverB !== undefined, {
    message: 'give Racah C as "c" (cm-1) or as the ratio "cOverB"',
    path: ['c'],
  })
  .refine((q) => q.c === undefined || q.cOverB === undefined, {
    message: 'give either "c" or "cOverB", not both',
    path: ['cOverB'],
  });
export type LevelsQuery = z.infer<typeof levelsQuery>;

export const diagramQuery = z.strictObject({
  d: dCount,
  geometry: geometry.default('octahedral'),
  cOverB: positive('C/B ratio of the diagram.').max(20).default(DIAGRAM_DEFAULTS.cOverB),
  maxDqOverB: positive('Largest Dq/B on the axis.').min(BOUNDS.maxDqOverB.min).max(LIMITS.maxDqOverB).default(DIAGRAM_DEFAULTS.maxDqOverB),
  steps: z.number().int().min(1).max(LIMITS.maxSteps).default(DIAGRAM_DEFAULTS.steps).meta({
    description: 'Number of Dq/B intervals from 0 to maxDqOverB.',
  }),
  axis: z.enum(['dq', 'distortion', 'zeta']).optional().meta({
    description: 'Beyond the cubic field: E/B against Dq/B (dq), against Ds/B as (Ds, Dt) grow from 0 (distortion), or against ζ/B (zeta).',
  }),
  b: positive('Racah B in cm-1, the energy unit of a diagram beyond the cubic field (default 1000).').max(LIMITS.maxEnergy).optional(),
  dq: z.number().min(0).max(LIMITS.maxEnergy).optional().meta({ description: 'Fixed Dq in cm-1 on the distortion and zeta axes.' }),
  ...fieldBeyondCubic,
});
export type DiagramQuery = z.infer<typeof diagramQuery>;

const bandObject = z.strictObject({
  position: positive('Band maximum in cm-1.').max(LIMITS.maxEnergy),
  uncertainty: positive('Standard uncertainty of the position, cm-1.').max(LIMITS.maxEnergy).optional(),
  epsilon: z.number().min(0).finite().optional().meta({ description: 'Molar absorption coefficient, L mol-1 cm-1.' }),
  width: positive('Full width at half maximum, cm-1.').max(LIMITS.maxEnergy).optional(),
  flags: z.array(z.string().min(1).max(40)).max(10).optional().meta({
    description: 'Hints for the fit: "shoulder" (sh), "spin-forbidden" (sf), "charge-transfer" (ct, left out of the fit).',
  }),
});

/**
 * The fit beyond the cubic field (src/fit-tetragonal), the names of the CLI's
 * `fit --symmetry`, `--zeta`, `--free-zeta`. Symmetry "tetragonal", a zeta or
 * freeZeta: true switch the fit to Dq, Ds, Dt (and B, ζ); absent, the cubic
 * fit answers as before.
 */
const fitBeyondCubic = {
  symmetry: z.enum(['cubic', 'tetragonal']).optional().meta({
    description: 'cubic (default) or tetragonal: fit Dq, Ds, Dt (and B) with a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt (positive Ds, Dt: elongated along z). The answer is then the tetragonal fit: dq, ds, dt, zeta with uncertainties, each band with its D4h level and octahedral parent.',
  }),
  zeta: z.union([z.number().min(0).max(LIMITS.maxEnergy), z.literal('free-ion')]).optional().meta({
    description: 'Spin–orbit constant ζ fixed in cm-1, or "free-ion" for the ion\'s tabulated value (default 0, off).',
  }),
  freeZeta: z.boolean().optional().meta({ description: 'Fit ζ as well.' }),
};

/** True when the body asks for the fit beyond the cubic field. */
export function wantsFitBeyondCubic(body: { symmetry?: 'cubic' | 'tetragonal' | undefined; zeta?: unknown; freeZeta?: boolean | undefined }): boolean {
  return body.symmetry === 'tetragonal' || body.zeta !== undefined || body.freeZeta === true;
}

/** Fields only the cubic fit reads: named as errors with the tetragonal fit rather than left unused. */
const CUBIC_ONLY: ReadonlyArray<{ field: 'c' | 'freeC' | 'trees' | 'window' | 'formula' | 'ligands'; why: string }> = [
  { field: 'c', why: 'give "cOverB" (C/B stays fixed)' },
  { field: 'freeC', why: 'C/B stays fixed' },
  { field: 'trees', why: 'the tetragonal fit has no Trees correction' },
  { field: 'window', why: 'the tetragonal fit does not use the measured range' },
  { field: 'formula', why: 'give the metal as "ion"' },
  { field: 'ligands', why: 'the tetragonal fit has no ligand priors' },
];

function refuseCubicOnlyFields(body: Record<string, unknown> & { symmetry?: 'cubic' | 'tetragonal' | undefined; freeZeta?: boolean | undefined }, ctx: z.RefinementCtx): void {
  if (!wantsFitBeyondCubic(body)) return;
  for (const { field, why } of CUBIC_ONLY) {
    const value = body[field];
    // freeC: false is the default and harmless.
    if (value === undefined || (field === 'freeC' && value === false)) continue;
    ctx.addIssue({ code: 'custom', message: `"${field}" is not available with symmetry "tetragonal", zeta or freeZeta: ${why}`, path: [field] });
  }
}

export const band = z.union([positive('Band maximum in cm-1.').max(LIMITS.maxEnergy), bandObject]);

export const fitBody = z
  .strictObject({
    ion: ion.optional(),
    d: dCount.optional(),
    geometry: geometry.optional(),
    bands: z.array(band).min(1).max(LIMITS.maxBands, {
      message: `a fit takes at most ${MAX_FIT_BANDS} bands (the d–d bands of one complex, with shoulders and spin-forbidden bands); leave out solvent, impurity and charge-transfer bands`,
    }).meta({
      description: 'Observed d-d band maxima in cm-1, as numbers or objects.',
    }),
    cOverB: cOverBField.optional(),
    c: cField.optional(),
    freeC: z.boolean().optional().meta({ description: 'Fit C as a free parameter (needs enough bands).' }),
    trees: z.union([z.literal('free'), z.number().min(-500).max(500)]).optional().meta({ description: 'The Trees correction α·L(L+1): α fixed in cm-1, or "free" to fit it. Default: none.' }),
    formula: formulaField.optional(),
    ligands: ligandsField.optional(),
    window: z
      .strictObject({ min: positive('Lowest wavenumber measured, cm-1.').max(LIMITS.maxEnergy), max: positive('Highest wavenumber measured, cm-1.').max(LIMITS.maxEnergy) })
      .refine((w) => w.max > w.min, { message: 'window.max must be above window.min', path: ['max'] })
      .optional()
      .meta({ description: 'The measured range, cm-1: a strong transition predicted inside it must show a band.' }),
    ...fitBeyondCubic,
  })
  .refine((body) => body.ion !== undefined || body.d !== undefined || body.formula !== undefined, {
    message: 'give the metal as "ion" (e.g. "Cr3+") or as "d" (the d-electron count)',
    path: ['ion'],
  })
  .superRefine(refuseCubicOnlyFields);
export type FitBody = z.infer<typeof fitBody>;

export { X_UNITS, Y_UNITS };

/** Fields of POST /analyze, as query parameters or multipart form fields. */
export const analyzeFields = z.strictObject({
  ...REST_ANALYSIS_FIELDS,
  fileName: z.string().trim().min(1).max(200).optional().meta({
    description: 'Name used in error positions (file:line:column) for a raw-body upload.',
  }),
});
export type AnalyzeFields = z.infer<typeof analyzeFields>;

/** Content types POST /analyze accepts as a raw body (besides multipart/form-data). */
export const SPECTRUM_CONTENT_TYPES = [
  'text/csv',
  'text/plain',
  'text/tab-separated-values',
  'chemical/x-jcamp-dx',
  'application/octet-stream',
] as const;
