/**
 * The results library over HTTP, mounted at /api/v1/analyses:
 *   POST   /                 analyse an uploaded spectrum and save it: 201 with the record
 *   GET    /                 { analyses, total, limit, offset }, newest first (?query, ?ion, ?limit, ?offset)
 *   GET    /:id              one record: details, original's name/size/SHA-256, options, result, revisions
 *   GET    /:id/original     the original file, byte for byte
 *   PATCH  /:id              change details (JSON body)
 *   DELETE /:id              204
 *   POST   /:id/refit        rerun on the stored original with changed options: a new revision,
 *                             with `changes` listing what moved in the assignment
 * The upload takes what POST /api/v1/analyze takes (multipart field
 * "spectrum" or a raw body; the same analysis fields), plus the details
 * sample, formula, ligands, solvent, temperature (K), measuredOn, note.
 * Errors are FieldgapErrors; the app's error handler answers them.
 */
import { Router, type Request } from 'express';
import { extname } from 'node:path';
import { z } from 'zod';
import { listSpectra } from '../../src/analysis.js';
import { checkCorrections } from '../../src/analysis-corrections.js';
import { detailsFromFormula } from '../../src/library/formula-details.js';
import { invalidArgument } from '../../src/errors.js';
import { analyzeFields } from '../schemas.js';
import type { Library } from '../../src/library/library.js';
import { refitAnalysis } from '../../src/library/refit.js';
import { fileRecordsFields, storeFileSpectra } from '../../src/library/store-file.js';
import type { SpectrumLister } from '../../src/library/spectra-to-store.js';
import type { AnalysisDetails, AnalysisPatch, StoredOptions } from '../../src/library/types.js';
import { checkDetails, MAX_NOTE, MAX_SHORT_TEXT } from '../../src/library/validate.js';
import { libraryFor } from '../security/scope.js';
import { spectrumUpload, type UploadedSpectrum } from '../upload.js';
import { parseJsonBody, parseTextFields } from '../validate.js';
import { toAnalyzeOptions, type AnalyzeFunction } from './analyze.js';

export interface AnalysesRouterDeps {
  library: Library;
  /** The pipeline, off the event loop (createApp passes its pool's). */
  analyze: AnalyzeFunction;
  /** The spectra a file holds (one record each), off the event loop (createApp passes its pool's); default: parsed here. */
  list?: SpectrumLister;
  /** Upload size limit, bytes; default 10 MiB. */
  maxBodyBytes?: number;
}

const shortText = (description: string) => z.string().max(MAX_SHORT_TEXT).meta({ description });

/** The details of a record, as query parameters, form fields or JSON. */
export const detailFields = {
  sample: shortText('Sample name; default: the uploaded file name without its extension.').optional(),
  formula: shortText('Complex formula as written, e.g. "[Cr(H2O)6]Cl3".').optional(),
  ligands: z
    .union([z.string().max(1000), z.array(z.string().max(MAX_SHORT_TEXT)).max(20)])
    .optional()
    .meta({ description: 'Ligands: a list, or one text with commas ("H2O,Cl").' }),
  solvent: shortText('Solvent.').optional(),
  temperature: z.number().positive().max(5000).optional().meta({ description: 'Temperature of the measurement, K.' }),
  measuredOn: z.string().max(10).optional().meta({ description: 'Date of the measurement, YYYY-MM-DD.' }),
  note: z.string().max(MAX_NOTE).optional().meta({ description: 'Free text.' }),
};

/** The user's corrections: as JSON text in a query or form field, as an object in a JSON body; null removes them (refit). */
const correctionsField = z
  .union([z.string().max(100_000), z.looseObject({}), z.null()])
  .optional()
  .meta({
    description:
      'Corrections stored with the record and applied by the analysis: {"bands":[{"position":17400,"flags":["shoulder"]}, ...], "alternative":0}. ' +
      'bands: the band list fitted instead of the found bands (removed ones left out, added ones in, reclassified ones with their flag); ' +
      'alternative: the index of the chosen alternative assignment. C/B, c and freeC are fields of their own.',
  });

/** POST /analyses fields: the analysis fields of POST /analyze, the details and the corrections. */
export const analysisRecordFields = analyzeFields.extend({ ...detailFields, corrections: correctionsField });

export const listQuery = z.strictObject({
  query: z.string().max(200).optional().meta({ description: 'Words that must all occur in sample, formula, ion, ligands, solvent or note.' }),
  ion: z.string().max(40).optional().meta({ description: 'Only this metal ion, e.g. "Cr3+".' }),
  sha256: z.string().max(64).optional().meta({ description: 'Only records whose original file has this SHA-256 (hex).' }),
  limit: z.number().int().min(1).max(1000).optional().meta({ description: 'Page size, default 50.' }),
  offset: z.number().int().min(0).optional().meta({ description: 'Records to skip, default 0.' }),
});

/** PATCH body: details to change; null clears one (except sample). */
export const patchBody = z.strictObject(
  Object.fromEntries(Object.entries(detailFields).map(([key, schema]) => [key, key === 'sample' ? schema : schema.unwrap().nullable().optional()])) as {
    [K in keyof typeof detailFields]: z.ZodOptional<z.ZodNullable<ReturnType<(typeof detailFields)[K]['unwrap']>>>;
  },
);

/** POST /:id/refit: analysis options to change (fileName is always the stored original's), and the corrections. */
export const refitFields = analyzeFields.omit({ fileName: true }).extend({ corrections: correctionsField });

