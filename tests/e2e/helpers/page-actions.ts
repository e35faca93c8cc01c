/** What a user does on the page, as small steps shared by the page tests. */
import type { Page } from 'playwright-core';
import type { DemoFile } from './demo.js';

/** The text of a result card's value: "17 447 ± 139". */
export async function cardValue(page: Page, id: string): Promise<string> {
  return ((await page.locator(`#${id} .value`).textContent()) ?? '').trim();
}

export interface SampleFields {
  sample?: string;
  ligand?: string;
  formula?: string;
}

/** Chooses the files, fills the sample details and presses Analyse. */
export async function uploadAndAnalyse(page: Page, files: DemoFile[], fields: SampleFields = {}): Promise<void> {
  await page.setInputFiles('#file-input', files.map((f) => f.path));
  await page.fill('#ion', files[0]!.ion);
  await page.selectOption('#geometry', files[0]!.geometry);
  await page.fill('#conc', String(files[0]!.concentration));
  await page.fill('#sample', fields.sample ?? '');
  await page.fill('#ligand', fields.ligand ?? '');
  await page.fill('#formula', fields.formula ?? '');
  await page.click('#analyse');
}
