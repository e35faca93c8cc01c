/**
 * `npm run load`: throughput and latency of POST /api/v1/fit and POST
 * /api/v1/analyze (a 2,000-point CSV) against the service as a user runs it
 * (`bin/fieldgap serve` on 127.0.0.1, a free port, its own process, so the
 * load generator does not share the server's event loop), with GET /health
 * and GET /levels first as baselines of the service's own cost. Bounded:
 * LOAD_SECONDS (default 10) per measurement after a 2 s warm-up, then the
 * server is stopped and the script exits.
 *
 * Two measurements per endpoint, at most 16 connections:
 * - flat out (autocannon, 16 connections each sending its next request as
 *   soon as the answer came): the most the service does, req/s; fit and
 *   analyze also at 4 connections (a few clients: each waits for its answer, so the
 *   pool must keep both cores busy with little queued);
 * - paced at the target rate (requests sent at even intervals over up to 16
 *   connections, latency counted from each request's scheduled time, so a
 *   slow answer cannot hide the requests queued behind it): p50 and p99.
 *   autocannon's own rate option sends each second's requests in one burst
 *   at the start of the second, which measures burst queueing, not latency
 *   at a rate.
 * Flat out, every request waits behind the other 15 (mean latency =
 * 16 / throughput by Little's law), so p99 there mostly shows throughput.
 *
 * Targets (issue 19; benchmark, not a test) on a 2-core machine: fit
 * ≥ 1 500 req/s; analyze ≥ 150 req/s at 4 and at 16 connections, p99
 * < 250 ms at 16 connections at that rate. Every line carries the load
 * average of the machine (1 min), since other work changes every figure.
 *
 * The spectrum and the band list are invented for load only (two Gaussian
 * bands on a sloping baseline, with noise); they check nothing.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { Agent, request } from 'node:http';
import { createRequire } from 'node:module';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { startServiceProcess, type ServiceProcess } from '../bench/spawn.js';
import { formatDelimited, synthesizeSpectrum } from '../src/spectrum/index.js';

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
interface AutocannonOptions {
  url: string;
  method: 'POST' | 'GET';
  headers?: Record<string, string>;
  body?: string;
  connections: number;
  duration: number;
  timeout: number;
}
type Autocannon = (options: AutocannonOptions) => Promise<AutocannonResult>;

// autocannon ships no type declarations; its documented promise form is typed above.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const SECONDS = Number(process.env['LOAD_SECONDS'] ?? 10);
const CONNECTIONS = 16;

/**
 * An invented 2,000-point absorbance spectrum, 300-1100 nm: two d-d-like
 * Gaussians in energy on a sloping baseline with seeded noise 0.002 (a
 * measured spectrum always has noise; noise-free data are no typical load).
 */
function inventedCsv(points = 2000): string {
  const s = synthesizeSpectrum({
    bands: [{ position: 17_400, fwhm: 2600, height: 0.35 }, { position: 24_500, fwhm: 3000, height: 0.3 }],
    fromNm: 300, toNm: 1100, stepNm: 800 / (points - 1), baselineOffset: 0.02, baselineSlope: 0.01, noise: 0.002, seed: 5,
  });
  return formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['wavelength_nm', 'absorbance'] });
}

interface Endpoint {
  name: string;
  url: string;
  method: 'POST' | 'GET';
  headers?: Record<string, string>;
  body?: string;
}

function line(name: string, text: string): void {
  process.stdout.write(`${name.padEnd(26)} ${text}   load average ${loadavg()[0]!.toFixed(1)}\n`);
}

/** One request first, so a broken endpoint says why instead of producing a fast stream of errors. */
async function probe(e: Endpoint): Promise<boolean> {
  const answer = await fetch(e.url, { method: e.method, ...(e.headers ? { headers: e.headers } : {}), ...(e.body !== undefined ? { body: e.body } : {}) });
  if (answer.ok) return true;
  process.stderr.write(`load: ${e.name} answered ${answer.status}: ${(await answer.text()).slice(0, 300)}\n`);
  return false;
}

/** Flat out with autocannon over `connections` connections (after a 2 s warm-up); returns requests per second. */
async function flatOut(e: Endpoint, connections = CONNECTIONS): Promise<number> {
  const options = { url: e.url, method: e.method, ...(e.headers ? { headers: e.headers } : {}), ...(e.body !== undefined ? { body: e.body } : {}) };
  await autocannon({ ...options, connections, duration: 2, timeout: 10 });
  const result = await autocannon({ ...options, connections, duration: SECONDS, timeout: 10 });
  const failed = result.non2xx + result.errors + result.timeouts;
  line(e.name, `flat out, ${String(connections).padStart(2)} conn. ${result.requests.average.toFixed(0).padStart(6)} req/s   p50 ${String(result.latency.p50).padStart(4)} ms   p99 ${String(result.latency.p99).padStart(4)} ms   ${result.requests.total} requests${failed > 0 ? `, ${failed} failed` : ''}`);
  return result.requests.average;
}

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))] ?? Number.NaN;
}

/**
 * `rate` requests per second at even intervals for SECONDS, over at most 16
 * keep-alive connections; each latency runs from the request's scheduled
 * send time to the end of its answer. Returns p99 in ms.
 */
