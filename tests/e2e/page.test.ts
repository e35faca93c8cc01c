/**
 * The page as a chemist uses it, in headless Chromium against the real
 * service: upload an (invented) spectrum, read 10Dq and the spin state,
 * zoom, look at an alternative, correct the bands and refit. Every number the
 * page shows is checked against the service's own answer for the same input.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatWithUncertainty, spinStateText } from '../../web/format.js';
import type { AnalyzeResult } from '../../web/types.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';
import { apiAnalyze, apiFit } from './helpers/api.js';

describe.skipIf(browserTestsSkipped())('the web page in headless Chromium', () => {
  const s = sessionPerSuite();
  /** The service's answer for the first file. */
  let first: AnalyzeResult;

  it('analyses an uploaded spectrum and shows the service\'s 10Dq and spin state', async () => {
    const file = s.files[0]!;
    const expected = await apiAnalyze(s.service, file);
    first = expected;
    expect(expected.fit).not.toBeNull();
    const fit = expected.fit!;

    await s.page.goto(s.service.baseUrl);
    await expect(s.page.title()).resolves.toMatch(/fieldgap/);
    await uploadAndAnalyse(s.page, [file]);
    await s.page.waitForSelector('#p-tendq', { timeout: 30_000 });

    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq));
    expect(await cardValue(s.page, 'p-b')).toBe(formatWithUncertainty(fit.b, fit.uncertainty.b));
    expect(await cardValue(s.page, 'p-spin')).toBe(spinStateText(fit.spinState));
    expect(await cardValue(s.page, 'p-unpaired')).toBe(String(fit.unpairedElectrons));
    expect(await s.page.locator('#assignments tbody tr').count()).toBe(fit.assignments.length);
    // The plots are uPlot canvases, drawn.
    await s.page.waitForSelector('#spectrum-plot canvas');
    await s.page.waitForSelector('#diagram-plot canvas', { timeout: 20_000 });
    await s.page.waitForSelector('#residuals-plot canvas');
    await s.page.screenshot({ path: join(SHOTS, 'analysed.png'), fullPage: true });
  }, 60_000);

  it('switches the spectrum axis to nm and back', async () => {
    await s.page.click('#unit-nm');
    await s.page.waitForSelector('#unit-nm[aria-pressed="true"]');
    await expect(s.page.locator('#spectrum-plot .u-legend').first().textContent()).resolves.toMatch(/nm/);
    await s.page.click('#unit-cm-1');
    await s.page.waitForSelector('#unit-cm-1[aria-pressed="true"]');
  }, 30_000);

  it('zooms by dragging across the spectrum and comes back with Reset zoom', async () => {
    const canvas = s.page.locator('#spectrum-plot canvas').first();
    const image = (): Promise<string> => canvas.evaluate((c) => (c as HTMLCanvasElement).toDataURL());
    const before = await image();
    const over = s.page.locator('#spectrum-plot .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    await s.page.mouse.move(box.x + box.width * 0.3, box.y + box.height * 0.5);
    await s.page.mouse.down();
    await s.page.mouse.move(box.x + box.width * 0.6, box.y + box.height * 0.5, { steps: 8 });
    await s.page.mouse.up();
    await s.page.waitForFunction((b) => (document.querySelector('#spectrum-plot canvas') as HTMLCanvasElement).toDataURL() !== b, before);
    // A drag is a zoom, never a new band.
    expect(await s.page.locator('#band-table tbody tr', { hasText: 'added' }).count()).toBe(0);
    await s.page.click('#spectrum-reset');
    await s.page.waitForFunction((b) => (document.querySelector('#spectrum-plot canvas') as HTMLCanvasElement).toDataURL() === b, before);
  }, 30_000);

  it('a refit with no correction gives back the analysis\'s own fit', async () => {
    await s.page.click('#refit');
    await s.page.waitForSelector('#refit:not([disabled])');
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
    expect(await cardValue(s.page, 'p-b')).toBe(formatWithUncertainty(first.fit!.b, first.fit!.uncertainty.b));
    expect(await cardValue(s.page, 'p-c')).toBe(formatWithUncertainty(first.fit!.c, first.fit!.uncertainty.c));
    expect(await s.page.locator('#p-tendq .card-note').count()).toBe(0);
  }, 30_000);

  it('shows the numbers of an alternative assignment, and goes back to the best fit', async (ctx) => {
    const alternative = first.fit!.alternatives?.[0];
    if (alternative === undefined || alternative.tenDq === undefined) ctx.skip();
    await s.page.click('#alt-0');
    await s.page.waitForSelector('#alt-0[aria-pressed="true"]');
    // An alternative has no uncertainties: the value alone is shown.
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(alternative!.tenDq, null));
    await expect(s.page.locator('#result-subtitle').textContent()).resolves.toMatch(/showing alternative 1/);
    await s.page.click('#alt-best');
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
  }, 30_000);

  it('refits with a new C/B and shows what the service fits for it', async () => {
    await s.page.fill('#refit-c-over-b', '3.2');
    await s.page.dispatchEvent('#refit-c-over-b', 'change');
    const requestPromise = s.page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await s.page.click('#refit');
    const body = (await requestPromise).postDataJSON() as { cOverB?: number; bands: { flags: string[] }[] };
    expect(body.cOverB).toBe(3.2);
    await s.page.waitForFunction(() => document.querySelector('#p-c .card-note')?.textContent?.includes('3.20'));
    const expected = await apiFit(s.service, body);
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    expect(await cardValue(s.page, 'p-b')).toBe(formatWithUncertainty(expected.b, expected.uncertainty.b));
    // C/B held fixed: C = (C/B)·B, by definition of the ratio.
    // (The service rounds B and C to 0.1 cm-1.)
    expect(Math.abs(expected.c! - 3.2 * expected.b!)).toBeLessThan(0.5);
    if (!body.bands.some((band) => band.flags.includes('spin-forbidden'))) {
      // d3 octahedral with quartet bands only: their energies depend on Dq and B, not C — Tanabe & Sugano (1954), J. Phys. Soc. Jpn. 9, 753.
      expect(expected.tenDq).toBeCloseTo(first.fit!.tenDq, 0);
    }
  }, 30_000);

  it('removes a band, refits, and shows what the service fits for the corrected list', async () => {
    const rows = s.page.locator('#band-table tbody tr');
    const count = await rows.count();
    expect(count).toBeGreaterThanOrEqual(2);
    // Remove the highest band: the fit then rests on the others.
    const lastPosition = Number(await rows.nth(count - 1).getAttribute('data-position'));
    await s.page.click(`#band-${count - 1}-remove`);
    await s.page.waitForSelector(`#band-${count - 1}-restore`);
    const requestPromise = s.page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await s.page.click('#refit');
    const request = await requestPromise;
    const body = request.postDataJSON() as { bands: { position: number }[] };
    expect(body.bands.map((b) => b.position)).not.toContain(lastPosition);
    await s.page.waitForSelector('#refit:not([disabled])');
    const expected = await apiFit(s.service, body);
    const shown = await cardValue(s.page, 'p-tendq');
    expect(shown).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    expect(await s.page.locator('#assignments tbody tr').count()).toBe(expected.assignments.length);
    if (Math.abs(expected.tenDq - first.fit!.tenDq) >= 0.5) {
      await expect(s.page.locator('#p-tendq .card-note').textContent()).resolves.toMatch(/was .* before the corrections/);
    }
    await s.page.screenshot({ path: join(SHOTS, 'corrected.png'), fullPage: true });
    await s.page.click('#undo');
    await s.page.waitForFunction((text) => document.querySelector('#p-tendq .value')?.textContent === text, formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
  }, 30_000);

  it('marks a band as charge transfer: the fit leaves it out', async () => {
    const rows = s.page.locator('#band-table tbody tr');
    const position = Number(await rows.nth(0).getAttribute('data-position'));
    await s.page.selectOption('#band-0-kind', 'charge-transfer');
    const requestPromise = s.page.waitForRequest((r) => r.url().endsWith('/api/v1/fit') && r.method() === 'POST');
    await s.page.click('#refit');
    const body = (await requestPromise).postDataJSON() as { bands: { position: number; flags: string[] }[] };
    expect(body.bands.find((band) => band.position === position)?.flags).toContain('charge-transfer');
    await s.page.waitForSelector('#refit:not([disabled])');
    const expected = await apiFit(s.service, body);
    expect(expected.assignments.some((a) => Math.abs(a.observed - position) < 1)).toBe(false);
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(expected.tenDq, expected.uncertainty.tenDq));
    await expect(rows.nth(0).locator('td').nth(4).textContent()).resolves.toContain('charge transfer');
    await s.page.click('#undo');
    await s.page.waitForFunction(() => (document.querySelector('#band-0-kind') as HTMLSelectElement).value !== 'charge-transfer');
  }, 30_000);

  it('adds a band where the spectrum is clicked', async () => {
    const rows = s.page.locator('#band-table tbody tr');
    const count = await rows.count();
    await s.page.click('#pick-band');
    await s.page.waitForSelector('#pick-band[aria-pressed="true"]');
    const over = s.page.locator('#spectrum-plot .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    await s.page.mouse.click(box.x + box.width * 0.5, box.y + box.height * 0.5);
    await s.page.waitForFunction((n) => document.querySelectorAll('#band-table tbody tr').length === n + 1, count);
    const added = s.page.locator('#band-table tbody tr', { hasText: 'added' });
    const position = Number(await added.getAttribute('data-position'));
    // Clicked halfway across the unzoomed cm-1 axis, which spans the curves' grid.
    const grid = first.curves?.grid ?? [];
    const middle = (grid[0]! + grid[grid.length - 1]!) / 2;
    expect(Math.abs(position - middle)).toBeLessThan(0.02 * (grid[grid.length - 1]! - grid[0]!));
    await s.page.locator('#band-table tbody tr', { hasText: 'added' }).getByRole('button', { name: 'Delete' }).click();
    await s.page.waitForFunction((n) => document.querySelectorAll('#band-table tbody tr').length === n, count);
  }, 30_000);

  it('made no request outside the service and logged no script error', () => {
    expect(s.outside).toEqual([]);
    expect(s.problems).toEqual([]);
    expect(s.failed).toEqual([]);
  });
});
