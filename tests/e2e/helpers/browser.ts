/**
 * Headless Chromium for the page tests: Debian's /usr/bin/chromium (or
 * $FIELDGAP_CHROMIUM) driven by playwright-core, with a fresh profile in a
 * temporary folder and every background network feature switched off.
 */
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

export const CHROMIUM_PATH = process.env['FIELDGAP_CHROMIUM'] ?? '/usr/bin/chromium';

/** In CI the browser must be there (a missing one fails); elsewhere its absence skips the tests. */
export function browserTestsSkipped(): boolean {
  const skip = !process.env['CI'] && !existsSync(CHROMIUM_PATH);
  if (skip) console.warn(`page tests skipped: no browser at ${CHROMIUM_PATH} (apt-get install chromium, or set FIELDGAP_CHROMIUM); they always run in CI`);
  return skip;
}

export interface Browser {
  context: BrowserContext;
  close(): Promise<void>;
}

export async function launchBrowser(): Promise<Browser> {
  const profile = await mkdtemp(join(tmpdir(), 'fieldgap-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
    viewport: { width: 1366, height: 900 },
    acceptDownloads: true,
  });
  return {
    context,
    async close() {
      await context.close();
      await rm(profile, { recursive: true, force: true });
    },
  };
}
