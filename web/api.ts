/**
 * Calls to the fieldgap service. Every failure becomes an ApiError carrying
 * the service's { code, message, path } so the page can show where the
 * problem is; a network failure or a non-JSON answer gets code 'network'.
 */
import { ANALYSIS_OPTION_NAMES as NAME } from '../src/analysis-option-names.js';
import type { AnalyzeResult, ApiErrorBody, Diagram, FitResult, LibraryPage, LibraryRecord, SavedFile, SeriesReport, TetragonalFitResult } from './types.js';
import { priorFields, type FitRequest, type SampleDetails, type TetragonalFitRequest } from './state.js';
import type { FieldLevel, ResolvedParameters } from '../src/ligand-field/field-levels.js';
import type { FieldDiagramAnswer } from './plots/level-diagram-spec.js';

export class ApiError extends Error {
  readonly body: ApiErrorBody;
  constructor(body: ApiErrorBody) {
    super(body.message);
    this.body = body;
  }
}

const BASE = '/api/v1';

/**
 * Sent with every request: the service refuses a write from a web page
 * without it (server/security/origin.ts WRITE_HEADER), and a foreign page
 * cannot add it without a CORS preflight the service never approves.
 */
const PAGE_HEADERS: Readonly<Record<string, string>> = { 'X-Fieldgap-Request': '1' };

function withPageHeaders(init: RequestInit): RequestInit {
  return { ...init, headers: { ...PAGE_HEADERS, ...(init.headers as Record<string, string> | undefined) } };
}

function isErrorBody(value: unknown): value is { error: ApiErrorBody } {
  if (typeof value !== 'object' || value === null || !('error' in value)) return false;
  const error = (value as { error: unknown }).error;
  return typeof error === 'object' && error !== null && 'message' in error;
}

async function readJson<T>(response: Response, what: string): Promise<T> {
  let body: unknown;
  try {
    body = await response.json();
  } catch {
    throw new ApiError({
      code: 'network',
      message: `The service sent an answer that is not JSON for ${what} (HTTP ${response.status}).`,
      path: '',
    });
  }
  if (!response.ok || isErrorBody(body)) {
    if (isErrorBody(body)) {
      const { code, message, path } = body.error;
      throw new ApiError({ code: String(code ?? 'error'), message: String(message), path: String(path ?? '') });
    }
    throw new ApiError({ code: 'http', message: `${what} failed with HTTP ${response.status}.`, path: '' });
  }
  return body as T;
}

async function send<T>(url: string, init: RequestInit, what: string): Promise<T> {
  let response: Response;
  try {
    response = await fetch(url, withPageHeaders(init));
  } catch {
    throw new ApiError({ code: 'network', message: `Could not reach the fieldgap service for ${what}.`, path: '' });
  }
  return readJson<T>(response, what);
}

/** The query fields of POST /analyze for the sample details given (names from the one table, src/analysis-option-names.ts). */
export function analyzeQuery(details: SampleDetails): URLSearchParams {
  const query = new URLSearchParams();
  const ion = details.ion.trim();
  if (ion !== '') query.set(NAME.ion.rest, ion);
  else if (details.d !== null) query.set(NAME.d.rest, String(details.d));
  query.set(NAME.geometry.rest, details.geometry);
  if (details.concentration !== null) query.set(NAME.concentration.rest, String(details.concentration));
  if (details.pathLength !== null) query.set(NAME.pathLength.rest, String(details.pathLength));
  if (details.xUnit !== null) query.set(NAME.xUnit.rest, details.xUnit);
  if (details.column.trim() !== '') query.set(NAME.column.rest, details.column.trim());
  if (details.cOverB !== null) query.set(NAME.cOverB.rest, String(details.cOverB));
  if (details.freeC) query.set(NAME.freeC.rest, 'true');
  if (details.stepCorrection === false) query.set('stepCorrection', 'false');
  const priors = priorFields(details);
  if (priors.formula !== undefined) query.set('formula', priors.formula);
  if (priors.ligands !== undefined) query.set('ligands', priors.ligands);
  // The page plots the spectrum, so it always asks for the curves.
  query.set('curves', 'true');
  return query;
}

export function analyze(file: File, details: SampleDetails): Promise<AnalyzeResult> {
  const form = new FormData();
  form.append('spectrum', file, file.name);
  return send<AnalyzeResult>(`${BASE}/analyze?${analyzeQuery(details).toString()}`, { method: 'POST', body: form }, `the analysis of ${file.name}`);
}

export function fit(request: FitRequest): Promise<FitResult> {
  return send<FitResult>(
    `${BASE}/fit`,
    { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(request) },
    'the refit',
  );
}

/** POST /fit with symmetry "tetragonal": Dq, Ds, Dt (and B) with each band's D4h level and octahedral parent. */
export function fitTetragonal(request: TetragonalFitRequest): Promise<TetragonalFitResult> {
  return send<TetragonalFitResult>(
    `${BASE}/fit`,
    { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(request) },
    'the tetragonal fit',
  );
}

/** POST /predict: what a formula says (the Predict view). */
export function predict<T>(body: Record<string, unknown>): Promise<T> {
  return send<T>(`${BASE}/predict`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }, 'the prediction');
}

export interface DiagramQuery {
  d: number;
  geometry: string;
  cOverB: number;
  maxDqOverB: number;
  steps: number;
}

