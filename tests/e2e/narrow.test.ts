/**
 * The page in a narrow window (phones, a window beside another): at 400 px
 * and 360 px nothing scrolls sideways, on the start page, with an analysis
 * shown and on every tab, and the header's tabs stay on the dark band
 * (readable: light text on dark, not on the light page).
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';

/** How far the document is wider than the window, in CSS pixels (0 when it fits). */
async function sidewaysOverflow(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
}

/** Tabs whose box leaves the header's box (drawn on the light page, unreadable). */
async function tabsOutsideHeader(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const header = document.querySelector('header.top')!.getBoundingClientRect();
    return Array.from(document.querySelectorAll<HTMLElement>('[role="tab"]:not([hidden])'))
      .filter((tab) => {
        const r = tab.getBoundingClientRect();
        return r.left < header.left || r.right > header.right || r.top < header.top || r.bottom > header.bottom;
      })
      .map((tab) => tab.textContent ?? '');
  });
}

describe.skipIf(browserTestsSkipped())('the page in a narrow window', () => {
  const s = sessionPerSuite();

  for (const width of [400, 360]) {
    it(`has no sideways scroll at ${width} px, on the start page, with a result and on each tab`, async () => {
      await s.page.setViewportSize({ width, height: 800 });
      await s.page.goto(s.service.baseUrl);
      expect(await tabsOutsideHeader(s.page)).toEqual([]);
      expect(await sidewaysOverflow(s.page)).toBeLessThanOrEqual(0);
      await uploadAndAnalyse(s.page, [s.files[0]!]);
      await s.page.waitForSelector('#p-tendq');
      await s.page.waitForSelector('#diagram-plot canvas');
      expect(await sidewaysOverflow(s.page)).toBeLessThanOrEqual(0);
      await s.page.screenshot({ path: join(SHOTS, `narrow-${width}-analyse.png`), fullPage: true });
      for (const tab of ['compare', 'predict', 'levels']) {
        await s.page.click(`#tab-${tab}`);
        await s.page.waitForSelector(`#view-${tab}:not([hidden]) > *`);
        expect(await sidewaysOverflow(s.page), `${tab} at ${width} px`).toBeLessThanOrEqual(0);
      }
      await s.page.click('#levels-form button[type=submit]');
      await s.page.waitForSelector('#levels-table');
      expect(await sidewaysOverflow(s.page), `levels with a result at ${width} px`).toBeLessThanOrEqual(0);
      await s.page.screenshot({ path: join(SHOTS, `narrow-${width}-levels.png`), fullPage: true });
      expect(await tabsOutsideHeader(s.page)).toEqual([]);
      expect(s.problems).toEqual([]);
      await s.page.click('#tab-analyse');
    }, 120_000);
  }
});
