/** Shared set-up of the service tests: an app that logs into an array, not to stdout. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { pino, type Logger } from 'pino';
import { createApp, type AppOptions, type FieldgapApp } from '../../server/app.js';

export interface TestApp {
  app: FieldgapApp;
  /** The JSON log lines written so far. */
  logs: Record<string, unknown>[];
  dispose(): Promise<void>;
}

export function captureLogger(): { logger: Logger; logs: Record<string, unknown>[] } {
  const logs: Record<string, unknown>[] = [];
  const stream = new Writable({
    write(chunk: Buffer, _encoding, callback) {
      for (const line of chunk.toString('utf8').split('\n')) if (line.trim()) logs.push(JSON.parse(line) as Record<string, unknown>);
      callback();
    },
  });
  return { logger: pino({ level: 'info' }, stream), logs };
}

/** An app computing in-process (unless options say otherwise), with a throw-away data folder. */
export function makeTestApp(options: AppOptions = {}): TestApp {
  const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-server-test-'));
  const { logger, logs } = captureLogger();
  const app = createApp({ pool: 'in-process', logger, staticDir: false, dataDir, ...options });
  return {
    app,
    logs,
    async dispose() {
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