export function diagram(query: DiagramQuery): Promise<Diagram> {
  const params = new URLSearchParams({
    d: String(query.d),
    geometry: query.geometry,
    cOverB: String(query.cOverB),
    maxDqOverB: String(query.maxDqOverB),
    steps: String(query.steps),
  });
  return send<Diagram>(`${BASE}/diagram?${params.toString()}`, { method: 'GET' }, 'the energy-level diagram');
}

/** GET /levels beyond the cubic field: Dq, B, C with tetragonal Ds, Dt and spin–orbit ζ (cm-1). */
export type FieldLevelsQuery = ResolvedParameters & {
  d: number;
  /** The form's symmetry: a geometry, or "tetragonal". */
  geometry: string;
};

/** One level as GET /levels gives it with ds, dt or zeta: the engine's own type. */
export type FieldLevelRow = FieldLevel;

export interface FieldLevelsAnswer {
  group: string;
  groundTerm: string;
  levels: FieldLevelRow[];
  notes: string[];
}

/** GET /diagram with an axis: E/B of every level along Dq, the distortion or ζ (the Levels tab's plot). */
export interface FieldDiagramQuery extends FieldLevelsQuery {
  axis: 'dq' | 'distortion' | 'zeta';
  maxDqOverB: number;
  steps: number;
}

export function fieldDiagram(query: FieldDiagramQuery): Promise<FieldDiagramAnswer> {
  const { c, ...rest } = query;
  const params = new URLSearchParams(Object.entries({ ...rest, cOverB: c / query.b }).map(([k, v]): [string, string] => [k, String(v)]));
  return send<FieldDiagramAnswer>(`${BASE}/diagram?${params.toString()}`, { method: 'GET' }, 'the level diagram');
}

export function fieldLevels(query: FieldLevelsQuery): Promise<FieldLevelsAnswer> {
  const params = new URLSearchParams(Object.entries(query).map(([k, v]): [string, string] => [k, String(v)]));
  return send<FieldLevelsAnswer>(`${BASE}/levels?${params.toString()}`, { method: 'GET' }, 'the energy levels');
}

/** Details the library stores with an analysis. */
export interface LibraryDetails {
  sample: string;
  ligands: string;
  formula: string;
  note: string;
}

export interface LibraryQuery {
  query?: string;
  ion?: string;
  limit?: number;
  offset?: number;
}

/** What the page reads from the service's OpenAPI document. */
interface ServiceDocument {
  paths?: Record<string, unknown>;
  info?: { 'x-fieldgap-limits'?: { maxUploadBytes?: unknown } };
}

let serviceDocument: Promise<ServiceDocument | null> | null = null;

/** The service's OpenAPI document, asked once per page load; null when it cannot be read. */
function readServiceDocument(): Promise<ServiceDocument | null> {
  serviceDocument ??= fetch(`${BASE}/openapi.json`).then(
    async (response) => (response.ok ? ((await response.json()) as ServiceDocument) : null),
    () => null,
  ).catch(() => null);
  return serviceDocument;
}

/**
 * Whether this service has the results library, read from its OpenAPI
 * document (asking the endpoint itself would log a 404 where it is missing).
 */
export async function libraryAvailable(): Promise<boolean> {
  const document = await readServiceDocument();
  return document?.paths !== undefined && `${BASE}/analyses` in document.paths;
}

/**
 * The largest spectrum file the service accepts, bytes, from its OpenAPI
 * document (info['x-fieldgap-limits'], stated from the server's own option);
 * null when the service does not say: the page then lets the service judge.
 */
export async function uploadLimit(): Promise<number | null> {
  const limit = (await readServiceDocument())?.info?.['x-fieldgap-limits']?.maxUploadBytes;
  return typeof limit === 'number' && Number.isFinite(limit) && limit > 0 ? limit : null;
}

export function listAnalyses(query: LibraryQuery = {}): Promise<LibraryPage> {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== '') params.set(key, String(value));
  return send<LibraryPage>(`${BASE}/analyses?${params.toString()}`, { method: 'GET' }, 'the library list');
}

/**
 * POST /analyses: the service analyses the original again with the same
 * fields and stores file, options, result and details together: one record
 * per spectrum of a file with several (unless `column` names one), all
 * listed in the answer's `records`.
 */
export function saveAnalysis(file: File, fields: URLSearchParams, details: LibraryDetails): Promise<SavedFile> {
  const form = new FormData();
  form.append('spectrum', file, file.name);
  for (const [key, value] of Object.entries(details)) if (value.trim() !== '') form.append(key, value.trim());
  return send<SavedFile>(`${BASE}/analyses?${fields.toString()}`, { method: 'POST', body: form }, `saving ${file.name}`);
}

export function getAnalysis(id: number): Promise<LibraryRecord> {
  return send<LibraryRecord>(`${BASE}/analyses/${id}`, { method: 'GET' }, `record ${id}`);
}

export async function deleteAnalysis(id: number): Promise<void> {
  let response: Response;
  try {
    response = await fetch(`${BASE}/analyses/${id}`, withPageHeaders({ method: 'DELETE' }));
  } catch {
    throw new ApiError({ code: 'network', message: `Could not reach the fieldgap service to delete record ${id}.`, path: '' });
  }
  if (!response.ok) await readJson<unknown>(response, `deleting record ${id}`);
}

/** The whole series (all=true): the page lists and downloads every analysis, as it always did; the service's default is a page of each list. */
export function series(ion: string): Promise<SeriesReport> {
  return send<SeriesReport>(`${BASE}/series?${new URLSearchParams({ ion, all: 'true' }).toString()}`, { method: 'GET' }, `the ${ion} series`);
}
