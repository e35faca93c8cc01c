/**
 * [V(H2O)6]2+ as the spectrum tests generate it: 4T2g ≈ 12 300–12 400, 4T1g(F) ≈ 18 500, 4T1g(P) ≈ 27 900 cm-1,
 * ε ≈ 3–5, and the sharp doublets 2Eg, 2T1g near 13 000–14 000 (Lever, Inorganic Electronic Spectroscopy, 2nd ed.,
 * 1984, from memory). The positions below are those of the corpus case v2-aqua (10Dq 12 490); widths,
 * skews and ε are invented to look measured. Test data, not a check value against the outside world.
 */
import type { TruthBand } from '../../accuracy/truth-bands.js';

export const VANADIUM_AQUA_BANDS: readonly TruthBand[] = [
  { label: '4T2g(F)', level: '4T2g#0', centre: 12490, position: 12490, fwhm: 3370, skew: 1.07, epsilon: 3.1, kind: 'spin-allowed', weak: false },
  { label: '2Eg(G)', level: '2Eg#0', centre: 13264, position: 13264, fwhm: 170, skew: 1.09, epsilon: 0.11, kind: 'spin-forbidden', weak: false },
  { label: '2T1g(G)', level: '2T1g#0', centre: 13922, position: 13922, fwhm: 180, skew: 1.04, epsilon: 0.1, kind: 'spin-forbidden', weak: false },
  { label: '4T1g(F)', level: '4T1g#0', centre: 18714, position: 18714, fwhm: 3410, skew: 1.24, epsilon: 2.98, kind: 'spin-allowed', weak: false },
  { label: '4T1g(P)', level: '4T1g#1', centre: 29106, position: 29106, fwhm: 4020, skew: 1.29, epsilon: 4.32, kind: 'spin-allowed', weak: false },
];
