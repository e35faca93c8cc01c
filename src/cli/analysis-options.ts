import type { AnalyzeOptions } from '../analysis.js';
import { parseIon } from '../chemistry/ions.js';
import { ANALYSIS_OPTION_NAMES, type AnalysisOptionKey } from '../analysis-option-names.js';
import { checkCliAnalysisOptions } from '../analysis-option-schema.js';
import { parseXUnitOption } from '../spectrum/index.js';
import { numberOption } from './options.js';
import { geometryOption } from './geometry-option.js';

/** The analysis options of `analyze`, `library add|refit` and `series`. Energies in cm-1. */
export const ANALYSIS_OPTIONS = {
  ion: { type: 'string' },
  d: { type: 'string' },
  geometry: { type: 'string' },
  conc: { type: 'string' },
  path: { type: 'string' },
  'x-unit': { type: 'string' },
  column: { type: 'string' },
  'c-over-b': { type: 'string' },
  c: { type: 'string' },
  'free-c': { type: 'boolean' },
} as const satisfies Record<(typeof ANALYSIS_OPTION_NAMES)[AnalysisOptionKey]['cli'], { type: 'string' | 'boolean' }>;

export const ANALYSIS_USAGE = `Analysis options:
  --ion ION         metal ion, e.g. Cr3+ or Co(II)  (or --d N, the d-electron count)
  --geometry G      octahedral or tetrahedral
  --conc M          concentration in mol/L (gives molar absorption coefficients)
  --path CM         path length in cm (default 1)
  --x-unit U        x unit when the file does not say: nm, cm-1, eV, um
  --column C        which y column: its number (from 1) or its header
  --c-over-b R      fixed C/B ratio for the fit
  --c C             fixed Racah C in cm-1
  --free-c          fit C as a free parameter`;

type AnalysisValues = { [K in keyof typeof ANALYSIS_OPTIONS]?: (typeof ANALYSIS_OPTIONS)[K]['type'] extends 'boolean' ? boolean : string };

/** The pipeline's options from the command line (checked against src/analysis-option-schema.ts); only the options given are set. */
export function analysisOptionsFrom(values: AnalysisValues): AnalyzeOptions {
  const options: AnalyzeOptions = {};
  if (values.ion !== undefined) {
    // Read once here, so a misspelt ion is one usage error, not a failure in every row of a batch.
    parseIon(values.ion, { path: '--ion' });
    options.ion = values.ion;
  }
  const d = numberOption('d', values.d, { min: 1, max: 9, integer: true });
  if (d !== undefined) options.d = d;
  if (values.geometry !== undefined) options.geometry = geometryOption(values.geometry);
  const conc = numberOption('conc', values.conc, { min: Number.MIN_VALUE });
  if (conc !== undefined) options.concentration = conc;
  const path = numberOption('path', values.path, { min: Number.MIN_VALUE });
  if (path !== undefined) options.pathLength = path;
  if (values['x-unit'] !== undefined) options.xUnit = parseXUnitOption(values['x-unit'], '--x-unit');
  if (values.column !== undefined) options.column = /^\d+$/.test(values.column.trim()) ? Number(values.column) : values.column;
  const cOverB = numberOption('c-over-b', values['c-over-b'], { min: Number.MIN_VALUE, max: 20 });
  if (cOverB !== undefined) options.cOverB = cOverB;
  const c = numberOption('c', values.c, { min: Number.MIN_VALUE });
  if (c !== undefined) options.c = c;
  if (values['free-c']) options.freeC = true;
  // The ranges of the one options schema (the REST fields have the same), and C fixed one way at most.
  return checkCliAnalysisOptions(options);
}
