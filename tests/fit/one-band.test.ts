/**
 * One band whose energy depends on B: B (and C/B) fixed at the prior, 10Dq
 * fitted, the transition and the spin state chosen by the posterior
 * (src/fit/prior-b.ts), instead of a refusal (issue 13, item 5).
 */
import { describe, expect, it } from 'vitest';
import { computeLevels } from '../../src/ligand-field/index.js';
import { fitBands } from '../../src/fit/index.js';
import { resolveFitSettings } from '../../src/fit/settings.js';
import { bPriorOf } from '../../src/fit/prior-b.js';
import { LIKELIHOOD } from '../../src/fit/likelihood.js';

/** 380–780 nm, a visible-only instrument, in cm-1. */
const VISIBLE = { min: 1e7 / 780, max: 1e7 / 380 };

/** Slow reference: Dq at which the labelled level lies `energy` above the ground level, by bisection on the engine. */
function dqByBisection(d: number, label: string, energy: number, b: number, c: number, lo: number, hi: number): number {
  const at = (dq: number) => {
    const levels = computeLevels(d, 'octahedral', { dq, b, c }).levels;
    const level = levels.find((l) => l.label === label);
    if (!level) throw new Error(`no level ${label}`);
    return level.energy - energy;
  };
  let a = lo;
  let z = hi;
  const fa = at(a);
  if (fa * at(z) > 0) throw new Error('bisection bracket does not straddle the root');
  for (let i = 0; i < 80; i++) {
    const m = (a + z) / 2;
    if (at(m) * fa > 0) a = m;
    else z = m;
  }
  return (a + z) / 2;
}

describe('one band: B at its prior', () => {
  it('fits one band of d2 with B fixed at its prior and says so, instead of refusing', () => {
    // [V(H2O)6]3+: ν1 3T2g near 17 800 cm-1 (Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from memory).
    const r = fitBands({ ion: 'V3+', bands: [17_800] });
    const prior = bPriorOf(resolveFitSettings({ ion: 'V3+', bands: [17_800] }));
    expect(r.b).toBeCloseTo(prior.b, 0);
    expect(r.uncertainty.b).toBeCloseTo(prior.sigma, 0);
    expect(r.status).toBe('exact');
    const b = r.undetermined.find((u) => u.parameter === 'b');
    expect(b?.action).toMatch(/^B fixed at its prior/);
    expect(r.warnings.join(' ')).toMatch(/B is not determined by one band: B fixed at its prior/);
    expect(r.assignments).toHaveLength(1);
  });

  it('centres B on β × B0: the middle of the β prior, or 1 − h·k from the ligands', () => {
    // Internal consistency with likelihood.ts, not an outside check.
    const plain = resolveFitSettings({ ion: 'Co2+', bands: [19_600] });
    expect(bPriorOf(plain).b).toBeCloseTo(((LIKELIHOOD.betaMin + LIKELIHOOD.betaMax) / 2) * plain.b0!, 6);
    const aqua = resolveFitSettings({ ion: 'Co2+', bands: [19_600], ligands: 'H2O' });
    expect(aqua.priors.betaExpected).not.toBeNull();
    expect(bPriorOf(aqua).b).toBeCloseTo(aqua.priors.betaExpected! * aqua.b0!, 6);
    expect(bPriorOf(aqua).sigma).toBeCloseTo(LIKELIHOOD.betaLigandSigma * aqua.b0!, 6);
  });

  it('gives hexaaqua Co(II) from its one visible band as high-spin', () => {
    // [Co(H2O)6]2+: the visible maximum near 19 400–20 000 cm-1 (4T1g(P), with 4A2g beside it); the ion is the
    // textbook high-spin d7 (Lever 1984, from memory; issue 13 "Done when").
    for (const ligands of [undefined, 'H2O']) {
      const r = fitBands({ ion: 'Co2+', bands: [19_600], window: VISIBLE, ...(ligands && { ligands }) });
      expect(r.spinState).toBe('high-spin');
      expect(r.spinStateProbabilities['high-spin']).toBeGreaterThan(0.9);
      expect(r.undetermined.map((u) => u.parameter)).toContain('b');
    }
  });

  it('gives hexaammine Co(III) from its first band as low-spin, 10Dq within its stated uncertainty', () => {
    // [Co(NH3)6]3+: 1A1g → 1T1g near 21 000 cm-1, 10Dq ≈ 22 900 cm-1 (Lever 1984, from memory);
    // f(NH3)·g(Co3+) = 22 750 (Jørgensen 1971, −0.7 %).
    const r = fitBands({ ion: 'Co3+', bands: [21_000], window: VISIBLE });
    expect(r.spinState).toBe('low-spin');
    expect(r.assignments[0]!.label).toBe('1T1g(I)');
    expect(Math.abs(r.tenDq - 22_900)).toBeLessThanOrEqual(2 * r.uncertainty.tenDq!);
  });

  it('solves Dq exactly and carries σ(B) into σ(10Dq) (bisection on the engine as reference)', () => {
    // V3+ ν1 at 17 800 cm-1: the reference solves E(3T2g) = 17 800 at B and at B ± h by bisection.
    const r = fitBands({ ion: 'V3+', bands: [17_800] });
    const label = r.assignments[0]!.label;
    const ratio = r.c! / r.b!;
    const at = (b: number, energy = 17_800) => dqByBisection(2, label, energy, b, ratio * b, 100, 5000);
    expect(r.dq).toBeCloseTo(at(r.b!), 1);
    const h = 1;
    const dDqdB = (at(r.b! + h) - at(r.b! - h)) / (2 * h);
    const dDqdE = (at(r.b!, 17_800 + h) - at(r.b!, 17_800 - h)) / (2 * h);
    // The band's own σ: 1% of 17 800 (the default, observations.ts).
    const sigmaDq = Math.hypot(178 * dDqdE, dDqdB * r.uncertainty.b!);
    expect(r.uncertainty.dq!).toBeGreaterThan(0.97 * sigmaDq);
    expect(r.uncertainty.dq!).toBeLessThan(1.03 * sigmaDq);
  });

  it('keeps the exact 10Dq of a band at 10Dq (ν1 of d3) rather than assuming B', () => {
    // [Cr(NH3)6]3+: ν1 = 10Dq near 21 550 cm-1 (Lever 1984, from memory); the only band in the window.
    const r = fitBands({ ion: 'Cr3+', bands: [21_550], window: VISIBLE });
    expect(r.tenDq).toBe(21_550);
    expect(r.b).toBeNull();
  });

  it('charges a lone ν1 for the transitions the window should then show, at B\'s prior', () => {
    // One Ni(II) band in a 200–1100 nm window read as ν1 = 10Dq: ν2 would then lie inside the range with no band.
    const r = fitBands({ ion: 'Ni2+', bands: [14_800], window: { min: 1e7 / 1100, max: 1e7 / 200 } });
    expect(r.b).toBeNull();
    const window = r.penalties.filter((p) => p.rule === 'skipped-transition');
    expect(window.length).toBeGreaterThan(0);
    expect(window[0]!.detail).toMatch(/3T1g\(F\).*with B at its prior/);
    expect(r.skipped.map((t) => t.label)).toContain('3T1g(F)');
  });
});
