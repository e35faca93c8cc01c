/**
 * "Save to library" of a file with several spectra, in headless Chromium
 * against the real service: the page saves one record per spectrum (the
 * rule of library add and watch, src/library/spectra-to-store.ts), says
 * so, and lists them in the library. The file is the invented demo
 * scenario's three-column spectra-demo/cr-series.csv.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { LibraryPage } from '../../web/types.js';
import { browserTestsSkipped, launchBrowser, type Browser } from './helpers/browser.js';
import { startService, type RunningService } from './helpers/server.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';

const SERIES = resolve(import.meta.dirname, '..', '..', 'spectra-demo', 'cr-series.csv');

describe.skipIf(browserTestsSkipped())('saving a file with several spectra from the page', () => {
  let service: RunningService;
  let browser: Browser;
  let folder: string;
  let page: Page;
  const errors: string[] = [];

  beforeAll(async () => {
    folder = await mkdtemp(join(tmpdir(), 'fieldgap-e2e-multicol-'));
    service = await startService();
    browser = await launchBrowser();
    page = await browser.context.newPage();
    page.on('pageerror', (error) => errors.push(error.message));
    await page.goto(service.baseUrl);
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    await service?.stop();
    if (folder !== undefined) await rm(folder, { recursive: true, force: true });
  });

  it('saves every column as its own record and says how many', async () => {
    await page.waitForSelector('#tab-library:not([hidden])');
    await uploadAndAnalyse(page, [{ path: SERIES, name: 'cr-series.csv', ion: 'Cr3+', geometry: 'octahedral', concentration: 0.05 }]);
    await page.waitForSelector('#save-library');
    await page.click('#save-library');
    await page.waitForSelector('#saved-note');
    const stored = (await (await fetch(`${service.baseUrl}/api/v1/analyses?limit=100`)).json()) as LibraryPage;
    expect(stored.total).toBe(3);
    const ids = stored.analyses.map((a) => a.id).sort((a, b) => a - b);
    const notice = await page.locator('#notice').textContent();
    expect(notice).toContain(`Saved cr-series.csv as 3 records, one per spectrum in the file: ${ids[0]} (Cr-en absorbance), ${ids[1]} (Cr-urea absorbance), ${ids[2]} (Cr-NCS absorbance).`);
    expect(stored.analyses.map((a) => a.sample).sort()).toEqual(['cr-series: Cr-NCS absorbance', 'cr-series: Cr-en absorbance', 'cr-series: Cr-urea absorbance']);
    expect(errors).toEqual([]);
  }, 90_000);
});
