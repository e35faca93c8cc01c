/**
 * The Levels tab of the page in headless Chromium against the real service:
 * choose tetragonal symmetry and spin–orbit coupling, and the table shows
 * what GET /api/v1/levels answers for the same parameters.
 */
import { describe, expect, it } from 'vitest';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';

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

  it('names the field of a bad value', async () => {
    await s.page.fill('#lv-zeta', '-5');
    await s.page.click('#levels-form button[type=submit]');
    await s.page.waitForSelector('#levels-out .error', { timeout: 30_000 });
    expect(await s.page.textContent('#levels-out .error')).toMatch(/zeta/);
  }, 60_000);
});
