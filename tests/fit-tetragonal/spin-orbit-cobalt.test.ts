import { describe, expect, it } from 'vitest';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { freeIonZeta } from '../../src/ligand-field/free-ion-zeta.js';
import { fitTetragonal } from '../../src/fit-tetragonal/index.js';

it('tetrahedral [CoCl4]2-: the visible multiplet is read as 4T1(P) components, with ζ held to complexes\' range by its prior', () => {
  // Band set from memory: ν2 ≈ 5 500 cm-1 (4A2 → 4T1(F)); the visible 4A2 → 4T1(P) band with maxima near 720, 690 and
  // 665 nm (its commonly quoted structure); Δt ≈ 3 200 cm-1 (Lever, Inorganic Electronic Spectroscopy, 1984, from memory).
  // The visible spread (~1 150 cm-1) is more than spin–orbit coupling alone gives at ζ ≤ ζ0 (the 2G doublets that share
  // the envelope are not in this model): without its prior the fit pushes ζ to ~160 % of the free ion's; with it ζ stays
  // at the top of the complexes' range. Reported, not hidden: this is the done-when item not met.
  const result = fitTetragonal({ ion: 'Co2+', geometry: 'tetrahedral', symmetry: 'cubic', bands: [5500, '720nm', '690nm', '665nm'].join(','), zeta: 'free-ion', freeZeta: true });
  expect(result.assignments.map((a) => a.parent)).toEqual(['4T1(F)', '4T1(P)', '4T1(P)', '4T1(P)']);
  expect(result.components.map((c) => c.parent)).toEqual(['4T1(P)']);
  const ratio = result.zeta / result.freeIonZeta!;
  expect(ratio).toBeGreaterThan(0.5);
  expect(ratio).toBeLessThan(1.1);
  expect(Math.abs(result.tenDq - 3200)).toBeLessThan(0.2 * 3200);
}, 180_000); // a bound, not a speed check: every evaluation diagonalises all 120 states of d7

/**
 * Why a fit of the [CoCl4]2- visible band gives ζ above the free ion's
 * (issue 15, "Done when": ζ near the free ion's reduced value; not met).
 *
 * The engine already holds every state of d7 (120), so the spin-forbidden
 * doublets of 2G that lie inside the 4T1(P) band (2E, 2T1, 2A1, 2T2) mix in
 * through spin–orbit coupling: the first test shows levels of the band that
 * are half 4T1(P) and a third or more 2T1(G). What the engine does not hold
 * is any coupling to vibrations: the Jahn–Teller effect of the orbitally
 * degenerate 4T1(P) state, the vibronic envelope, a distortion of the
 * tetrahedron. The second test measures, over the whole usual range of Dq,
 * B and C/B of tetrahedral Co(II), how far apart the levels that carry at
 * least a quarter of 4T1(P) (those that can give a maximum of the band) can
 * lie at a given ζ: at most ~780 cm-1 for ζ ≤ ζ0, ~1 100 cm-1 only at
 * 1.2 ζ0, ~1 600 cm-1 at 1.6 ζ0. A band set whose visible maxima spread over
 * ~1 150 cm-1 (720 → 665 nm, the set above, from memory) can only be met by
 * the model with ζ ≈ 1.2–1.6 ζ0, which is what the unconstrained fit
 * returned (162 %); the ζ prior holds it at the top of the complexes' range
 * instead. So the large ζ is not an error of the spin–orbit engine or of
 * the assignment (an experiment that also let bands sit on levels led by a
 * doublet but holding ≥ 10–25 % 4T1(P) gave the same ζ and no better fit on
 * this set, so it was not kept): the envelope is wider than spin–orbit
 * coupling makes it, and band maxima of such an envelope do not measure ζ.
 * A published multiplet analysis with its band list (searched for: CoCl4
 * 2-, Cs3CoCl5, Cs2CoCl4 crystal spectra; Co(II) in tetrahedral oxide sites,
 * Wildner 1996) could not be read, so no outside check value is used here.
 * These are properties of this engine (not outside checks).
 */
describe('tetrahedral Co(II): what spin–orbit coupling alone can spread the 4T1(P) band over', () => {
  const zeta0 = freeIonZeta('Co2+')!.zeta;

  it('the 2G doublets inside the band already mix with 4T1(P) in the engine', () => {
    const levels = computeFieldLevels(7, 'tetrahedral', { dq: 320, b: 720, c: 3200, zeta: 0.85 * zeta0 }).levels;
    const band = levels.filter((l) => l.energy > 13000 && l.energy < 17000);
    const mixed = band.filter((l) => (l.parentWeights?.['4T1(P)'] ?? 0) >= 0.25 && (l.parentWeights?.['2T1(G)'] ?? 0) >= 0.2);
    expect(mixed.length).toBeGreaterThanOrEqual(1);
    // Weights are shares of one state: they never add up to more than 1.
    for (const l of band) expect(Object.values(l.parentWeights ?? {}).reduce((a, b) => a + b, 0)).toBeLessThanOrEqual(1 + 1e-9);
  });

  it('levels holding ≥ 25 % 4T1(P) span < 800 cm-1 for ζ ≤ ζ0 and > 1 000 cm-1 only beyond 1.2 ζ0', () => {
    const widest = (fraction: number): number => {
      let worst = 0;
      for (const dq of [260, 300, 340, 380])
        for (const b of [650, 725, 800])
          for (const cOverB of [4, 4.4, 4.8]) {
            const levels = computeFieldLevels(7, 'tetrahedral', { dq, b, c: cOverB * b, zeta: fraction * zeta0 }).levels;
            const carrying = levels.filter((l) => (l.parentWeights?.['4T1(P)'] ?? 0) >= 0.25).map((l) => l.energy);
            worst = Math.max(worst, Math.max(...carrying) - Math.min(...carrying));
          }
      return worst;
    };
    expect(widest(0.8)).toBeLessThan(700);
    expect(widest(1.0)).toBeLessThan(800);
    expect(widest(1.6)).toBeGreaterThan(1150);
  }, 120_000); // a bound, not a speed check: 36 evaluations of all 120 states each
});
