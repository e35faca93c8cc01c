/**
 * Benchmark of fitLigandField with automatic assignment: median time of one fit
 * per d^n, geometry and spin branch, on the band sets of the round-trip test
 * (the engine's spin-allowed transitions below 50 000 cm-1, the lowest six;
 * quartets for high-spin d5) at B = 800 cm-1, C/B = 4.5. "cold" is the first
 * fit of a (d, geometry, C/B), which builds and caches the level scan.
 * Also band lists with extra, split and single bands (the robustness cases).
 * Target: median under 20 ms for every case. Both the wall-clock median and
 * the median process CPU time (user + system, process.cpuUsage) are shown:
 * on a shared machine the wall clock includes waiting for a core.
 */
import { engineCallCount } from '../src/fit/engine.js';
import { fitLigandField, type FitInput } from '../src/fit/index.js';
import { computeLevels } from '../src/ligand-field/index.js';
import type { Geometry } from '../src/ligand-field/types.js';

const B = 800;
const C_OVER_B = 4.5;
const RUNS = 21;
const TARGET_MS = 20;

function bandsFor(d: number, geometry: Geometry, dqOverB: number): number[] {
  const levels = computeLevels(d, geometry, { dq: dqOverB * B, b: B, c: C_OVER_B * B }).levels;
  const ground = levels[0]!;
  let chosen = levels.filter((l) => l.energy > 0 && l.energy < 50_000 && l.multiplicity === ground.multiplicity);
  if (chosen.length === 0) chosen = levels.filter((l) => l.energy > 0 && l.energy < 50_000 && Math.abs(l.multiplicity - ground.multiplicity) === 2);
  const positions: number[] = [];
  for (const l of chosen) if (!positions.some((p) => Math.abs(p - l.energy) < 1)) positions.push(Math.round(l.energy));
  return positions.slice(0, 6).filter((p) => p >= 2000);
}

interface Case {
  name: string;
  input: FitInput;
}

function cases(): Case[] {
  const list: Case[] = [];
  for (let d = 1; d <= 9; d++) {
    list.push({ name: `d${d} oct`, input: { d, geometry: 'octahedral', bands: bandsFor(d, 'octahedral', 1.5) } });
    if (d >= 4 && d <= 7) {
      list.push({ name: `d${d} oct low-spin`, input: { d, geometry: 'octahedral', bands: bandsFor(d, 'octahedral', 3.2) } });
    }
  }
  for (let d = 1; d <= 9; d++) list.push({ name: `d${d} tet`, input: { d, geometry: 'tetrahedral', bands: bandsFor(d, 'tetrahedral', 0.6) } });
  // from memory ([Mn(H2O)6]2+ quartet bands, see tests/fit/published.test.ts): C free scans eight C/B ratios.
  list.push({ name: 'Mn2+ free C', input: { ion: 'Mn2+', bands: [18900, 23100, 25000, 28000, 29700], freeC: true } });
  list.push({ name: 'Cr3+ fixed C', input: { ion: 'Cr3+', bands: [17400, 24600], c: 3000 } });
  // Band lists as a band finder reports them (tests/fit/robust.test.ts): extras, split maxima, one band.
  const sf = (position: number) => ({ position, flags: ['spin-forbidden'] });
  list.push({ name: 'Cr3+ 7 with extras', input: { ion: 'Cr3+', bands: [sf(12534), 21893, sf(23237), 28755, 28407, 30005, sf(33333)] } });
  list.push({ name: 'Cr3+ split pairs', input: { ion: 'Cr3+', bands: [sf(13188), 21175, 22304, 27523, 28834] } });
  list.push({ name: 'Ni2+ one band', input: { ion: 'Ni2+', bands: [8500] } });
  list.push({ name: 'Cr3+ 8, 6 unflagged', input: { ion: 'Cr3+', bands: [sf(13000), 17400, 19000, 24600, 26000, sf(29000), 31000, 38000] } });
  return list;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

export async function run(): Promise<void> {
  const rows: string[][] = [['case', 'bands', 'result', 'cold ms', 'median ms', 'cpu ms', 'engine calls', 'target']];
  let worst = 0;
  for (const { name, input } of cases()) {
    let t0 = performance.now();
    let first: ReturnType<typeof fitLigandField>;
    try {
      first = fitLigandField(input);
    } catch (error) {
      rows.push([name, String(Array.isArray(input.bands) ? input.bands.length : 0), `fails: ${(error as Error).message.slice(0, 40)}`, '', '', '', '', '']);
      continue;
    }
    const cold = performance.now() - t0;
    const times: number[] = [];
    const cpu: number[] = [];
    let calls = 0;
    for (let i = 0; i < RUNS; i++) {
      const c0 = engineCallCount();
      const u0 = process.cpuUsage();
      t0 = performance.now();
      fitLigandField(input);
      times.push(performance.now() - t0);
      const u = process.cpuUsage(u0);
      cpu.push((u.user + u.system) / 1000);
      calls = engineCallCount() - c0;
    }
    const med = median(times);
    const cpuMed = median(cpu);
    worst = Math.max(worst, Math.min(med, cpuMed));
    const result = `${first.groundTerm} ${first.spinState === 'no-choice' ? '' : first.spinState}`.trim();
    const bandCount = Array.isArray(input.bands) ? input.bands.length : 0;
    const verdict = med < TARGET_MS ? 'ok' : cpuMed < TARGET_MS ? 'ok (cpu)' : 'OVER';
    rows.push([name, String(bandCount), result, cold.toFixed(1), med.toFixed(2), cpuMed.toFixed(2), String(calls), verdict]);
  }
  const widths = rows[0]!.map((_, col) => Math.max(...rows.map((r) => r[col]!.length)));
  for (const row of rows) process.stdout.write(`${row.map((cell, col) => (col === 0 || col === 2 ? cell.padEnd(widths[col]!) : cell.padStart(widths[col]!))).join('  ')}\n`);
  process.stdout.write(`\nslowest case ${worst.toFixed(2)} ms (the lower of its wall and cpu medians; target < ${TARGET_MS} ms per fit, median of ${RUNS} after a cold run)\n`);
}
