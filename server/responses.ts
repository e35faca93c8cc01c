/**
 * The shapes of the service's answers, for the OpenAPI document. They follow
 * the core's result types (src/ligand-field/types.ts, the fit and analysis
 * results) and are loose (extra fields allowed) so the core may add fields;
 * the tests parse real answers with them, so a change in the core that breaks
 * a documented field fails a test instead of drifting silently.
 */
import { z } from 'zod';
import { ERROR_CODES } from '../src/errors.js';
import type { AnalyzeOptions, AnalyzeResult } from '../src/analysis.js';
import type { AnalysisCorrections } from '../src/analysis-corrections.js';
import type { BandInput } from '../src/fit/bands.js';
import type { FitResult } from '../src/fit/types.js';
import type { AnalysisRecord, AnalysisSummary, FitSummary, ListPage, RevisionInfo } from '../src/library/types.js';
import type { FileRecordEntry, NotSavedSpectrum } from '../src/library/store-file.js';
import { X_UNITS, Y_UNITS } from '../src/spectrum/types.js';
import { ASSIGNED_KINDS } from '../src/report/band-assigned-kind.js';

const num = z.number();
const geometry = z.enum(['octahedral', 'tetrahedral']);

export const errorResponse = z
  .strictObject({
    error: z.strictObject({
      code: z.enum(ERROR_CODES),
      message: z.string(),
      path: z.string().meta({ description: 'The field, option or file position the error is about; "" when none.' }),
      problems: z.array(z.strictObject({ path: z.string(), message: z.string() })).optional()
        .meta({ description: 'When a request has several bad fields: each of them (the message lists them all too); `path` is the first one\'s.' }),
    }),
  })
  .meta({ description: 'Every error answer.' });

export const healthResponse = z.strictObject({
  status: z.literal('ok'),
  version: z.string(),
  uptime: num.meta({ description: 'Seconds since the server started.' }),
  pool: z.strictObject({
    mode: z.enum(['workers', 'in-process']).meta({ description: 'Where computations run.' }),
    workersStopped: z.int().nonnegative().meta({
      description: 'Worker threads stopped (time limit, a client gone for over a second, a crash) and replaced by cold ones since the start.',
    }),
  }),
  library: z.strictObject({
    engine: z.enum(['sqlite', 'postgres']).meta({ description: 'Where the results library lives: a SQLite file, or a PostgreSQL database shared by instances.' }),
    readOnly: z.boolean().meta({ description: 'Writes are refused (a read-only data folder); reads work.' }),
    reachable: z.boolean().meta({ description: 'The library answered just now. When false, library routes answer 503 until it does.' }),
    message: z.string().optional().meta({ description: 'Why the library is not reachable.' }),
  }),
});

const level = z.looseObject({
  energy: num.meta({ description: 'cm-1 above the ground level.' }),
  term: z.string().meta({ examples: ['4T1g'] }),
  multiplicity: z.number().int(),
  irrep: z.string(),
  cubicIrrep: z.enum(['A1', 'A2', 'E', 'T1', 'T2']),
  degeneracy: z.number().int(),
  parent: z.string().meta({ examples: ['4F'] }),
  label: z.string().meta({ examples: ['4T1g(P)'] }),
  rank: z.number().int(),
});

export const levelsResponse = z.looseObject({
  d: z.number().int(),
  geometry: geometry.optional(),
  dq: num,
  b: num,
  c: num,
  groundTerm: z.string(),
  spinState: z.enum(['high-spin', 'low-spin', 'no-choice']),
  unpairedElectrons: z.number().int(),
  levels: z.array(level),
  notes: z.array(z.string()),
});

export const diagramResponse = z.looseObject({
  d: z.number().int(),
  geometry: geometry.optional(),
  cOverB: num,
  dqOverB: z.array(num),
  groundTerms: z.array(z.string()),
  lines: z.array(
    z.looseObject({
      label: z.string(),
      term: z.string(),
      parent: z.string(),
      multiplicity: z.number().int(),
      irrep: z.string(),
      rank: z.number().int(),
      energies: z.array(num).meta({ description: 'E/B above the ground level at each step.' }),
    }),
  ),
});

