/**
 * "Save to library" of a file with several spectra, in headless Chromium
 * against the real service: the page saves one record per spectrum (the
 * rule of library add and watch, src/library/spectra-to-store.ts), says
 * so, and lists them in the library. The file is the invented demo
 * scenario's three-column spectra-demo/cr-series.csv.
 */
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { LibraryPage } from '../../web/types.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';

const SERIES = resolve(import.meta.dirname, '..', '..', 'spectra-demo', 'cr-series.csv');

describe.skipIf(browserTestsSkipped())('saving a file with several spectra from the page', () => {
  const s = sessionPerSuite();

  it('saves every column as its own record and says how many', async () => {
    const page = s.page;
    await page.goto(s.service.baseUrl);
    await page.waitForSelector('#tab-library:not([hidden])');
    await uploadAndAnalyse(page, [{ path: SERIES, name: 'cr-series.csv', ion: 'Cr3+', geometry: 'octahedral', concentration: 0.05 }]);
    await page.waitForSelector('#save-library');
    await page.click('#save-library');
    await page.waitForSelector('#saved-note');
    const stored = (await (await fetch(`${s.service.baseUrl}/api/v1/analyses?limit=100`)).json()) as LibraryPage;
    expect(stored.total).toBe(3);
    const ids = stored.analyses.map((a) => a.id).sort((a, b) => a - b);
    const notice = await page.locator('#notice').textContent();
    expect(notice).toContain(`Saved cr-series.csv as 3 records, one per spectrum in the file: ${ids[0]} (Cr-en absorbance), ${ids[1]} (Cr-urea absorbance), ${ids[2]} (Cr-NCS absorbance).`);
    expect(stored.analyses.map((a) => a.sample).sort()).toEqual(['cr-series: Cr-NCS absorbance', 'cr-series: Cr-en absorbance', 'cr-series: Cr-urea absorbance']);
    expect(s.problems).toEqual([]);
    expect(s.failed).toEqual([]);
  }, 90_000);
});
