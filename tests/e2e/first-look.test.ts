/**
 * The page's first look and its size check, in headless Chromium against the
 * real service (AUDIT2 findings 20 and 21):
 * - a file over the service's upload limit (read from the OpenAPI document)
 *   is refused in words before anything is sent;
 * - the Levels tab opens with its example computed, the Predict tab with its
 *   example pair predicted: no empty boxes.
 * Numbers are checked against the engine (computeFieldLevels) and the
 * service's own answer: consistency checks, not outside ones; the chemistry
 * of the Predict pair is common practice.
 */
import { describe, expect, it } from 'vitest';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { oversizeMessage } from '../../web/upload-size.js';
import { browserTestsSkipped } from './helpers/browser.js';
import { sessionPerSuite } from './helpers/session.js';

/** The service's default upload limit (server/app.ts maxBodyBytes), as its OpenAPI document states it. */
async function documentedLimit(baseUrl: string): Promise<number> {
  const doc = (await (await fetch(`${baseUrl}/api/v1/openapi.json`)).json()) as { info: { 'x-fieldgap-limits': { maxUploadBytes: number } } };
  return doc.info['x-fieldgap-limits'].maxUploadBytes;
}

describe('the refusal wording (pure)', () => {
  it('says the size and the limit in words, exact bytes only where the rounded ones would read alike', () => {
    expect(oversizeMessage('big.csv', 48_000_210, 10 * 1024 * 1024)).toBe('big.csv is 48 MB; this service accepts files up to 10 MiB (10.5 MB). It was not sent.');
    expect(oversizeMessage('edge.csv', 10 * 1024 * 1024 + 1, 10 * 1024 * 1024)).toBe('edge.csv is 10485761 bytes; this service accepts files up to 10485760 bytes. It was not sent.');
    expect(oversizeMessage('ok.csv', 10 * 1024 * 1024, 10 * 1024 * 1024)).toBeNull();
    expect(oversizeMessage('any.csv', 48_000_210, null)).toBeNull();
  });
});