const nullableNum = num.nullable();

const spinState = z.enum(['high-spin', 'low-spin', 'no-choice']);
const assignmentBrief = { observed: num, calculated: num, residual: num, term: z.string(), label: z.string() };
const penalty = z.looseObject({ rule: z.string(), amount: num.meta({ description: 'Added to the score (a deviance).' }), detail: z.string() });

/**
 * Every field of the core's FitResult (src/fit/types.ts), each described: the
 * `satisfies` below fails to compile when the core gains or loses a field
 * this document does not describe.
 */
const assignedBand = z.looseObject({
  ...assignmentBrief, parent: z.string(), multiplicity: z.number().int(), spinAllowed: z.boolean(),
  bands: z.array(z.number().int()), flags: z.array(z.string()), coincident: z.array(z.string()),
});

const fitShape = {
  d: z.number().int(),
  ion: z.string().nullable(),
  geometry: geometry.optional(),
  dq: num,
  tenDq: num,
  b: nullableNum,
  c: nullableNum,
  cOverB: nullableNum,
  cMode: z.enum(['ratio', 'fixed', 'free']),
  beta: nullableNum.meta({ description: 'Nephelauxetic ratio B/B0; null where B0 is not tabulated.' }),
  betaSd: nullableNum.meta({ description: 'Standard uncertainty of beta: uncertainty.b / freeIonB.' }),
  freeIonB: nullableNum,
  freeIonC: nullableNum,
  freeIonSource: z.string().nullable(),
  groundTerm: z.string(),
  groundLabel: z.string(),
  spinState,
  unpairedElectrons: z.number().int(),
  spinOnlyMoment: num.meta({ description: 'μB.' }),
  lfse: z.looseObject({ dq: num, cm1: num, configuration: z.string() }),
  rmsResidual: num,
  status: z.enum(['converged', 'exact', 'not-converged']),
  message: z.string(),
  evaluations: z.number().int(),
  alpha: num.optional().meta({ description: 'The Trees correction α·L(L+1), α in cm-1; present only when the fit used it (option trees).' }),
  uncertainty: z.looseObject({ tenDq: nullableNum, dq: nullableNum, b: nullableNum, c: nullableNum, alpha: nullableNum.optional() }).meta({ description: 'Standard uncertainties, cm-1 (dq in Dq units of cm-1); null where not fitted; alpha only when α was fitted.' }),
  correlation: z.looseObject({ bDq: nullableNum, cDq: nullableNum, cB: nullableNum }),
  score: num.meta({ description: 'Deviance, −2·ln of the posterior up to a constant: lower is better.' }),
  chiSquare: num,
  probability: num.meta({ description: 'Probability of the chosen assignment: exp(−score/2) normalised over the solutions evaluated.' }),
  assignmentGroup: z.looseObject({
    probability: num, members: z.number().int(), spinAllowed: z.array(z.looseObject({ observed: num, label: z.string() })),
    tenDqRange: z.tuple([num, num]), bRange: z.tuple([num, num]).nullable(),
  }).meta({ description: 'The solutions that share the chosen spin-allowed assignment, spin state and parameters (they differ only in the labels of spin-forbidden or unexplained bands): their summed probability and parameter ranges, cm-1.' }),
  assignmentSpread: z.looseObject({
    tenDqRange: z.tuple([num, num]), bRange: z.tuple([num, num]).nullable(),
    spread: z.looseObject({ tenDq: num, b: nullableNum }), fitUncertainty: z.looseObject({ tenDq: nullableNum, b: nullableNum }),
    widened: z.boolean(), rule: z.string(),
  }).meta({ description: 'How far the weak-band labellings of the assignment group move 10Dq and B (cm-1): their range, the spread Δ (largest distance from the value to an end of the range) and the fit\'s own σ; uncertainty.tenDq and uncertainty.b are √(σ_fit² + Δ²).' }),
  goodnessOfFit: z.looseObject({
    chiSquare: num, degreesOfFreedom: z.number().int(), pValue: num, verdict: z.enum(['good', 'poor']), betaPhysical: z.boolean().nullable(),
  }).meta({ description: 'Absolute check of the chosen solution: χ² of the positions against its degrees of freedom, its p-value, "poor" below 1 %; betaPhysical false when β lies outside 0.3–1.1. The probability is only relative to the other assignments.' }),
  spinStateProbabilities: z.record(z.string(), num).meta({ description: 'Probability of each spin state, e.g. {"high-spin": 0.99, "low-spin": 0.01}.' }),
  undetermined: z.array(z.looseObject({ parameter: z.string(), reason: z.string(), action: z.string() })).meta({
    description: 'Parameters the bands cannot fix, and what was done (fixed at the prior, or not reported).',
  }),
  window: z.looseObject({ min: num, max: num }).nullable(),
  ligands: z.array(z.string()),
  penalties: z.array(penalty),
  assignments: z.array(assignedBand),
  unassigned: z.array(z.looseObject({ observed: num, band: z.number().int(), reason: z.string() })),
  skipped: z.array(z.looseObject({ energy: num, term: z.string(), label: z.string(), reason: z.string() })),
  alternatives: z.array(z.looseObject({
    assignments: z.array(assignedBand),
    rmsResidual: num, chiSquare: num, score: num, penalties: z.array(penalty), dq: num, tenDq: num, b: nullableNum, c: nullableNum, beta: nullableNum,
    groundTerm: z.string(), groundLabel: z.string(), spinState, reason: z.string(),
    probability: num.meta({ description: 'Probability of this alternative among the solutions evaluated.' }),
    inChosenGroup: z.boolean().meta({ description: 'Same spin-allowed assignment, spin state and parameters as the chosen one: differs only in weak-band labels.' }),
  })),
  crossover: z.looseObject({ dqOverB: num, fittedDqOverB: num, difference: num, percent: num, near: z.boolean() }).nullable(),
  predicted: z.array(z.looseObject({
    energy: num, term: z.string(), label: z.string(), parent: z.string(), multiplicity: z.number().int(), spinAllowed: z.boolean(), twoElectron: z.boolean(),
  })),
  warnings: z.array(z.string()),
  notes: z.array(z.string()),
} satisfies Record<keyof FitResult, z.ZodType>;

