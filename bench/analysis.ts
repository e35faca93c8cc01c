/**
 * The whole job in process: a 2,000-point CSV (text) through analyzeSpectrum
 * (parse, process, fit). Target: median under 8 ms. The spectrum is
 * invented for timing only: two Cr(III)-like bands, a spin-forbidden band,
 * a UV edge, a sloping baseline and noise.
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
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < 30; i++) {
    const t = performance.now();
    const c = process.cpuUsage();
    analyzeSpectrum(csv, options);
    const used = process.cpuUsage(c);
    wall.push(performance.now() - t);
    cpu.push((used.user + used.system) / 1000);
  }
  const m = median(wall);
  process.stdout.write(`analyzeSpectrum, ${s.wavelength.length}-point CSV, Cr3+: median ${m.toFixed(1)} ms wall, ${median(cpu).toFixed(1)} ms CPU, min ${Math.min(...wall).toFixed(1)} ms; first call ${coldMs.toFixed(0)} ms (builds the caches); load average ${loadavg()[0]!.toFixed(1)}\n`);
  process.stdout.write(`target < 8 ms median: ${m < 8 ? 'met' : 'NOT met'}\n`);
  reportFigure({ key: 'analysis.2000.ms', label: 'analyzeSpectrum, 2 000 points (wall)', value: m, unit: 'ms', better: 'lower' });
  reportFigure({ key: 'analysis.2000.cpuMs', label: 'analyzeSpectrum, 2 000 points (CPU)', value: median(cpu), unit: 'ms', better: 'lower' });
}
