/**
 * The OpenAPI 3.1 description of the service, assembled from the same zod
 * schemas that validate the requests (schemas.ts) and describe the answers
 * (responses.ts) via z.toJSONSchema: there is no hand-written copy of a
 * schema to fall out of date. Built once per app.
 */
import { z } from 'zod';
import { analysisRecordFields, listQuery, patchBody, refitFields } from './routes/analyses.js';
import { predictBody, seriesQuery } from './routes/series.js';
import { tetragonalFitResponse } from './responses-tetragonal.js';
import { analyzeFields, diagramQuery, fitBody, levelsQuery, SPECTRUM_CONTENT_TYPES } from './schemas.js';
import {
  analysisRecordResponse,
  savedFileResponse,
  analyzeResponse,
  diagramResponse,
  errorResponse,
  fitResponse,
  healthResponse,
  levelsResponse,
  listPageResponse,
} from './responses.js';

type JsonSchema = Record<string, unknown>;

/** JSON Schema 2020-12 (OpenAPI 3.1's dialect): what a client sends ("input") or gets back ("output"). */
function jsonSchema(schema: z.ZodType, io: 'input' | 'output' = 'input'): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, { io, unrepresentable: 'any' }) as JsonSchema;
  return rest;
}

/** One OpenAPI query parameter per field of an object schema. */
function queryParameters(schema: z.ZodObject): JsonSchema[] {
  const object = jsonSchema(schema) as { properties?: Record<string, JsonSchema>; required?: string[] };
  const required = new Set(object.required ?? []);
  return Object.entries(object.properties ?? {}).map(([name, property]) => {
    const { description, ...rest } = property;
    return {
      name,
      in: 'query',
      required: required.has(name),
      ...(typeof description === 'string' ? { description } : {}),
      schema: rest,
    };
  });
}

const ERRORS: Record<string, string> = {
  '400': 'Bad input: a field of the wrong type or range, or a file that could not be parsed. `path` names the field.',
  '401': 'The server runs beyond loopback and the request carries no valid access token (Authorization: Bearer).',
  '403': 'A Host header that is not a name of this server, or a change sent by another web site.',
  '404': 'Unknown route or record.',
  '413': 'Body over the size limit.',
  '415': 'Unsupported Content-Type.',
  '422': 'Valid input that no ligand-field model explains.',
  '500': 'A bug; the answer carries no details (they are in the server log).',
  '503': 'All workers busy and the queue full; retry later.',
  '504': 'The computation exceeded the time limit.',
};

function errorResponses(codes: string[]): Record<string, JsonSchema> {
  const out: Record<string, JsonSchema> = {};
  for (const code of codes) {
    out[code] = { description: ERRORS[code], content: { 'application/json': { schema: { $ref: '#/components/schemas/Error' } } } };
  }
  return out;
}

function ok(description: string, schemaName: string): JsonSchema {
  return { description, content: { 'application/json': { schema: { $ref: `#/components/schemas/${schemaName}` } } } };
}

const COMPUTE_ERRORS = ['400', '500', '503', '504'];

/** The limits a server runs with, stated in the document. */
export interface DocumentedLimits {
  maxBodyBytes: number;
  maxJsonBytes: number;
  requestTimeoutMs: number;
}

function bytes(n: number): string {
  return n % (1024 * 1024) === 0 ? `${n / (1024 * 1024)} MiB` : `${n} bytes`;
}

