/**
 * The ion families of the validation corpus: for each common d1–d9 ion and
 * geometry (octahedral and tetrahedral, both spin states where they occur),
 * the range of Dq, B and C/B it shows with common ligands, the ε of its
 * strongest spin-allowed band, its known weak transitions, its Jahn–Teller
 * and spin–orbit structure, and the windows in which it is measured.
 *
 * The ranges are typical values of the trade, not check values: each case
 * draws its own Dq, B and C/B inside them from its seed, and the truth the
 * pipeline is graded against is what was drawn. Where a range comes from
 * the literature, `source` names it; values recalled without a source at
 * hand say "from memory". The aqua and ammine ranges were compared with
 * Jørgensen's estimates 10Dq = f·g and β = 1 − h·k (C. K. Jørgensen, Modern
 * Aspects of Ligand Field Theory, 1971, pp 347–348, as tabulated at
 * chemprof.tripod.com/fghk.htm): generator.test.ts checks that they agree.
 * Intensity classes are common practice
 * (octahedral spin-allowed ε 1–150, tetrahedral 50–1 500, spin-forbidden
 * ≪ allowed, charge transfer ≥ 1 000).
 */
import type { Geometry, SpinState } from '../../src/ligand-field/types.js';
import type { BandSplit } from './truth-bands.js';

export type VariantName = 'vis' | 'uvvis' | 'uvvis-smooth' | 'nir';

export interface Family {
  key: string;
  /** What the family stands for: "[Ni(H2O)6]2+ and other O-donor Ni(II)". */
  complex: string;
  ion: string;
  d: number;
  geometry: Geometry;
  spin: SpinState;
  /** Dq, B (cm-1) and C/B ranges [low, high]. */
  dq: [number, number];
  b: [number, number];
  cOverB: [number, number];
  /** ε of the strongest spin-allowed band (d5 high-spin: of the strongest quartet), L mol-1 cm-1. */
  epsilon: [number, number];
  weak?: Record<string, number>;
  forbidden?: Record<string, { factor: number; fwhm: number }>;
  splits?: BandSplit[];
  /** Lowest spin-allowed levels that give a band. @default 3 */
  allowedCount?: number;
  /** One case per entry; a variant may repeat (another seed, other distortions). */
  variants: VariantName[];
  source: string;
}

const LEVER = 'Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984) (from memory)';
const FIGGIS = 'Figgis & Hitchman, Ligand Field Theory and Its Applications (2000) (from memory)';
/** A Jahn–Teller doublet: two components `split` cm-1 apart, the lower weaker. */
const jt = (split: number, lower = 0.65, label?: string): BandSplit => ({
  ...(label !== undefined && { label }), offsets: [-split / 2, split / 2], weights: [lower, 1], widthFactor: 0.8,
});

