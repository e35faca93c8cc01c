/**
 * Published band sets: band maxima (cm-1) with the 10Dq and B the
 * literature derives from them. They join the corpus as `fit` cases: the
 * published analysis is the check value, and each entry names its source
 * beside the numbers. Values that could not be looked up while writing say
 * "from memory" in their source; what a search found is cited in the same
 * string (Jørgensen's g, the 10Dq of the hexaaqua ions in his table;
 * Ballhausen's F2, F4 for [Mn(H2O)6]2+; the Ni2+-in-MgO lines with their Dq).
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
/** Found: Jørgensen's g(metal) is 10Dq of the hexaaqua ion (f(H2O) = 1); f·g estimates other ligands. */
const JORGENSEN = (note: string): string => `${LEVER}; found: Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348 (via chemprof.tripod.com/fghk.htm): ${note}`;
/** Found: Ballhausen's F2 = 1200, F4 = 106 cm-1 for [Mn(H2O)6]2+, i.e. B = F2 − 5F4 = 670, C = 35F4 = 3710 (quoted on ppdoc.com/periodical/3f3c46c77bc81eb81e7815cc0f322624.html). */
/** Found band maxima (search, December 2026), each listed with its address in docs/sources.md. */
const FOUND = {
  niAqua: 'found: 8 500, 13 800, 25 300 cm-1 as such in a thesis chapter on Ni(II) spectra (123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN)',
  coAqua: 'found: aqueous CoCl2·6H2O band at 512 nm = 19 531 cm-1 (www.iasj.net/iasj/article/131143), +0.7 % from 19 400',
};
const BALLHAUSEN_MN = 'B 670 and C 3710 found: Ballhausen F2 = 1200, F4 = 106 cm-1 (via ppdoc.com/periodical/3f3c46c77bc81eb81e7815cc0f322624.html); bands and 10Dq from memory';

