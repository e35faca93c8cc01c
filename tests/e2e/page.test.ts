/**
 * The page as a chemist uses it, in headless Chromium against the real
 * service: upload an (invented) spectrum, read 10Dq and the spin state,
 * correct the bands, refit, download, compare two analyses. Every number the
 * page shows is checked against the service's own answer for the same input.
 */
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { formatWithUncertainty, spinStateText } from '../../web/format.js';
import type { AnalyzeResult, FitResult } from '../../web/types.js';
import { browserTestsSkipped, launchBrowser, type Browser } from './helpers/browser.js';
import { startService, type RunningService } from './helpers/server.js';
import { demoFiles, type DemoFile } from './helpers/demo.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';

const SHOTS = resolve(import.meta.dirname, '..', '..', 'test-results', 'e2e');

async function apiAnalyze(service: RunningService, file: DemoFile): Promise<AnalyzeResult> {
  const form = new FormData();
  form.append('spectrum', new Blob([await readFile(file.path)]), file.name);
  const query = new URLSearchParams({ ion: file.ion, geometry: file.geometry, conc: String(file.concentration), curves: 'true' });
  const response = await fetch(`${service.baseUrl}/api/v1/analyze?${query}`, { method: 'POST', body: form });
  expect(response.status).toBe(200);
  return (await response.json()) as AnalyzeResult;
}

/** The service's answer for a file, whatever its status. */
async function apiAnswer(service: RunningService, file: DemoFile): Promise<{ status: number; body: unknown }> {
  const form = new FormData();
  form.append('spectrum', new Blob([await readFile(file.path)]), file.name);
  const query = new URLSearchParams({ ion: file.ion, geometry: file.geometry, conc: String(file.concentration), curves: 'true' });
  const response = await fetch(`${service.baseUrl}/api/v1/analyze?${query}`, { method: 'POST', body: form });
  return { status: response.status, body: await response.json() };
}

