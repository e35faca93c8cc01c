/**
 * Every tab of the page walked with the keyboard alone, in headless Chromium
 * at 1280 and 400 px: each Tab stop shows a visible focus mark, every form
 * control has a name a screen reader reads, and the tab list is reached and
 * moved with the arrow keys. What it checks is the page's own behaviour; no
 * outside numbers are involved.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserTestsSkipped } from './helpers/browser.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';
import { sessionPerSuite } from './helpers/session.js';

interface Stop {
  what: string;
  name: string;
  focusMark: boolean;
  visible: boolean;
}

/** Presses Tab up to `limit` times from the top of the page and describes each stop. */
async function walk(page: Page, limit: number): Promise<Stop[]> {
  await page.evaluate(() => { (document.activeElement as HTMLElement | null)?.blur(); window.scrollTo(0, 0); });
  const stops: Stop[] = [];
  const seen = new Set<string>();
  for (let i = 0; i < limit; i++) {
    await page.keyboard.press('Tab');
    const stop = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (el === null || el === document.body) return null;
      const style = getComputedStyle(el);
      const outlined = style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) > 0;
      const shadowed = style.boxShadow !== 'none';
      // A file input is marked through its drop zone (the zone is outlined while focus is within).
      const zone = el.closest('.drop');
      const zoneMarked = zone !== null && getComputedStyle(zone).outlineStyle !== 'none';
      const labelled = (el as HTMLInputElement).labels?.length ? Array.from((el as HTMLInputElement).labels!, (l) => l.textContent ?? '').join(' ') : '';
      const name = (el.getAttribute('aria-label') ?? '') || labelled || (el.getAttribute('aria-labelledby') ? document.getElementById(el.getAttribute('aria-labelledby')!)?.textContent ?? '' : '') || (el.tagName === 'BUTTON' || el.tagName === 'A' || el.tagName === 'SUMMARY' ? el.textContent ?? '' : '') || (el.getAttribute('title') ?? '');
      const box = el.getBoundingClientRect();
      return {
        what: `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}${el.getAttribute('type') ? `[${el.getAttribute('type')}]` : ''}`,
        name: name.trim().replace(/\s+/g, ' '),
        focusMark: outlined || shadowed || zoneMarked,
        visible: box.width > 0 && box.height > 0,
        key: `${el.tagName}#${el.id}#${Array.from(el.parentElement?.children ?? []).indexOf(el)}#${box.x},${box.y}`,
      };
    });
    if (stop === null) continue;
    if (seen.has(stop.key)) break;
    seen.add(stop.key);
    const { key: _key, ...rest } = stop;
    stops.push(rest);
  }
  return stops;
}

/** Every visible input, select, textarea or button without a name a screen reader reads. */
async function unnamedControls(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const el of Array.from(document.querySelectorAll<HTMLElement>('input, select, textarea, button'))) {
      if (el.closest('[hidden]') || el.getClientRects().length === 0) continue;
      if (el instanceof HTMLInputElement && el.type === 'file') continue; // named by its "Choose files…" label
      const labels = (el as HTMLInputElement).labels;
      const named = (labels !== null && labels !== undefined && labels.length > 0 && Array.from(labels).some((l) => (l.textContent ?? '').trim() !== ''))
        || (el.getAttribute('aria-label') ?? '').trim() !== ''
        || (el.getAttribute('aria-labelledby') ?? '') !== ''
        || (el.tagName === 'BUTTON' && (el.textContent ?? '').trim() !== '')
        || (el.getAttribute('title') ?? '').trim() !== '';
      if (!named) out.push(`${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''}${el.className ? `.${String(el.className).replace(/\s+/g, '.')}` : ''}`);
    }
    return out;
  });
}

