/**
 * Ligand series over HTTP, mounted at /api/v1:
 *   GET  /series?ion=Cr3%2B[&criterion=two-sigma]
 *        the library's analyses of that ion ranked by 10Dq and by 1 − β
 *        (weakest first, neighbours within their uncertainties flagged) and
 *        Jørgensen's f and h fitted per ligand (src/library/series.ts)
 *   POST /predict { "formula", "geometry"? }
 *        10Dq, β, B, C and spin state estimated from the formula alone
 *        (src/series predictComplex); every number is marked as an estimate
 * Energies in cm-1. Errors are FieldgapErrors for the app's error handler.
 */
import { Router } from 'express';
import { z } from 'zod';
import { predictComplex } from '../../src/series/index.js';
import type { Library } from '../../src/library/library.js';
import { librarySeries } from '../../src/library/series.js';
import { parseJsonBody, parseTextFields } from '../validate.js';

export interface SeriesRouterDeps {
  library: Library;
}

export const seriesQuery = z.strictObject({
  ion: z.string().trim().min(1).max(40).meta({ description: 'The metal ion whose analyses to rank, e.g. "Cr3+".', examples: ['Cr3+'] }),
  criterion: z.enum(['one-sigma', 'two-sigma']).optional().meta({
    description: 'When neighbours count as not resolved: |Δ| < k·sqrt(σ1² + σ2²) with k = 1 (default) or 2.',
  }),
});

export const predictBody = z.strictObject({
  formula: z.string().trim().min(1).max(200).meta({ description: 'Complex formula, e.g. "[Co(NH3)6]Cl3".', examples: ['[Co(NH3)6]Cl3'] }),
  geometry: z.enum(['octahedral', 'tetrahedral']).optional().meta({ description: 'Overrides the guess from the coordination number.' }),
});

export function createSeriesRouter({ library }: SeriesRouterDeps): Router {
  const router = Router();

  router.get('/series', async (req, res) => {
    const { ion, criterion } = parseTextFields(seriesQuery, req.query);
    res.json(await librarySeries(library, ion, criterion === undefined ? {} : { criterion }));
  });

  // One ligand-field calculation at one Dq: milliseconds, so it runs here rather than in the pool.
  router.post('/predict', (req, res) => {
    const { formula, geometry } = parseJsonBody(predictBody, req.body);
    res.json(predictComplex(formula, geometry === undefined ? {} : { geometry }));
  });

  return router;
}
