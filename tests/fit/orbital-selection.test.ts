/**
 * The tetrahedral orbital selection rule (src/fit/orbital-selection.ts) and
 * its use in the score: a transition whose Γground × Γexcited lacks T2 is
 * weak, so two strong bands of a tetrahedral d2 or d7 ion are ν2 and ν3.
 */
import { describe, expect, it } from 'vitest';
import { fitBands } from '../../src/fit/index.js';
import { orbitallyForbiddenLevels, tetrahedralDipoleAllowed } from '../../src/fit/orbital-selection.js';
import { cachedLevelScan, scanGroundLevels } from '../../src/fit/scan.js';

/**
 * Slow reference: the multiplicity of T2 in Γa × Γb from the Td character
 * table (classes E, 8C3, 3C2, 6S4, 6σd; common practice, any group-theory text).
 */
const CLASS_SIZES = [1, 8, 3, 6, 6];
const CHARACTERS: Record<string, number[]> = {
  A1: [1, 1, 1, 1, 1],
  A2: [1, 1, 1, -1, -1],
  E: [2, -1, 2, 0, 0],
  T1: [3, 0, -1, 1, -1],
  T2: [3, 0, -1, -1, 1],
};
function t2Multiplicity(a: string, b: string): number {
  let sum = 0;
  for (let c = 0; c < 5; c++) sum += CLASS_SIZES[c]! * CHARACTERS[a]![c]! * CHARACTERS[b]![c]! * CHARACTERS['T2']![c]!;
  return sum / 24;
}

describe('tetrahedral orbital selection rule', () => {
  it('allows ground → excited exactly when Γground × Γexcited contains T2 (character-table reference)', () => {
    const irreps = Object.keys(CHARACTERS);
    for (const a of irreps) {
      for (const b of irreps) {
        const m = t2Multiplicity(a, b);
        expect(Number.isInteger(m)).toBe(true);
        expect(tetrahedralDipoleAllowed(a, b), `${a} → ${b}`).toBe(m > 0);
      }
    }
  });

  it('flags 3T2 of d2 and 4T2 of d7 tetrahedral, nothing octahedral, no spin-forbidden level', () => {
    const flagged = (d: number, geometry: 'octahedral' | 'tetrahedral') => {
      const scan = cachedLevelScan(d, geometry, 4.5);
      const ground = scanGroundLevels(scan)[0]!;
      const flags = orbitallyForbiddenLevels(scan, ground);
      return scan.ids.filter((_, k) => flags[k] === 1).map((id) => id.label);
    };
    expect(flagged(2, 'tetrahedral')).toEqual(['3T2(F)']);
    expect(flagged(7, 'tetrahedral')).toEqual(['4T2(F)']);
    expect(flagged(8, 'tetrahedral')).toEqual([]); // 3T1 ground: every T is allowed
    expect(flagged(2, 'octahedral')).toEqual([]);
    expect(flagged(8, 'octahedral')).toEqual([]);
  });

  it('reads two strong bands of tetrahedral V(III) in a 250–2500 nm window as ν2 and ν3, not ν1 and ν2', () => {
    // [VCl4]-: ν2 near 9 000 and ν3 near 15 000 cm-1, ν1 weak in the infrared (Lever, Inorganic Electronic
    // Spectroscopy, 2nd ed. (1984), from memory); ε of a few hundred for ν2, ν3 (common practice for Td).
    const fit = fitBands({ ion: 'V3+', geometry: 'tetrahedral', bands: '9000:e=150,15000:e=200', window: { min: 4000, max: 40000 } });
    expect(fit.assignments.map((a) => a.label)).toEqual(['3T1(F)', '3T1(P)']);
    // Without the rule the same bands were read as 3T2, 3T1(F) with 10Dq ≈ 9 000 and β ≈ 1.
    expect(fit.tenDq).toBeLessThan(7000);
  });
});
