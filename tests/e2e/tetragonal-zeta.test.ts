/**
 * The spin–orbit choice of the tetragonal refit on the Analyse tab, in
 * headless Chromium against the real service: off, fixed, the free ion's ζ,
 * or fitted; the request carries `zeta` / `freeZeta` as REST takes them, the
 * page shows the answer, and the README's caution (spin–orbit fits not yet
 * validated) stands beside the choice.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fitTetragonal, type TetragonalFitResult } from '../../src/fit-tetragonal/index.js';
import { formatWithUncertainty } from '../../web/format.js';
import { CU_BANDS, loadCuWithPublishedBands } from './helpers/invented-cu.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { cardValue } from './helpers/page-actions.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';

interface SentFit {
  symmetry: string;
  zeta?: number | 'free-ion';
  freeZeta?: boolean;
}

describe.skipIf(browserTestsSkipped())('the spin–orbit choice of the tetragonal refit', () => {
  const s = sessionPerSuite();

  async function refit(): Promise<{ sent: SentFit; fit: TetragonalFitResult }> {
    const answer = s.page.waitForResponse((r) => r.url().endsWith('/api/v1/fit') && r.request().method() === 'POST');
    await s.page.click('#refit');
    const response = await answer;
    expect(response.status()).toBe(200);
    const fit = (await response.json()) as TetragonalFitResult;
    await s.page.waitForSelector('#refit:not([disabled])');
    return { sent: response.request().postDataJSON() as SentFit, fit };
  }

  it('sends off, fixed, free-ion and fitted ζ as REST takes them, with the caution beside the choice', async () => {
    const page = s.page;
    await loadCuWithPublishedBands(page, s.service.baseUrl, s.folder);
    // The ζ choice belongs to the tetragonal refit only.
    expect(await page.locator('#refit-zeta-mode').count()).toBe(0);
    await page.selectOption('#refit-symmetry', 'tetragonal');
    await page.waitForSelector('#refit-zeta-mode');
    expect(await page.inputValue('#refit-zeta-mode')).toBe('off');
    await expect(page.locator('#refit-zeta-caution').textContent()).resolves.toBe('Fits with spin–orbit coupling run but are not yet validated.');
    expect(await page.getAttribute('#refit-zeta-mode', 'aria-describedby')).toBe('refit-zeta-caution');

    // Off: no zeta in the request (the service's default, 0), as before.
    const off = await refit();
    expect(off.sent.zeta).toBeUndefined();
    expect(off.sent.freeZeta).toBeUndefined();
    expect(off.fit.zeta).toBe(0);

    // Fixed: the number typed, in cm-1 (an input, not a check value).
    await page.selectOption('#refit-zeta-mode', 'fixed');
    await page.waitForSelector('#refit-zeta');
    await page.fill('#refit-zeta', '600');
    await page.press('#refit-zeta', 'Tab');
    const fixed = await refit();
    expect(fixed.sent.zeta).toBe(600);
    expect(fixed.fit.zeta).toBe(600);
    // The page's card shows the service's answer; compared with the core's fit of the same request (consistency, not an outside check).
    expect(await cardValue(page, 't-zeta')).toBe(formatWithUncertainty(fixed.fit.zeta, fixed.fit.uncertainty.zeta));
    const core = fitTetragonal({ ion: 'Cu2+', geometry: 'octahedral', bands: CU_BANDS, zeta: 600 });
    expect(fixed.fit.dq).toBeCloseTo(core.dq, 6);
    expect(await page.getAttribute('#refit-zeta-caution', 'class')).toBe('caution');

    // The free ion's value.
    await page.selectOption('#refit-zeta-mode', 'free-ion');
    await page.waitForSelector('#refit-zeta', { state: 'detached' });
    const freeIon = await refit();
    expect(freeIon.sent.zeta).toBe('free-ion');
    expect(freeIon.fit.zetaMode).toBe('free-ion');
    expect(freeIon.fit.zeta).toBeCloseTo(fitTetragonal({ ion: 'Cu2+', geometry: 'octahedral', bands: CU_BANDS, zeta: 'free-ion' }).zeta, 6);

    // Fitted.
    await page.selectOption('#refit-zeta-mode', 'fitted');
    const fitted = await refit();
    expect(fitted.sent.freeZeta).toBe(true);
    expect(fitted.fit.zetaMode).toBe('free');
    await page.locator('#bands').screenshot({ path: join(SHOTS, 'tetragonal-zeta-bands.png') });

    // Undo returns to the cubic fit with spin–orbit off.
    await page.click('#undo');
    await page.selectOption('#refit-symmetry', 'tetragonal');
    await page.waitForSelector('#refit-zeta-mode');
    expect(await page.inputValue('#refit-zeta-mode')).toBe('off');
    expect(s.problems).toEqual([]);
  }, 180_000);
});
