/**
 * The results library on the page, in headless Chromium against the real
 * service with an empty library: save three analyses of the invented Cr(III)
 * demo scenario with their ligands, list them, rank the ligand series, reopen
 * one, delete one, export CSV. What the page shows is checked against the
 * service's own answers (GET /api/v1/analyses, GET /api/v1/series).
 */
import { mkdir, mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import Papa from 'papaparse';
import { formatWithUncertainty } from '../../web/format.js';
import type { LibraryPage, SeriesReport } from '../../web/types.js';
import { browserTestsSkipped, launchBrowser, type Browser } from './helpers/browser.js';
import { startService, type RunningService } from './helpers/server.js';
import { demoFiles, type DemoFile } from './helpers/demo.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';
import { apiAnswer } from './helpers/api.js';

const SHOTS = resolve(import.meta.dirname, '..', '..', 'test-results', 'e2e');
/** The ligands of the invented demo scenario (spectra-demo/README.md). */
const LIGANDS: Record<string, string> = { 'cr-aqua.csv': 'H2O', 'cr-oxalato.txt': 'ox', 'cr-ammine.jdx': 'NH3' };

describe.skipIf(browserTestsSkipped())('the results library on the page', () => {
  let service: RunningService;
  let browser: Browser;
  let folder: string;
  let page: Page;
  /** The demo files the service analyses, each with its ligand. */
  let usable: { file: DemoFile; ligand: string }[];
  const errors: string[] = [];

  const list = async (): Promise<LibraryPage> => (await (await fetch(`${service.baseUrl}/api/v1/analyses?limit=100`)).json()) as LibraryPage;

  beforeAll(async () => {
    folder = await mkdtemp(join(tmpdir(), 'fieldgap-e2e-library-'));
    await mkdir(SHOTS, { recursive: true });
    const files = await demoFiles(folder);
    service = await startService();
    usable = [];
    for (const [i, file] of files.entries()) {
      if ((await apiAnswer(service, file)).status === 200) usable.push({ file, ligand: LIGANDS[file.name] ?? `L${i + 1}` });
    }
    browser = await launchBrowser();
    page = await browser.context.newPage();
    page.on('pageerror', (error) => errors.push(error.message));
    page.on('dialog', (dialog) => void dialog.accept());
    await page.goto(service.baseUrl);
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    await service?.stop();
    if (folder !== undefined) await rm(folder, { recursive: true, force: true });
  });

  it('saves analyses with their sample and ligand', async () => {
    await page.waitForSelector('#tab-library:not([hidden])');
    // A series needs two analyses at least.
    expect(usable.length).toBeGreaterThanOrEqual(2);
    for (const { file, ligand } of usable) {
      await uploadAndAnalyse(page, [file], { sample: `invented ${ligand} extract`, ligand });
      await page.waitForSelector('#save-library');
      await page.click('#save-library');
      await page.waitForSelector('#saved-note');
    }
    const stored = await list();
    expect(stored.total).toBe(usable.length);
    expect(stored.analyses.map((a) => a.ligands)).toEqual(usable.map((u) => [u.ligand]).reverse());
  }, 90_000);

  it('lists what the library holds, with the stored 10Dq and β', async () => {
    await page.click('#tab-library');
    await page.waitForSelector('#library-table');
    const stored = await list();
    for (const record of stored.analyses) {
      const cells = page.locator(`#library-table tr[data-id="${record.id}"] td`);
      expect(await cells.nth(2).textContent()).toBe(formatWithUncertainty(record.summary.tenDq, record.summary.tenDqSd));
      expect(await cells.nth(4).textContent()).toBe(formatWithUncertainty(record.summary.beta, record.summary.betaSd, 2));
    }
  }, 30_000);

  it('ranks the ligand series as the service does, with error-bar plots', async () => {
    await page.waitForSelector('#series-tendq .series-line');
    const report = (await (await fetch(`${service.baseUrl}/api/v1/series?ion=Cr3%2B`)).json()) as SeriesReport;
    expect(await page.locator('#series-tendq .series-line').textContent()).toBe(report.spectrochemical.series);
    expect(await page.locator('#series-beta .series-line').textContent()).toBe(report.nephelauxetic.series);
    expect(await page.locator('#series-tendq table.data tbody tr').count()).toBe(report.spectrochemical.entries.length);
    await page.waitForSelector('#series-tendq-plot canvas');
    await page.waitForSelector('#series-beta-plot canvas');
    await page.screenshot({ path: join(SHOTS, 'library.png'), fullPage: true });
  }, 30_000);

  it('exports the list as CSV, one row per record', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#library-csv')]);
    const rows = Papa.parse<string[]>((await readFile(await download.path(), 'utf8')).trim()).data;
    expect(rows).toHaveLength(1 + usable.length);
    expect(rows.slice(1).map((r) => r[4]).sort()).toEqual(usable.map((u) => u.ligand).sort());
  }, 30_000);

  it('reopens a stored analysis on the Analyse view', async () => {
    const record = (await list()).analyses[0]!;
    await page.click(`#library-open-${record.id}`);
    await page.waitForSelector('#p-tendq');
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(record.summary.tenDq, record.summary.tenDqSd));
    await expect(page.locator('#result-title').textContent()).resolves.toContain(record.sample);
    await page.waitForSelector('#spectrum-plot canvas');
    await expect(page.locator('#saved-note').textContent()).resolves.toContain(`record ${record.id}`);
  }, 30_000);

  it('deletes a record after asking', async () => {
    await page.click('#tab-library');
    await page.waitForSelector('#library-table');
    const before = await list();
    const record = before.analyses[before.analyses.length - 1]!;
    await page.click(`#library-delete-${record.id}`);
    await page.waitForFunction((id) => document.querySelector(`#library-table tr[data-id="${id}"]`) === null, record.id);
    const left = await list();
    expect(left.total).toBe(before.total - 1);
    expect(left.analyses.some((a) => a.id === record.id)).toBe(false);
    expect(errors).toEqual([]);
  }, 30_000);
});
