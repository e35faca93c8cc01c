/**
 * POST /analyze: a spectrum (multipart field "spectrum" or a raw body) with
 * its options as query parameters or form fields; answers the
 * analyzeSpectrum result, exactly what `fieldgap analyze --json` prints.
 */
import { Router } from 'express';
import type { AnalyzeOptions, AnalyzeResult } from '../../src/analysis.js';
import { analyzeOptionsFromRest } from '../../src/analysis-option-schema.js';
import type { SpectrumLister } from '../../src/library/spectra-to-store.js';
import { clientGoneSignal } from '../abort.js';
import type { ComputePool } from '../pool.js';
import { analyzeFields, type AnalyzeFields } from '../schemas.js';
import { spectrumUpload, type UploadedSpectrum } from '../upload.js';
import { parseTextFields } from '../validate.js';

export interface AnalyzeRouterDeps {
  analyze: AnalyzeFunction;
  /** Upload size limit in bytes. */
  maxBodyBytes: number;
}

/**
 * The pipeline as the routes (and the results library) call it: off the
 * event loop, with a time limit; `signal`, when given, drops the work once
 * nobody waits for it (see clientGoneSignal).
 */
export type AnalyzeFunction = (content: Buffer, options: AnalyzeOptions, signal?: AbortSignal) => Promise<AnalyzeResult>;

/** The service's names (conc, path) → the pipeline's options (src/analysis-option-schema.ts); absent fields stay absent. */
export function toAnalyzeOptions(fields: AnalyzeFields, fileName: string | undefined): AnalyzeOptions {
  const name = fields.fileName ?? fileName;
  return { ...(name !== undefined && { fileName: name }), ...analyzeOptionsFromRest(fields) };
}

/** analyzeSpectrum in the pool. */
export function analyzeInPool(pool: ComputePool, timeoutMs: number): AnalyzeFunction {
  return async (content, options, signal) =>
    (await pool.run({ kind: 'analyze', input: { content, options } }, signal ? { timeoutMs, signal } : { timeoutMs })) as AnalyzeResult;
}

/** The spectra a file holds (src/analysis.ts listSpectra), parsed in the pool: a 10 MiB upload is not parsed on the event loop. */
export function spectraInPool(pool: ComputePool, timeoutMs: number): SpectrumLister {
  return async (content, options) =>
    (await pool.run({ kind: 'spectra', input: { content, options: options ?? {} } }, { timeoutMs })) as Array<{ column: number; name: string }>;
}

export function createAnalyzeRouter({ analyze, maxBodyBytes }: AnalyzeRouterDeps): Router {
  const router = Router();
  router.post('/analyze', spectrumUpload(maxBodyBytes), async (_req, res) => {
    const upload = res.locals['spectrum'] as UploadedSpectrum;
    const fields = parseTextFields(analyzeFields, upload.fields);
    res.json(await analyze(upload.content, toAnalyzeOptions(fields, upload.label), clientGoneSignal(res)));
  });
  return router;
}
