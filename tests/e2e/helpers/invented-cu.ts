/**
 * The Cu(II) case of the tetragonal page tests: published band maxima, and an
 * invented spectrum (not a measurement) to load before typing them in.
 */
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { formatDelimited, synthesizeSpectrum } from '../../../src/spectrum/index.js';

// Polarized crystal spectrum of bisethylenediamine copper(II) thiosulfate, Proc. Indian Acad. Sci. (Chem. Sci.) 88(3),
// 143–147, https://www.ias.ac.in/describe/article/jcsc/088/03/0143-0147: bands at 14.30, 15.60 and 19.10 kK.
export const CU_BANDS = [14300, 15600, 19100];

/**
 * An invented Cu(II) spectrum (not a measurement, never a check value): one broad asymmetric envelope of three
 * overlapping bands in a 380–900 nm window, as a d9 complex gives. The user types the band maxima of the paper in.
 */
export async function writeInventedCu(folder: string): Promise<string> {
  const spectrum = synthesizeSpectrum({
    bands: [
      { position: 14_300, fwhm: 2600, epsilon: 40 },
      { position: 15_600, fwhm: 2600, epsilon: 60 },
      { position: 19_100, fwhm: 3600, epsilon: 25 },
    ],
    fromNm: 380,
    toNm: 900,
    stepNm: 1,
    concentration: 0.01,
    baselineOffset: 0.01,
    edge: { position: 38_000, fwhm: 6000, height: 1.0 },
    noise: 0.001,
    seed: 5,
  });
  const text = formatDelimited({
    x: spectrum.wavelength,
    ys: [spectrum.absorbance],
    header: ['wavelength (nm)', 'absorbance'],
    preamble: ['# invented Cu(II) spectrum for the fieldgap page tests, not a measurement'],
  });
  const path = join(folder, 'invented-cu.csv');
  await writeFile(path, text);
  return path;
}


/**
 * On the page at `baseUrl`: analyse the invented spectrum as Cu2+ (0.01 M),
 * take out the bands the finder found in the envelope and type in the
 * published maxima (CU_BANDS), as a user would before a tetragonal refit.
 */
export async function loadCuWithPublishedBands(page: Page, baseUrl: string, folder: string): Promise<void> {
  await page.goto(baseUrl);
  await page.setInputFiles('#file-input', [await writeInventedCu(folder)]);
  await page.fill('#ion', 'Cu2+');
  await page.fill('#conc', '0.01');
  await page.click('#analyse');
  await page.waitForSelector('#band-table', { timeout: 60_000 });
  for (;;) {
    const remove = page.locator('#band-table button[id$="-remove"]').first();
    if ((await remove.count()) === 0) break;
    await remove.click();
  }
  for (const position of CU_BANDS) {
    await page.fill('#add-position', String(position));
    await page.click('#add-band');
    await page.waitForSelector(`#band-table tr[data-position="${position}"]`);
  }
}
