/**
 * Running the built CLI as a user does, for the start-up and batch benches:
 * wall time of a whole process and, optionally, its peak memory.
 */
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

export const ROOT = fileURLToPath(new URL('..', import.meta.url));
/** The CLI to run: bin/fieldgap, or FIELDGAP_BENCH_BIN (another build, e.g. the previous release's, for baseline.json). */
export const BIN = process.env['FIELDGAP_BENCH_BIN'] ?? fileURLToPath(new URL('../bin/fieldgap', import.meta.url));
const RSS_PRELOAD = new URL('./report-rss.mjs', import.meta.url).href;

/** Whether the bundle bin/fieldgap runs has been built (npm run build). */
export function bundleBuilt(): boolean {
  if (process.env['FIELDGAP_BENCH_BIN'] !== undefined) return existsSync(BIN);
  return existsSync(fileURLToPath(new URL('../dist/cli/main.js', import.meta.url)));
}

export interface Timed {
  ms: number;
  code: number | null;
  stdout: string;
  stderr: string;
  /** Peak resident memory of the whole process (threads included), kB; when asked for. */
  maxRssKb?: number;
  /** CPU time of the whole process (all threads, user + system), ms; with `rss`. */
  cpuMs?: number;
}

/**
 * Runs `node ...args` to the end; resolves when it exits (no time limit).
 * `dropStdout` sends a long output (a batch's table) nowhere instead of holding it.
 */
export function timeNode(args: string[], { cwd = ROOT, rss = false, dropStdout = false } = {}): Promise<Timed> {
  return new Promise((resolve, reject) => {
    const argv = rss ? ['--import', RSS_PRELOAD, ...args] : args;
    const start = performance.now();
    const child = spawn(process.execPath, argv, { cwd, stdio: ['ignore', dropStdout ? 'ignore' : 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout?.setEncoding('utf8').on('data', (t: string) => void (stdout += t));
    child.stderr?.setEncoding('utf8').on('data', (t: string) => void (stderr += t));
    child.on('error', reject);
    child.on('close', (code) => {
      const ms = performance.now() - start;
      const m = /maxRSS-kB (\d+) cpu-us (\d+)\s*$/.exec(stderr);
      resolve({ ms, code, stdout, stderr, ...(m && { maxRssKb: Number(m[1]), cpuMs: Number(m[2]) / 1000 }) });
    });
  });
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** A running `fieldgap serve` (its own process), as the load test and the service bench start it. */
export interface ServiceProcess {
  url: string;
  pid: number;
  stop(): Promise<void>;
}

/**
 * `BIN serve` on 127.0.0.1 and a free port with `dataDir` as its library, logging warnings only; resolves once it
 * prints the address it listens on. `stderr` 'inherit' shows the service's own messages (the load test), 'ignore'
 * keeps a bench's table clean.
 */
export function startServiceProcess(dataDir: string, stderr: 'inherit' | 'ignore' = 'ignore'): Promise<ServiceProcess> {
  const child = spawn(process.execPath, [BIN, 'serve', '--port', '0', '--host', '127.0.0.1', '--data', dataDir], {
    env: { ...process.env, FIELDGAP_LOG_LEVEL: 'warn' },
    stdio: ['ignore', 'pipe', stderr],
  });
  const exited = new Promise<void>((resolveExit) => child.once('exit', () => resolveExit()));
  return new Promise((resolveStart, rejectStart) => {
    let out = '';
    child.stdout.setEncoding('utf8').on('data', (chunk: string) => {
      out += chunk;
      const url = /serving on (http:\/\/\S+\/)/.exec(out)?.[1];
      if (url === undefined) return;
      resolveStart({ url, pid: child.pid!, stop: async () => { child.kill('SIGTERM'); await exited; } });
    });
    child.once('exit', (code) => rejectStart(new Error(`the server stopped before it listened (exit code ${code}): ${out.trim()}`)));
  });
}
