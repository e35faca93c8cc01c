/**
 * `npm run load`: throughput and p99 latency of POST /api/v1/fit and
 * POST /api/v1/analyze (a 2,000-point CSV), measured with autocannon against
 * a server this script starts itself on 127.0.0.1 (a free port), with the
 * real worker pool; GET /health and GET /levels first, as baselines of the
 * service's own cost. Bounded: LOAD_SECONDS (default 10) per endpoint after a
 * 2 s warm-up, then the server stops and the script exits.
 *
 * Targets (benchmark, not a test) on a 2-core machine at 16 connections:
 * fit ≥ 500 req/s, analyze ≥ 100 req/s, p99 < 100 ms.
 *
 * The spectrum and the band list are invented for load only (two Gaussian
 * bands on a sloping baseline, with noise); they check nothing.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pino } from 'pino';
import { startServer } from '../server/main.js';
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

async function measure(name: string, options: Omit<AutocannonOptions, 'connections' | 'duration' | 'timeout'>) {
  // One request first, so a broken endpoint says why instead of producing a fast stream of errors.
  const probe = await fetch(options.url, {
    method: options.method,
    ...(options.headers ? { headers: options.headers } : {}),
    ...(options.body !== undefined ? { body: options.body } : {}),
  });
  if (!probe.ok) {
    process.stderr.write(`load: ${name} answered ${probe.status}: ${(await probe.text()).slice(0, 300)}\n`);
    return;
  }
  await autocannon({ ...options, connections: CONNECTIONS, duration: 2, timeout: 10 });
  const result = await autocannon({ ...options, connections: CONNECTIONS, duration: SECONDS, timeout: 10 });
  const failed = result.non2xx + result.errors + result.timeouts;
  process.stdout.write(
    `${name.padEnd(26)} ${result.requests.average.toFixed(0).padStart(6)} req/s   p50 ${String(result.latency.p50).padStart(4)} ms   p99 ${String(result.latency.p99).padStart(4)} ms   ${result.requests.total} requests${failed > 0 ? `, ${failed} failed` : ''}\n`,
  );
}

async function main(): Promise<void> {
  const dataDir = mkdtempSync(join(tmpdir(), 'fieldgap-load-'));
  const running = await startServer({ port: 0, host: '127.0.0.1', logger: pino({ level: 'error' }, pino.destination(2)), staticDir: false, dataDir });
  const watchdog = setTimeout(() => {
    process.stderr.write('load: took too long, stopping\n');
    process.exit(1);
  }, ((SECONDS + 2) * 4 + 30) * 1000);
  watchdog.unref();
  try {
    process.stdout.write(`load: ${running.url}, ${CONNECTIONS} connections, ${SECONDS} s per endpoint, pool: ${running.app.pool.mode}\n`);
    // Baselines: the service's own cost (HTTP, validation, the pool) without a heavy computation.
    await measure('GET /api/v1/health', { url: `${running.url}api/v1/health`, method: 'GET' });
    await measure('GET /api/v1/levels (pool)', { url: `${running.url}api/v1/levels?d=3&dq=1740&b=725&c=2900`, method: 'GET' });
    await measure('POST /api/v1/fit', {
      url: `${running.url}api/v1/fit`,
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ ion: 'Cr3+', geometry: 'octahedral', bands: [17_400, 24_500] }),
    });
    await measure('POST /api/v1/analyze (2k)', {
      url: `${running.url}api/v1/analyze?ion=Cr3%2B&geometry=octahedral&conc=0.01`,
      method: 'POST',
      headers: { 'content-type': 'text/csv' },
      body: inventedCsv(),
    });
  } finally {
    await running.close();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

await main();