async function paced(e: Endpoint, rate: number): Promise<number> {
  const target = new URL(e.url);
  const agent = new Agent({ keepAlive: true, maxSockets: CONNECTIONS });
  const body = e.body === undefined ? undefined : Buffer.from(e.body);
  const send = () =>
    new Promise<number>((resolveSend, rejectSend) => {
      const headers = { ...(e.headers ?? {}), ...(body ? { 'content-length': String(body.length) } : {}) };
      const req = request({ host: target.hostname, port: target.port, path: target.pathname + target.search, method: e.method, agent, headers }, (res) => {
        res.resume();
        res.on('end', () => resolveSend(res.statusCode ?? 0));
      });
      req.setTimeout(10_000, () => req.destroy(new Error('timed out after 10 s')));
      req.on('error', rejectSend);
      req.end(body);
    });
  const latencies: number[] = [];
  const pending: Array<Promise<void>> = [];
  let failed = 0;
  const start = performance.now();
  const total = Math.round(rate * SECONDS);
  for (let k = 0; k < total; k++) {
    const due = start + (k * 1000) / rate;
    const wait = due - performance.now();
    if (wait > 0) await new Promise((r) => setTimeout(r, wait));
    pending.push(
      send().then(
        (status) => {
          if (status < 200 || status >= 300) failed++;
          latencies.push(performance.now() - due);
          if (process.env['LOAD_DEBUG'] && performance.now() - due > Number(process.env['LOAD_DEBUG'])) process.stderr.write(`slow: sent at ${((due - start) / 1000).toFixed(3)} s, ${(performance.now() - due).toFixed(0)} ms\n`);
        },
        () => {
          failed++;
        },
      ),
    );
  }
  await Promise.all(pending);
  const seconds = (performance.now() - start) / 1000;
  agent.destroy();
  latencies.sort((p, q) => p - q);
  const p99 = quantile(latencies, 0.99);
  line(e.name, `at ${String(rate).padStart(4)}/s ${(latencies.length / seconds).toFixed(0).padStart(6)} req/s   p50 ${quantile(latencies, 0.5).toFixed(0).padStart(4)} ms   p99 ${p99.toFixed(0).padStart(4)} ms   ${latencies.length} requests${failed > 0 ? `, ${failed} failed` : ''}`);
  return failed > 0 ? Number.POSITIVE_INFINITY : p99;
}

async function main(): Promise<void> {
  const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-load-'));
  const watchdog = setTimeout(() => {
    process.stderr.write('load: took too long, stopping\n');
    process.exit(1);
  }, ((SECONDS + 2) * 10 + 60) * 1000);
  watchdog.unref();
  let server: ServiceProcess | undefined;
  try {
    server = await startServiceProcess(dataDir, 'inherit');
    const api = `${server.url}api/v1`;
    process.stdout.write(`load: ${server.url} (bin/fieldgap serve, its own process), at most ${CONNECTIONS} connections, ${SECONDS} s per measurement\n`);
    const health: Endpoint = { name: 'GET /api/v1/health', url: `${api}/health`, method: 'GET' };
    const levels: Endpoint = { name: 'GET /api/v1/levels (pool)', url: `${api}/levels?d=3&dq=1740&b=725&c=2900`, method: 'GET' };
    const fit: Endpoint = {
      name: 'POST /api/v1/fit', url: `${api}/fit`, method: 'POST', headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ ion: 'Cr3+', geometry: 'octahedral', bands: [17_400, 24_500] }),
    };
    const analyze: Endpoint = {
      name: 'POST /api/v1/analyze (2k)', url: `${api}/analyze?ion=Cr3%2B&geometry=octahedral&conc=0.01`, method: 'POST',
      headers: { 'content-type': 'text/csv' }, body: inventedCsv(),
    };
    for (const e of [health, levels, fit, analyze]) if (!(await probe(e))) process.exitCode = 1;
    if (process.exitCode === 1) return;
    // Baselines: the service's own cost (HTTP, validation, the pool) without a heavy computation.
    await flatOut(health);
    await flatOut(levels);
    const verdicts: string[] = [];
    const settle = () => new Promise((r) => setTimeout(r, 2000));
    // A few clients (4 connections) first: each waits for its answer, so the pool must keep both cores busy with little queued.
    await flatOut(fit, 4);
    await settle();
    const fitMost = await flatOut(fit);
    verdicts.push(`${fit.name}: ${fitMost >= 1500 ? 'met' : 'NOT met'} (${fitMost.toFixed(0)} ≥ 1500 req/s at 16 connections)`);
    await settle();
    // Latency at a rate the page and scripts reach (no target of its own).
    await paced(fit, 500);
    for (const connections of [4, CONNECTIONS]) {
      // Let the server finish what the previous run left queued, so it is not counted against the next.
      await settle();
      const most = await flatOut(analyze, connections);
      verdicts.push(`${analyze.name} at ${connections} connections: ${most >= 150 ? 'met' : 'NOT met'} (${most.toFixed(0)} ≥ 150 req/s)`);
    }
    await settle();
    const p99 = await paced(analyze, 150);
    verdicts.push(`${analyze.name} p99: ${p99 < 250 ? 'met' : 'NOT met'} (${p99.toFixed(0)} < 250 ms at 150 req/s over up to ${CONNECTIONS} connections)`);
    process.stdout.write(`targets: ${verdicts.join('; ')}\n`);
    // Each stopped worker costs a cold restart that shows as a burst of slow answers.
    const { pool } = (await (await fetch(health.url)).json()) as { pool: { workersStopped: number } };
    process.stdout.write(`workers stopped and replaced during the run: ${pool.workersStopped}\n`);
  } finally {
    await server?.stop();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

await main();
