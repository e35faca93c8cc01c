import { describe, expect, it } from 'vitest';
import { computeLevels } from '../../src/ligand-field/index.js';
import { spinNumbers } from '../../src/predict/spin-decision.js';
import { seededRandom } from '../fit/random.js';

/**
 * Slow reference for the spin probability: draw 10Dq and B from their
 * log-normal distributions (C/B fixed), ask the ligand-field engine for the
 * ground state of each draw, count the low-spin ones. The closed form
 * Φ(ln(10Dq/10Dq_x)/σ) must agree within the Monte Carlo error. Internal
 * consistency (the engine is the project's own), not an outside check.
 */
function gaussian(random: () => number): number {
  // Box–Muller.
  const u = 1 - random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

function monteCarloLowSpin(d: number, tenDq: number, sDq: number, b: number, c: number, sB: number, draws: number, seed: number): number {
  const random = seededRandom(seed);
  let low = 0;
  for (let i = 0; i < draws; i++) {
    const x = tenDq * Math.exp(sDq * gaussian(random));
    const scale = Math.exp(sB * gaussian(random));
    const levels = computeLevels(d, 'octahedral', { dq: x / 10, b: b * scale, c: c * scale });
    if (levels.spinState === 'low-spin') low++;
  }
  return low / draws;
}

describe('spin probability against a Monte Carlo of the engine', () => {
  const cases: [d: number, tenDq: number, b: number, c: number][] = [
    [6, 12500, 700, 2800],
    [5, 19000, 650, 3000],
    [4, 17000, 750, 3000],
    [7, 17500, 800, 3200],
  ];
  for (const [d, tenDq, b, c] of cases) {
    it(`d${d} at 10Dq = ${tenDq} cm-1, B = ${b} cm-1`, () => {
      const sDq = 0.1;
      const sB = 0.08;
      const closed = spinNumbers({ d, geometry: 'octahedral', tenDq, tenDqSigmaRel: sDq, b, c, bSigmaRel: sB })!;
      const draws = 600;
      const mc = monteCarloLowSpin(d, tenDq, sDq, b, c, sB, draws, 1000 + d);
      const p = closed.probabilities.lowSpin;
      const se = Math.sqrt(Math.max(p * (1 - p), 0.01) / draws);
      expect(Math.abs(mc - p), `closed ${p.toFixed(3)}, Monte Carlo ${mc.toFixed(3)}`).toBeLessThan(4 * se + 0.01);
    });
  }
});
