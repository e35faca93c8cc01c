/**
 * AUDIT3 finding 4: in a tetrahedral spectrum a component of a split
 * spin-allowed band, narrower than a typical band but with a peak ε inside
 * the tetrahedral spin-allowed range, is d–d, not spin-forbidden. The band
 * values are what the spectrum stage measured on the AUDIT3 [NiCl4]2-
 * spectrum (a synthesized file, not a measurement): 13 911 cm-1 ε 191 FWHM
 * 1 979, and its component 15 542 cm-1 ε 72 FWHM 1 183.
 */
import { describe, expect, it } from 'vitest';
import { bandsClassify, defaultThresholds } from '../../src/spectrum/band-classify.js';

describe('tetrahedral: a narrow component of a spin-allowed multiplet', () => {
  const t = defaultThresholds('tetrahedral');
  const main = { position: 13911, fwhm: 1979, height: 0.954, epsilon: 191 };

  it('ε 72 beside ε 191 is d–d: inside the tetrahedral spin-allowed range 50–1 500 (common practice; issue 13 item 3)', () => {
    const { kinds } = bandsClassify([main, { position: 15542, fwhm: 1183, height: 0.362, epsilon: 72 }], t);
    expect(kinds).toEqual(['d-d', 'd-d']);
  });

  it('a weak band below the range (peak ε 8, FWHM 1 500) beside it is still spin-forbidden', () => {
    // Spin-forbidden bands of tetrahedral complexes: ε of a few units, far below the spin-allowed ones (common practice).
    const { kinds } = bandsClassify([main, { position: 16800, fwhm: 1500, height: 0.04, epsilon: 8 }], t);
    expect(kinds[1]).toBe('spin-forbidden');
  });

  it('a narrow spin-flip line (FWHM 400) well below the main band is spin-forbidden whatever its peak ε', () => {
    const { kinds } = bandsClassify([main, { position: 16800, fwhm: 400, height: 0.3, epsilon: 60 }], t);
    expect(kinds[1]).toBe('spin-forbidden');
  });
});

describe('octahedral: unchanged for a line narrower than the typical width', () => {
  const t = defaultThresholds('octahedral');
  it('[Cr(ox)3]3- 2Eg-like line (ε 1.5, FWHM 200) beside the 4T2g band (ε 70) is spin-forbidden', () => {
    // Values shaped like the AUDIT3 [Cr(ox)3]3- spectrum (finding 6; invented widths, not measurements).
    const { kinds } = bandsClassify([{ position: 17500, fwhm: 3000, height: 0.84, epsilon: 70 }, { position: 14400, fwhm: 200, height: 0.018, epsilon: 1.5 }], t);
    expect(kinds).toEqual(['d-d', 'spin-forbidden']);
  });
});
