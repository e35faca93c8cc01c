/**
 * The Levels tab of the page in headless Chromium against the real service:
 * choose tetragonal symmetry and spin–orbit coupling, and the table shows
 * what GET /api/v1/levels answers for the same parameters.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { SHOTS, sessionPerSuite } from './helpers/session.js';

describe.skipIf(browserTestsSkipped())('the Levels tab', () => {
  const s = sessionPerSuite();

  it('computes tetragonal levels with spin–orbit coupling as the engine does', async () => {
    await s.page.goto(s.service.baseUrl);
    await s.page.click('#tab-levels');
    await s.page.selectOption('#lv-symmetry', 'tetragonal');
    for (const [name, value] of [['d', '9'], ['dq', '1200'], ['b', '1000'], ['c', '4000'], ['ds', '1500'], ['dt', '300'], ['zeta', '830']] as const) {
      await s.page.fill(`#lv-${name}`, value);
    }
    await s.page.click('#levels-form button[type=submit]');
    await s.page.waitForSelector('#levels-table', { timeout: 30_000 });
    const rows = await s.page.$$eval('#levels-table tbody tr', (trs) => trs.map((tr) => Array.from(tr.querySelectorAll('td'), (td) => td.textContent ?? '')));
    const expected = computeFieldLevels(9, 'octahedral', { dq: 1200, b: 1000, c: 4000, ds: 1500, dt: 300, zeta: 830 }).levels;
    expect(rows.map((r) => r[0])).toEqual(expected.map((l) => l.term));
    expect(rows.map((r) => r[1])).toEqual(expected.map((l) => l.energy.toFixed(0)));
    expect(rows.map((r) => r[4])).toEqual(expected.map((l) => l.parent));
    expect(s.problems).toEqual([]);
    expect(s.outside).toEqual([]);
  }, 60_000);

  it('is styled as the other views, writes cm⁻¹, and draws the level diagram for the chosen parameters', async () => {
    // Still the tetragonal d9 with ζ = 830 cm⁻¹ of the test above: the diagram opens on the ζ axis.
    const answer = s.page.waitForResponse((r) => r.url().includes('/api/v1/diagram') && r.url().includes('axis=zeta'));
    await s.page.click('#levels-form button[type=submit]');
    const diagram = (await (await answer).json()) as { b: number; x: number[]; lines: Array<{ energies: number[] }> };
    await s.page.waitForSelector('#levels-diagram-plot canvas');
    expect(await s.page.getAttribute('#levels-axis-zeta', 'aria-pressed')).toBe('true');
    expect(await s.page.locator('#levels-diagram [id^="levels-axis-"]').count()).toBe(3);
    // The right end of the ζ axis is the chosen parameters: its E/B times B are the table's energies.
    const last = diagram.x.length - 1;
    expect(diagram.x[last]! * diagram.b).toBeCloseTo(830, 6);
    const ends = diagram.lines.map((l) => l.energies[last]! * diagram.b).sort((a, b) => a - b);
    const expected = computeFieldLevels(9, 'octahedral', { dq: 1200, b: 1000, c: 4000, ds: 1500, dt: 300, zeta: 830 }).levels.map((l) => l.energy);
    expect(ends.length).toBe(expected.length);
    ends.forEach((e, i) => expect(e).toBeCloseTo(expected[i]!, 0));
    // One unit wording, the convention once, and the form's controls styled as elsewhere.
    const text = await s.page.locator('#view-levels').innerText();
    expect(text).toMatch(/cm⁻¹/);
    expect(text).not.toMatch(/\bcm-1\b/);
    expect(text.match(/a1g\(z²\) = 6Dq/g)?.length).toBe(1);
    expect(await s.page.getAttribute('#levels-table', 'class')).toMatch(/\bdata\b/);
    expect(await s.page.getAttribute('#levels-form button[type=submit]', 'class')).toMatch(/\bbutton\b/);
    await s.page.screenshot({ path: join(SHOTS, 'levels-1280.png'), fullPage: true });

    const distortion = s.page.waitForResponse((r) => r.url().includes('/api/v1/diagram') && r.url().includes('axis=distortion'));
    await s.page.click('#levels-axis-distortion');
    const distorted = (await (await distortion).json()) as { x: number[]; b: number };
    expect(distorted.x[distorted.x.length - 1]! * distorted.b).toBeCloseTo(1500, 6);
    await s.page.waitForSelector('#levels-axis-distortion[aria-pressed="true"]');
    await s.page.setViewportSize({ width: 400, height: 900 });
    await s.page.screenshot({ path: join(SHOTS, 'levels-400.png'), fullPage: true });
    expect(await s.page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
    await s.page.setViewportSize({ width: 1366, height: 900 });
    expect(s.problems).toEqual([]);
  }, 60_000);

  it('names the field of a bad value', async () => {
    await s.page.fill('#lv-zeta', '-5');
    await s.page.click('#levels-form button[type=submit]');
    await s.page.waitForSelector('#levels-out .error', { timeout: 30_000 });
    expect(await s.page.textContent('#levels-out .error')).toMatch(/zeta/);
  }, 60_000);
});
