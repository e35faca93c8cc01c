/**
 * A band flagged spin-forbidden (by the user, or by the spectrum stage, which
 * judges by intensity alone) may be a weak two-electron spin-allowed
 * transition: 4A2g(F) of high-spin octahedral Co(II) (flaggedClass,
 * src/fit/enumerate.ts). Issue 13: the visible spectrum of hexaaqua Co(II)
 * was read with its strong band as 4A2g and 10Dq ≈ 10 500.
 *
 * Check values: hexaaqua Co(II) bands 16 000 (4A2g, weak) and 19 400 cm-1
 * (4T1g(P)), 10Dq ≈ 9 200 cm-1: Lever, Inorganic Electronic Spectroscopy,
 * 2nd ed. (1984) (from memory; also fixtures/spectra/real-like/README.md).
 */
import { describe, expect, it } from 'vitest';
import { fitLigandField } from '../../src/fit/index.js';

const VISIBLE = { min: 1e7 / 780, max: 1e7 / 380 };

describe('a flagged weak band may take a two-electron spin-allowed transition', () => {
  it('visible-only hexaaqua Co(II): the weak shoulder is 4A2g(F), the strong band 4T1g(P), high-spin', () => {
    const r = fitLigandField({ ion: 'Co2+', bands: '16000:sf:sh:e=0.5, 19400:e=4.8', window: VISIBLE });
    expect(r.assignments.map((a) => a.label)).toEqual(['4A2g(F)', '4T1g(P)']);
    expect(r.spinState).toBe('high-spin');
    // Lever (1984), from memory: 10Dq ≈ 9 200; ν1 (8 100) lies outside this window, so the two visible bands fix it
    // only to within about 8 % (the 4A2g reading of the strong band gave +14 %).
    expect(Math.abs(r.tenDq - 9200) / 9200).toBeLessThanOrEqual(0.08);
    // And it says that B rests on the weak band's assignment.
    expect(r.undetermined.map((u) => u.parameter).sort()).toEqual(['b', 'tenDq']);
  });

  it('the flagged band is not forced onto a spin-allowed level: without a two-electron level it stays spin-forbidden (Cr3+)', () => {
    // Cr3+ (d3 octahedral) has no two-electron quartet without a one-electron partner: a flagged band goes to a doublet.
    const r = fitLigandField({ ion: 'Cr3+', bands: '14900:sf, 17400, 24600' }); // Lever (1984), from memory: 2Eg near 14 900
    const flagged = r.assignments.find((a) => a.flags.includes('spin-forbidden'));
    expect(flagged?.multiplicity).toBe(2);
  });
});
