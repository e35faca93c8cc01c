/**
 * Spectrum stage benchmark: median time of a full in-process load of a
 * 2,001-point spectrum (parse CSV text + processSpectrum), target < 50 ms,
 * aim ~20 ms (the whole analysis including the fit must stay under 50 ms).
 * Input: an invented Cr(III)-like spectrum, 300–1100 nm every 0.4 nm.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { formatDelimited, formatJcamp, parseSpectrumText, processSpectrum, synthesizeSpectrum, type Spectrum } from '../src/spectrum/index.js';

const DEMO = fileURLToPath(new URL('../spectra-demo/', import.meta.url));

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)] as number;
}

/** Wall time and CPU time (ms) of fn: on a shared machine the CPU time is the steadier figure. */
function time<T>(fn: () => T): [T, number, number] {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = fn();
  const wall = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return [value, wall, (c.user + c.system) / 1000];
}

export async function run(): Promise<void> {
  const s = synthesizeSpectrum({
    bands: [{ position: 17400, fwhm: 3000, epsilon: 15 }, { position: 24600, fwhm: 3500, epsilon: 18 }],
    concentration: 0.02, noise: 0.002, baselineOffset: 0.02, baselineSlope: 0.01,
    edge: { position: 40000, fwhm: 8000, height: 2 }, seed: 3, fromNm: 300, toNm: 1100, stepNm: 0.4, descending: true,
  });
  const csv = formatDelimited({ x: s.wavelength, ys: [s.absorbance], header: ['Wavelength (nm)', 'Absorbance'] });
  const jcamp = formatJcamp({ title: 'invented', x: s.wavelength, y: s.absorbance, xUnits: 'NANOMETERS', yUnits: 'ABSORBANCE' });
  const parse: number[] = [];
  const processing: number[] = [];
  const total: number[] = [];
  const cpu: number[] = [];
  const jdx: number[] = [];
  let bands = 0;
  for (let k = 0; k < 45; k++) {
    const [parsed, tp, cp] = time(() => parseSpectrumText(csv, { fileName: 'bench.csv' }));
    const [result, tq, cq] = time(() => processSpectrum(parsed.spectra[0]!, { concentration: 0.02, geometry: 'octahedral' }));
    const [, tj] = time(() => parseSpectrumText(jcamp, { fileName: 'bench.jdx' }));
    bands = result.bands.length;
    if (k < 5) continue; // warm-up
    parse.push(tp);
    processing.push(tq);
    total.push(tp + tq);
    cpu.push(cp + cq);
    jdx.push(tj);
  }
  const f = (v: number) => `${v.toFixed(1)} ms`;
  console.log(`spectrum: ${s.wavelength.length} points, ${bands} bands found, ${total.length} runs`);
  console.log(`  parse CSV          median ${f(median(parse))}`);
  console.log(`  parse JCAMP DIFDUP median ${f(median(jdx))}`);
  console.log(`  process            median ${f(median(processing))}`);
  console.log(`  parse + process    median ${f(median(total))} wall, ${f(median(cpu))} CPU (target < 50 ms, aim ~20 ms)`);
  hardCases();
}

/**
 * processSpectrum alone on harder inputs, target median ≤ 20 ms: a
 * 2,001-point strong-field Cr(III)-like spectrum (narrow spin-forbidden
 * band, 4T1g beside the UV edge, saturated maxima) and every invented demo
 * spectrum in spectra-demo/ (701 points each).
 */
function hardCases(): void {
  const s = synthesizeSpectrum({
    bands: [{ position: 12530, fwhm: 450, epsilon: 0.9 }, { position: 21900, fwhm: 2900, epsilon: 71 }, { position: 28900, fwhm: 3300, epsilon: 60 }],
    concentration: 0.05, noise: 0.002, baselineOffset: 0.02, baselineSlope: 0.01,
    edge: { position: 43000, fwhm: 9000, height: 2.5 }, seed: 14, fromNm: 300, toNm: 1100, stepNm: 0.4,
  });
  const inputs: Array<[string, Spectrum]> = [['strong-field 2001 points', { x: s.wavelength, y: s.absorbance, xUnit: 'nm', yUnit: 'absorbance', name: 'hard', column: 1, metadata: {} }]];
  for (const file of readdirSync(DEMO).filter((n) => /\.(csv|txt|jdx)$/.test(n)).sort()) {
    for (const spectrum of parseSpectrumText(new Uint8Array(readFileSync(DEMO + file)), { fileName: file }).spectra) inputs.push([`${file} ${spectrum.name}`.slice(0, 40), spectrum]);
  }
  const f = (v: number) => `${v.toFixed(1)} ms`;
  for (const [name, spectrum] of inputs) {
    const wall: number[] = [];
    const cpu: number[] = [];
    let bands = 0;
    for (let k = 0; k < 25; k++) {
      const [result, t, c] = time(() => processSpectrum(spectrum, { concentration: 0.05, geometry: 'octahedral' }));
      bands = result.bands.length;
      if (k < 5) continue;
      wall.push(t);
      cpu.push(c);
    }
    console.log(`  process ${name.padEnd(40)} ${bands} bands  median ${f(median(wall))} wall, ${f(median(cpu))} CPU`);
  }
}
