/**
 * The shape of POST /fit's answer beyond the cubic field (symmetry
 * "tetragonal", zeta or freeZeta): the core's TetragonalFitResult
 * (src/fit-tetragonal/types.ts), what `fit --symmetry tetragonal --json`
 * prints. Loose like the other answers (responses.ts); the `satisfies` fails
 * to compile when the core gains or loses a field this does not describe.
 * Energies in cm-1.
 */
import { z } from 'zod';
import type { TetragonalFitResult } from '../src/fit-tetragonal/index.js';

const num = z.number();
const nullableNum = num.nullable();

const assignment = z.looseObject({
  observed: num,
  calculated: num,
  residual: num,
  term: z.string().meta({ description: 'The D4h level, multiplicity and irrep: "2B2g".' }),
  parent: z.string().meta({ description: 'Its octahedral parent: "2T2g(D)".' }),
  label: z.string().meta({ description: 'Level with parent: "2B2g[2T2g(D)]".' }),
  degeneracy: z.number().int(),
  bands: z.array(z.number().int()),
});

const tetragonalShape = {
  d: z.number().int(),
  ion: z.string().nullable(),
  geometry: z.enum(['octahedral', 'tetrahedral']),
  symmetry: z.enum(['cubic', 'tetragonal']),
  dq: num,
  tenDq: num,
  ds: num.meta({ description: 'Ds, cm-1; positive with Dt: elongated along z.' }),
  dt: num,
  b: nullableNum.meta({ description: 'Racah B, cm-1; null for d1 and d9 (no interelectronic repulsion).' }),
  c: nullableNum,
  cOverB: num,
  zeta: num.meta({ description: 'Spin–orbit ζ, cm-1 (0: off).' }),
  zetaMode: z.enum(['fixed', 'free-ion', 'free']),
  freeIonZeta: nullableNum,
  uncertainty: z.looseObject({ dq: nullableNum, tenDq: nullableNum, ds: nullableNum, dt: nullableNum, b: nullableNum, c: nullableNum, zeta: nullableNum }).meta({
    description: 'Standard uncertainties, cm-1; null when fixed or not fixed by the data on their own.',
  }),
  status: z.enum(['exact', 'converged', 'underdetermined', 'not-converged']),
  determined: z.array(z.string()).meta({ description: 'The parameter combinations the bands fix, e.g. ["Dq", "Ds + 1.683·Dt − 2.256·B"].' }),
  undetermined: z.array(z.string()),
  rmsResidual: num,
  score: num,
  probability: num,
  penalties: z.array(z.looseObject({ rule: z.string(), amount: num, detail: z.string() })),
  groundTerm: z.string(),
  groundLabel: z.string(),
  assignments: z.array(assignment),
  components: z.array(z.looseObject({ parent: z.string(), bands: z.array(num), labels: z.array(z.string()), splitting: num })).meta({
    description: 'Octahedral parents with more than one band on their components: one cubic band, split.',
  }),
  alternatives: z.array(z.looseObject({ labels: z.array(z.string()), rmsResidual: num, score: num, probability: num })),
  predicted: z.array(z.looseObject({ energy: num, degeneracy: z.number().int(), irrep: z.string(), parent: z.string(), label: z.string() })),
  warnings: z.array(z.string()),
  notes: z.array(z.string()),
} satisfies Record<keyof TetragonalFitResult, z.ZodType>;

export const tetragonalFitResponse = z.looseObject(tetragonalShape);
