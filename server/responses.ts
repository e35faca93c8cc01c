/**
 * The shapes of the service's answers, for the OpenAPI document. They follow
 * the core's result types (src/ligand-field/types.ts, the fit and analysis
 * results) and are loose (extra fields allowed) so the core may add fields;
 * the tests parse real answers with them, so a change in the core that breaks
 * a documented field fails a test instead of drifting silently.
 */
import { z } from 'zod';

const num = z.number();
const geometry = z.enum(['octahedral', 'tetrahedral']);

export const errorResponse = z
  .strictObject({
    error: z.strictObject({
      code: z.enum([
        'invalid-argument',
        'parse-error',
        'unsupported-format',
        'unexplained',
        'not-found',
        'too-large',
        'timeout',
        'storage-full',
        'storage-read-only',
        'storage-unavailable',
        'storage-broken',
        'internal',
        'unauthorized',
        'forbidden',
      ]),
      message: z.string(),
      path: z.string().meta({ description: 'The field, option or file position the error is about; "" when none.' }),
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
  geometry,
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
  geometry,
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

export const fitResponse = z.looseObject({
  d: z.number().int(),
  ion: z.string().nullable(),
  geometry,
  dq: num,
  tenDq: num,
  b: nullableNum,
  c: nullableNum,
  cOverB: nullableNum,
  cMode: z.enum(['ratio', 'fixed', 'free']),
  beta: nullableNum.meta({ description: 'Nephelauxetic ratio B/B0; null where B0 is not tabulated.' }),
  freeIonB: nullableNum,
  groundTerm: z.string(),
  spinState: z.enum(['high-spin', 'low-spin', 'no-choice']),
  unpairedElectrons: z.number().int(),
  spinOnlyMoment: num.meta({ description: 'μB.' }),
  lfse: z.looseObject({ dq: num, cm1: num, configuration: z.string() }),
  rmsResidual: num,
  status: z.enum(['converged', 'exact', 'not-converged']),
  message: z.string(),
  uncertainty: z.looseObject({ tenDq: nullableNum, b: nullableNum, c: nullableNum }),
  assignments: z.array(
    z.looseObject({ observed: num, calculated: num, residual: num, term: z.string(), parent: z.string(), label: z.string() }),
  ),
  alternatives: z.array(z.looseObject({
    rmsResidual: num, dq: num, reason: z.string(),
    probability: num.meta({ description: 'Probability of this alternative among the solutions evaluated.' }),
  })),
  probability: num.meta({ description: 'Probability of the chosen assignment: exp(−score/2) normalised over the solutions evaluated.' }),
  spinStateProbabilities: z.record(z.string(), num).meta({ description: 'Probability of each spin state, e.g. {"high-spin": 0.99, "low-spin": 0.01}.' }),
  undetermined: z.array(z.looseObject({ parameter: z.string(), reason: z.string(), action: z.string() })).meta({
    description: 'Parameters the bands cannot fix, and what was done (fixed at the prior, or not reported).',
  }),
  predicted: z.array(z.looseObject({ energy: num, term: z.string(), label: z.string(), spinAllowed: z.boolean() })),
  warnings: z.array(z.string()),
});

export const analyzeResponse = z.looseObject({
  spectrum: z.looseObject({
    points: z.number().int(),
    range: z.tuple([num, num]).meta({ description: 'Lowest and highest wavenumber, cm-1.' }),
    xUnit: z.string(),
    yUnit: z.string(),
    masked: z.unknown(),
  }),
  bands: z.array(
    z.looseObject({
      position: num.meta({ description: 'cm-1.' }),
      wavelength: num.meta({ description: 'nm.' }),
      height: num,
      epsilon: nullableNum,
      fwhm: nullableNum,
      area: nullableNum,
      oscillatorStrength: nullableNum,
      kind: z.string(),
    }),
  ),
  fit: fitResponse.nullable(),
  warnings: z.array(z.string()),
  curves: z.unknown().optional(),
});
