/**
 * The rest of the page in headless Chromium against the real service:
 * labels and focus, drag-and-drop, downloads, the comparison of several
 * analyses, and an error from a bad file; checked against the service's own
 * answers for the same files.
 */
import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatWithUncertainty } from '../../web/format.js';
import type { AnalyzeResult, FitResult } from '../../web/types.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';
import { apiAnalyze, apiAnswer } from './helpers/api.js';

describe.skipIf(browserTestsSkipped())('more of the web page in headless Chromium', () => {
  const s = sessionPerSuite();
  /** The service's answer for the first file. */
  let first: AnalyzeResult;
  /** Uploads the service itself refuses (the bad file, a demo file it cannot fit). */
  let expectedAnalyzeFailures = 0;

  it('analyses a spectrum to start from', async () => {
    first = await apiAnalyze(s.service, s.files[0]!);
    await s.page.goto(s.service.baseUrl);
    await uploadAndAnalyse(s.page, [s.files[0]!]);
    await s.page.waitForSelector('#p-tendq', { timeout: 30_000 });
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(first.fit!.tenDq, first.fit!.uncertainty.tenDq));
  }, 60_000);

  it('labels every control and shows where the keyboard focus is', async () => {
    const unlabelled = await s.page.evaluate(() =>
      Array.from(document.querySelectorAll('input, select, textarea, button'))
        .filter((el) => {
          const e = el as HTMLInputElement;
          if (e.type === 'hidden' || e.closest('[hidden]')) return false;
          const named = e.labels?.length || e.getAttribute('aria-label') || e.getAttribute('aria-labelledby') || (e.tagName === 'BUTTON' && e.textContent?.trim());
          return !named;
        })
        .map((el) => el.outerHTML.slice(0, 80)),
    );
    expect(unlabelled).toEqual([]);
    await s.page.focus('#refit');
    await s.page.keyboard.press('Shift+Tab');
    await s.page.keyboard.press('Tab');
    const outline = await s.page.evaluate(() => getComputedStyle(document.activeElement!).outlineStyle);
    expect(outline).not.toBe('none');
  }, 30_000);

  it('takes files dropped on the drop zone', async () => {
    const name = s.files[0]!.name;
    const text = await readFile(s.files[0]!.path, 'latin1');
    await s.page.evaluate(([fileName, content]) => {
      const data = new DataTransfer();
      data.items.add(new File([content!], fileName!, { type: 'text/plain' }));
      const zone = document.querySelector('#drop-zone')!;
      zone.dispatchEvent(new DragEvent('dragover', { dataTransfer: data, bubbles: true, cancelable: true }));
      zone.dispatchEvent(new DragEvent('drop', { dataTransfer: data, bubbles: true, cancelable: true }));
    }, [name, text]);
    await expect(s.page.locator('#queue li').first().textContent()).resolves.toContain(name);
    await expect(s.page.locator('#analyse').isDisabled()).resolves.toBe(false);
    await s.page.getByRole('button', { name: `Remove ${name} from the list` }).click();
    await expect(s.page.locator('#queue li').count()).resolves.toBe(0);
  }, 30_000);

  it('downloads the results as JSON and CSV and the spectrum as SVG and PNG', async () => {
    const grab = async (id: string): Promise<string> => {
      const [download] = await Promise.all([s.page.waitForEvent('download'), s.page.click(`#${id}`)]);
      const path = await download.path();
      return readFile(path, id.endsWith('png') ? 'latin1' : 'utf8');
    };
    const json = JSON.parse(await grab('download-json')) as { fit: FitResult };
    const shown = await cardValue(s.page, 'p-tendq');
    expect(formatWithUncertainty(json.fit.tenDq, json.fit.uncertainty.tenDq)).toBe(shown);
    const csv = await grab('download-csv');
    expect(csv.split('\n')[0]).toBe('quantity,value,uncertainty,unit');
    expect(csv).toContain(`10Dq,${json.fit.tenDq},`);
    const svg = await grab('spectrum-svg');
    await writeFile(join(SHOTS, 'spectrum.svg'), svg);
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(svg).toContain('wavenumber / cm⁻¹');
    const png = await grab('spectrum-png');
    expect(png.slice(1, 4)).toBe('PNG');
  }, 30_000);

  it('compares two analyses side by side', async () => {
    const pair = [s.files[1]!, s.files[2]!];
    const answers = await Promise.all(pair.map((file) => apiAnswer(s.service, file)));
    // The comparison needs analyses that succeed; one that fails must show as s.failed, not vanish.
    expect(answers.some((answer) => answer.status === 200)).toBe(true);
    await uploadAndAnalyse(s.page, pair);
    await s.page.waitForFunction(() => document.querySelectorAll('#entries .status.pending').length === 0 && document.querySelectorAll('#entries li').length === 3);
    await s.page.click('#tab-compare');
    await s.page.waitForSelector('#compare-table');
    const done = answers.filter((answer) => answer.status === 200).length;
    expectedAnalyzeFailures += pair.length - done;
    expect(await s.page.locator('#compare-table tbody tr').count()).toBe(1 + done);
    const cell = (name: string) => s.page.locator('#compare-table tbody tr', { hasText: name }).locator('td').nth(3);
    for (const [i, file] of pair.entries()) {
      const answer = answers[i]!;
      if (answer.status === 200) {
        const fit = (answer.body as AnalyzeResult).fit!;
        expect(await cell(file.name).textContent()).toBe(formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq));
        // β with its ±, as the result cards show it (column 7: after 10Dq, B, C).
        if (fit.beta !== null) expect(await s.page.locator('#compare-table tbody tr', { hasText: file.name }).locator('td').nth(6).textContent()).toBe(formatWithUncertainty(fit.beta, fit.betaSd ?? null, 2));
      } else {
        await expect(s.page.locator('#entries li', { hasText: file.name }).locator('.status').textContent()).resolves.toBe('failed');
      }
    }
    await s.page.waitForSelector('#overlay-plot canvas');
    await s.page.screenshot({ path: join(SHOTS, 'compare.png'), fullPage: true });
    await s.page.click('#tab-analyse');
  }, 60_000);

  it('shows the service\'s error message and where the problem is for a bad file', async () => {
    const bad = join(s.folder, 'not-a-spectrum.csv');
    await writeFile(bad, 'this,is\nnot,a spectrum\n');
    await s.page.setInputFiles('#file-input', [bad]);
    await s.page.click('#analyse');
    expectedAnalyzeFailures += 1;
    await s.page.waitForSelector('#analysis-error', { timeout: 20_000 });
    const text = (await s.page.locator('#analysis-error').textContent()) ?? '';
    expect(text).toContain('not-a-spectrum.csv could not be analysed');
    await s.page.screenshot({ path: join(SHOTS, 'error.png'), fullPage: true });
  }, 30_000);

  it('made no request outside the service and logged no script error', () => {
    expect(s.outside).toEqual([]);
    expect(s.problems).toEqual([]);
    // The only failed answers: uploads the service refuses (the file that is not a spectrum, a demo it cannot fit).
    const refused = s.failed.filter((f) => /^4\d\d POST \/api\/v1\/analyze\?/.test(f));
    expect(s.failed.filter((f) => !refused.includes(f))).toEqual([]);
    expect(refused).toHaveLength(expectedAnalyzeFailures);
  });
});
