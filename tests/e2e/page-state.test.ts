/**
 * The page keeps its state (issue 18, item 8), in headless Chromium against
 * the real service: a zoomed spectrum stays zoomed, on the same chart node,
 * when a band is removed or put back; the diagram chart is not rebuilt by a
 * band edit; a unit switch still redraws the axis. Every wait is on a page
 * event or selector (a redraw is seen through the data-draws/data-x-range
 * attributes PlotFrame writes on each draw), never on the clock.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';
import { uploadAndAnalyse } from './helpers/page-actions.js';

type Range = [number, number];

async function shownRange(page: Page, id: string): Promise<Range> {
  const text = (await page.getAttribute(`#${id}-plot`, 'data-x-range')) ?? '';
  const [lo, hi] = text.split(' ').map(Number);
  return [lo!, hi!];
}

async function draws(page: Page, id: string): Promise<number> {
  return Number((await page.getAttribute(`#${id}-plot`, 'data-draws')) ?? '0');
}

/** Waits until the chart has drawn more often than `count`. */
async function redrawnAfter(page: Page, id: string, count: number): Promise<void> {
  await page.waitForFunction(([plot, n]) => Number(document.querySelector(`#${plot}-plot`)?.getAttribute('data-draws') ?? '0') > Number(n), [id, String(count)] as const);
}

/** Marks the current uPlot root of a plot so a later check can tell whether it is the same node. */
async function tagChart(page: Page, id: string, tag: string): Promise<void> {
  await page.evaluate(([plot, name]) => {
    const root = document.querySelector(`#${plot}-plot .uplot`);
    if (root === null) throw new Error(`no chart in #${plot}-plot`);
    (window as unknown as Record<string, Element>)[name!] = root;
  }, [id, tag] as const);
}

async function sameChart(page: Page, id: string, tag: string): Promise<boolean> {
  return page.evaluate(([plot, name]) => {
    const before = (window as unknown as Record<string, Element | undefined>)[name!];
    return before !== undefined && before.isConnected && document.querySelector(`#${plot}-plot .uplot`) === before;
  }, [id, tag] as const);
}