export const fitResponse = z.looseObject(fitShape);

const spectrumShape = {
  points: z.number().int(),
  range: z.tuple([num, num]).meta({ description: 'Lowest and highest wavenumber, cm-1.' }),
  xUnit: z.enum(X_UNITS),
  yUnit: z.enum(Y_UNITS),
  masked: z.array(z.looseObject({ from: num, to: num, reason: z.string() })).meta({ description: 'Ranges left out of the analysis, cm-1.' }),
  name: z.string(),
  column: z.number().int().meta({ description: 'The y column analysed (1-based).' }),
  format: z.string(),
  signalUnit: z.enum(['absorbance', 'epsilon']).meta({ description: "'epsilon' (L mol-1 cm-1) with a concentration." }),
  noise: num.meta({ description: 'Noise standard deviation, signal unit.' }),
  quantization: num.meta({ description: 'Rounding step of the values as read, signal unit; 0 when not rounded.' }),
  stepCorrections: z.array(z.looseObject({})).meta({ description: 'Detector steps removed from the data.' }),
  columns: z.array(z.looseObject({ column: z.number().int(), name: z.string() })).optional(),
} satisfies Record<keyof AnalyzeResult['spectrum'], z.ZodType>;

const bandShape = {
  position: num.meta({ description: 'cm-1.' }),
  wavelength: num.meta({ description: 'nm.' }),
  height: num,
  epsilon: nullableNum.meta({ description: 'L mol-1 cm-1, with a concentration.' }),
  fwhm: nullableNum,
  area: nullableNum,
  oscillatorStrength: nullableNum,
  kind: z.enum(['d-d', 'spin-forbidden', 'charge-transfer']),
  positionUncertainty: num.meta({ description: 'One standard deviation of the position, cm-1.' }),
  shoulder: z.boolean(),
  window: z.string().meta({ description: 'Where the maximum lies relative to the measured range.' }),
  maximumInWindow: z.boolean(),
  assignedKind: z.enum(ASSIGNED_KINDS).nullable().optional().meta({ description: "What the band is by its assigned transition ('spin-allowed', 'two-electron': spin-allowed but weak, 'spin-forbidden'); null when unassigned. `kind` stays the class by intensity and width alone." }),
} satisfies Record<keyof AnalyzeResult['bands'][number], z.ZodType>;

