/**
 * The probability card on the page: a short card in a chemist's words. For a
 * d9 spectrum (one spin-allowed band, B not determinable) it names B as not
 * fixed, in one line, with the reason folded; no JSON field names ("tenDq"),
 * no "(null)".
 */
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';

const CU = resolve(import.meta.dirname, '..', '..', 'fixtures', 'spectra', 'real-like', 'cu-aqua-visible.csv');

describe.skipIf(browserTestsSkipped())('the probability card', () => {
  const s = sessionPerSuite();

  it('says in a line which parameters the bands do not fix, with the reasons folded', async () => {
    await s.page.goto(s.service.baseUrl);
    await uploadAndAnalyse(s.page, [{ path: CU, name: 'cu-aqua-visible.csv', ion: 'Cu2+', geometry: 'octahedral', concentration: 0.08 }]);
    await s.page.waitForSelector('#p-probability');
    const card = s.page.locator('#p-probability');
    expect(await card.locator('#p-undetermined summary').textContent()).toBe('not fixed by the bands: B');
    // Folded: the reason is not shown until the user opens it.
    expect(await card.locator('#p-undetermined li').first().isVisible()).toBe(false);
    const shown = (await card.innerText()).trim();
    expect(shown.split('\n').length).toBeLessThanOrEqual(4);
    await card.locator('#p-undetermined summary').click();
    const all = (await card.innerText()).trim();
    expect(all).toMatch(/B, C and β are not determined/);
    await s.page.screenshot({ path: join(SHOTS, 'probability-card.png') });
    expect(all).not.toMatch(/tenDq|null|\bcm-1\b/);
    // One unit wording on the page: the core's warnings say cm-1, the page cm⁻¹.
    const warnings = (await s.page.locator('#warnings').innerText());
    expect(warnings).toMatch(/cm⁻¹/);
    expect(warnings).not.toMatch(/\bcm-1\b/);
    expect(s.problems).toEqual([]);
  }, 90_000);
});
