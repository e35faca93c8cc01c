/** The service's own answers, asked directly over HTTP, to check the page against. */
import { readFile } from 'node:fs/promises';
import type { AnalyzeResult, FitResult } from '../../../web/types.js';
import type { DemoFile } from './demo.js';
import type { RunningService } from './server.js';

/** POST /api/v1/analyze for a file with the fields the page sends; any status. */
export async function apiAnswer(service: RunningService, file: DemoFile, extra: Record<string, string> = {}): Promise<{ status: number; body: unknown }> {
  const form = new FormData();
  form.append('spectrum', new Blob([await readFile(file.path)]), file.name);
  const query = new URLSearchParams({ ion: file.ion, geometry: file.geometry, conc: String(file.concentration), curves: 'true', ...extra });
  const response = await fetch(`${service.baseUrl}/api/v1/analyze?${query}`, { method: 'POST', body: form });
  return { status: response.status, body: await response.json() };
}

/** The analysis of a file the service must accept. */
export async function apiAnalyze(service: RunningService, file: DemoFile, extra: Record<string, string> = {}): Promise<AnalyzeResult> {
  const { status, body } = await apiAnswer(service, file, extra);
  if (status !== 200) throw new Error(`the service refused ${file.name} (${status}): ${JSON.stringify(body)}`);
  return body as AnalyzeResult;
}

/** POST /api/v1/fit with a body the page sent. */
export async function apiFit(service: RunningService, body: unknown): Promise<FitResult> {
  const response = await fetch(`${service.baseUrl}/api/v1/fit`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  if (response.status !== 200) throw new Error(`the service refused the fit (${response.status}): ${await response.text()}`);
  return (await response.json()) as FitResult;
}