export const FAMILIES: readonly Family[] = [
  // ---- octahedral ----
  { key: 'ti3-aqua', complex: '[Ti(H2O)6]3+', ion: 'Ti3+', d: 1, geometry: 'octahedral', spin: 'no-choice',
    dq: [1880, 2030], b: [650, 700], cOverB: [4, 4.4], epsilon: [4, 6], splits: [jt(2900, 0.7)],
    variants: ['vis', 'uvvis'], source: `band 20 300 cm-1 (Lever 1984, from memory) with a Jahn–Teller shoulder near 17 400, ε ≈ 4; ${LEVER}` },
  { key: 'v3-aqua', complex: '[V(H2O)6]3+', ion: 'V3+', d: 2, geometry: 'octahedral', spin: 'no-choice',
    dq: [1750, 1900], b: [600, 680], cOverB: [4.3, 4.8], epsilon: [5, 9], weak: { '3A2g(F)': 0.05 },
    variants: ['vis', 'uvvis', 'nir'], source: `bands 17 800, 25 700 cm-1, 10Dq ≈ 18 900, B ≈ 620; ${LEVER}` },
  { key: 'cr3-o-donor', complex: '[Cr(H2O)6]3+, [Cr(ox)3]3-, [Cr(urea)6]3+', ion: 'Cr3+', d: 3, geometry: 'octahedral', spin: 'no-choice',
    dq: [1580, 1800], b: [620, 750], cOverB: [3.9, 4.5], epsilon: [14, 80], weak: { '4T1g(P)': 0.4 },
    variants: ['vis', 'uvvis', 'uvvis-smooth', 'nir', 'vis', 'uvvis'], source: `10Dq 16 000–18 000, B 620–750 cm-1; ${LEVER}; g(Cr3+) = 17 400 and f(ox)·g = 17 226 (Jørgensen 1971)` },
  { key: 'cr3-n-donor', complex: '[Cr(NH3)6]3+, [Cr(en)3]3+', ion: 'Cr3+', d: 3, geometry: 'octahedral', spin: 'no-choice',
    dq: [2100, 2200], b: [600, 670], cOverB: [3.9, 4.5], epsilon: [35, 75], weak: { '4T1g(P)': 0.4 },
    variants: ['vis', 'uvvis', 'uvvis-smooth', 'nir'], source: `[Cr(NH3)6]3+ 21 550, 28 500 cm-1, B ≈ 657; ${LEVER}` },
  { key: 'v2-aqua', complex: '[V(H2O)6]2+', ion: 'V2+', d: 3, geometry: 'octahedral', spin: 'no-choice',
    dq: [1170, 1250], b: [620, 690], cOverB: [3.9, 4.4], epsilon: [3, 8],
    variants: ['uvvis', 'nir'], source: `10Dq ≈ 12 300, B ≈ 650 cm-1; ${LEVER}` },
  { key: 'cr2-aqua', complex: '[Cr(H2O)6]2+', ion: 'Cr2+', d: 4, geometry: 'octahedral', spin: 'high-spin',
    dq: [1350, 1450], b: [700, 790], cOverB: [4, 4.4], epsilon: [4, 6], splits: [jt(4000, 0.5)],
    variants: ['uvvis', 'nir'], source: `one Jahn–Teller-split band near 14 000 cm-1, 10Dq ≈ 14 000; ${LEVER}` },
  { key: 'mn3-aqua', complex: '[Mn(H2O)6]3+', ion: 'Mn3+', d: 4, geometry: 'octahedral', spin: 'high-spin',
    dq: [2000, 2120], b: [850, 950], cOverB: [4, 4.4], epsilon: [40, 110], splits: [jt(3500, 0.5)],
    variants: ['vis', 'uvvis'], source: 'd–d maximum at 21 000 cm-1, Jahn–Teller distorted (Wells & Davies, "A spectrophotometric investigation of the aquomanganese(III) ion in perchlorate media", J. Chem. Soc. A 1967, 1858)' },
  { key: 'mn3-cyano', complex: '[Mn(CN)6]3- (low-spin d4)', ion: 'Mn3+', d: 4, geometry: 'octahedral', spin: 'low-spin',
    dq: [2900, 3100], b: [500, 600], cOverB: [4, 4.5], epsilon: [60, 150],
    variants: ['uvvis'], source: `low-spin d4 cyanide, 10Dq near 30 000 cm-1; ${FIGGIS}` },
  { key: 'mn2-aqua', complex: '[Mn(H2O)6]2+', ion: 'Mn2+', d: 5, geometry: 'octahedral', spin: 'high-spin',
    dq: [820, 880], b: [650, 700], cOverB: [5.3, 5.6], epsilon: [0.025, 0.04],
    variants: ['vis', 'uvvis', 'uvvis-smooth', 'uvvis'], source: `quartets 18 900–29 700 cm-1, B ≈ 671, C ≈ 3710, 10Dq ≈ 8 500; ${LEVER}` },
  { key: 'fe3-o-donor', complex: '[Fe(H2O)6]3+ and Fe(III) in oxides', ion: 'Fe3+', d: 5, geometry: 'octahedral', spin: 'high-spin',
    dq: [1250, 1450], b: [650, 780], cOverB: [4.5, 5.2], epsilon: [1, 4],
    variants: ['uvvis', 'nir', 'vis'], source: `quartets 12 600, 18 500, 24 300 cm-1; ${LEVER}` },
  { key: 'fe3-cyano', complex: '[Fe(CN)6]3- (low-spin d5)', ion: 'Fe3+', d: 5, geometry: 'octahedral', spin: 'low-spin',
    dq: [3300, 3500], b: [450, 550], cOverB: [4.3, 4.8], epsilon: [80, 150],
    allowedCount: 2,
    variants: ['uvvis'], source: `low-spin d5 cyanide, 10Dq near 35 000 cm-1; ${FIGGIS}` },
  { key: 'fe2-aqua', complex: '[Fe(H2O)6]2+', ion: 'Fe2+', d: 6, geometry: 'octahedral', spin: 'high-spin',
    dq: [980, 1050], b: [800, 900], cOverB: [4, 4.4], epsilon: [1, 3], splits: [jt(2000, 0.6)],
    variants: ['uvvis', 'nir'], source: `5T2g→5Eg split 10 400 and 8 300 cm-1, 10Dq ≈ 10 400; ${LEVER}` },
  { key: 'co3-fluoro', complex: '[CoF6]3- (high-spin d6)', ion: 'Co3+', d: 6, geometry: 'octahedral', spin: 'high-spin',
    dq: [1280, 1350], b: [720, 800], cOverB: [4, 4.4], epsilon: [20, 40], splits: [jt(3100, 0.8)],
    variants: ['uvvis'], source: `bands 11 400 and 14 500 cm-1 (Jahn–Teller split 5Eg), 10Dq ≈ 13 000; ${LEVER}` },
  { key: 'co3-aqua', complex: '[Co(H2O)6]3+', ion: 'Co3+', d: 6, geometry: 'octahedral', spin: 'low-spin',
    dq: [1790, 1870], b: [600, 680], cOverB: [4.4, 4.9], epsilon: [40, 60],
    allowedCount: 2,
    variants: ['vis', 'uvvis'], source: `bands 16 600, 24 900 cm-1; ${LEVER}; g(Co3+) = 18 200 (Jørgensen 1971)` },
  { key: 'co3-ammine', complex: '[Co(NH3)6]3+, [Co(en)3]3+', ion: 'Co3+', d: 6, geometry: 'octahedral', spin: 'low-spin',
    dq: [2250, 2340], b: [580, 640], cOverB: [4.4, 4.9], epsilon: [50, 100],
    allowedCount: 2,
    variants: ['vis', 'uvvis', 'uvvis-smooth', 'nir'], source: `[Co(NH3)6]3+ 21 050, 29 550 cm-1, 10Dq ≈ 22 870, B ≈ 615; ${LEVER}` },
  { key: 'fe2-cyano', complex: '[Fe(CN)6]4- (low-spin d6)', ion: 'Fe2+', d: 6, geometry: 'octahedral', spin: 'low-spin',
    dq: [3200, 3400], b: [400, 470], cOverB: [4.4, 4.9], epsilon: [100, 150],
    allowedCount: 2,
    variants: ['uvvis'], source: `bands 31 000, 37 000 cm-1, 10Dq ≈ 33 800; ${LEVER}` },
  { key: 'co2-aqua', complex: '[Co(H2O)6]2+', ion: 'Co2+', d: 7, geometry: 'octahedral', spin: 'high-spin',
    dq: [900, 980], b: [800, 880], cOverB: [4, 4.6], epsilon: [4, 6], weak: { '4A2g(F)': 0.1 },
    splits: [{ label: '4T1g(P)', offsets: [0, 1500], weights: [1, 0.5], widthFactor: 0.85 }],
    variants: ['vis', 'uvvis', 'nir', 'vis', 'nir'], source: `8 100, 16 000 (weak), 19 400 cm-1 with a shoulder near 21 000, 10Dq ≈ 9 200, B ≈ 825; ${LEVER}; found: 512 nm = 19 531 (docs/sources.md CO-AQUA-IASJ), +0.7 %; g(Co2+) = 9 000 (Jørgensen 1971)` },
  { key: 'co2-low-spin', complex: 'low-spin Co(II) / Ni(III) (strong-field d7)', ion: 'Co2+', d: 7, geometry: 'octahedral', spin: 'low-spin',
    dq: [2050, 2250], b: [650, 750], cOverB: [4.2, 4.6], epsilon: [60, 150],
    variants: ['uvvis'], source: `strong-field d7 beyond the crossover (Dq/B ≈ 2.2); ${FIGGIS}` },
  { key: 'ni2-aqua', complex: '[Ni(H2O)6]2+', ion: 'Ni2+', d: 8, geometry: 'octahedral', spin: 'no-choice',
    dq: [830, 880], b: [900, 960], cOverB: [4.2, 4.6], epsilon: [2, 6], forbidden: { '1Eg(D)': { factor: 0.3, fwhm: 900 } },
    variants: ['vis', 'uvvis', 'nir', 'vis', 'uvvis-smooth', 'nir'], source: `8 500, 13 800 (with 1Eg near 15 000), 25 300 cm-1, 10Dq ≈ 8 500, B ≈ 930; ${LEVER}; found: 8 500, 13 800, 1Eg 15 200, 25 300 (docs/sources.md NI-AQUA-VN)` },
  { key: 'ni2-n-donor', complex: '[Ni(NH3)6]2+, [Ni(en)3]2+', ion: 'Ni2+', d: 8, geometry: 'octahedral', spin: 'no-choice',
    dq: [1050, 1160], b: [820, 900], cOverB: [4.2, 4.6], epsilon: [5, 10], forbidden: { '1Eg(D)': { factor: 0.2, fwhm: 800 } },
    variants: ['vis', 'uvvis', 'nir', 'uvvis-smooth'], source: `[Ni(NH3)6]2+ 10 750, 17 500, 28 200 cm-1, B ≈ 880; ${LEVER}` },
  { key: 'cu2-aqua', complex: '[Cu(H2O)6]2+', ion: 'Cu2+', d: 9, geometry: 'octahedral', spin: 'no-choice',
    dq: [1220, 1280], b: [700, 700], cOverB: [4, 4], epsilon: [10, 14], splits: [jt(3000, 0.55)],
    variants: ['vis', 'uvvis', 'nir', 'vis'], source: 'one broad band near 12 500 cm-1 (Lever 1984, from memory)' },
  { key: 'cu2-ammine', complex: '[Cu(NH3)4(H2O)2]2+', ion: 'Cu2+', d: 9, geometry: 'octahedral', spin: 'no-choice',
    dq: [1450, 1650], b: [700, 700], cOverB: [4, 4], epsilon: [40, 60], splits: [jt(2800, 0.5)],
    variants: ['vis', 'uvvis', 'uvvis-smooth'], source: `one band near 16 000 cm-1 (610 nm), ε ≈ 50; ${LEVER}` },
  // ---- tetrahedral ----
  { key: 'v4-tet', complex: 'VCl4 (d1 tetrahedral)', ion: 'V4+', d: 1, geometry: 'tetrahedral', spin: 'no-choice',
    dq: [750, 900], b: [600, 600], cOverB: [4, 4], epsilon: [60, 150], splits: [jt(1200, 0.8)],
    variants: ['nir'], source: `one band near 9 000 cm-1; ${LEVER}` },
  { key: 'v3-tet', complex: '[VCl4]- (d2 tetrahedral)', ion: 'V3+', d: 2, geometry: 'tetrahedral', spin: 'no-choice',
    dq: [480, 560], b: [450, 550], cOverB: [4.3, 4.8], epsilon: [100, 300], weak: { '3T2(F)': 0.08 },
    variants: ['nir'], source: `d2 tetrahedral, ν2 near 9 000 and ν3 near 15 000 cm-1; ${LEVER}` },
  { key: 'cr3-tet', complex: 'Cr(III) in tetrahedral oxide sites (d3 tetrahedral)', ion: 'Cr3+', d: 3, geometry: 'tetrahedral', spin: 'high-spin',
    dq: [650, 750], b: [500, 600], cOverB: [4.2, 4.6], epsilon: [80, 250],
    variants: ['nir'], source: `rare; ranges by analogy with tetrahedral Co(II) (from memory)` },
  { key: 'cr2-tet', complex: 'Cr(II) in tetrahedral sites (d4 tetrahedral)', ion: 'Cr2+', d: 4, geometry: 'tetrahedral', spin: 'high-spin',
    dq: [500, 600], b: [700, 790], cOverB: [4, 4.4], epsilon: [50, 200], splits: [jt(1300, 0.7)],
    variants: ['nir'], source: `one band near 5 500 cm-1 (Cr2+ in II–VI hosts; from memory)` },
  { key: 'mn2-tet', complex: '[MnCl4]2-, [MnBr4]2-', ion: 'Mn2+', d: 5, geometry: 'tetrahedral', spin: 'high-spin',
    dq: [300, 420], b: [640, 720], cOverB: [5.2, 5.6], epsilon: [0.6, 4],
    variants: ['vis', 'uvvis', 'nir'], source: `sharp quartets 21 000–27 000 cm-1, ε ≈ 1–4; ${LEVER}` },
  { key: 'fe2-tet', complex: '[FeCl4]2- (d6 tetrahedral)', ion: 'Fe2+', d: 6, geometry: 'tetrahedral', spin: 'high-spin',
    dq: [450, 550], b: [800, 900], cOverB: [4, 4.4], epsilon: [50, 200], splits: [jt(900, 0.7)],
    variants: ['nir'], source: `one band near 4 000–5 500 cm-1; ${LEVER}` },
  { key: 'co2-tet', complex: '[CoCl4]2-, [CoBr4]2-, [Co(NCS)4]2-', ion: 'Co2+', d: 7, geometry: 'tetrahedral', spin: 'no-choice',
    dq: [300, 480], b: [650, 780], cOverB: [4, 4.6], epsilon: [300, 700], weak: { '4T2(F)': 0.05 },
    splits: [
      { label: '4T1(P)', offsets: [-700, 0, 650], weights: [0.8, 1, 0.7], widthFactor: 0.6 },
      { label: '4T1(F)', offsets: [-600, 0, 500], weights: [0.9, 1, 0.8], widthFactor: 0.7 },
    ],
    variants: ['vis', 'nir', 'uvvis', 'nir'], source: `[CoCl4]2- ν2 ≈ 5 500, ν3 ≈ 14 700 cm-1 (multiplet), Δt ≈ 3 200, B ≈ 710; ${LEVER}` },
  { key: 'ni2-tet', complex: '[NiCl4]2-, [NiBr4]2-', ion: 'Ni2+', d: 8, geometry: 'tetrahedral', spin: 'no-choice',
    dq: [380, 430], b: [700, 800], cOverB: [4.2, 4.6], epsilon: [100, 200], weak: { '3T2(F)': 0.1 },
    splits: [{ label: '3T1(P)', offsets: [-900, 0, 700], weights: [0.6, 1, 0.8], widthFactor: 0.6 }],
    variants: ['nir', 'uvvis', 'nir'], source: `[NiCl4]2- ν2 ≈ 7 500, ν3 ≈ 14 000–15 500 cm-1 (multiplet), Δt ≈ 4 100; ${LEVER}` },
  { key: 'cu2-tet', complex: '[CuCl4]2- (flattened tetrahedral)', ion: 'Cu2+', d: 9, geometry: 'tetrahedral', spin: 'no-choice',
    dq: [750, 900], b: [700, 700], cOverB: [4, 4], epsilon: [60, 150], splits: [jt(2000, 0.7)],
    variants: ['nir', 'uvvis'], source: `one broad band near 9 000 cm-1; ${LEVER}` },
];
