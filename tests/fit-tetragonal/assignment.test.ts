import { describe, expect, it } from 'vitest';
import { fitTetragonal, tetragonalFitReport } from '../../src/fit-tetragonal/index.js';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';

/**
 * Assignment in tetragonal symmetry, scored by the likelihood of src/fit.
 * Not outside checks: the band lists are made from the project's own engine
 * (a trans-CrN4X2-like d3 scenario, invented), then treated as a measured list
 * is: positions moved by amounts of the size a real band maximum differs from
 * the model (asymmetric, overlapping bands), rounded to 10 cm-1, with widths,
 * a sharp spin-forbidden band and a charge-transfer band flagged. Published
 * band sets are the sources helper's (tests/fit-tetragonal/published.test.ts).
 */
const truth = { dq: 1700, b: 650, c: 2860, ds: 700, dt: 350 };
const quartets = computeFieldLevels(3, 'octahedral', truth).levels.filter((l) => l.multiplicity === 4 && l.energy > 0);
const at = (label: string): number => quartets.find((l) => l.label === label)!.energy;
const measured = (energy: number, shift: number): number => Math.round((energy + shift) / 10) * 10;

describe('tetragonal assignment with the probabilistic score', () => {
  it('a trans d3 complex: both split parents (4T2g and 4T1g) are recognised, each as two components of one band', () => {
    const bands = [
      { position: measured(at('4Eg[4T2g(F)]'), 140), width: 2600 },
      { position: 13900, flags: ['spin-forbidden' as const] }, // the sharp 2Eg line near the first band
      { position: measured(at('4B2g[4T2g(F)]'), -110), width: 2200 },
      { position: measured(at('4A2g[4T1g(F)]'), 90), width: 2400 },
      { position: measured(at('4Eg[4T1g(F)]'), -160), width: 2800 },
      { position: 32000, flags: ['charge-transfer' as const] },
    ];
    const result = fitTetragonal({ ion: 'Cr3+', bands, cOverB: truth.c / truth.b });
    expect(result.assignments.map((a) => a.label)).toEqual(['4Eg[4T2g(F)]', '4B2g[4T2g(F)]', '4A2g[4T1g(F)]', '4Eg[4T1g(F)]']);
    expect(result.components.map((c) => c.parent)).toEqual(['4T2g(F)', '4T1g(F)']);
    expect(result.components[0]!.bands).toHaveLength(2);
    // The shifts above move the parameters, but not far: Dq to a few %, Ds and Dt to some 100 cm-1.
    expect(Math.abs(result.dq - truth.dq)).toBeLessThan(0.05 * truth.dq);
    expect(Math.abs(result.ds - truth.ds)).toBeLessThan(250);
    expect(Math.abs(result.dt - truth.dt)).toBeLessThan(150);
    expect(result.probability).toBeGreaterThan(0.5);
    expect(result.probability).toBeLessThanOrEqual(1);
    const total = result.probability + result.alternatives.reduce((s, a) => s + a.probability, 0);
    expect(total).toBeLessThanOrEqual(1 + 1e-9);
    expect(tetragonalFitReport(result)).toMatch(/one 4T2g\(F\) band, split/);
    // Every quartet component below the highest band has a band: nothing is charged as missing.
    expect(result.penalties.filter((p) => p.rule === 'skipped-transition')).toEqual([]);
  });

  it('as many bands as parameters cannot choose between assignments: the fit says so instead of picking silently', () => {
    // Three bands, Dq, Ds, Dt free (B fixed): every assignment fits exactly; nothing but position data to go on.
    const bands = [
      { position: measured(at('4Eg[4T2g(F)]'), 100), width: 2600 },
      { position: measured(at('4B2g[4T2g(F)]'), -80), width: 2200 },
      { position: measured((at('4A2g[4T1g(F)]') + at('4Eg[4T1g(F)]')) / 2, 0), width: 5200 },
    ];
    const result = fitTetragonal({ ion: 'Cr3+', bands, cOverB: truth.c / truth.b, b: truth.b });
    expect(result.status).toBe('exact');
    expect(result.warnings.join(' ')).toMatch(/another assignment fits as well/);
    expect(result.probability).toBeLessThan(0.5);
    expect(result.alternatives.length).toBeGreaterThan(0);
  });
});