async function apiFit(service: RunningService, body: unknown): Promise<FitResult> {
  const response = await fetch(`${service.baseUrl}/api/v1/fit`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
  expect(response.status).toBe(200);
  return (await response.json()) as FitResult;
}

describe.skipIf(browserTestsSkipped())('the web page in headless Chromium', () => {
  let service: RunningService;
  let browser: Browser;
  let folder: string;
  let page: Page;
  let files: DemoFile[];
  /** The service's answer for the first file. */
  let first: AnalyzeResult;
  const outside: string[] = [];
  const problems: string[] = [];
  const failed: string[] = [];
  /** Uploads the service itself refuses (the bad file, a demo file it cannot fit). */
  let expectedAnalyzeFailures = 0;

  beforeAll(async () => {
    folder = await mkdtemp(join(tmpdir(), 'fieldgap-e2e-'));
    files = await demoFiles(folder);
    await mkdir(SHOTS, { recursive: true });
    service = await startService();
    browser = await launchBrowser();
    page = await browser.context.newPage();
    // The page must work offline: any request to another origin is recorded and refused.
    await browser.context.route('**/*', (route) => {
      const url = route.request().url();
      if (url.startsWith(service.baseUrl) || url.startsWith('data:') || url.startsWith('blob:')) return route.continue();
      outside.push(url);
      return route.abort();
    });
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
    page.on('console', (message) => {
      // Failed HTTP answers are checked one by one below, with their URLs.
      if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(`console: ${message.text()}`);
    });
    page.on('response', (response) => {
      if (response.status() >= 400) failed.push(`${response.status()} ${response.request().method()} ${response.url().replace(service.baseUrl, '')}`);
    });
  }, 60_000);

  afterAll(async () => {
    await browser?.close();
    await service?.stop();
    if (folder !== undefined) await rm(folder, { recursive: true, force: true });
  });

  it('analyses an uploaded spectrum and shows the service\'s 10Dq and spin state', async () => {
    const file = files[0]!;
    const expected = await apiAnalyze(service, file);
    first = expected;
    expect(expected.fit).not.toBeNull();
    const fit = expected.fit!;

    await page.goto(service.baseUrl);
    await expect(page.title()).resolves.toMatch(/fieldgap/);
    await uploadAndAnalyse(page, [file]);
    await page.waitForSelector('#p-tendq', { timeout: 30_000 });

    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq));
    expect(await cardValue(page, 'p-b')).toBe(formatWithUncertainty(fit.b, fit.uncertainty.b));
    expect(await cardValue(page, 'p-spin')).toBe(spinStateText(fit.spinState));
    expect(await cardValue(page, 'p-unpaired')).toBe(String(fit.unpairedElectrons));
    expect(await page.locator('#assignments tbody tr').count()).toBe(fit.assignments.length);
    // The plots are uPlot canvases, drawn.
    await page.waitForSelector('#spectrum-plot canvas');
    await page.waitForSelector('#diagram-plot canvas', { timeout: 20_000 });
    await page.waitForSelector('#residuals-plot canvas');
    await page.screenshot({ path: join(SHOTS, 'analysed.png'), fullPage: true });
  }, 60_000);

  it('switches the spectrum axis to nm and back', async () => {
    await page.click('#unit-nm');
    await page.waitForSelector('#unit-nm[aria-pressed="true"]');
    await expect(page.locator('#spectrum-plot .u-legend').first().textContent()).resolves.toMatch(/nm/);
    await page.click('#unit-cm-1');
    await page.waitForSelector('#unit-cm-1[aria-pressed="true"]');
  }, 30_000);

  it('zooms by dragging across the spectrum and comes back with Reset zoom', async () => {
    const canvas = page.locator('#spectrum-plot canvas').first();
    const image = (): Promise<string> => canvas.evaluate((c) => (c as HTMLCanvasElement).toDataURL());
    const before = await image();
    const over = page.locator('#spectrum-plot .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.3, box.y + box.height * 0.5);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.6, box.y + box.height * 0.5, { steps: 8 });
    await page.mouse.up();
    await page.waitForFunction((b) => (document.querySelector('#spectrum-plot canvas') as HTMLCanvasElement).toDataURL() !== b, before);
    // A drag is a zoom, never a new band.
    expect(await page.locator('#band-table tbody tr', { hasText: 'added' }).count()).toBe(0);
    await page.click('#spectrum-reset');
    await page.waitForFunction((b) => (document.querySelector('#spectrum-plot canvas') as HTMLCanvasElement).toDataURL() === b, before);
  }, 30_000);

  it('labels every control and shows where the keyboard focus is', async () => {
    const unlabelled = await page.evaluate(() =>
      Array.from(document.querySelectorAll('input, select, textarea, button'))
        .filter((el) => {
          const e = el as HTMLInputElement;
          if (e.type === 'hidden' || e.closest('[hidden]')) return false;
          const named = e.labels?.length || e.getAttribute('aria-label') || e.getAttribute('aria-labelledby') || (e.tagName === 'BUTTON' && e.textContent?.trim());
          return !named;
        })
        .map((el) => el.outerHTML.slice(0, 80)),
    );
    expect(unlabelled).toEqual([]);
    await page.focus('#refit');
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    const outline = await page.evaluate(() => getComputedStyle(document.activeElement!).outlineStyle);
    expect(outline).not.toBe('none');
  }, 30_000);

  it('takes files dropped on the drop zone', async () => {
    const name = files[0]!.name;
    const text = await readFile(files[0]!.path, 'latin1');
    await page.evaluate(([fileName, content]) => {
      const data = new DataTransfer();
      data.items.add(new File([content!], fileName!, { type: 'text/plain' }));
      const zone = document.querySelector('#drop-zone')!;
      zone.dispatchEvent(new DragEvent('dragover', { dataTransfer: data, bubbles: true, cancelable: true }));
      zone.dispatchEvent(new DragEvent('drop', { dataTransfer: data, bubbles: true, cancelable: true }));
    }, [name, text]);
    await expect(page.locator('#queue li').first().textContent()).resolves.toContain(name);
    await expect(page.locator('#analyse').isDisabled()).resolves.toBe(false);
    await page.getByRole('button', { name: `Remove ${name} from the list` }).click();
    await expect(page.locator('#queue li').count()).resolves.toBe(0);
  }, 30_000);

  it('a refit with no correction gives back the analysis\'s own fit', async () => {
    await page.click('#refit');
    await page.waitForSelector('#refit:not([disabled])');
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
    expect(await cardValue(page, 'p-b')).toBe(formatWithUncertainty(first.fit!.b, first.fit!.uncertainty.b));
    expect(await cardValue(page, 'p-c')).toBe(formatWithUncertainty(first.fit!.c, first.fit!.uncertainty.c));
    expect(await page.locator('#p-tendq .card-note').count()).toBe(0);
  }, 30_000);

  it('shows the numbers of an alternative assignment, and goes back to the best fit', async (ctx) => {
    const alternative = first.fit!.alternatives?.[0];
    if (alternative === undefined || alternative.tenDq === undefined) ctx.skip();
    await page.click('#alt-0');
    await page.waitForSelector('#alt-0[aria-pressed="true"]');
    // An alternative has no uncertainties: the value alone is shown.
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(alternative!.tenDq, null));
    await expect(page.locator('#result-subtitle').textContent()).resolves.toMatch(/showing alternative 1/);
    await page.click('#alt-best');
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
  }, 30_000);

  it('refits with a new C/B and shows what the service fits for it', async () => {
    await page.fill('#refit-c-over-b', '3.2');
    await page.dispatchEvent('#refit-c-over-b', 'change');
    const requestPromise = page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await page.click('#refit');
    const body = (await requestPromise).postDataJSON() as { cOverB?: number; bands: { flags: string[] }[] };
    expect(body.cOverB).toBe(3.2);
    await page.waitForFunction(() => document.querySelector('#p-c .card-note')?.textContent?.includes('3.20'));
    const expected = await apiFit(service, body);
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    expect(await cardValue(page, 'p-b')).toBe(formatWithUncertainty(expected.b, expected.uncertainty.b));
    // C/B held fixed: C = (C/B)·B, by definition of the ratio.
    // (The service rounds B and C to 0.1 cm-1.)
    expect(Math.abs(expected.c! - 3.2 * expected.b!)).toBeLessThan(0.5);
    if (!body.bands.some((band) => band.flags.includes('spin-forbidden'))) {
      // d3 octahedral with quartet bands only: their energies depend on Dq and B, not C — Tanabe & Sugano (1954), J. Phys. Soc. Jpn. 9, 753.
      expect(expected.tenDq).toBeCloseTo(first.fit!.tenDq, 0);
    }
  }, 30_000);

  it('removes a band, refits, and shows what the service fits for the corrected list', async () => {
    const rows = page.locator('#band-table tbody tr');
    const count = await rows.count();
    expect(count).toBeGreaterThanOrEqual(2);
    // Remove the highest band: the fit then rests on the others.
    const lastPosition = Number(await rows.nth(count - 1).getAttribute('data-position'));
    await page.click(`#band-${count - 1}-remove`);
    await page.waitForSelector(`#band-${count - 1}-restore`);
    const requestPromise = page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await page.click('#refit');
    const request = await requestPromise;
    const body = request.postDataJSON() as { bands: { position: number }[] };
    expect(body.bands.map((b) => b.position)).not.toContain(lastPosition);
    await page.waitForSelector('#refit:not([disabled])');
    const expected = await apiFit(service, body);
    const shown = await cardValue(page, 'p-tendq');
    expect(shown).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    expect(await page.locator('#assignments tbody tr').count()).toBe(expected.assignments.length);
    if (Math.abs(expected.tenDq - first.fit!.tenDq) >= 0.5) {
      await expect(page.locator('#p-tendq .card-note').textContent()).resolves.toMatch(/was .* before the corrections/);
    }
    await page.screenshot({ path: join(SHOTS, 'corrected.png'), fullPage: true });
    await page.click('#undo');
    await page.waitForFunction((text) => document.querySelector('#p-tendq .value')?.textContent === text, formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
  }, 30_000);

  it('marks a band as charge transfer: the fit leaves it out', async () => {
    const rows = page.locator('#band-table tbody tr');
    const position = Number(await rows.nth(0).getAttribute('data-position'));
    await page.selectOption('#band-0-kind', 'charge-transfer');
    const requestPromise = page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await page.click('#refit');
    const body = (await requestPromise).postDataJSON() as { bands: { position: number; flags: string[] }[] };
    expect(body.bands.find((band) => band.position === position)?.flags).toContain('charge-transfer');
    await page.waitForSelector('#refit:not([disabled])');
    const expected = await apiFit(service, body);
    expect(expected.assignments.some((a) => Math.abs(a.observed - position) < 1)).toBe(false);
    expect(await cardValue(page, 'p-tendq')).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    await expect(rows.nth(0).locator('td').nth(4).textContent()).resolves.toContain('charge transfer');
    await page.click('#undo');
    await page.waitForFunction(() => (document.querySelector('#band-0-kind') as HTMLSelectElement).value !== 'charge-transfer');
  }, 30_000);

  it('adds a band where the spectrum is clicked', async () => {
    const rows = page.locator('#band-table tbody tr');
    const count = await rows.count();
    await page.click('#pick-band');
    await page.waitForSelector('#pick-band[aria-pressed="true"]');
    const over = page.locator('#spectrum-plot .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.5, box.y + box.height * 0.5);
    await page.waitForFunction((n) => document.querySelectorAll('#band-table tbody tr').length === n + 1, count);
    const added = page.locator('#band-table tbody tr', { hasText: 'added' });
    const position = Number(await added.getAttribute('data-position'));
    // Clicked halfway across the unzoomed cm-1 axis, which spans the curves' grid.
    const grid = first.curves?.grid ?? [];
    const middle = (grid[0]! + grid[grid.length - 1]!) / 2;
    expect(Math.abs(position - middle)).toBeLessThan(0.02 * (grid[grid.length - 1]! - grid[0]!));
    await page.locator('#band-table tbody tr', { hasText: 'added' }).getByRole('button', { name: 'Delete' }).click();
    await page.waitForFunction((n) => document.querySelectorAll('#band-table tbody tr').length === n, count);
  }, 30_000);

  it('downloads the results as JSON and CSV and the spectrum as SVG and PNG', async () => {
    const grab = async (id: string): Promise<string> => {
      const [download] = await Promise.all([page.waitForEvent('download'), page.click(`#${id}`)]);
      const path = await download.path();
      return readFile(path, id.endsWith('png') ? 'latin1' : 'utf8');
    };
    const json = JSON.parse(await grab('download-json')) as { fit: FitResult };
    const shown = await cardValue(page, 'p-tendq');
    expect(formatWithUncertainty(json.fit.tenDq, json.fit.uncertainty.tenDq)).toBe(shown);
    const csv = await grab('download-csv');
    expect(csv.split('\n')[0]).toBe('quantity,value,uncertainty,unit');
    expect(csv).toContain(`10Dq,${json.fit.tenDq},`);
    const svg = await grab('spectrum-svg');
    await writeFile(join(SHOTS, 'spectrum.svg'), svg);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain('wavenumber / cm⁻¹');
    const png = await grab('spectrum-png');
    expect(png.slice(1, 4)).toBe('PNG');
  }, 30_000);

  it('compares two analyses side by side', async () => {
    const pair = [files[1]!, files[2]!];
    const answers = await Promise.all(pair.map((file) => apiAnswer(service, file)));
    // The comparison needs analyses that succeed; one that fails must show as failed, not vanish.
    expect(answers.some((answer) => answer.status === 200)).toBe(true);
    await uploadAndAnalyse(page, pair);
    await page.waitForFunction(() => document.querySelectorAll('#entries .status.pending').length === 0 && document.querySelectorAll('#entries li').length === 3);
    await page.click('#tab-compare');
    await page.waitForSelector('#compare-table');
    const done = answers.filter((answer) => answer.status === 200).length;
    expectedAnalyzeFailures += pair.length - done;
    expect(await page.locator('#compare-table tbody tr').count()).toBe(1 + done);
    const cell = (name: string) => page.locator('#compare-table tbody tr', { hasText: name }).locator('td').nth(3);
    for (const [i, file] of pair.entries()) {
      const answer = answers[i]!;
      if (answer.status === 200) {
        const fit = (answer.body as AnalyzeResult).fit!;
        expect(await cell(file.name).textContent()).toBe(formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq));
      } else {
        await expect(page.locator('#entries li', { hasText: file.name }).locator('.status').textContent()).resolves.toBe('failed');
      }
    }
    await page.waitForSelector('#overlay-plot canvas');
    await page.screenshot({ path: join(SHOTS, 'compare.png'), fullPage: true });
    await page.click('#tab-analyse');
  }, 60_000);

  it('shows the service\'s error message and where the problem is for a bad file', async () => {
    const bad = join(folder, 'not-a-spectrum.csv');
    await writeFile(bad, 'this,is\nnot,a spectrum\n');
    await page.setInputFiles('#file-input', [bad]);
    await page.click('#analyse');
    expectedAnalyzeFailures += 1;
    await page.waitForSelector('#analysis-error', { timeout: 20_000 });
    const text = (await page.locator('#analysis-error').textContent()) ?? '';
    expect(text).toContain('not-a-spectrum.csv could not be analysed');
    await page.screenshot({ path: join(SHOTS, 'error.png'), fullPage: true });
  }, 30_000);

  it('made no request outside the service and logged no script error', () => {
    expect(outside).toEqual([]);
    expect(problems).toEqual([]);
    // The only failed answers: uploads the service refuses (the file that is not a spectrum, a demo it cannot fit).
    const refused = failed.filter((f) => /^4\d\d POST \/api\/v1\/analyze\?/.test(f));
    expect(failed.filter((f) => !refused.includes(f))).toEqual([]);
    expect(refused).toHaveLength(expectedAnalyzeFailures);
  });
});