describe.skipIf(browserTestsSkipped())('the page keeps its state', () => {
  const s = sessionPerSuite();
  let full: Range;
  let zoom: Range;

  beforeAll(async () => {
    await s.page.goto(s.service.baseUrl);
    await uploadAndAnalyse(s.page, [s.files[0]!]);
    await s.page.waitForSelector('#band-0-remove', { timeout: 30_000 });
    await s.page.waitForSelector('#spectrum-plot[data-draws]');
    await s.page.waitForSelector('#diagram-plot[data-draws]', { timeout: 30_000 });
  }, 90_000);

  it('zooms the spectrum around the first band by dragging', async () => {
    full = await shownRange(s.page, 'spectrum');
    expect(full[1]).toBeGreaterThan(full[0]);
    const position = Number(await s.page.locator('#band-table tbody tr').first().getAttribute('data-position'));
    expect(position).toBeGreaterThan(full[0]);
    expect(position).toBeLessThan(full[1]);
    const over = s.page.locator('#spectrum-plot .u-over');
    await over.scrollIntoViewIfNeeded();
    const box = (await over.boundingBox())!;
    // Unzoomed, the cm-1 axis maps linearly onto the plot area.
    const px = (x: number): number => box.x + ((x - full[0]) / (full[1] - full[0])) * box.width;
    const span = (full[1] - full[0]) * 0.12;
    const from = Math.max(full[0], position - span);
    const to = Math.min(full[1], position + span);
    const before = await draws(s.page, 'spectrum');
    await s.page.mouse.move(px(from), box.y + box.height * 0.5);
    await s.page.mouse.down();
    await s.page.mouse.move(px(to), box.y + box.height * 0.5, { steps: 8 });
    await s.page.mouse.up();
    await redrawnAfter(s.page, 'spectrum', before);
    zoom = await shownRange(s.page, 'spectrum');
    // Zoomed in: a narrower window inside the full one, around the band.
    expect(zoom[1] - zoom[0]).toBeLessThan(0.5 * (full[1] - full[0]));
    expect(zoom[0]).toBeGreaterThanOrEqual(full[0]);
    expect(zoom[1]).toBeLessThanOrEqual(full[1]);
    expect(position).toBeGreaterThan(zoom[0]);
    expect(position).toBeLessThan(zoom[1]);
  }, 30_000);

  it('removing a band redraws the same chart and keeps the zoom', async () => {
    await tagChart(s.page, 'spectrum', 'spectrumChart');
    await tagChart(s.page, 'diagram', 'diagramChart');
    await s.page.evaluate(() => {
      const kept = window as unknown as Record<string, Element | null>;
      kept['diagramFigure'] = document.querySelector('#diagram-figure');
      kept['cards'] = document.querySelector('#parameters');
    });
    const image = await s.page.locator('#spectrum-plot canvas').first().evaluate((c) => (c as HTMLCanvasElement).toDataURL());
    const before = await draws(s.page, 'spectrum');
    await s.page.click('#band-0-remove');
    await s.page.waitForSelector('#band-0-restore');
    // The removed band's curve is redrawn greyed out, on the same chart.
    await redrawnAfter(s.page, 'spectrum', before);
    expect(await sameChart(s.page, 'spectrum', 'spectrumChart')).toBe(true);
    const after = await s.page.locator('#spectrum-plot canvas').first().evaluate((c) => (c as HTMLCanvasElement).toDataURL());
    expect(after).not.toBe(image);
    const kept = await shownRange(s.page, 'spectrum');
    expect(kept[0]).toBeCloseTo(zoom[0], 6);
    expect(kept[1]).toBeCloseTo(zoom[1], 6);
    // The band edit changed nothing the diagram shows: not rebuilt, its figure is the same node.
    expect(await sameChart(s.page, 'diagram', 'diagramChart')).toBe(true);
    expect(await s.page.evaluate(() => document.querySelector('#diagram-figure') === (window as unknown as Record<string, Element | null>)['diagramFigure'])).toBe(true);
    // Nor the result cards: only the bands panel and the spectrum changed.
    expect(await s.page.evaluate(() => document.querySelector('#parameters') === (window as unknown as Record<string, Element | null>)['cards'])).toBe(true);
  }, 30_000);

  it('a refit without the band redraws the cards but keeps the spectrum chart and its zoom', async () => {
    const response = s.page.waitForResponse((r) => r.url().endsWith('/api/v1/fit') && r.request().method() === 'POST');
    await s.page.click('#refit');
    expect((await response).status()).toBe(200);
    await s.page.waitForSelector('#refit:not([disabled])');
    // The new fit is new cards (the old node is gone) ...
    expect(await s.page.evaluate(() => document.querySelector('#parameters') !== (window as unknown as Record<string, Element | null>)['cards'])).toBe(true);
    // ... on the same spectrum chart, still zoomed.
    expect(await sameChart(s.page, 'spectrum', 'spectrumChart')).toBe(true);
    const kept = await shownRange(s.page, 'spectrum');
    expect(kept[0]).toBeCloseTo(zoom[0], 6);
    expect(kept[1]).toBeCloseTo(zoom[1], 6);
  }, 30_000);

  it('putting the band back keeps the zoom too, and Reset zoom shows everything', async () => {
    const before = await draws(s.page, 'spectrum');
    await s.page.click('#band-0-restore');
    await s.page.waitForSelector('#band-0-remove');
    await redrawnAfter(s.page, 'spectrum', before);
    expect(await sameChart(s.page, 'spectrum', 'spectrumChart')).toBe(true);
    const kept = await shownRange(s.page, 'spectrum');
    expect(kept[0]).toBeCloseTo(zoom[0], 6);
    expect(kept[1]).toBeCloseTo(zoom[1], 6);
    const count = await draws(s.page, 'spectrum');
    await s.page.click('#spectrum-reset');
    await redrawnAfter(s.page, 'spectrum', count);
    const reset = await shownRange(s.page, 'spectrum');
    expect(reset[0]).toBeCloseTo(full[0], 6);
    expect(reset[1]).toBeCloseTo(full[1], 6);
  }, 30_000);

  it('a unit switch still redraws the x axis in nm, then back in cm-1, and leaves the bands panel alone', async () => {
    await s.page.evaluate(() => {
      (window as unknown as Record<string, Element | null>)['bandsPanel'] = document.querySelector('#bands');
    });
    await s.page.click('#unit-nm');
    await s.page.waitForSelector('#unit-nm[aria-pressed="true"]');
    // A new axis needs a new chart; its range is the same window in nm.
    await s.page.waitForFunction(() => {
      const text = document.querySelector('#spectrum-plot')?.getAttribute('data-x-range') ?? '';
      return Number(text.split(' ')[1]) < 5000;
    });
    const nm = await shownRange(s.page, 'spectrum');
    expect(nm[0]).toBeCloseTo(1e7 / full[1], 3);
    expect(nm[1]).toBeCloseTo(1e7 / full[0], 3);
    expect(await s.page.evaluate(() => document.querySelector('#bands') === (window as unknown as Record<string, Element | null>)['bandsPanel'])).toBe(true);
    await s.page.click('#unit-cm-1');
    await s.page.waitForFunction(() => {
      const text = document.querySelector('#spectrum-plot')?.getAttribute('data-x-range') ?? '';
      return Number(text.split(' ')[1]) > 5000;
    });
  }, 30_000);

  it('logged no script error and no failed request', () => {
    expect(s.problems).toEqual([]);
    expect(s.failed).toEqual([]);
    expect(s.outside).toEqual([]);
  });
});
