/**
 * The whole job on visible-only spectra as instruments export them
 * (380–780 nm, 1 nm, absorbance rounded to 0.01; tests/spectrum/visible-cases.ts):
 * aqueous Ni(II), Co(II), Cu(II) through analyzeSpectrum. Target: median CPU
 * time under 50 ms each (the 2 000-point target of bench/analysis.ts holds
 * for these 401-point files too). CPU time is printed beside wall time: on
 * a shared machine the wall time measures the neighbours.
 */
import { analyzeSpectrum } from '../src/analysis.js';
import { realisticCsv } from '../tests/spectrum/realistic.js';
import { COBALT, COPPER, NICKEL } from '../tests/spectrum/visible-cases.js';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[sorted.length >> 1]!;
}

export async function run(): Promise<void> {
  let worst = 0;
  for (const c of [NICKEL, COBALT, COPPER]) {
    const csv = realisticCsv(c.spectrum);
    const options = { ion: c.ion, concentration: c.spectrum.concentration };
    analyzeSpectrum(csv, options);
    const wall: number[] = [];
    const cpu: number[] = [];
    for (let i = 0; i < 20; i++) {
      const t = performance.now();
      const u = process.cpuUsage();
      analyzeSpectrum(csv, options);
      const used = process.cpuUsage(u);
      wall.push(performance.now() - t);
      cpu.push((used.user + used.system) / 1000);
    }
    worst = Math.max(worst, median(cpu));
    process.stdout.write(`analyzeSpectrum, ${c.name} visible-only (401 points, 0.01): median ${median(wall).toFixed(1)} ms wall, ${median(cpu).toFixed(1)} ms CPU\n`);
  }
  process.stdout.write(`target < 50 ms median CPU: ${worst < 50 ? 'met' : 'NOT met'}\n`);
}
