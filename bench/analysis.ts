/**
 * The whole job in process: a 2,000-point CSV (text) through analyzeSpectrum
 * (parse, process, fit). Target: median under 8 ms, once warm (a batch
 * worker or the service analyses thousands in one process); the first call
 * and calls 2–31 (the figure of earlier releases) are shown beside it. The
 * spectrum is invented for timing only: two Cr(III)-like bands, a
 * spin-forbidden band, a UV edge, a sloping baseline and noise.
 */
import { loadavg } from 'node:os';
import { analyzeSpectrum } from '../src/analysis.js';
import { formatDelimited, synthesizeSpectrum } from '../src/spectrum/index.js';
import { reportFigure } from './figures.js';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1]!;
}

export async function run(): Promise<void> {
  const s = synthesizeSpectrum({
    bands: [{ position: 14_400, fwhm: 450, height: 0.004 }, { position: 17_400, fwhm: 2800, height: 0.35 }, { position: 24_500, fwhm: 3200, height: 0.4 }],
    fromNm: 300, toNm: 1100, stepNm: 800 / 1999, baselineOffset: 0.02, baselineSlope: 0.01,
    edge: { position: 44_000, fwhm: 9000, height: 2.5 }, noise: 0.002, seed: 3,
  });
  const csv = formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['wavelength_nm', 'absorbance'] });
  const options = { ion: 'Cr3+', concentration: 0.02 };
  const cold = performance.now();
  analyzeSpectrum(csv, options);
  const coldMs = performance.now() - cold;
  // Calls 2–31 (as in earlier releases: the JIT is still compiling, on other threads, so CPU can exceed wall),
  // then 60 more once warm: what a batch worker or the service, which analyse thousands, spend on each.
  const early = timeCalls(() => analyzeSpectrum(csv, options), 30);
  const warm = timeCalls(() => analyzeSpectrum(csv, options), 60);
  const load = loadavg()[0]!.toFixed(1);
  process.stdout.write(`analyzeSpectrum, ${s.wavelength.length}-point CSV, Cr3+: calls 2-31 median ${median(early.wall).toFixed(1)} ms wall, ${median(early.cpu).toFixed(1)} ms CPU, min ${Math.min(...early.wall).toFixed(1)} ms; first call ${coldMs.toFixed(0)} ms (builds the caches); load average ${load}\n`);
  const m = median(warm.wall);
  process.stdout.write(`  warm (calls 32-91): median ${m.toFixed(1)} ms wall, ${median(warm.cpu).toFixed(1)} ms CPU, min ${Math.min(...warm.wall).toFixed(1)} ms; load average ${loadavg()[0]!.toFixed(1)}\n`);
  process.stdout.write(`target < 8 ms median (warm): ${m < 8 ? 'met' : 'NOT met'}; calls 2-31: ${median(early.wall) < 8 ? 'met' : 'NOT met'}\n`);
  reportFigure({ key: 'analysis.2000.ms', label: 'analyzeSpectrum, 2 000 points (wall, calls 2-31)', value: median(early.wall), unit: 'ms', better: 'lower' });
  reportFigure({ key: 'analysis.2000.cpuMs', label: 'analyzeSpectrum, 2 000 points (CPU, calls 2-31)', value: median(early.cpu), unit: 'ms', better: 'lower' });
  reportFigure({ key: 'analysis.2000.warmMs', label: 'analyzeSpectrum, 2 000 points (wall, warm)', value: m, unit: 'ms', better: 'lower' });
  reportFigure({ key: 'analysis.2000.warmCpuMs', label: 'analyzeSpectrum, 2 000 points (CPU, warm)', value: median(warm.cpu), unit: 'ms', better: 'lower' });
}

/** Wall and CPU time (ms) of `count` calls, each on its own. */
function timeCalls(call: () => void, count: number): { wall: number[]; cpu: number[] } {
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < count; i++) {
    const t = performance.now();
    const c = process.cpuUsage();
    call();
    const used = process.cpuUsage(c);
    wall.push(performance.now() - t);
    cpu.push((used.user + used.system) / 1000);
  }
  return { wall, cpu };
}
