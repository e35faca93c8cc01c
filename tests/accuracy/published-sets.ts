/**
 * Published band sets: band maxima (cm-1) with the 10Dq and B the
 * literature derives from them. They join the corpus as `fit` cases: the
 * published analysis is the check value, and each entry names its source
 * beside the numbers. Values that could not be looked up while writing say
 * "from memory" in their source.
 */
import type { Geometry, SpinState } from '../../src/ligand-field/types.js';

export interface PublishedSet {
  id: string;
  complex: string;
  ion: string;
  geometry: Geometry;
  /** Band list text as `fieldgap fit --bands` takes it. */
  bands: string;
  freeC?: boolean;
  /** Published 10Dq and B, cm-1 (B null: not determinable or not given). */
  tenDq: number;
  b: number | null;
  spinState: SpinState;
  source: string;
}

const LEVER = 'Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984) (from memory)';

export const PUBLISHED_SETS: readonly PublishedSet[] = [
  { id: 'v3-aqua', complex: '[V(H2O)6]3+', ion: 'V3+', geometry: 'octahedral', bands: '17800,25700', tenDq: 18900, b: 620, spinState: 'no-choice', source: LEVER },
  { id: 'cr3-aqua', complex: '[Cr(H2O)6]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '17400,24600', tenDq: 17400, b: 725, spinState: 'no-choice', source: LEVER },
  { id: 'cr3-ammine', complex: '[Cr(NH3)6]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '21550,28500', tenDq: 21550, b: 657, spinState: 'no-choice', source: LEVER },
  { id: 'mn2-aqua', complex: '[Mn(H2O)6]2+', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,25000,28000,29700', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: LEVER },
  { id: 'mn2-aqua-sf', complex: '[Mn(H2O)6]2+ (bands flagged spin-forbidden)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,25000:sf,28000:sf,29700:sf', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: LEVER },
  { id: 'mn2-aqua-c-ratio', complex: '[Mn(H2O)6]2+ (C not freed by the user)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,25000,28000,29700', tenDq: 8500, b: 671, spinState: 'high-spin', source: LEVER },
  { id: 'mn2-aqua-c-ratio-sf', complex: '[Mn(H2O)6]2+ (flagged, C not freed by the user)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,25000:sf,28000:sf,29700:sf', tenDq: 8500, b: 671, spinState: 'high-spin', source: LEVER },
  // The 4A1g/4Eg(G) pair resolved and 4T1g(P) added: the seven quartets below 33 000 cm-1 usually listed for the ion
  // (from memory; cf. Heidt, Koster and Johnson, J. Am. Chem. Soc. 80 (1958) 6471, perchlorate solution).
  // Checked (issue 13, helper fit-b): the search tool found no text of the source to confirm the list, so it stays
  // "from memory". The set is consistent with itself but not with the cubic model without a Trees correction: the
  // field-independent 4A1g,4Eg(G) = 10B + 5C ≈ 25 125 and 4Eg(D) = 17B + 5C = 29 700 (exact in that model) give
  // B ≈ 654, C ≈ 3 717, where the engine reproduces the other five bands within 550 cm-1 at 10Dq 8 500 but puts
  // 4T1g(P) at 35 130 cm-1, 2 700 above 32 400. A Trees term αL(L+1) (α ≈ 70 cm-1 for Mn2+, from memory) lowers 4P
  // against 4G and 4D by 18α and 14α and brings 4T1g(P) near 32 400: the published assignment presumes it. The
  // engine has no α, so the fit bends 10Dq to reach 32 400 (−15 %); leaving that band out gives 8 470 (−0.4 %).
  { id: 'mn2-aqua-7', complex: '[Mn(H2O)6]2+, seven quartets', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,24950,25300,27950,29700,32400', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; Heidt, Koster & Johnson (1958) (from memory)` },
  { id: 'mn2-aqua-7-sf', complex: '[Mn(H2O)6]2+, seven quartets flagged spin-forbidden', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,24950:sf,25300:sf,27950:sf,29700:sf,32400:sf', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; Heidt, Koster & Johnson (1958) (from memory)` },
  { id: 'co3-ammine', complex: '[Co(NH3)6]3+', ion: 'Co3+', geometry: 'octahedral', bands: '21050,29550', tenDq: 22870, b: 615, spinState: 'low-spin', source: LEVER },
  { id: 'co2-aqua', complex: '[Co(H2O)6]2+', ion: 'Co2+', geometry: 'octahedral', bands: '8100,19400', tenDq: 9200, b: 825, spinState: 'high-spin', source: LEVER },
  { id: 'co2-tet-cl', complex: '[CoCl4]2-', ion: 'Co2+', geometry: 'tetrahedral', bands: '5500,14700', tenDq: 3200, b: 710, spinState: 'no-choice', source: LEVER },
  { id: 'ni2-aqua', complex: '[Ni(H2O)6]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '8500,13800,25300', tenDq: 8500, b: 930, spinState: 'no-choice', source: LEVER },
  { id: 'ni2-ammine', complex: '[Ni(NH3)6]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '10750,17500,28200', tenDq: 10750, b: 880, spinState: 'no-choice', source: LEVER },
  { id: 'ni2-tet-cl', complex: '[NiCl4]2-', ion: 'Ni2+', geometry: 'tetrahedral', bands: '7550,14250', tenDq: 4100, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'ti3-aqua', complex: '[Ti(H2O)6]3+', ion: 'Ti3+', geometry: 'octahedral', bands: '20300', tenDq: 20300, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'v2-aqua', complex: '[V(H2O)6]2+', ion: 'V2+', geometry: 'octahedral', bands: '12350,18500,27900', tenDq: 12350, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'cr3-en', complex: '[Cr(en)3]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '21850,28500', tenDq: 21850, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'fe2-aqua', complex: '[Fe(H2O)6]2+', ion: 'Fe2+', geometry: 'octahedral', bands: '10400', tenDq: 10400, b: null, spinState: 'high-spin', source: LEVER },
  { id: 'ni2-en', complex: '[Ni(en)3]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '11200,18350,29000', tenDq: 11200, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'cu2-aqua', complex: '[Cu(H2O)6]2+', ion: 'Cu2+', geometry: 'octahedral', bands: '12500', tenDq: 12500, b: null, spinState: 'no-choice', source: LEVER },
];
