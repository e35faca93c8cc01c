/**
 * The page shows when the ± of 10Dq and B covers the spread of the weak-band
 * labellings (src/fit/assignment-spread.ts, issue 13): under the value, the
 * range the labellings span and the fit's own ±, and the ± shown is the
 * service's combined one. Invented demo spectra (spectra-demo/): no outside
 * number is checked, only that the page says what the service answered.
 */
import { describe, expect, it } from 'vitest';
import { formatNumber, formatWithUncertainty } from '../../web/format.js';
import type { AnalyzeResult } from '../../web/types.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';
import { cardValue, uploadAndAnalyse } from './helpers/page-actions.js';
import { apiAnalyze } from './helpers/api.js';

describe.skipIf(browserTestsSkipped())('the spread of the weak-band labellings on the page', () => {
  const s = sessionPerSuite();

  it('a widened ± shows its range and the fit-alone ±; an unwidened one shows none', async () => {
    const answers: Array<{ index: number; result: AnalyzeResult }> = [];
    for (const [index, file] of s.files.entries()) answers.push({ index, result: await apiAnalyze(s.service, file) });
    const widened = answers.find((a) => a.result.fit?.assignmentSpread?.widened === true);
    const plain = answers.find((a) => a.result.fit !== null && a.result.fit?.assignmentSpread?.widened === false);
    // The demo set holds both kinds (a sharp spin-forbidden line gives a labelling group); if it ever does not, say so.
    expect(widened, 'a demo spectrum whose ± the labellings widen').toBeDefined();
    await s.page.goto(s.service.baseUrl);
    await uploadAndAnalyse(s.page, [s.files[widened!.index]!]);
    await s.page.waitForSelector('#p-tendq');
    const fit = widened!.result.fit!;
    expect(await cardValue(s.page, 'p-tendq')).toBe(formatWithUncertainty(fit.tenDq, fit.uncertainty.tenDq));
    const spread = fit.assignmentSpread!;
    const text = await s.page.locator('#p-tendq-spread').textContent();
    expect(text).toContain(`${formatNumber(spread.tenDqRange[0])}–${formatNumber(spread.tenDqRange[1])}`);
    expect(text).toContain(`fit alone ± ${formatNumber(spread.fitUncertainty.tenDq)}`);
    if (plain !== undefined) {
      await s.page.goto(s.service.baseUrl);
      await uploadAndAnalyse(s.page, [s.files[plain.index]!]);
      await s.page.waitForSelector('#p-tendq');
      expect(await s.page.locator('#p-tendq-spread').count()).toBe(0);
    }
    expect(s.problems).toEqual([]);
  }, 120_000);
});
