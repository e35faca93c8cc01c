/**
 * A file with several spectra on the page: the page says which column it
 * analysed and analyses another, or each, as the CLI batch does; every
 * column's numbers equal the service's answer for that column. Also: the
 * page's writes carry the header the service requires of a web page.
 */
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatDelimited, synthesizeSpectrum } from '../../src/spectrum/index.js';
import { formatWithUncertainty } from '../../web/format.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';
import { cardValue } from './helpers/page-actions.js';
import { apiAnalyze } from './helpers/api.js';

/** An invented two-sample d3 file (not a measurement): one wavelength column, two absorbance columns. */
async function writeTwoColumns(folder: string): Promise<string> {
  const make = (positions: [number, number], seed: number) =>
    synthesizeSpectrum({
      bands: [
        { position: positions[0], fwhm: 2600, epsilon: 15 },
        { position: positions[1], fwhm: 3200, epsilon: 18 },
      ],
      fromNm: 300, toNm: 900, stepNm: 1, concentration: 0.02, baselineOffset: 0.01,
      edge: { position: 40_000, fwhm: 6000, height: 1.2 }, noise: 0.001, seed,
    });
  const a = make([17_400, 24_600], 3);
  const b = make([21_700, 28_500], 4);
  const text = formatDelimited({
    x: a.wavelength,
    ys: [a.absorbance, b.absorbance],
    header: ['wavelength (nm)', 'sample A', 'sample B'],
    preamble: ['# invented two-sample file for the fieldgap page tests, not a measurement'],
  });
  const path = join(folder, 'two-samples.csv');
  await writeFile(path, text);
  return path;
}

describe.skipIf(browserTestsSkipped())('a multi-column file on the page', () => {
  const s = sessionPerSuite();

  it('analyses the first column, offers the others, and analyses each as its own entry', async () => {
    const path = await writeTwoColumns(s.folder);
    const file = { path, name: 'two-samples.csv', ion: 'Cr3+', geometry: 'octahedral' as const, concentration: 0.02 };
    const second = await apiAnalyze(s.service, file, { column: '2' });
    await s.page.goto(s.service.baseUrl);
    await s.page.setInputFiles('#file-input', [path]);
    await s.page.fill('#ion', 'Cr3+');
    await s.page.fill('#conc', '0.02');
    await s.page.click('#analyse');
    await s.page.waitForSelector('#columns-panel');
    expect(await s.page.locator('#columns-panel').textContent()).toMatch(/holds 2 spectra; this is column 1 \(sample A\)/);
    await s.page.click('#analyse-each-column');
    await s.page.waitForSelector('#result-subtitle:has-text("two-samples.csv #2")');
    await s.page.waitForSelector('#p-tendq');
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(second.fit!.tenDq, second.fit!.uncertainty.tenDq));
    expect(await s.page.locator('#entries li .entry').count()).toBe(2);
    expect(s.problems).toEqual([]);
    expect(s.failed).toEqual([]);
  }, 90_000);
});
