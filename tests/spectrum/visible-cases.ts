/**
 * Visible-only spectra (380–780 nm, 1 nm steps, absorbance rounded to 0.01)
 * of aqueous ions, built with realistic.ts from published band positions
 * and ε. Widths, asymmetry and the split of each band are invented to look
 * like recorded spectra; positions and ε name their source.
 */
import type { RealisticOptions } from './realistic.js';

export interface VisibleCase {
  name: string;
  ion: string;
  spectrum: RealisticOptions;
}

/**
 * [Ni(H2O)6]2+: 3T2g 8 500, 3T1g(F) 13 800 (split by the 1Eg level near
 * 15 300: two maxima near 725 and 655 nm), 3T1g(P) 25 300 cm-1 — found:
 * 8 500, 13 800, 1Eg 15 200, 25 300 in a thesis chapter on Ni(II) spectra
 * (docs/sources.md NI-AQUA-VN);
 * ε about 2, 2 and 5 — from memory (Lever, Inorganic Electronic
 * Spectroscopy, 2nd ed., 1984; the usual textbook set).
 */
export const NICKEL: VisibleCase = {
  name: '[Ni(H2O)6]2+', ion: 'Ni2+',
  spectrum: {
    concentration: 0.2, scatterAt400: 0.005, offset: 0.01,
    bands: [
      { position: 8500, epsilon: 2.0, fwhm: 3000 },
      { position: 13_800, epsilon: 2.0, fwhm: 1600, skew: 1.1 },
      { position: 15_300, epsilon: 1.8, fwhm: 1300, skew: 1.2 },
      { position: 25_300, epsilon: 5.0, fwhm: 3000, skew: 1.3 },
    ],
    chargeTransfer: { position: 50_000, fwhm: 9000, epsilon: 3000 },
  },
};

/**
 * [Co(H2O)6]2+: 4T2g 8 100, 4A2g ≈ 16 000 (weak, two-electron), 4T1g(P)
 * 19 400 cm-1 (ε ≈ 5) with a spin–orbit shoulder near 21 500 — from memory
 * (Lever, 1984); found for the main band: 512 nm = 19 531 cm-1 (+0.7 %,
 * docs/sources.md CO-AQUA-IASJ).
 */
export const COBALT: VisibleCase = {
  name: '[Co(H2O)6]2+', ion: 'Co2+',
  spectrum: {
    concentration: 0.2, scatterAt400: 0.003,
    bands: [
      { position: 8100, epsilon: 1.5, fwhm: 3500 },
      { position: 16_000, epsilon: 0.5, fwhm: 2500 },
      { position: 19_400, epsilon: 4.8, fwhm: 2600, skew: 1.2 },
      { position: 21_500, epsilon: 2.2, fwhm: 2400 },
    ],
  },
};

/**
 * [Cu(H2O)6]2+: one broad Jahn–Teller band, maximum near 12 300 cm-1
 * (≈ 810 nm), ε ≈ 12 — from memory (Lever, 1984). Its lower Jahn–Teller component
 * (≈ 10 000 cm-1) is invented in size.
 */
export const COPPER: VisibleCase = {
  name: '[Cu(H2O)6]2+', ion: 'Cu2+',
  spectrum: {
    concentration: 0.1, scatterAt400: 0.004,
    bands: [
      { position: 12_400, epsilon: 11, fwhm: 6500, skew: 1.4 },
      { position: 10_000, epsilon: 4, fwhm: 4000 },
    ],
  },
};

/**
 * MnO4- (d0 Mn(VII)): an O→Mn charge-transfer band with a vibronic
 * progression, maxima at 525 and 545 nm (kccn.konan-u.ac.jp, "吸光光度分析",
 * absorption spectrum of KMnO4), ε ≈ 2 400 — from memory; the components
 * at 507 and 567 nm and the second CT band near 32 000 cm-1 (311 nm) from
 * memory.
 */
export const PERMANGANATE: VisibleCase = {
  name: 'MnO4-', ion: 'Mn7+',
  spectrum: {
    concentration: 4e-4,
    bands: [
      { position: 1e7 / 567, epsilon: 1500, fwhm: 900, skew: 1.1 },
      { position: 1e7 / 545, epsilon: 2400, fwhm: 900, skew: 1.1 },
      { position: 1e7 / 525, epsilon: 2300, fwhm: 900, skew: 1.1 },
      { position: 1e7 / 507, epsilon: 1600, fwhm: 900, skew: 1.1 },
      { position: 1e7 / 490, epsilon: 800, fwhm: 1000, skew: 1.1 },
    ],
    chargeTransfer: { position: 32_000, fwhm: 5000, epsilon: 1800 },
  },
};
