/**
 * Classification by integrated intensity (bandClassify.ts): a sharp
 * spin-flip line may stand taller than the broad bands beside it, and bands
 * of one kind on either side of ε = 1 must not be split between classes.
 * The band sets are shaped like those of high-spin d5 aqua ions: broad
 * 4T1g(G) and 4T2g(G) bands, sharp 4A1g,4Eg(G) and 4Eg(D) lines (widths
 * ≈ 2000 and ≈ 250 cm-1; ε about 1 for Fe(III), 0.01–0.05 for Mn(II):
 * Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), from memory).
 */
import { describe, expect, it } from 'vitest';
import { bandEpsilonEquivalent, bandsClassify, defaultThresholds } from '../../src/spectrum/band-classify.js';

const oct = defaultThresholds('octahedral');
const band = (position: number, epsilon: number | null, fwhm: number, height = epsilon ?? 0) => ({ position, fwhm, height, epsilon });

describe('classification by integrated intensity', () => {
  it('the ε-equivalent keeps a broad band\'s peak ε and scales a narrow one by its width', () => {
    expect(bandEpsilonEquivalent(10, 3000, oct)).toBe(10);
    expect(bandEpsilonEquivalent(10, 2500, oct)).toBe(10);
    expect(bandEpsilonEquivalent(10, 250, oct)).toBeCloseTo(1, 12);
  });

  it('weak quartets of Fe(III) on either side of ε = 1 share one class, the tall sharp line included', () => {
    // ε 1.09 and 0.94 broad, sharp lines of ε 2.6–4.7: all of one kind (the nir case of the corpus, rounded).
    const bands = [band(14430, 1.09, 2000), band(19230, 0.94, 1790), band(25020, 4.65, 250), band(27830, 3.36, 370), band(30280, 2.62, 250)];
    const { kinds } = bandsClassify(bands, oct);
    expect(new Set(kinds).size).toBe(1);
  });

  it('a spectrum whose strongest band is below ε 1 is spin-forbidden throughout, its tallest sharp line too', () => {
    const bands = [band(14180, 0.91, 3000), band(18330, 0.83, 2300), band(24090, 4.27, 250)];
    expect(bandsClassify(bands, oct).kinds).toEqual(['spin-forbidden', 'spin-forbidden', 'spin-forbidden']);
    // Mn(II): every band far below ε 1.
    const mn = [band(19070, 0.011, 2160), band(22480, 0.015, 1770), band(25110, 0.066, 250)];
    expect(bandsClassify(mn, oct).kinds).toEqual(['spin-forbidden', 'spin-forbidden', 'spin-forbidden']);
  });

  it('a sharp line as tall as the spin-allowed band beside it is spin-forbidden (its area is a tenth)', () => {
    // Cr(III)-like: 4T2g broad ε 15, a 2Eg-like line ε 15 but 250 cm-1 wide.
    const bands = [band(14900, 15, 250), band(17400, 15, 3000), band(24500, 12, 3200)];
    expect(bandsClassify(bands, oct).kinds).toEqual(['spin-forbidden', 'd-d', 'd-d']);
  });

  it('without ε the same rule holds on heights', () => {
    const bands = [band(14900, null, 250, 0.5), band(17400, null, 3000, 0.5), band(24500, null, 3200, 0.4)];
    const { kinds, relative } = bandsClassify(bands, oct);
    expect(relative).toBe(true);
    expect(kinds).toEqual(['spin-forbidden', 'd-d', 'd-d']);
  });
});