const ORIGINAL_TYPES: Record<string, string> = {
  '.csv': 'text/csv',
  '.tsv': 'text/tab-separated-values',
  '.txt': 'text/plain',
  '.jdx': 'chemical/x-jcamp-dx',
  '.dx': 'chemical/x-jcamp-dx',
  '.jcamp': 'chemical/x-jcamp-dx',
};

export function createAnalysesRouter({ library, analyze, list = listSpectra, maxBodyBytes = 10 * 1024 * 1024 }: AnalysesRouterDeps): Router {
  const router = Router();

  router.post('/', spectrumUpload(maxBodyBytes), async (req, res) => {
    const upload = res.locals['spectrum'] as UploadedSpectrum;
    const { sample, formula, ligands, solvent, temperature, measuredOn, note, corrections, ...analysis } = parseTextFields(analysisRecordFields, upload.fields);
    const fileName = analysis.fileName ?? upload.fileName ?? 'spectrum';
    // The formula gives the ion, the ligands and a geometry guess the client did not give (the rule `library add --formula` uses).
    const given = ligands !== undefined ? ligandList(ligands) : undefined;
    const fromFormula = formula !== undefined ? detailsFromFormula(formula, { ...analysis, ligands: given }, 'formula', '"ion"') : null;
    if (fromFormula?.ion !== undefined) analysis.ion = fromFormula.ion;
    if (fromFormula?.geometry !== undefined) analysis.geometry = fromFormula.geometry;
    const detailLigands = given ?? fromFormula?.ligands;
    // Checked before the (costly) analysis, so a bad date does not cost a fit.
    const details = checkDetails({
      sample: sample ?? fileName.replace(/\.[^.]*$/, ''),
      formula, solvent, temperature, measuredOn, note,
      ...(detailLigands !== undefined && { ligands: detailLigands }),
      ...(analysis.ion !== undefined && { ion: analysis.ion }),
    }) as AnalysisDetails;
    const options = toAnalyzeOptions(analysis, upload.fileName);
    if (corrections != null) options.corrections = checkCorrections(corrections);
    // Every spectrum of the file is its own record (the rule of library add and watch); the answer is the first, with `records` listing all.
    const stored = await storeFileSpectra({
      content: upload.content, fileName, options,
      // Messages name the upload as the user sent it ("request body" for a raw body), never the stored name made up for it.
      label: analysis.fileName ?? upload.label, details, library: libraryFor(library, res),
      analyze: (content, o) => analyze(Buffer.from(content.buffer, content.byteOffset, content.byteLength), o), list,
      names: { corrections: 'corrections', column: 'column' },
    });
    const first = stored.records[0]!;
    res.status(201).location(`${req.baseUrl}/${first.id}`).json({ ...first, ...fileRecordsFields(stored) });
  });

  router.get('/', async (req, res) => {
    const { query, ion, sha256, limit, offset } = parseTextFields(listQuery, req.query);
    res.json(await libraryFor(library, res).list({ ...(query !== undefined && { query }), ...(ion !== undefined && { ion }), ...(sha256 !== undefined && { sha256 }), ...(limit !== undefined && { limit }), ...(offset !== undefined && { offset }) }));
  });

  router.get('/:id', async (req, res) => {
    res.json(await libraryFor(library, res).get(idParam(req)));
  });

  router.get('/:id/original', async (req, res) => {
    const original = await libraryFor(library, res).getOriginal(idParam(req));
    res.attachment(original.fileName);
    // Set as is: res.type() would add a charset the file may not be in.
    res.setHeader('Content-Type', ORIGINAL_TYPES[extname(original.fileName).toLowerCase()] ?? 'application/octet-stream');
    // RFC 9530: the SHA-256 of the bytes, so a client can check what it got.
    res.set('Repr-Digest', `sha-256=:${Buffer.from(original.sha256, 'hex').toString('base64')}:`);
    res.set('ETag', `"${original.sha256}"`);
    res.send(original.bytes);
  });

  router.patch('/:id', async (req, res) => {
    const id = idParam(req);
    const body = parseJsonBody(patchBody, req.body ?? {});
    const patch: AnalysisPatch = {};
    for (const [key, value] of Object.entries(body) as [keyof typeof body, unknown][]) {
      if (value === undefined) continue;
      (patch as Record<string, unknown>)[key] = key === 'ligands' && value !== null ? ligandList(value as string | string[]) : value;
    }
    res.json(await libraryFor(library, res).update(id, patch));
  });

  router.delete('/:id', async (req, res) => {
    await libraryFor(library, res).remove(idParam(req));
    res.status(204).end();
  });

  router.post('/:id/refit', async (req, res) => {
    const id = idParam(req);
    const { corrections, ...fields } = req.is('application/json') ? parseJsonBody(refitFields, req.body ?? {}) : parseTextFields(refitFields, req.query);
    const changes = toAnalyzeOptions(fields, undefined) as Record<string, unknown>;
    // null takes the corrections away: the fit goes back to the found bands and the best assignment.
    if (corrections !== undefined) changes['corrections'] = corrections === null ? null : checkCorrections(corrections);
    const record = await refitAnalysis(libraryFor(library, res), id, changes, (content, options: StoredOptions) => analyze(content, options));
    res.json(record);
  });

  return router;
}

function idParam(req: Request): number {
  const text = String(req.params['id']);
  if (!/^[1-9]\d{0,15}$/.test(text)) throw invalidArgument('id', `id: expected a whole number from 1, got "${text}"`);
  return Number(text);
}

function ligandList(value: string | string[]): string[] {
  const items = Array.isArray(value) ? value : value.split(',');
  return items.map((l) => l.trim()).filter((l) => l !== '');
}