/** Every field of the core's AnalyzeResult (src/analysis.ts); the `satisfies` ties the keys to it. */
const analyzeShape = {
  spectrum: z.looseObject(spectrumShape),
  bands: z.array(z.looseObject(bandShape)),
  fit: fitResponse.nullable(),
  warnings: z.array(z.string()),
  curves: z.looseObject({
    grid: z.array(num).meta({ description: 'Uniform grid, cm-1, ascending.' }),
    signal: z.array(nullableNum),
    baseline: z.array(num),
    model: z.array(num),
    components: z.array(z.array(num)),
  }).optional(),
  corrections: z.looseObject({}).optional().meta({ description: 'The corrections the fit was made with.' }),
} satisfies Record<keyof AnalyzeResult, z.ZodType>;

export const analyzeResponse = z.looseObject(analyzeShape);

/** A band of a user's correction (src/fit/bands.ts BandInput): cm-1. */
const correctionBandShape = {
  position: num.meta({ description: 'Band maximum, cm-1.' }),
  uncertainty: num.optional().meta({ description: 'Standard uncertainty of the position, cm-1.' }),
  epsilon: num.optional().meta({ description: 'L mol-1 cm-1.' }),
  width: num.optional().meta({ description: 'Full width at half maximum, cm-1.' }),
  area: num.optional().meta({ description: 'Integrated intensity of the band (any consistent unit): weights the components of a split band.' }),
  flags: z.array(z.string()).optional().meta({ description: '"shoulder", "spin-forbidden", "charge-transfer".' }),
} satisfies Record<keyof BandInput, z.ZodType>;

/**
 * The analysis options a stored analysis was made with: the core's
 * AnalyzeOptions (src/analysis.ts), in the pipeline's names (REST's conc and
 * path are stored as concentration and pathLength). Only the options given
 * are stored.
 */
const storedOptionsShape = {
  fileName: z.string().optional().meta({ description: "The original file's name (error positions name it)." }),
  ion: z.string().optional().meta({ description: 'The metal ion as given, e.g. "Cr3+".' }),
  d: z.int().min(1).max(9).optional().meta({ description: 'The d-electron count, when given instead of the ion.' }),
  geometry: geometry.optional(),
  concentration: num.optional().meta({ description: 'mol/L.' }),
  pathLength: num.optional().meta({ description: 'cm.' }),
  xUnit: z.enum(X_UNITS).optional(),
  yUnit: z.enum(Y_UNITS).optional(),
  column: z.union([z.int(), z.string()]).optional().meta({ description: 'The y column: its 1-based number or its header.' }),
  cOverB: num.optional().meta({ description: 'Fixed C/B.' }),
  c: num.optional().meta({ description: 'Fixed Racah C, cm-1.' }),
  freeC: z.boolean().optional().meta({ description: 'C fitted.' }),
  stepCorrection: z.boolean().optional(),
  formula: z.string().optional(),
  ligands: z.union([z.string(), z.array(z.string())]).optional(),
  curves: z.boolean().optional(),
  corrections: z.looseObject({
    bands: z.array(z.looseObject(correctionBandShape)).optional().meta({ description: 'The band list fitted instead of the found bands.' }),
    alternative: z.int().nonnegative().optional().meta({ description: 'The chosen alternative assignment (from 0).' }),
  } satisfies Record<keyof AnalysisCorrections, z.ZodType>).optional().meta({ description: "The user's corrections." }),
} satisfies Record<keyof AnalyzeOptions, z.ZodType>;
const storedOptions = z.looseObject(storedOptionsShape);