describe.skipIf(browserTestsSkipped())('the page with the keyboard alone', () => {
  const s = sessionPerSuite();

  for (const width of [1280, 400]) {
    it(`reaches every control of every tab with a visible focus mark and a name at ${width} px`, async () => {
      await s.page.setViewportSize({ width, height: 900 });
      await s.page.goto(s.service.baseUrl);
      await uploadAndAnalyse(s.page, [s.files[0]!]);
      await s.page.waitForSelector('#p-tendq', { timeout: 60_000 });
      const report: Record<string, { stops: Stop[]; unnamed: string[] }> = {};
      for (const tab of ['analyse', 'compare', 'library', 'predict', 'levels']) {
        await s.page.focus('#tab-analyse');
        // The arrow keys move along the tab list (the ARIA tabs pattern); Enter is not needed.
        for (let i = 0; i < 5 && (await s.page.getAttribute(`#tab-${tab}`, 'aria-selected')) !== 'true'; i++) await s.page.keyboard.press('ArrowRight');
        expect(await s.page.getAttribute(`#tab-${tab}`, 'aria-selected')).toBe('true');
        if (tab === 'levels') await s.page.waitForSelector('#levels-table');
        if (tab === 'predict') await s.page.waitForSelector('#predict-b-result');
        if (tab === 'library') await s.page.waitForSelector('#view-library:not([hidden]) > *');
        const stops = await walk(s.page, 120);
        report[tab] = { stops, unnamed: await unnamedControls(s.page) };
      }
      // The analysed file's entry is read as "name, status", not run together.
      expect(report['analyse']!.stops.find((st) => st.what.startsWith('button#entry-'))?.name).toMatch(/\.(csv|txt|jdx), 10Dq/);
      for (const [tab, { stops, unnamed }] of Object.entries(report)) {
        expect(unnamed, `${tab} at ${width} px: controls without a name`).toEqual([]);
        expect(stops.filter((st) => !st.focusMark).map((st) => st.what), `${tab} at ${width} px: stops without a focus mark`).toEqual([]);
        expect(stops.filter((st) => st.name === '').map((st) => st.what), `${tab} at ${width} px: stops without a name`).toEqual([]);
        expect(stops.filter((st) => !st.visible).map((st) => st.what), `${tab} at ${width} px: invisible stops`).toEqual([]);
      }
      expect(s.problems).toEqual([]);
    }, 180_000);
  }

  it('skips to the view shown, on every tab', async () => {
    await s.page.setViewportSize({ width: 1280, height: 900 });
    await s.page.goto(s.service.baseUrl);
    for (const [tab, target, words] of [['levels', 'view-levels', 'Skip to the Levels view'], ['predict', 'view-predict', 'Skip to the Predict view'], ['analyse', 'main', 'Skip to the results']] as const) {
      await s.page.click(`#tab-${tab}`);
      // The skip link is the stop before the tab list.
      await s.page.keyboard.press('Shift+Tab');
      expect(await s.page.evaluate(() => document.activeElement?.textContent)).toBe(words);
      await s.page.keyboard.press('Enter');
      await s.page.waitForFunction((id) => document.activeElement?.id === id, target);
      // The next Tab lands inside the view, not back at the top (the Analyse results hold no control before an analysis).
      if (tab === 'analyse') continue;
      await s.page.keyboard.press('Tab');
      expect(await s.page.evaluate((id) => document.getElementById(id)!.contains(document.activeElement), target), tab).toBe(true);
    }
  }, 60_000);

  it('keeps the keyboard focus on the button pressed while Predict and Refit run', async () => {
    await s.page.setViewportSize({ width: 1280, height: 900 });
    await s.page.goto(s.service.baseUrl);
    await s.page.click('#tab-predict');
    await s.page.waitForSelector('#predict-a-result');
    await s.page.fill('#predict-a-formula', '[Co(NH3)6]3+');
    await s.page.focus('#predict-a-go');
    const answer = s.page.waitForResponse((r) => r.url().endsWith('/api/v1/predict'));
    await s.page.keyboard.press('Enter');
    await answer;
    await s.page.waitForFunction(() => document.querySelector('#predict-a-result h3')?.textContent?.includes('Co(NH3)6'));
    await s.page.waitForFunction(() => document.activeElement?.id === 'predict-a-go');

    await s.page.click('#tab-analyse');
    await uploadAndAnalyse(s.page, [s.files[0]!]);
    await s.page.waitForSelector('#refit');
    await s.page.focus('#refit');
    const refit = s.page.waitForResponse((r) => r.url().endsWith('/api/v1/fit'));
    await s.page.keyboard.press('Enter');
    await refit;
    await s.page.waitForSelector('#refit:not([disabled])');
    await s.page.waitForFunction(() => document.activeElement?.id === 'refit');
  }, 90_000);
});
