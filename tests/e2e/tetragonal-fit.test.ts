/**
 * The tetragonal fit on the page (issue 15 item 5: "choose the symmetry, see
 * the levels and the fit"), in headless Chromium against the real service:
 * the Symmetry choice of the refit sends symmetry "tetragonal" to POST
 * /api/v1/fit, and the page shows Dq, Ds, Dt with their uncertainties and
 * each band's D4h level with its octahedral parent, as the service answered.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatWithUncertainty } from '../../web/format.js';
import { fitTetragonal, type TetragonalFitResult } from '../../src/fit-tetragonal/index.js';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { cardValue } from './helpers/page-actions.js';
import { CU_BANDS, loadCuWithPublishedBands } from './helpers/invented-cu.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';

describe.skipIf(browserTestsSkipped())('the tetragonal fit on the page', () => {
  const s = sessionPerSuite();

  it('refits the bands in D4h and shows Dq, Ds, Dt with uncertainties, D4h levels and octahedral parents', async () => {
    const page = s.page;
    await page.setViewportSize({ width: 1280, height: 900 });
    // Take out the bands the finder found in the envelope; type in the published maxima.
    await loadCuWithPublishedBands(page, s.service.baseUrl, s.folder);

    // The symmetry choice: tetragonal hides the cubic-only "fit C" box and says what it fits.
    await page.selectOption('#refit-symmetry', 'tetragonal');
    await page.waitForSelector('#refit-free-c', { state: 'detached' });
    await expect(page.locator('#refit-symmetry-hint').textContent()).resolves.toMatch(/Dq, Ds and Dt/);

    const answer = page.waitForResponse((r) => r.url().endsWith('/api/v1/fit') && r.request().method() === 'POST');
    await page.click('#refit');
    const response = await answer;
    const sent = response.request().postDataJSON() as { symmetry: string; ion: string; bands: Array<{ position: number }>; window?: unknown; freeC?: unknown };
    expect(sent.symmetry).toBe('tetragonal');
    expect(sent.ion).toBe('Cu2+');
    expect(sent.bands.map((b) => b.position)).toEqual(CU_BANDS);
    // Fields only the cubic fit reads are not sent (the service would name them as errors).
    expect(sent.window).toBeUndefined();
    expect(sent.freeC).toBeUndefined();
    const fit = (await response.json()) as TetragonalFitResult;
    await page.waitForSelector('#tetragonal-fit');
    // The result is drawn far above the Refit button: the page takes the reader (and the keyboard focus) there.
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('tetragonal-fit');

    // The answer is the core's fit of the same bands (the project's own fit, not an outside check: that is
    // tests/fit-tetragonal/published.test.ts, where these bands give the published Dq, Ds, Dt).
    const core = fitTetragonal({ ion: 'Cu2+', geometry: 'octahedral', bands: CU_BANDS });
    expect(fit.dq).toBeCloseTo(core.dq, 6);
    expect(fit.ds).toBeCloseTo(core.ds, 6);
    expect(fit.dt).toBeCloseTo(core.dt, 6);

    // The page shows what the service answered, with the uncertainties.
    expect(await cardValue(page, 't-dq')).toBe(formatWithUncertainty(fit.dq, fit.uncertainty.dq));
    expect(await cardValue(page, 't-ds')).toBe(formatWithUncertainty(fit.ds, fit.uncertainty.ds));
    expect(await cardValue(page, 't-dt')).toBe(formatWithUncertainty(fit.dt, fit.uncertainty.dt));
    expect(await cardValue(page, 't-dq')).toContain('±');
    // d9: no Racah B card.
    expect(await page.locator('#t-b').count()).toBe(0);
    const rows = await page.$$eval('#tetragonal-assignments tbody tr', (trs) => trs.map((tr) => Array.from(tr.querySelectorAll('th, td'), (c) => c.textContent ?? '')));
    expect(rows.map((r) => [r[0], r[1], r[2]])).toEqual(fit.assignments.map((a) => [a.term, a.parent, formatNumber(a.observed)]));
    expect(rows.map((r) => r[0])).toEqual(['2A1g', '2B2g', '2Eg']);
    expect(rows.map((r) => r[1])).toEqual(['2Eg(D)', '2T2g(D)', '2T2g(D)']);
    // The split 2T2g band is said to be one octahedral band, and the equally good compressed assignment is warned about.
    await expect(page.locator('#tetragonal-components').textContent()).resolves.toContain(`${formatNumber(15_600)} and ${formatNumber(19_100)} cm⁻¹: components of one octahedral 2T2g(D) band`);
    await expect(page.locator('#tetragonal-warnings').textContent()).resolves.toMatch(/another assignment fits as well/);
    // Download JSON carries the tetragonal fit shown, as the service sent it.
    const download = page.waitForEvent('download');
    await page.click('#download-json');
    const saved = JSON.parse(await readFile((await (await download).path())!, 'utf8')) as { tetragonalFit?: TetragonalFitResult };
    expect(saved.tetragonalFit).toEqual(fit);
    // The band list names each band by its D4h level and parent while the tetragonal fit is shown.
    for (const a of fit.assignments) {
      await expect(page.locator(`#band-table tr[data-position="${a.observed}"] td`).nth(4).textContent()).resolves.toBe(a.label);
    }
    const text = await page.locator('#tetragonal-fit').innerText();
    expect(text).not.toMatch(/\bcm-1\b/);
    await page.screenshot({ path: join(SHOTS, 'tetragonal-fit-1280.png'), fullPage: true });
    await page.setViewportSize({ width: 400, height: 900 });
    await page.screenshot({ path: join(SHOTS, 'tetragonal-fit-400.png'), fullPage: true });
    await page.locator('#tetragonal-fit').screenshot({ path: join(SHOTS, 'tetragonal-fit-400-panel.png') });
    await page.locator('#bands').screenshot({ path: join(SHOTS, 'tetragonal-fit-400-bands.png') });
    expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await page.setViewportSize({ width: 1280, height: 900 });

    // "see the levels": one click opens the Levels tab computed at the fitted Dq, Ds, Dt.
    const levelsAnswer = page.waitForResponse((r) => r.url().includes('/api/v1/levels'));
    await page.click('#tetragonal-levels');
    await levelsAnswer;
    await page.waitForSelector('#levels-table');
    expect(await page.inputValue('#lv-symmetry')).toBe('tetragonal');
    const field = async (name: string): Promise<number> => Number(await page.inputValue(`#lv-${name}`));
    expect(await field('dq')).toBeCloseTo(fit.dq, 1);
    expect(await field('ds')).toBeCloseTo(fit.ds, 1);
    expect(await field('dt')).toBeCloseTo(fit.dt, 1);
    const levels = computeFieldLevels(9, 'octahedral', { dq: await field('dq'), b: await field('b'), c: await field('c'), ds: await field('ds'), dt: await field('dt'), zeta: 0 }).levels;
    const shown = await page.$$eval('#levels-table tbody tr', (trs) => trs.map((tr) => Array.from(tr.querySelectorAll('td'), (td) => td.textContent ?? '')));
    expect(shown.map((r) => r[0])).toEqual(levels.map((l) => l.term));
    expect(shown.map((r) => r[1])).toEqual(levels.map((l) => l.energy.toFixed(0)));
    // The fitted levels are the observed bands (an exact fit of three bands): 14 300, 15 600, 19 100 above the ground level.
    expect(levels.slice(1).map((l) => Math.round(l.energy))).toEqual(CU_BANDS);
    await page.screenshot({ path: join(SHOTS, 'tetragonal-fit-levels.png'), fullPage: true });
    await page.click('#tab-analyse');
    expect(s.problems).toEqual([]);
    expect(s.outside).toEqual([]);
  }, 120_000);

  it('says which combination two bands fix, and goes back to the cubic fit', async () => {
    const page = s.page;
    // Two of the three bands: Dq, Ds, Dt cannot all be fixed; the page says so instead of showing false uncertainties.
    await page.click(`#band-table tr[data-position="${CU_BANDS[2]}"] button[id$="-delete"]`);
    await page.waitForSelector(`#band-table tr[data-position="${CU_BANDS[2]}"]`, { state: 'detached' });
    // The fit shown is of three bands: the page says it no longer matches the list.
    await page.waitForSelector('#tetragonal-stale');
    const answer = page.waitForResponse((r) => r.url().endsWith('/api/v1/fit') && r.request().method() === 'POST');
    await page.click('#refit');
    const fit = (await (await answer).json()) as TetragonalFitResult;
    expect(fit.status).toBe('underdetermined');
    await page.waitForSelector('#tetragonal-determined');
    expect(await page.locator('#tetragonal-stale').count()).toBe(0);
    const line = (await page.locator('#tetragonal-determined').textContent()) ?? '';
    for (const combination of fit.determined) expect(line).toContain(combination);
    for (const name of fit.undetermined) {
      const id = { Dq: 't-dq', Ds: 't-ds', Dt: 't-dt' }[name];
      if (id !== undefined) await expect(page.locator(`#${id} .card-note`).textContent()).resolves.toMatch(/not fixed by the bands alone/);
    }
    // Back to cubic: the tetragonal panel goes, the cubic refit answers as before.
    await page.selectOption('#refit-symmetry', 'cubic');
    await page.waitForSelector('#tetragonal-fit', { state: 'detached' });
    const cubic = page.waitForResponse((r) => r.url().endsWith('/api/v1/fit') && r.request().method() === 'POST');
    await page.click('#refit');
    const cubicBody = (await cubic).request().postDataJSON() as Record<string, unknown>;
    expect(cubicBody['symmetry']).toBeUndefined();
    await page.waitForSelector('#refit:not([disabled])');
    expect(s.problems).toEqual([]);
  }, 60_000);

  it('names the problem when the tetragonal fit cannot place the bands', async () => {
    const page = s.page;
    await page.selectOption('#refit-symmetry', 'tetragonal');
    // d9 has three spin-allowed transitions from the ground level in D4h: a fourth and fifth band cannot be placed.
    for (const position of [21_000, 23_000, 25_000]) {
      await page.fill('#add-position', String(position));
      await page.click('#add-band');
      await page.waitForSelector(`#band-table tr[data-position="${position}"]`);
    }
    await page.click('#refit');
    await page.waitForSelector('#notice .notice.error');
    await expect(page.locator('#notice').textContent()).resolves.toMatch(/Tetragonal fit failed: .*\(at bands\)/);
    await page.click('#notice-close');
  }, 60_000);
});
