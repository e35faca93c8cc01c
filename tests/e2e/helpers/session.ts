/**
 * One page-test session: the real service, headless Chromium with one page,
 * the demo files, and watchers for what must never happen (a request to
 * another origin, a script error, an HTTP failure nobody expected).
 */
import { mkdir, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { launchBrowser, type Browser } from './browser.js';
import { startService, type RunningService } from './server.js';
import { demoFiles, type DemoFile } from './demo.js';

/** Screenshots and downloads kept for a person to look at (gitignored). */
export const SHOTS = resolve(import.meta.dirname, '..', '..', '..', 'test-results', 'e2e');

export interface Session {
  service: RunningService;
  browser: Browser;
  page: Page;
  /** A temporary folder for files the tests write. */
  folder: string;
  files: DemoFile[];
  /** Requests to other origins (refused: the page must work offline). */
  outside: string[];
  /** Script errors and console errors other than failed loads. */
  problems: string[];
  /** "422 POST /api/v1/analyze?…": every HTTP answer ≥ 400 the page got. */
  failed: string[];
  close(): Promise<void>;
}

export async function openSession(): Promise<Session> {
  const folder = await mkdtemp(join(tmpdir(), 'fieldgap-e2e-'));
  const files = await demoFiles(folder);
  await mkdir(SHOTS, { recursive: true });
  const service = await startService();
  const browser = await launchBrowser();
  const page = await browser.context.newPage();
  const outside: string[] = [];
  const problems: string[] = [];
  const failed: string[] = [];
  await browser.context.route('**/*', (route) => {
    const url = route.request().url();
    if (url.startsWith(service.baseUrl) || url.startsWith('data:') || url.startsWith('blob:')) return route.continue();
    outside.push(url);
    return route.abort();
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('console', (message) => {
    // Failed HTTP answers are collected with their URLs in `failed`.
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(`console: ${message.text()}`);
  });
  page.on('response', (response) => {
    if (response.status() >= 400) failed.push(`${response.status()} ${response.request().method()} ${response.url().replace(service.baseUrl, '')}`);
  });
  return {
    service, browser, page, folder, files, outside, problems, failed,
    async close() {
      await browser.close();
      await service.stop();
      await rm(folder, { recursive: true, force: true });
    },
  };
}

/**
 * One session for the enclosing suite: opened before its first test (a
 * generous limit: the page is built and Chromium started on a busy machine),
 * closed after its last. The Session returned reads the open one, so a suite
 * writes `const s = sessionPerSuite()` and uses `s.page` in its tests.
 */
export function sessionPerSuite(): Session {
  let open: Session | undefined;
  beforeAll(async () => {
    open = await openSession();
  }, 60_000);
  afterAll(async () => {
    await open?.close();
    open = undefined;
  });
  const now = (): Session => {
    if (open === undefined) throw new Error('sessionPerSuite: the session is open only while the suite runs');
    return open;
  };
  return {
    get service() { return now().service; },
    get browser() { return now().browser; },
    get page() { return now().page; },
    get folder() { return now().folder; },
    get files() { return now().files; },
    get outside() { return now().outside; },
    get problems() { return now().problems; },
    get failed() { return now().failed; },
    close: () => now().close(),
  };
}
