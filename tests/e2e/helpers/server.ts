/**
 * The real service for the page tests: the page built into a temporary
 * folder, createApp with computations in-process and a temporary library,
 * listening on 127.0.0.1 at a free port.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pino from 'pino';
import { createApp } from '../../../server/app.js';
import { buildWeb } from '../../../scripts/build-web.mjs';

export interface RunningService {
  baseUrl: string;
  stop(): Promise<void>;
}

export async function startService(): Promise<RunningService> {
  const folder = await mkdtemp(join(tmpdir(), 'fieldgap-page-'));
  const staticDir = await buildWeb({ outdir: join(folder, 'public'), minify: false });
  const app = createApp({ pool: 'in-process', staticDir, dataDir: join(folder, 'data'), logger: pino({ level: 'silent' }) });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    async stop() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.close();
      await rm(folder, { recursive: true, force: true });
    },
  };
}