export const PUBLISHED_SETS: readonly PublishedSet[] = [
  { id: 'v3-aqua', complex: '[V(H2O)6]3+', ion: 'V3+', geometry: 'octahedral', bands: '17800,25700', tenDq: 18900, b: 620, spinState: 'no-choice', source: LEVER },
  { id: 'cr3-aqua', complex: '[Cr(H2O)6]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '17400,24600', tenDq: 17400, b: 725, spinState: 'no-choice', source: JORGENSEN('g(Cr3+) = 17 400 = this 10Dq') },
  { id: 'cr3-ammine', complex: '[Cr(NH3)6]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '21550,28500', tenDq: 21550, b: 657, spinState: 'no-choice', source: JORGENSEN('f(NH3)·g(Cr3+) = 21 750, an estimate within 1 %') },
  { id: 'mn2-aqua', complex: '[Mn(H2O)6]2+', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,25000,28000,29700', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; ${BALLHAUSEN_MN}` },
  { id: 'mn2-aqua-sf', complex: '[Mn(H2O)6]2+ (bands flagged spin-forbidden)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,25000:sf,28000:sf,29700:sf', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; ${BALLHAUSEN_MN}` },
  { id: 'mn2-aqua-c-ratio', complex: '[Mn(H2O)6]2+ (C not freed by the user)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,25000,28000,29700', tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; ${BALLHAUSEN_MN}` },
  { id: 'mn2-aqua-c-ratio-sf', complex: '[Mn(H2O)6]2+ (flagged, C not freed by the user)', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,25000:sf,28000:sf,29700:sf', tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; ${BALLHAUSEN_MN}` },
  // The 4A1g/4Eg(G) pair resolved and 4T1g(P) added: the seven quartets below 33 000 cm-1 usually listed for the ion
  // (from memory; cf. Heidt, Koster and Johnson, J. Am. Chem. Soc. 80 (1958) 6471, perchlorate solution).
  // Checked (issue 13, helper fit-b): the search tool found no text of the source to confirm the list, so it stays
  // "from memory". The set is consistent with itself but not with the cubic model without a Trees correction: the
  // field-independent 4A1g,4Eg(G) = 10B + 5C ≈ 25 125 and 4Eg(D) = 17B + 5C = 29 700 (exact in that model) give
  // B ≈ 654, C ≈ 3 717, where the engine reproduces the other five bands within 550 cm-1 at 10Dq 8 500 but puts
  // 4T1g(P) at 35 130 cm-1, 2 700 above 32 400. A Trees term αL(L+1) (α ≈ 70 cm-1 for Mn2+, from memory) lowers 4P
  // against 4G and 4D by 18α and 14α and brings 4T1g(P) near 32 400: the published assignment presumes it. Without
  // α the fit bends 10Dq to reach 32 400 (−15 %); leaving that band out gives 8 415 (−1 %). With α fitted (`trees:
  // 'free'`, issue 13 helper assign) all seven fit to rms 46 cm-1 at α 90, B 823, C 3 020, but 10Dq 7 630: the 8 500
  // here is the value of an analysis without α, so the α fit is not graded against it (done-when.test.ts).
  // Searched again (issue 13, helper honest, December 2026; search tool, corpora pages and docs): Heidt, Koster &
  // Johnson 1958 (no text found); Koplitz, Kim & McClure, "Temperature dependence of 10Dq for aqueous
  // hexaaquomanganese(II)" (abstract only, koreauniv.pure.elsevier.com: 10Dq falls by about 1 000 cm-1 from 25 to
  // 250 °C with B and C fixed; no 25 °C value, no band list); Lever (no text found); Ballhausen's F2, F4 (above; the
  // quoting page's 10Dq is cut off). Found: Jørgensen's g(Mn2+) = 8 000 cm-1 (Modern Aspects of Ligand Field Theory
  // (1971) pp. 347–348, via chemprof.tripod.com/fghk.htm), i.e. 10Dq of the hexaaqua ion as his table gives it, 6 %
  // below the 8 500 used here. It is a factor for estimating Δ, given to two figures, not an analysis of these
  // bands, so the check value stays 8 500 (from memory) and the two markers in done-when.test.ts stay failing; the
  // published 10Dq of this ion is uncertain by about that 6 % between the two sources. Against 8 000 the seven-band
  // fit would still miss (7 198, −10 %; with α fitted 7 627, −4.7 %).
  { id: 'mn2-aqua-7', complex: '[Mn(H2O)6]2+, seven quartets', ion: 'Mn2+', geometry: 'octahedral', bands: '18900,23100,24950,25300,27950,29700,32400', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; Heidt, Koster & Johnson (1958) (from memory); ${BALLHAUSEN_MN}` },
  { id: 'mn2-aqua-7-sf', complex: '[Mn(H2O)6]2+, seven quartets flagged spin-forbidden', ion: 'Mn2+', geometry: 'octahedral', bands: '18900:sf,23100:sf,24950:sf,25300:sf,27950:sf,29700:sf,32400:sf', freeC: true, tenDq: 8500, b: 671, spinState: 'high-spin', source: `${LEVER}; Heidt, Koster & Johnson (1958) (from memory); ${BALLHAUSEN_MN}` },
  { id: 'co3-ammine', complex: '[Co(NH3)6]3+', ion: 'Co3+', geometry: 'octahedral', bands: '21050,29550', tenDq: 22870, b: 615, spinState: 'low-spin', source: JORGENSEN('f(NH3)·g(Co3+) = 22 750, an estimate within 1 %') },
  { id: 'co2-aqua', complex: '[Co(H2O)6]2+', ion: 'Co2+', geometry: 'octahedral', bands: '8100,19400', tenDq: 9200, b: 825, spinState: 'high-spin', source: `${JORGENSEN('g(Co2+) = 9 000, 2 % below this 10Dq')}; ${FOUND.coAqua}` },
  { id: 'co2-tet-cl', complex: '[CoCl4]2-', ion: 'Co2+', geometry: 'tetrahedral', bands: '5500,14700', tenDq: 3200, b: 710, spinState: 'no-choice', source: LEVER },
  { id: 'ni2-aqua', complex: '[Ni(H2O)6]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '8500,13800,25300', tenDq: 8500, b: 930, spinState: 'no-choice', source: `${JORGENSEN('g(Ni2+) = 8 700, 2.4 % above this 10Dq')}; ${FOUND.niAqua}` },
  { id: 'ni2-ammine', complex: '[Ni(NH3)6]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '10750,17500,28200', tenDq: 10750, b: 880, spinState: 'no-choice', source: JORGENSEN('f(NH3)·g(Ni2+) = 10 875, an estimate within 1.2 %') },
  // Measured lines with their published analysis (found): Ni2+ in MgO, Phys. Rev. (1958), abstract via
  // preview.concepedia.online/publication/W4254481442: lines 8600, 13 400, (14 800), (21 550), 24 500, … cm-1, Dq = 860,
  // E_P = 13 000 (B ≈ 867). The spin-allowed lines with 14 800, the 1Eg(D) partner that spin–orbit coupling mixes with
  // 3T1g(F) at 13 400 (their barycentre is the spin-allowed energy; common practice for d8, not stated in the abstract).
  // Without 14 800 the fit gives 10Dq 8 225 (−4.4 %): the cubic model puts 3T1g(F) near 14 100, not at 13 400.
  { id: 'ni2-mgo', complex: 'Ni2+ in MgO (crystal)', ion: 'Ni2+', geometry: 'octahedral', bands: '8600,13400,14800,24500', tenDq: 8600, b: 867, spinState: 'no-choice', source: 'Paramagnetic and Optical Spectra of Divalent Nickel in Cubic Crystalline Fields, Phys. Rev. (1958): Dq 860, E_P 13 000 cm-1 (found)' },
  { id: 'ni2-tet-cl', complex: '[NiCl4]2-', ion: 'Ni2+', geometry: 'tetrahedral', bands: '7550,14250', tenDq: 4100, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'ti3-aqua', complex: '[Ti(H2O)6]3+', ion: 'Ti3+', geometry: 'octahedral', bands: '20300', tenDq: 20300, b: null, spinState: 'no-choice', source: `${LEVER}; 10Dq = ν for d1 (common practice)` },
  { id: 'v2-aqua', complex: '[V(H2O)6]2+', ion: 'V2+', geometry: 'octahedral', bands: '12350,18500,27900', tenDq: 12350, b: null, spinState: 'no-choice', source: JORGENSEN('g(V2+) = 12 000, 2.8 % below this 10Dq') },
  { id: 'cr3-en', complex: '[Cr(en)3]3+', ion: 'Cr3+', geometry: 'octahedral', bands: '21850,28500', tenDq: 21850, b: null, spinState: 'no-choice', source: LEVER },
  { id: 'fe2-aqua', complex: '[Fe(H2O)6]2+', ion: 'Fe2+', geometry: 'octahedral', bands: '10400', tenDq: 10400, b: null, spinState: 'high-spin', source: LEVER },
  { id: 'ni2-en', complex: '[Ni(en)3]2+', ion: 'Ni2+', geometry: 'octahedral', bands: '11200,18350,29000', tenDq: 11200, b: null, spinState: 'no-choice', source: JORGENSEN('f(en)·g(Ni2+) = 11 136, an estimate within 0.6 %') },
  { id: 'cu2-aqua', complex: '[Cu(H2O)6]2+', ion: 'Cu2+', geometry: 'octahedral', bands: '12500', tenDq: 12500, b: null, spinState: 'no-choice', source: `${LEVER}; 10Dq = ν for d9 (common practice)` },
];
