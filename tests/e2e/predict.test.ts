/**
 * The Predict view in headless Chromium against the real service: type a
 * formula, see the d-count, spin state, unpaired electrons, the orbital boxes
 * with arrows and the energy scale; two complexes side by side; an error that
 * names where the formula is wrong. Checked against the service's own answer
 * for the same formula (POST /api/v1/predict) and, for the chemistry, common
 * practice.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';

async function servicePrediction(baseUrl: string, formula: string): Promise<{ unpairedElectrons: { value: number }; tenDq: { value: number } }> {
  const response = await fetch(`${baseUrl}/api/v1/predict`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ formula }) });
  return (await response.json()) as { unpairedElectrons: { value: number }; tenDq: { value: number } };
}

describe.skipIf(browserTestsSkipped())('the Predict view in headless Chromium', () => {
  const s = sessionPerSuite();

  beforeAll(async () => {
    await s.page.goto(s.service.baseUrl);
  });

  it('predicts two complexes side by side: [Fe(H2O)6]2+ high-spin, [Fe(CN)6]4- low-spin', async () => {
    await s.page.getByRole('tab', { name: 'Predict' }).click();
    await s.page.fill('#predict-a-formula', '[Fe(H2O)6]2+');
    await s.page.click('#predict-a-go');
    await s.page.fill('#predict-b-formula', '[Fe(CN)6]4-');
    await s.page.click('#predict-b-go');
    await s.page.waitForSelector('#predict-a-result');
    await s.page.waitForSelector('#predict-b-result');
    expect(await s.page.textContent('#predict-a-dcount')).toBe('d6 (Fe2+)'); // common practice
    expect(await s.page.textContent('#predict-a-spin')).toMatch(/^high-spin/); // common practice
    expect(await s.page.textContent('#predict-a-unpaired')).toBe('4'); // common practice
    expect(await s.page.textContent('#predict-b-spin')).toMatch(/^low-spin/); // common practice
    expect(await s.page.textContent('#predict-b-unpaired')).toBe('0'); // common practice
    // The page shows what the service answers.
    const service = await servicePrediction(s.service.baseUrl, '[Fe(CN)6]4-');
    expect(Number(await s.page.textContent('#predict-b-unpaired'))).toBe(service.unpairedElectrons.value);
    // The diagram: t2g full of paired arrows for low-spin d6, eg empty.
    const boxes = await s.page.$$eval('#predict-b-orbitals .orbital-set', (sets) => sets.map((set) => [set.querySelector('.set-name')?.textContent, Array.from(set.querySelectorAll('.box'), (b) => b.textContent?.trim())]));
    expect(boxes).toEqual([['eg', ['', '']], ['t2g', ['↑↓', '↑↓', '↑↓']]]);
    expect(await s.page.getAttribute('#predict-a-orbitals', 'aria-label')).toMatch(/t2g4 eg2/);
    // The energy scale: 10Dq beside the crossover and Π.
    expect(await s.page.$$eval('#predict-a-energy .energy-name', (els) => els.map((e) => e.textContent))).toEqual(['10Dq', 'crossover', 'Π = 2.5B + 4C']);
    expect(await s.page.textContent('#predict-b-why')).toMatch(/cyanide and CO are strong-field ligands/);
    await s.page.screenshot({ path: `${SHOTS}/predict-side-by-side.png`, fullPage: true });
  }, 60_000);

  it('square planar by the rule, the geometry override, and a borderline case says so', async () => {
    await s.page.fill('#predict-a-formula', '[Ni(CN)4]2-');
    await s.page.click('#predict-a-go');
    await s.page.waitForFunction(() => document.querySelector('#predict-a-geometry-value')?.textContent === 'square-planar');
    expect(await s.page.textContent('#predict-a-unpaired')).toBe('0'); // common practice: diamagnetic
    await s.page.fill('#predict-b-formula', '[NiCl4]2-');
    await s.page.selectOption('#predict-b-geometry', 'square-planar');
    await s.page.click('#predict-b-go');
    await s.page.waitForFunction(() => document.querySelector('#predict-b-dcount')?.textContent === 'd8 (Ni2+)');
    expect(await s.page.textContent('#predict-b-geometry-value')).toBe('square-planar');
    await s.page.selectOption('#predict-b-geometry', '');
    await s.page.fill('#predict-b-formula', '[Fe(edta)]-');
    await s.page.click('#predict-b-go');
    await s.page.waitForSelector('#predict-b-borderline');
    expect(await s.page.textContent('#predict-b-spin')).toMatch(/^borderline: /);
    await s.page.screenshot({ path: `${SHOTS}/predict-square-planar-borderline.png`, fullPage: true });
  }, 60_000);

  it('a bad formula gives an error that names the place', async () => {
    await s.page.fill('#predict-a-formula', '[Co(xyz)6]3+');
    await s.page.click('#predict-a-go');
    await s.page.waitForSelector('#predict-a-error');
    expect(await s.page.textContent('#predict-a-error')).toMatch(/unknown ligand "xyz".*Where: formula/);
    expect(s.failed).toEqual(['400 POST /api/v1/predict']);
    expect(s.problems).toEqual([]);
    expect(s.outside).toEqual([]);
  }, 30_000);
});
