/**
 * The REST service on each test's library: createApp with computations in
 * process and no page, over the library libraryPerTest made. Call it after
 * libraryPerTest, so the service closes before its library goes (vitest runs
 * after-hooks in reverse).
 */
import { afterEach, beforeEach } from 'vitest';
import { createApp, type FieldgapApp } from '../../../server/app.js';
import { captureLogger } from '../../server/helpers.js';
import type { LibraryPerTest } from './engines.js';

export function servicePerTest(fresh: LibraryPerTest): { readonly app: FieldgapApp } {
  let app: FieldgapApp | undefined;
  beforeEach(() => {
    app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, ...fresh.where.app });
  });
  afterEach(async () => {
    await app?.close();
    app = undefined;
  });
  return {
    get app(): FieldgapApp {
      if (app === undefined) throw new Error('servicePerTest: there is a service only while a test runs');
      return app;
    },
  };
}
