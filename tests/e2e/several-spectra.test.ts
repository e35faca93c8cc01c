/**
 * A file with several spectra (the invented demo spectra-demo/cr-series.csv:
 * three y columns, en, urea and NCS): the page never analyses one column
 * silently. The list entry says which spectrum of how many it is, the
 * panel above the result says it too, "Analyse each" gives every column an
 * entry whose numbers are the service's for that column, and the panel
 * then switches between them.
 */
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatWithUncertainty } from '../../web/format.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';
import { apiAnalyze } from './helpers/api.js';

const SERIES = {
  path: resolve(import.meta.dirname, '..', '..', 'spectra-demo', 'cr-series.csv'),
  name: 'cr-series.csv', ion: 'Cr3+', geometry: 'octahedral' as const, concentration: 0.05,
};

describe.skipIf(browserTestsSkipped())('a file with several spectra', () => {
  const s = sessionPerSuite();

  it('says in the list and above the result which of the three is shown, and shows each', async () => {
    await s.page.goto(s.service.baseUrl);
    await uploadAndAnalyse(s.page, [SERIES]);
    await s.page.waitForSelector('#columns-panel');
    expect(await s.page.locator('#entries .entry-column').allTextContents()).toEqual(['spectrum 1 of 3: Cr-en absorbance']);
    expect(await s.page.locator('#columns-panel').innerText()).toMatch(/holds 3 spectra; this is column 1 \(Cr-en absorbance\)\.\s*2 of them are not analysed yet/);
    await s.page.screenshot({ path: join(SHOTS, 'several-spectra-1280.png') });

    await s.page.click('#analyse-each-column');
    await s.page.waitForFunction(() => document.querySelectorAll('#entries .entry-column').length === 3);
    await s.page.waitForSelector('#p-tendq');
    expect(await s.page.locator('#entries .entry-column').allTextContents()).toEqual([
      'spectrum 1 of 3: Cr-en absorbance', 'spectrum 2 of 3: Cr-urea absorbance', 'spectrum 3 of 3: Cr-NCS absorbance',
    ]);
    // The page shows column 2 now (the first of those just analysed); its numbers are the service's for column 2.
    const second = await apiAnalyze(s.service, SERIES, { column: '2' });
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(second.fit!.tenDq, second.fit!.uncertainty.tenDq));
    expect(await s.page.locator('#columns-panel').innerText()).toMatch(/this is column 2 \(Cr-urea absorbance\)\.\s*Every column is analysed/);
    expect(await s.page.locator('#analyse-each-column').count()).toBe(0);

    await s.page.click('#show-column-3');
    await s.page.waitForSelector('#columns-panel:has-text("this is column 3")');
    const third = await apiAnalyze(s.service, SERIES, { column: '3' });
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(third.fit!.tenDq, third.fit!.uncertainty.tenDq));
    expect(second.fit!.tenDq).not.toBe(third.fit!.tenDq);
    expect(await s.page.locator('#entries li .entry').count()).toBe(3);

    await s.page.setViewportSize({ width: 400, height: 900 });
    await s.page.screenshot({ path: join(SHOTS, 'several-spectra-400.png') });
    expect(await s.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await s.page.setViewportSize({ width: 1366, height: 900 });
    expect(s.problems).toEqual([]);
    expect(s.failed).toEqual([]);
  }, 120_000);
});
