import { describe, expect, it } from 'vitest';
import { orbitalContribution } from '../../src/predict/decide-spin.js';
import { predictComplex } from '../../src/series/predict.js';

/**
 * What predict says about the moment beyond spin-only (AUDIT2 findings 1 and 2).
 * The directions are facts of the trade: μ ≈ μso(1 − αλ/10Dq) for A2 and E
 * ground terms, λ < 0 past half filling (Figgis, Introduction to Ligand Fields
 * (1966), from memory); observed ranges from memory: tetrahedral Co(II)
 * 4.4–4.8 μB, octahedral Ni(II) 2.9–3.3 μB, Cu(II) 1.9–2.2 μB (all above
 * spin-only), Cr(III) 3.7–3.9 μB (at or just below 3.87).
 */
describe('predict: magnetism wording', () => {
  it('says "above spin-only" where the shell is more than half full (A2, E)', () => {
    expect(predictComplex('[CoCl4]2-').orbitalContribution.why).toMatch(/above spin-only/); // from memory: 4.4–4.8 μB
    expect(predictComplex('[Ni(NH3)6]2+').orbitalContribution.why).toMatch(/above spin-only/); // from memory: 2.9–3.3 μB
    expect(predictComplex('[Cu(H2O)6]2+').orbitalContribution.why).toMatch(/above spin-only/); // from memory: 1.9–2.2 μB
  });

  it('says "below spin-only" where the shell is less than half full', () => {
    expect(predictComplex('[Cr(NH3)6]3+').orbitalContribution.why).toMatch(/below spin-only/); // from memory: 3.7–3.9 μB
  });

  it('keeps the first-order flag as it was: T terms only', () => {
    expect(predictComplex('[CoCl4]2-').orbitalContribution.expected).toBe(false); // common practice: 4A2
    expect(predictComplex('[Co(H2O)6]2+').orbitalContribution.expected).toBe(true); // common practice: 4T1g
  });

  it('calls a closed-shell ground term diamagnetic, not "close to spin-only"', () => {
    for (const f of ['[MnO4]-', '[Co(NH3)6]3+', '[PtCl4]2-', '[Ni(CN)4]2-']) {
      const why = predictComplex(f).orbitalContribution.why;
      expect(why, f).toMatch(/diamagnetic/); // common practice: no unpaired electrons
      expect(why, f).not.toMatch(/spin-only/);
    }
  });

  it('calls 6A1 (high-spin d5) spin-only, with no mixing', () => {
    expect(predictComplex('[Mn(H2O)6]2+').orbitalContribution.why).toMatch(/spin-only/); // common practice: 5.9 μB
    expect(predictComplex('[Mn(H2O)6]2+').orbitalContribution.why).not.toMatch(/above|below/);
  });

  it('without d says no direction', () => {
    expect(orbitalContribution('4A2', 'tetrahedral').why).toMatch(/shifted from spin-only/);
  });
});
