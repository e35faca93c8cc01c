/**
 * The four "Done when" spectra of issue 13 as a visible-only instrument
 * records them (380–780 nm, 1 nm steps, absorbance rounded to 0.01): aqueous
 * Ni(II), Co(II), Cu(II) and permanganate. Unlike the corpus, these bands
 * are not placed by the project's engine: positions, ε and widths are the
 * published ones for those ions (sources beside each spectrum and in
 * fixtures/spectra/real-like/README.md). They are SYNTHESIZED to resemble
 * measured data; they are not measurements.
 *
 * Write the fixture files with:
 *   node --import tsx tests/accuracy/write-real-like.ts
 */
import { generateSpectrum, WINDOWS, type Distortions } from './generate-spectrum.js';
import type { TruthBand } from './truth-bands.js';

export interface RealLikeSpectrum {
  file: string;
  title: string;
  ion: string;
  concentration: number;
  bands: TruthBand[];
  distortions: Distortions;
  seed: number;
  /** What the published analysis says, for the Done-when test. */
  published: string;
}

const band = (label: string, position: number, fwhm: number, epsilon: number, skew = 1.12, kind: TruthBand['kind'] = 'spin-allowed'): TruthBand => ({
  label, level: label, centre: position, position, fwhm, skew, epsilon, kind, weak: false,
});

/** A visible-only export: 0.01 rounding, no noise beyond it, a small cell/solvent offset. */
const VISIBLE: Distortions = { digits: 2, noise: 0, offset: 0.01, slope: 0.004, scatter: 0.005 };

export const REAL_LIKE: readonly RealLikeSpectrum[] = [
  {
    file: 'ni-aqua-visible.csv', title: 'aqueous Ni(II) ([Ni(H2O)6]2+), 0.20 mol/L, 1 cm', ion: 'Ni2+', concentration: 0.2, seed: 1301,
    bands: [
      // 8 500, 13 800, 25 300 cm-1 (found: docs/sources.md NI-AQUA-VN, which also gives 1Eg at 15 200), ε ≈ 2, 2, 5 (Lever,
      // Inorganic Electronic Spectroscopy, 2nd ed. (1984), from memory);
      // the middle band is split by 3T1g(F)/1Eg mixing into maxima near 13 800 and 15 300 cm-1 (cf. González, Rodrigue-Witchel
      // and Reber, "Absorption spectroscopy of octahedral nickel(II) complexes: a case study of interactions between multiple
      // electronic excited states", Coord. Chem. Rev. 251 (2007) 351; positions from memory).
      band('3T2g(F)', 8500, 3000, 2.0, 1.2),
      band('3T1g(F)', 13800, 2400, 2.0, 1.1),
      band('1Eg(D)', 15300, 1800, 1.6, 1.05, 'spin-forbidden'),
      band('3T1g(P)', 25300, 3300, 5.2, 1.15),
    ],
    distortions: { ...VISIBLE, chargeTransfer: { edgeAbsorbance: 0.15, fwhm: 8000, epsilon: 1500 } },
    published: '10Dq ≈ 8 500 cm-1 (= ν1, found: docs/sources.md NI-AQUA-VN), B ≈ 930 cm-1 (Lever 1984, from memory)',
  },
  {
    file: 'co-aqua-visible.csv', title: 'aqueous Co(II) ([Co(H2O)6]2+), 0.15 mol/L, 1 cm', ion: 'Co2+', concentration: 0.15, seed: 1302,
    bands: [
      // Lever (1984) (from memory): 8 100 (4T2g), 16 000 (4A2g, weak), 19 400 cm-1 (4T1g(P), ε ≈ 5) with a shoulder near
      // 21 000; maximum of octahedral Co(II) at 19 420 cm-1 (512 nm) in Ca(NO3)2·4H2O melt (Advances in Molten Salts,
      // "Cobalt(II) chloride complexes in calcium nitrate tetrahydrate melt", Begell House).
      band('4T2g(F)', 8100, 3000, 1.5, 1.2),
      band('4A2g(F)', 16000, 2500, 0.5, 1.1),
      band('4T1g(P)', 19400, 3000, 4.8, 1.12),
      band('4T1g(P) shoulder', 21200, 2400, 2.2, 1.05),
    ],
    distortions: { ...VISIBLE, chargeTransfer: { edgeAbsorbance: 0.08, fwhm: 8000, epsilon: 1500 } },
    published: 'high-spin d7, 10Dq ≈ 9 200 cm-1, B ≈ 825 cm-1 (Lever 1984, from memory)',
  },
  {
    file: 'cu-aqua-visible.csv', title: 'aqueous Cu(II) ([Cu(H2O)6]2+), 0.080 mol/L, 1 cm', ion: 'Cu2+', concentration: 0.08, seed: 1303,
    bands: [
      // One broad Jahn–Teller band with its maximum near 810 nm (12 350 cm-1), ε ≈ 12 and FWHM ≈ 4 300 cm-1
      // (from memory: the usual values for aqueous Cu(II), Lever 1984).
      band('2Eg', 12350, 4300, 12, 1.15),
    ],
    distortions: { ...VISIBLE, chargeTransfer: { edgeAbsorbance: 0.03, fwhm: 8000, epsilon: 2000 } },
    published: 'one band with its maximum near 12 350 cm-1 (810 nm), beyond the 780 nm end',
  },
  {
    file: 'permanganate-visible.csv', title: 'aqueous KMnO4 (MnO4-, d0), 0.40 mmol/L, 1 cm', ion: 'Mn7+', concentration: 0.0004, seed: 1304,
    bands: [
      // Ligand-to-metal charge transfer with a vibronic progression: strongest maxima at 525 and 545 nm (Konan University
      // analytical chemistry web page on absorption photometry, kccn.konan-u.ac.jp/chemistry/ia/contents_02/05.html);
      // ε ≈ 2 400 at 525 nm, the further members near 507 and 566 nm and the second CT band near 311 nm from memory.
      band('CT 0-0', 17680, 750, 1100, 1.05, 'charge-transfer'),
      band('CT 0-1', 18320, 800, 2300, 1.05, 'charge-transfer'),
      band('CT 0-2', 19050, 800, 2400, 1.05, 'charge-transfer'),
      band('CT 0-3', 19720, 850, 1600, 1.05, 'charge-transfer'),
      band('CT 0-4', 20450, 900, 700, 1.05, 'charge-transfer'),
      band('CT envelope', 19000, 3600, 500, 1.1, 'charge-transfer'),
      band('CT 2', 32150, 5000, 1800, 1.1, 'charge-transfer'),
    ],
    distortions: { ...VISIBLE },
    published: 'd0: no d–d bands; every band is charge transfer',
  },
];

/** The CSV text of a real-like spectrum (deterministic). */
export function realLikeCsv(spectrum: RealLikeSpectrum): string {
  const s = generateSpectrum(spectrum.bands, WINDOWS.visible, spectrum.distortions, spectrum.concentration, spectrum.seed);
  const preamble = [`Sample: ${spectrum.title}`, 'Note: synthesized to resemble measured data (fieldgap tests/accuracy/real-like.ts); not a measurement'];
  return `${preamble.join('\n')}\n${s.csv}`;
}
