/**
 * Round trip: seeded random (Dq, B) at C/B = 4.5 → the engine's predicted
 * spin-allowed transitions below 50 000 cm-1 (the lowest six; for high-spin
 * d5, which has none, its quartets) → fitBands with only the d-count →
 * the same parameters. Noise-free, so the tolerance is tight (1e-4
 * relative). Dq/B is drawn away from any spin crossover (more than 15%) and
 * B in 500–1000 cm-1 (Dq/B 0.8–4 octahedral, 0.3–3.5 tetrahedral, so both spin states occur), the range of real complexes, so the plausibility
 * rules never argue against the truth.
 */
import { describe, expect, it } from 'vitest';
import { fitBands } from '../../src/fit/index.js';
import { computeLevels, crossoverDqOverB } from '../../src/ligand-field/index.js';
import type { Geometry } from '../../src/ligand-field/types.js';
import { seededRandom, uniform } from './random.js';

const C_OVER_B = 4.5;

function bandsFor(d: number, geometry: Geometry, dq: number, b: number): number[] {
  const levels = computeLevels(d, geometry, { dq, b, c: C_OVER_B * b }).levels;
  const ground = levels[0]!;
  let chosen = levels.filter((l) => l.energy > 0 && l.energy < 50_000 && l.multiplicity === ground.multiplicity);
  if (chosen.length === 0) chosen = levels.filter((l) => l.energy > 0 && l.energy < 50_000 && Math.abs(l.multiplicity - ground.multiplicity) === 2);
  const positions: number[] = [];
  for (const l of chosen) if (!positions.some((p) => Math.abs(p - l.energy) < 1)) positions.push(l.energy);
  return positions.slice(0, 6).filter((p) => p >= 2000);
}

const cases: Array<{ d: number; geometry: Geometry }> = [];
for (const geometry of ['octahedral', 'tetrahedral'] as const) for (let d = 1; d <= 9; d++) cases.push({ d, geometry });

describe('fitBands round trip', () => {
  it.each(cases)('recovers Dq and B for d$d $geometry', ({ d, geometry }) => {
    const random = seededRandom(1000 * d + (geometry === 'octahedral' ? 1 : 2));
    const crossover = crossoverDqOverB(d, geometry, C_OVER_B, { maxDqOverB: 12 });
    const [lo, hi] = geometry === 'octahedral' ? [0.8, 4] : [0.3, 3.5];
    for (let trial = 0; trial < 4; trial++) {
      let x: number;
      do x = uniform(random, lo, hi);
      while (crossover !== undefined && Math.abs(x - crossover) / crossover < 0.15);
      const b = uniform(random, 500, 1000);
      const dq = x * b;
      const bands = bandsFor(d, geometry, dq, b);
      const truth = computeLevels(d, geometry, { dq, b, c: C_OVER_B * b });
      const result = fitBands({ d, geometry, bands });
      const context = `d${d} ${geometry} Dq=${dq.toFixed(1)} B=${b.toFixed(1)} bands=${bands.map(Math.round).join(',')}`;
      expect(result.groundTerm, context).toBe(truth.groundTerm);
      expect(result.spinState, context).toBe(truth.spinState);
      expect(Math.abs(result.dq - dq) / dq, context).toBeLessThan(1e-4);
      if (result.b === null) {
        // One spin-allowed transition (d1, d9, high-spin d4 and d6): only 10Dq is determined.
        expect(bands.length, context).toBe(1);
      } else {
        expect(Math.abs(result.b - b) / b, context).toBeLessThan(1e-4);
        expect(result.rmsResidual, context).toBeLessThan(0.5);
      }
    }
  });
});
