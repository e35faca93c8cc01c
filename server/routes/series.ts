/**
 * Ligand series over HTTP, mounted at /api/v1:
 *   GET  /series?ion=Cr3%2B[&criterion=two-sigma][&limit=50&offset=0 | &all=true]
 *        the library's analyses of that ion ranked by 10Dq and by 1 − β
 *        (weakest first, neighbours within their uncertainties flagged) and
 *        Jørgensen's f and h fitted per ligand (src/library/series.ts); per
 *        ligand complete, the per-analysis lists a page (`page` says which)
 *        unless all=true
 *   POST /predict { "formula", "geometry"?, "library"? }
 *        10Dq, β, B, C, the spin state (rule or probability), occupation,
 *        LFSE and moment estimated from the formula alone (src/series
 *        predictComplex); every number is marked as an estimate. With
 *        "library": true the ligand factors fitted from the library's
 *        analyses of the same metal ion win over the tables.
 * Energies in cm-1. Errors are FieldgapErrors for the app's error handler.
 */
import { Router } from 'express';
import { z } from 'zod';
import { isFieldgapError } from '../../src/errors.js';
import { parseFormula } from '../../src/chemistry/formula.js';
import { ownFactorsFromFit, predictComplex, type PredictOptions } from '../../src/series/index.js';
import type { Library } from '../../src/library/library.js';
import { librarySeries } from '../../src/library/series.js';
import { criterionField } from '../../src/analysis-option-schema.js';
import { libraryFor } from '../security/scope.js';
import { parseJsonBody, parseTextFields } from '../validate.js';

export interface SeriesRouterDeps {
  library: Library;
}

export const seriesQuery = z.strictObject({
  ion: z.string().trim().min(1).max(40).meta({ description: 'The metal ion whose analyses to rank, e.g. "Cr3+".', examples: ['Cr3+'] }),
  criterion: criterionField.optional(),
  limit: z.number().int().min(1).max(100_000).optional().meta({ description: 'Analyses per list (rankings, skipped, fFrom/hFrom, no-f notes): a page; default 50. The ligand-level fields are always complete.' }),
  offset: z.number().int().min(0).optional().meta({ description: 'Analyses skipped at the start of each list; default 0.' }),
  all: z.boolean().optional().meta({ description: 'Every analysis in every list (the whole report, tens of MB at 100 000 analyses); default false.' }),
});

export const predictBody = z.strictObject({
  formula: z.string().trim().min(1).max(200).meta({ description: 'Complex formula, e.g. "[Co(NH3)6]Cl3".', examples: ['[Co(NH3)6]Cl3'] }),
  geometry: z.enum(['octahedral', 'tetrahedral', 'square-planar']).optional().meta({ description: 'Overrides the geometry from the coordination number and the rules of the trade.' }),
  library: z.boolean().optional().meta({ description: "Use the ligand factors fitted from the library's analyses of the same metal ion (default false)." }),
});

/** predictComplex's options for a request: the geometry, and with `library` the library's fitted factors. */
async function predictOptions(library: Library, formula: string, geometry: PredictOptions['geometry'] | undefined, useLibrary: boolean): Promise<{ options: PredictOptions; note: string | undefined }> {
  const options: PredictOptions = geometry === undefined ? {} : { geometry };
  if (!useLibrary) return { options, note: undefined };
  const ion = parseFormula(formula).metal.label;
  let fit = null;
  try {
    fit = (await librarySeries(library, ion)).factors;
  } catch (error) {
    if (!isFieldgapError(error) || error.code !== 'not-found') throw error;
  }
  if (!fit || fit.factors.length === 0) return { options, note: `the library has no fitted ligand factors for ${ion}: Jørgensen's tables used` };
  options.factors = ownFactorsFromFit(fit);
  return { options, note: `ligand factors fitted from the library's analyses of ${ion} used where it has them (${fit.factors.map((f) => f.ligand).join(', ')})` };
}

export function createSeriesRouter({ library }: SeriesRouterDeps): Router {
  const router = Router();

  router.get('/series', async (req, res) => {
    const { ion, criterion, limit, offset, all } = parseTextFields(seriesQuery, req.query);
    res.json(await librarySeries(libraryFor(library, res), ion, {
      ...(criterion !== undefined && { criterion }), ...(limit !== undefined && { limit }), ...(offset !== undefined && { offset }), ...(all !== undefined && { all }),
    }));
  });

  // One ligand-field calculation at one Dq: milliseconds, so it runs here rather than in the pool.
  router.post('/predict', async (req, res) => {
    const { formula, geometry, library: useLibrary } = parseJsonBody(predictBody, req.body);
    const { options, note } = await predictOptions(libraryFor(library, res), formula, geometry, useLibrary ?? false);
    const prediction = predictComplex(formula, options);
    if (note) prediction.warnings.push(note);
    res.json(prediction);
  });

  return router;
}
