/**
 * The setup of the database-outage suites (storage-errors, users-outage):
 * each test gets a fresh PostgreSQL library reached through a cut proxy
 * (cut-proxy.ts) and a service pointed at the proxy; after the test the
 * service and then the proxy close. The hook is registered after
 * libraryPerTest's, so it runs before the library is removed.
 */
import { afterEach } from 'vitest';
import { createApp, type AppOptions, type FieldgapApp } from '../../../server/app.js';
import type { Library } from '../../../src/library/library.js';
import { throughCutProxy, type CutProxy } from './cut-proxy.js';
import { libraryPerTest, type EngineName } from './engines.js';

export interface RoutedLibrary {
  /** The proxy in front of the database: cut() is the outage, restore() the recovery. */
  proxy: CutProxy;
  /** The library's URL pointed at the proxy (what the service is given). */
  url: URL;
  /** Opens the library directly (not through the proxy), to seed it before the outage. */
  open(): Promise<Library>;
}

export interface OutagePerTest {
  /** Routes this test's library through a new cut proxy; undefined for any engine but PostgreSQL. */
  route(): Promise<RoutedLibrary | undefined>;
  /** Makes the service under test (closed after the test). */
  serve(options: AppOptions): FieldgapApp;
}

/** Registers the outage suites' per-test library, proxy and service for `engine`. */
export function outagePerTest(engine: EngineName): OutagePerTest {
  const fresh = libraryPerTest(engine, { open: false });
  let app: FieldgapApp | undefined;
  let proxy: CutProxy | undefined;
  afterEach(async () => {
    try {
      await app?.close();
    } finally {
      await proxy?.close();
      app = undefined;
      proxy = undefined;
    }
  });
  return {
    async route() {
      const where = fresh.where;
      const routed = await throughCutProxy(where.location);
      if (routed === undefined) return undefined;
      proxy = routed.proxy;
      return { ...routed, open: () => where.open() };
    },
    serve(options) {
      app = createApp(options);
      return app;
    },
  };
}