describe.skipIf(browserTestsSkipped())('the page before the first analysis', () => {
  const s = sessionPerSuite();

  it('refuses a file over the service limit before sending it, and keeps one under it', async () => {
    const limit = await documentedLimit(s.service.baseUrl);
    expect(limit).toBe(10 * 1024 * 1024);
    const sent: string[] = [];
    s.page.on('request', (r) => { if (r.method() === 'POST') sent.push(r.url()); });
    const documentRead = s.page.waitForResponse((r) => r.url().endsWith('/api/v1/openapi.json'));
    await s.page.goto(s.service.baseUrl);
    await documentRead;
    const big = Buffer.alloc(limit + 1_000_000, 0x20);
    await s.page.setInputFiles('#file-input', [
      { name: 'huge.csv', mimeType: 'text/csv', buffer: big },
      { name: 'small.csv', mimeType: 'text/csv', buffer: Buffer.from('nm,absorbance\n400,0.10\n500,0.20\n') },
    ]);
    await s.page.waitForSelector('#upload-refused p');
    expect(await s.page.textContent('#upload-refused')).toBe('huge.csv is 11.5 MB; this service accepts files up to 10 MiB (10.5 MB). It was not sent.');
    expect(await s.page.$$eval('#queue .name', (els) => els.map((e) => e.textContent))).toEqual(['small.csv']);
    // Nothing was posted: the refusal is the page's own.
    expect(sent).toEqual([]);
    expect(s.failed).toEqual([]);
  }, 60_000);

  it('refuses a too-large file chosen before the limit was known, once it is', async () => {
    // The OpenAPI answer is held back until the file is chosen.
    let release!: () => void;
    const held = new Promise<void>((resolve) => { release = resolve; });
    await s.page.route('**/api/v1/openapi.json', async (route) => { await held; await route.continue(); });
    await s.page.goto(s.service.baseUrl);
    await s.page.setInputFiles('#file-input', [{ name: 'late.csv', mimeType: 'text/csv', buffer: Buffer.alloc(10 * 1024 * 1024 + 5_000_000, 0x20) }]);
    expect(await s.page.$$eval('#queue .name', (els) => els.map((e) => e.textContent))).toEqual(['late.csv']);
    release();
    await s.page.waitForSelector('#upload-refused p');
    expect(await s.page.textContent('#upload-refused')).toMatch(/^late\.csv is 15\.5 MB; this service accepts files up to 10 MiB/);
    expect(await s.page.locator('#queue .name').count()).toBe(0);
    expect(await s.page.isDisabled('#analyse')).toBe(true);
    await s.page.unroute('**/api/v1/openapi.json');
  }, 60_000);

  it('opens the Levels tab with its example computed, not an empty box', async () => {
    await s.page.goto(s.service.baseUrl);
    await s.page.click('#tab-levels');
    await s.page.waitForSelector('#levels-table');
    await s.page.waitForSelector('#levels-diagram-plot canvas');
    const read = (name: string): Promise<number> => s.page.inputValue(`#lv-${name}`).then(Number);
    const [d, dq, b, c] = [await read('d'), await read('dq'), await read('b'), await read('c')];
    const rows = await s.page.$$eval('#levels-table tbody tr', (trs) => trs.map((tr) => Array.from(tr.querySelectorAll('td'), (td) => td.textContent ?? '')));
    // Against the engine for the form's own values (a consistency check, not an outside one).
    const expected = computeFieldLevels(d, 'octahedral', { dq, b, c, ds: 0, dt: 0, zeta: 0 }).levels;
    expect(rows.map((r) => r[0])).toEqual(expected.map((l) => l.term));
    expect(rows.map((r) => r[1])).toEqual(expected.map((l) => l.energy.toFixed(0)));
    expect(s.problems).toEqual([]);
  }, 60_000);

  it('computes what the user asks even while the first look is still on its way', async () => {
    // The first look's answer is held until the user's own request has been answered: it must not overwrite it.
    let releaseFirst!: () => void;
    const firstHeld = new Promise<void>((resolve) => { releaseFirst = resolve; });
    let calls = 0;
    await s.page.route('**/api/v1/levels?*', async (route) => {
      calls += 1;
      if (calls === 1) await firstHeld;
      await route.continue();
    });
    await s.page.goto(s.service.baseUrl);
    await s.page.click('#tab-levels');
    await s.page.fill('#lv-d', '8');
    await s.page.fill('#lv-dq', '850');
    await s.page.fill('#lv-b', '1030');
    await s.page.fill('#lv-c', '4120');
    const mine = s.page.waitForResponse((r) => r.url().includes('/api/v1/levels') && r.url().includes('d=8'));
    await s.page.click('#levels-form button[type=submit]');
    await mine;
    await s.page.waitForSelector('#levels-table');
    const firstAnswered = s.page.waitForResponse((r) => r.url().includes('/api/v1/levels') && r.url().includes('d=3'));
    releaseFirst();
    await firstAnswered;
    // One more round trip through the page's event loop before reading the table.
    await s.page.evaluate(() => new Promise((resolve) => requestAnimationFrame(resolve)));
    const terms = await s.page.$$eval('#levels-table tbody tr td:first-child', (tds) => tds.map((td) => td.textContent));
    const expected = computeFieldLevels(8, 'octahedral', { dq: 850, b: 1030, c: 4120, ds: 0, dt: 0, zeta: 0 }).levels;
    expect(terms).toEqual(expected.map((l) => l.term));
    await s.page.unroute('**/api/v1/levels?*');
  }, 60_000);

  it('opens the Predict tab with its example pair predicted', async () => {
    await s.page.goto(s.service.baseUrl);
    await s.page.click('#tab-predict');
    await s.page.waitForSelector('#predict-a-result');
    await s.page.waitForSelector('#predict-b-result');
    expect(await s.page.inputValue('#predict-a-formula')).toBe('[Fe(H2O)6]2+');
    expect(await s.page.textContent('#predict-a-spin')).toMatch(/^high-spin/); // common practice
    expect(await s.page.textContent('#predict-b-spin')).toMatch(/^low-spin/); // common practice
    expect(s.problems).toEqual([]);
    expect(s.outside).toEqual([]);
  }, 60_000);
});
