/** Shared set-up of the service tests: an app that logs into an array, not to stdout. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Writable } from 'node:stream';
import { pino, type Logger } from 'pino';
import { createApp, type AppOptions, type FieldgapApp } from '../../server/app.js';

export type LogLine = Record<string, unknown>;

export interface TestApp {
  app: FieldgapApp;
  /** The JSON log lines written so far. */
  logs: LogLine[];
  /** Resolves with the first log line (written so far or later) that matches. */
  waitForLog(matches: (line: LogLine) => boolean): Promise<LogLine>;
  dispose(): Promise<void>;
}

export interface CapturedLog {
  logger: Logger;
  logs: LogLine[];
  /** Resolves with the first log line (written so far or later) that matches: waits on the log, not on a clock. */
  waitForLog(matches: (line: LogLine) => boolean): Promise<LogLine>;
}

export function captureLogger(): CapturedLog {
  const logs: LogLine[] = [];
  const waiting: Array<{ matches: (line: LogLine) => boolean; resolve: (line: LogLine) => void }> = [];
  const stream = new Writable({
    write(chunk: Buffer, _encoding, callback) {
      for (const text of chunk.toString('utf8').split('\n')) {
        if (!text.trim()) continue;
        const line = JSON.parse(text) as LogLine;
        logs.push(line);
        for (const w of [...waiting]) {
          if (w.matches(line)) {
            waiting.splice(waiting.indexOf(w), 1);
            w.resolve(line);
          }
        }
      }
      callback();
    },
  });
  const waitForLog = (matches: (line: LogLine) => boolean) =>
    new Promise<LogLine>((resolve) => {
      const found = logs.find(matches);
      if (found) resolve(found);
      else waiting.push({ matches, resolve });
    });
  return { logger: pino({ level: 'info' }, stream), logs, waitForLog };
}

/** An app computing in-process (unless options say otherwise), with a throw-away data folder. */
export function makeTestApp(options: AppOptions = {}): TestApp {
  const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-server-test-'));
  const { logger, logs, waitForLog } = captureLogger();
  const app = createApp({ pool: 'in-process', logger, staticDir: false, dataDir, ...options });
  return {
    app,
    logs,
    waitForLog,
    async dispose() {
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