/** The library's summary columns (src/library/types.ts FitSummary): cm-1, sd = one standard deviation. */
const fitSummaryShape = {
  tenDq: nullableNum, tenDqSd: nullableNum, b: nullableNum, bSd: nullableNum, c: nullableNum,
  beta: nullableNum, betaSd: nullableNum.meta({ description: 'Standard uncertainty of beta.' }),
  spinState: z.string().nullable(), rmsResidual: nullableNum, status: z.string().nullable(),
} satisfies Record<keyof FitSummary, z.ZodType>;
const fitSummary = z.strictObject(fitSummaryShape);

const original = z.looseObject({
  fileName: z.string(),
  sha256: z.string().meta({ description: 'Lower-case hex SHA-256 of the bytes.' }),
  size: z.int().nonnegative().meta({ description: 'Bytes.' }),
});

const summaryShape = {
  id: z.int().positive(),
  sample: z.string(),
  formula: z.string().optional(),
  ion: z.string().optional(),
  ligands: z.array(z.string()).optional(),
  solvent: z.string().optional(),
  temperature: num.optional().meta({ description: 'Kelvin.' }),
  measuredOn: z.string().optional().meta({ description: 'YYYY-MM-DD.' }),
  note: z.string().optional(),
  createdAt: z.string(),
  updatedAt: z.string(),
  original,
  revision: z.int().positive(),
  toolVersion: z.string(),
  summary: fitSummary,
  owner: z.string().optional().meta({ description: 'The user who added the record (absent in the single-user mode).' }),
  group: z.string().optional().meta({ description: "The owner's group: who may read the record (absent in the single-user mode)." }),
} satisfies Record<keyof AnalysisSummary, z.ZodType>;

const revisionShape = {
  revision: z.int().positive(),
  createdAt: z.string(),
  toolVersion: z.string(),
  options: storedOptions.meta({ description: 'The analysis options of this revision.' }),
  summary: fitSummary,
} satisfies Record<keyof RevisionInfo, z.ZodType>;

/** One stored analysis, as GET, POST, PATCH and refit answer it. */
export const analysisRecordResponse = z.looseObject({
  ...summaryShape,
  options: storedOptions.meta({ description: 'The analysis options of the current revision.' }),
  result: analyzeResponse,
  revisions: z.array(z.looseObject(revisionShape)).meta({ description: 'Every revision, oldest first; the last is the current one.' }),
} satisfies Record<keyof AnalysisRecord, z.ZodType>);

/** POST /api/v1/analyses: the first saved record, with every record the uploaded file gave (one per spectrum it holds). */
export const savedFileResponse = analysisRecordResponse.extend({
  records: z.array(z.strictObject({
    id: z.int().positive(),
    sample: z.string(),
    column: z.int().positive().nullable().meta({ description: 'The spectrum\'s data column in the file (1 = the first y column); null for a file with one spectrum or a column the client chose.' }),
    columnName: z.string().nullable().meta({ description: 'That column\'s header; null as for column.' }),
  } satisfies Record<keyof FileRecordEntry, z.ZodType>)).meta({ description: 'Every record the file gave, in the file\'s column order: one for a file with one spectrum (or with `column` given), one per y column of a file with several; the answer\'s own fields are the first\'s.' }),
  notSaved: z.array(z.strictObject({
    column: z.int().positive().nullable(),
    columnName: z.string().nullable(),
    error: z.strictObject({ code: z.enum(ERROR_CODES), message: z.string(), path: z.string() }),
  } satisfies Record<keyof NotSavedSpectrum, z.ZodType>)).meta({ description: 'The spectra of the file that could not be analysed (each with its error); the others are saved. Empty when all were.' }),
});

/** GET /api/v1/analyses. */
export const listPageResponse = z.looseObject({
  analyses: z.array(z.looseObject(summaryShape)).meta({ description: 'Newest first.' }),
  total: z.int().nonnegative().meta({ description: 'Matching records over all pages.' }),
  limit: z.int().positive(),
  offset: z.int().nonnegative(),
} satisfies Record<keyof ListPage, z.ZodType>);