/** The OpenAPI document for a server of this version and these limits. */
export function buildOpenApiDocument(version: string, limits: DocumentedLimits): JsonSchema {
  const fields = jsonSchema(analyzeFields) as { properties?: Record<string, JsonSchema> };
  const formSchema = {
    type: 'object',
    required: ['spectrum'],
    properties: {
      spectrum: { type: 'string', contentMediaType: 'application/octet-stream', description: 'The spectrum file (CSV, text table or JCAMP-DX).' },
      ...fields.properties,
    },
  };
  const rawBody = Object.fromEntries(SPECTRUM_CONTENT_TYPES.map((type) => [type, { schema: { type: 'string' } }]));
  const recordFields = jsonSchema(analysisRecordFields) as { properties?: Record<string, JsonSchema> };
  const recordForm = { ...formSchema, properties: { ...formSchema.properties, ...recordFields.properties } };
  const idParameter = { name: 'id', in: 'path', required: true, schema: { type: 'integer', minimum: 1 } };
  const record = (description: string) => ok(description, 'AnalysisRecord');

  return {
    openapi: '3.1.0',
    info: {
      title: 'fieldgap',
      version,
      description:
        'Ligand-field parameters (10Dq, Racah B and C, beta, spin state) from UV-vis-NIR spectra of d1-d9 complexes. All energies in cm-1; level energies from the ground level. ' +
        `Limits of this server: spectrum uploads up to ${bytes(limits.maxBodyBytes)}, JSON bodies up to ${bytes(limits.maxJsonBytes)} (413 over them); ` +
        `one computation may take ${limits.requestTimeoutMs} ms of running time (504 over it; 503 with Retry-After when the queue is full). Errors are { "error": { code, message, path } }. ` +
        'Every request must name this server in its Host header (403 otherwise); a change sent by a web browser must come from the service\'s own page and carry X-Fieldgap-Request (403 otherwise); ' +
        'a server bound beyond loopback requires its access token on every request, as Authorization: Bearer TOKEN (401 without).',
      // The same limits for programs (the page checks a file's size before it uploads it): one source, the server's options.
      'x-fieldgap-limits': { maxUploadBytes: limits.maxBodyBytes, maxJsonBytes: limits.maxJsonBytes, requestTimeoutMs: limits.requestTimeoutMs },
    },
    paths: {
      '/api/v1/health': {
        get: {
          operationId: 'health', summary: 'Liveness check',
          description: 'Needs no token. Beyond loopback, a request without a valid token (a proxy\'s health check) gets only { status, library: { reachable } }; with one, the full answer.',
          responses: { '200': ok('The server is up.', 'Health') },
        },
      },
      '/api/v1/openapi.json': {
        get: { operationId: 'openapi', summary: 'This document', responses: { '200': { description: 'OpenAPI 3.1 document.' } } },
      },
      '/api/v1/levels': {
        get: {
          operationId: 'levels',
          summary: 'Energy levels of d^n in a cubic field for given Dq, B, C',
          parameters: queryParameters(levelsQuery),
          responses: { '200': ok('The levels, as `fieldgap levels --json` prints them.', 'LevelsResult'), ...errorResponses(COMPUTE_ERRORS) },
        },
      },
      '/api/v1/diagram': {
        get: {
          operationId: 'diagram',
          summary: 'Tanabe–Sugano diagram: E/B against Dq/B',
          parameters: queryParameters(diagramQuery),
          responses: { '200': ok('The diagram, as `fieldgap diagram --json` prints it.', 'Diagram'), ...errorResponses(COMPUTE_ERRORS) },
        },
      },
      '/api/v1/fit': {
        post: {
          operationId: 'fit',
          summary: 'Fit 10Dq, B (and C) to observed band maxima',
          requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(fitBody) } } },
          responses: {
            '200': {
              description: 'The fit: the cubic FitResult, or with symmetry "tetragonal", zeta or freeZeta the TetragonalFitResult (what `fieldgap fit --symmetry tetragonal --json` prints).',
              content: { 'application/json': { schema: { oneOf: [{ $ref: '#/components/schemas/FitResult' }, { $ref: '#/components/schemas/TetragonalFitResult' }] } } },
            },
            ...errorResponses(['400', '413', '415', '422', '500', '503', '504']),
          },
        },
      },
      '/api/v1/analyze': {
        post: {
          operationId: 'analyze',
          summary: 'Analyse a spectrum: bands, assignment and fit',
          description:
            'Send the spectrum as the multipart form field `spectrum`, or as the raw body with one of the listed content types. ' +
            `Options go in the query string or as form fields. Largest upload: ${bytes(limits.maxBodyBytes)}.`,
          parameters: queryParameters(analyzeFields),
          requestBody: { required: true, content: { 'multipart/form-data': { schema: formSchema }, ...rawBody } },
          responses: {
            '200': ok('The analysis, as `fieldgap analyze --json` prints it.', 'AnalyzeResult'),
            ...errorResponses(['400', '413', '415', '422', '500', '503', '504']),
          },
        },
      },
      '/api/v1/analyses': {
        post: {
          operationId: 'addAnalysis',
          summary: 'Analyse a spectrum and save it in the results library',
          parameters: queryParameters(analysisRecordFields),
          requestBody: { required: true, content: { 'multipart/form-data': { schema: recordForm }, ...rawBody } },
          responses: { '201': ok('The saved record; a file with several spectra is one record per spectrum, listed in `records` (the answer is the first).', 'SavedFile'), ...errorResponses(['400', '413', '415', '422', '500', '503', '504']) },
        },
        get: {
          operationId: 'listAnalyses',
          summary: 'Stored analyses, newest first',
          parameters: queryParameters(listQuery),
          responses: { '200': ok('{ analyses, total, limit, offset }.', 'AnalysisList'), ...errorResponses(['400', '500']) },
        },
      },
      '/api/v1/analyses/{id}': {
        get: {
          operationId: 'getAnalysis',
          summary: 'One stored analysis with its revisions',
          parameters: [idParameter],
          responses: { '200': record('The record.'), ...errorResponses(['400', '404', '500']) },
        },
        patch: {
          operationId: 'updateAnalysis',
          summary: 'Change the details of a stored analysis',
          parameters: [idParameter],
          requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(patchBody) } } },
          responses: { '200': record('The updated record.'), ...errorResponses(['400', '404', '415', '500']) },
        },
        delete: {
          operationId: 'deleteAnalysis',
          summary: 'Delete a stored analysis, its original and its history',
          parameters: [idParameter],
          responses: { '204': { description: 'Deleted.' }, ...errorResponses(['400', '404', '500']) },
        },
      },
      '/api/v1/analyses/{id}/original': {
        get: {
          operationId: 'getOriginal',
          summary: 'The original file, byte for byte',
          parameters: [idParameter],
          responses: { '200': { description: 'The file as uploaded.' }, ...errorResponses(['400', '404', '500']) },
        },
      },
      '/api/v1/analyses/{id}/refit': {
        post: {
          operationId: 'refitAnalysis',
          summary: 'Analyse the stored original again with changed options: a new revision',
          parameters: [idParameter, ...queryParameters(refitFields)],
          requestBody: { required: false, content: { 'application/json': { schema: jsonSchema(refitFields) } } },
          responses: { '200': record('The record with its new revision.'), ...errorResponses(['400', '404', '422', '500', '503', '504']) },
        },
      },
      '/api/v1/series': {
        get: {
          operationId: 'series',
          summary: 'Spectrochemical and nephelauxetic ranking of the stored analyses of one ion',
          parameters: queryParameters(seriesQuery),
          responses: { '200': { description: 'The ranking and the fitted Jørgensen factors. Per ligand complete (`ligands`: n, mean 10Dq and β with σ, places, f and h; `ligandSeries`); the per-analysis lists (each ranking\'s entries, overlaps, skipped and series, `skipped`, each factor\'s fFrom and hFrom, the notes of analyses that give no f) hold items offset+1 … offset+limit unless all=true; `page` gives offset, limit and each list\'s whole length (`count` is the spectrochemical one).' }, ...errorResponses(['400', '404', '500']) },
        },
      },
      '/api/v1/predict': {
        post: {
          operationId: 'predict',
          summary: 'Estimate 10Dq, beta, B, C and the spin state from a complex formula',
          requestBody: { required: true, content: { 'application/json': { schema: jsonSchema(predictBody) } } },
          responses: { '200': { description: 'Estimates, each marked as such.' }, ...errorResponses(['400', '413', '415', '500']) },
        },
      },
    },
    components: {
      schemas: {
        Error: jsonSchema(errorResponse, 'output'),
        Health: jsonSchema(healthResponse, 'output'),
        LevelsResult: jsonSchema(levelsResponse, 'output'),
        Diagram: jsonSchema(diagramResponse, 'output'),
        FitResult: jsonSchema(fitResponse, 'output'),
        TetragonalFitResult: jsonSchema(tetragonalFitResponse, 'output'),
        AnalyzeResult: jsonSchema(analyzeResponse, 'output'),
        AnalysisRecord: jsonSchema(analysisRecordResponse, 'output'),
        SavedFile: jsonSchema(savedFileResponse, 'output'),
        AnalysisList: jsonSchema(listPageResponse, 'output'),
      },
    },
  };
}
