/**
 * The assignment rules of src/fit/penalties.ts, on band sets whose right
 * answer a chemist reads at sight (values from memory: Lever, Inorganic
 * Electronic Spectroscopy, 2nd ed., 1984, except where a found source is
 * cited beside them; see docs/sources.md).
 */
import { describe, expect, it } from 'vitest';
import { fitBands } from '../../src/fit/index.js';

describe('automatic assignment', () => {
  it('gives a band flagged spin-forbidden a doublet of Cr3+ and keeps the quartet fit', () => {
    // from memory: [Cr(H2O)6]3+ shows the weak sharp 2Eg/2T1g(G) pair near 15 000 cm-1 below 4T2g at 17 400
    const r = fitBands({ ion: 'Cr3+', bands: [{ position: 14900, flags: ['spin-forbidden'] }, 17400, 24600] });
    const sf = r.assignments.find((a) => a.observed === 14900)!;
    expect(sf.multiplicity).toBe(2);
    expect(sf.spinAllowed).toBe(false);
    expect(r.assignments.filter((a) => a.spinAllowed).map((a) => a.label)).toEqual(['4T2g(F)', '4T1g(F)']);
    expect(Math.abs(r.tenDq - 17400) / 17400).toBeLessThan(0.03);
  });

  it('leaves a band no transition can take unexplained, with a penalty, and says which', () => {
    // [Ni(H2O)6]2+ (8 500, 13 800, 25 300 cm-1; found: docs/sources.md NI-AQUA-VN) with a stray band at 19 000 cm-1
    const r = fitBands({ ion: 'Ni2+', bands: [8500, 13800, 19000, 25300] });
    expect(r.assignments.map((a) => a.observed)).toEqual([8500, 13800, 25300]);
    expect(r.unassigned).toEqual([{ observed: 19000, band: 2, reason: 'left unexplained by the chosen assignment' }]);
    expect(r.penalties.some((p) => p.rule === 'unexplained-band')).toBe(true);
  });

  it('leaves charge-transfer bands out of the fit', () => {
    const plain = fitBands({ ion: 'Co2+', bands: [8100, 19400] });
    const withCt = fitBands({ ion: 'Co2+', bands: '8100, 19400, 21500:ct' });
    expect(withCt.tenDq).toBe(plain.tenDq);
    expect(withCt.unassigned).toEqual([{ observed: 21500, band: 2, reason: 'charge-transfer band: left out of the fit' }]);
  });

  it('explains why each runner-up lost', () => {
    const r = fitBands({ ion: 'Cr3+', bands: [17400, 24600] });
    expect(r.alternatives.length).toBeGreaterThan(0);
    for (const alt of r.alternatives) {
      expect(alt.score).toBeGreaterThanOrEqual(r.score);
      expect(alt.reason).toMatch(/^(score [\d.]+ vs [\d.]+ \(.* as probable\)|equally good)/);
      expect(alt.probability).toBeLessThan(r.probability);
    }
    // The (4T1g(F), 4T1g(P)) reading puts 4T2g inside the measured range with no band: penalised, and said so.
    const skipLow = r.alternatives.find((a) => a.assignments[0]!.label === '4T1g(F)')!;
    expect(skipLow.reason).toMatch(/4T2g\(F\) at \d+ cm-1 lies below the lowest band/);
  });

  it('prefers β ≤ 1 and the one-electron band as the lowest: [Co(H2O)6]2+ with ν2 missing', () => {
    // from memory: 8 100 and 19 400 cm-1 (19 400 found within 0.7 %: 512 nm, docs/sources.md CO-AQUA-IASJ); reading 8 100
    // as the two-electron 4A2g would need 4T2g near 3 700 cm-1 unobserved
    const r = fitBands({ ion: 'Co2+', bands: [8100, 19400] });
    expect(r.assignments[0]!.label).toBe('4T2g(F)');
    expect(r.beta!).toBeLessThan(1);
  });

  it('weights by the band uncertainties when given and propagates them', () => {
    const tight = fitBands({ ion: 'Cr3+', bands: [{ position: 17400, uncertainty: 50 }, { position: 24600, uncertainty: 50 }] });
    const loose = fitBands({ ion: 'Cr3+', bands: [{ position: 17400, uncertainty: 500 }, { position: 24600, uncertainty: 500 }] });
    expect(tight.status).toBe('exact');
    // Exact fits: σ scales with the band σ (linear propagation).
    expect(loose.uncertainty.tenDq! / tight.uncertainty.tenDq!).toBeCloseTo(10, 1);
    expect(loose.uncertainty.b! / tight.uncertainty.b!).toBeCloseTo(10, 1);
    expect(Math.abs(tight.correlation.bDq!)).toBeLessThanOrEqual(1);
  });
});
