/**
 * Service: what one POST /api/v1/fit costs the service in CPU, read from the
 * kernel's per-thread counters of the `bin/fieldgap serve` process (Linux
 * /proc): the event loop's share (the main thread: HTTP, validation, the
 * hand-off to the pool) and all threads together (the workers' fits too).
 * `npm run load` measures the throughput target (1 500 req/s on 2 cores), but
 * a rate depends on what else the machine runs; CPU per request is the
 * figure that says whether a change made the route cheaper, interleaved
 * runs or not. Bounded: WARM_UP then REQUESTS requests over 16 connections
 * (autocannon), then STEADY more and REQUESTS again: the first figure is a
 * freshly started service (what `npm run load` sees in its first seconds),
 * the second one warm. They differ mostly by V8's optimising compiler: each
 * worker isolate compiles and re-compiles the fit's functions for its first
 * few thousand fits, on the platform's background threads (counted under
 * "all threads"; a profile of the serve process with perf showed them in
 * TurboFan), so a service that has answered ~10 000 fits costs markedly less
 * CPU per request than one that has answered 1 500. Needs `npm run build`
 * (the service runs from dist/server).
 *
 * The request is the fit of `npm run load` (two band maxima of a Cr(III)
 * complex, invented for load only); it checks nothing.
 */
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { reportFigure } from './figures.js';
import { startServiceProcess } from './spawn.js';

interface AutocannonResult {
  requests: { average: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
// autocannon ships no type declarations; the promise form used here is typed above.
const autocannon = createRequire(import.meta.url)('autocannon') as (options: object) => Promise<AutocannonResult>;

const WARM_UP = 1500;
const REQUESTS = 4000;
/** Requests between the cold and the warm measurement. */
const STEADY = 16_000;
const CONNECTIONS = 16;
/** Clock ticks per second of /proc/<pid>/task/<tid>/stat's utime and stime: USER_HZ, 100 on Linux (common practice). */
const TICKS_PER_S = 100;

/** CPU ticks (user + system) of each thread of process `pid`, by thread id. */
function threadTicks(pid: number): Map<number, number> {
  const out = new Map<number, number>();
  for (const tid of readdirSync(`/proc/${pid}/task`)) {
    try {
      // Fields after the command name, which is in parentheses and may hold spaces: utime and stime are the 12th and 13th.
      const fields = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8').split(') ')[1]!.split(' ');
      out.set(Number(tid), Number(fields[11]) + Number(fields[12]));
    } catch {
      // A thread that ended between the listing and the read counts no more.
    }
  }
  return out;
}

interface Measured {
  rate: number;
  /** CPU per request, µs: the event loop (main thread), and all threads of the process. */
  main: number;
  total: number;
}

/** REQUESTS fit requests: their rate and the serve process's CPU per request, from /proc per-thread counters. */
async function measure(pid: number, options: object): Promise<Measured> {
  const before = threadTicks(pid);
  const start = performance.now();
  const result = await autocannon({ ...options, amount: REQUESTS });
  const seconds = (performance.now() - start) / 1000;
  const after = threadTicks(pid);
  const failed = result.non2xx + result.errors + result.timeouts;
  if (failed > 0) throw new Error(`${failed} of ${REQUESTS} fit requests failed`);
  const perRequestUs = (ticks: number) => (ticks / TICKS_PER_S / REQUESTS) * 1e6;
  let all = 0;
  for (const [tid, ticks] of after) all += ticks - (before.get(tid) ?? 0);
  return { rate: REQUESTS / seconds, main: perRequestUs((after.get(pid) ?? 0) - (before.get(pid) ?? 0)), total: perRequestUs(all) };
}

export async function run(): Promise<void> {
  const service = fileURLToPath(new URL('../dist/server/main.js', import.meta.url));
  if (process.env['FIELDGAP_BENCH_BIN'] === undefined && !existsSync(service)) {
    process.stdout.write('skipped: the service is not built (npm run build)\n');
    return;
  }
  if (!existsSync('/proc/self/task')) {
    process.stdout.write('skipped: needs /proc (Linux) for per-thread CPU time\n');
    return;
  }
  const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-bench-service-'));
  const server = await startServiceProcess(dataDir);
  try {
    const options = {
      url: `${server.url}api/v1/fit`, method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ ion: 'Cr3+', geometry: 'octahedral', bands: [17_400, 24_500] }), connections: CONNECTIONS, timeout: 30,
    };
    await autocannon({ ...options, amount: WARM_UP });
    const cold = await measure(server.pid, options);
    await autocannon({ ...options, amount: STEADY });
    const warm = await measure(server.pid, options);
    for (const [name, m] of [['after 1 500 requests', cold], [`after ${(WARM_UP + REQUESTS + STEADY).toLocaleString('en')} requests`, warm]] as const) {
      process.stdout.write(`POST /api/v1/fit, ${REQUESTS} requests over ${CONNECTIONS} connections ${name}: ${m.rate.toFixed(0)} req/s; CPU per request ${m.main.toFixed(0)} µs on the event loop, ${m.total.toFixed(0)} µs in all threads; load average ${loadavg()[0]!.toFixed(1)}\n`);
    }
    reportFigure({ key: 'service.fit.reqPerS', label: 'service: POST /fit, 16 connections', value: cold.rate, unit: 'req/s', better: 'higher' });
    reportFigure({ key: 'service.fit.mainCpuUs', label: 'service: event-loop CPU per /fit', value: cold.main, unit: 'µs', better: 'lower' });
    reportFigure({ key: 'service.fit.cpuUs', label: 'service: CPU per /fit, all threads', value: cold.total, unit: 'µs', better: 'lower' });
    reportFigure({ key: 'service.fit.warmCpuUs', label: 'service: CPU per /fit, all threads, warm', value: warm.total, unit: 'µs', better: 'lower' });
  } finally {
    await server.stop();
    rmSync(dataDir, { recursive: true, force: true });
  }
}
