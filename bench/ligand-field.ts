/**
 * Speed of the ligand-field engine: one full computeLevels evaluation and a
 * 400-interval diagram per d^n, beside the straightforward approach (one dense
 * C(10, n) matrix per evaluation: the three operator matrices built once,
 * then per evaluation their sum diagonalised, eigenvalues only, no labels).
 * Medians over batches after a warm-up. Targets: d5 evaluation < 0.1 ms,
 * 400-point d5 diagram < 50 ms.
 */
import { loadavg } from 'node:os';
import { computeDiagram, computeLevels } from '../src/ligand-field/index.js';
import { symmetricEigenvaluesInPlace, createEigenWorkspace } from '../src/ligand-field/eigen-symmetric.js';
import { denseHamiltonian } from '../tests/reference/dense-hamiltonian.js';
import { seededRandom } from '../tests/reference/seeded-random.js';

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** Median milliseconds per call of fn, measured in batches of perBatch calls after warm-up calls. */
function timePerCall(fn: (i: number) => void, { warmup = 50, batches = 21, perBatch = 20 } = {}): number {
  for (let i = 0; i < warmup; i++) fn(i);
  const samples: number[] = [];
  let call = 0;
  for (let b = 0; b < batches; b++) {
    const start = performance.now();
    for (let i = 0; i < perBatch; i++) fn(call++);
    samples.push((performance.now() - start) / perBatch);
  }
  return median(samples);
}

/** The straightforward evaluator: dense Dq, B, C operator matrices over all determinants, summed and diagonalised. */
function denseEvaluator(d: number): (dq: number, b: number, c: number) => Float64Array {
  const parts = [
    denseHamiltonian(d, 'octahedral', { dq: 1, b: 0, c: 0 }),
    denseHamiltonian(d, 'octahedral', { dq: 0, b: 1, c: 0 }),
    denseHamiltonian(d, 'octahedral', { dq: 0, b: 0, c: 1 }),
  ].map((m) => Float64Array.from(m.flat()));
  const n = Math.round(Math.sqrt(parts[0]!.length));
  const h = new Float64Array(n * n);
  const values = new Float64Array(n);
  const workspace = createEigenWorkspace(n);
  return (dq, b, c) => {
    for (let i = 0; i < h.length; i++) h[i] = dq * parts[0]![i]! + b * parts[1]![i]! + c * parts[2]![i]!;
    symmetricEigenvaluesInPlace(h, n, values, workspace);
    return values;
  };
}

const fmt = (ms: number): string => (ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`);

/** A fixed workload (eigenvalues of one 25×25 matrix) so a reader can judge how loaded the machine was. */
function calibration(): number {
  const n = 25;
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = Math.sin(7 * i + 3 * j);
  const h = new Float64Array(n * n);
  const values = new Float64Array(n);
  const workspace = createEigenWorkspace(n);
  return timePerCall(() => {
    h.set(a);
    symmetricEigenvaluesInPlace(h, n, values, workspace);
  }, { warmup: 200, batches: 21, perBatch: 50 });
}

export async function run(): Promise<void> {
  const random = seededRandom(1);
  const before = calibration();
  // Fit-like parameters: Dq, B and C/B change on every call (no cache hit on C/B).
  const params = Array.from({ length: 4096 }, () => ({ dq: 300 + 2500 * random(), b: 500 + 600 * random(), c: 0 }));
  params.forEach((p) => (p.c = p.b * (3.5 + 1.5 * random())));
  const rows: string[][] = [['d^n', 'computeLevels', 'same C/B', 'dense C(10,n)', 'ratio', '400-step diagram', 'dense diagram', 'ratio']];
  for (let d = 1; d <= 9; d++) {
    const fast = timePerCall((i) => computeLevels(d, 'octahedral', params[i % params.length]!));
    const sameRatio = timePerCall((i) => computeLevels(d, 'octahedral', { dq: params[i % params.length]!.dq, b: 800, c: 3600 }));
    const dense = denseEvaluator(d);
    const heavy = d >= 3 && d <= 7;
    const slow = timePerCall((i) => {
      const p = params[i % params.length]!;
      dense(p.dq, p.b, p.c);
    }, heavy ? { warmup: 3, batches: 7, perBatch: 2 } : {});
    const diagram = timePerCall(() => computeDiagram(d, 'octahedral', { cOverB: 4.5, maxDqOverB: 4, steps: 400 }), {
      warmup: 2, batches: 7, perBatch: 1,
    });
    const denseDiagram = slow * 401;
    rows.push([`d${d}`, fmt(fast), fmt(sameRatio), fmt(slow), `${(slow / fast).toFixed(0)}×`, fmt(diagram), `≈ ${fmt(denseDiagram)}`, `${(denseDiagram / diagram).toFixed(0)}×`]);
  }
  const widths = rows[0]!.map((_, col) => Math.max(...rows.map((r) => r[col]!.length)));
  for (const row of rows) process.stdout.write(`${row.map((cell, col) => (col === 0 ? cell.padEnd(widths[col]!) : cell.padStart(widths[col]!))).join('  ')}\n`);
  const after = calibration();
  process.stdout.write(
    `\nLoad indicator: one 25×25 eigenvalue solve took ${fmt(before)} before and ${fmt(after)} after (median); ` +
      `load average ${loadavg().map((x) => x.toFixed(1)).join(', ')} on this machine.\n`,
  );
  process.stdout.write(
    '\nMedians, octahedral. computeLevels: full labelled evaluation, Dq, B, C/B new on every call.\n' +
      'same C/B: Dq new on every call, B and C fixed (free-ion terms cached), as along a diagram.\n' +
      'dense: one C(10,n) matrix summed from precomputed operators and diagonalised (eigenvalues only, no labels);\n' +
      'dense diagram = 401 dense evaluations (estimated from the per-call median). Targets: d5 < 0.1 ms, d5 diagram < 50 ms.\n',
  );
}
