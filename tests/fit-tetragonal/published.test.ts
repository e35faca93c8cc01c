/**
 * The tetragonal fit (src/fit-tetragonal, `fit --symmetry tetragonal`) on
 * published band sets, compared with the published analysis of the same
 * bands (issue 15, "Done when" item 2).
 *
 * What the search found and did not find is said here, so that a missing
 * case reads as missing and not as passed:
 * - Jahn–Teller (tetragonally elongated) Cu(II): found, below.
 * - trans-dihalo tetragonal Co(III)/Cr(III) (e.g. trans-[Cr(en)2F2]+, Baker &
 *   Phillips, Inorg. Chem. 5 (1966) 1042; Flint & Matthews, J. Chem. Soc.,
 *   Faraday Trans. 2, 70 (1974) 1307): the papers were found, their band
 *   maxima and Dq, Ds, Dt were not (only abstracts could be read).
 * - square-planar d8 ([PtCl4]2-: Martin, Tucker & Kassman, Inorg. Chem. 4
 *   (1965) 1682; [PdCl4]2-: Inorg. Chem. 14 (1975) 2543; [Ni(CN)4]2-): the
 *   papers were found, their numbers were not.
 * - tetrahedral Co(II) visible multiplet with ζ: the analysis of CoO4 in
 *   Ca3Co(SeO3)4 (Wildner, J. Solid State Chem. 124 (1996) 143: Dq 395,
 *   Dt 25, Ds 250, B 770, C 3400, ζ 500 cm-1) was found, its band list was
 *   not; the tetragonal fit also takes octahedral parents only.
 * Those three stay as `it.todo` until their band lists are at hand.
 *
 * Searched again (issue 15 follow-up, the `search` tool, corpora pages and
 * docs): Baker & Phillips 1966 (trans-[Cr(en)2X2]+: the page opening with
 * the abstract and introduction only, its tables not reachable), Flint &
 * Matthews 1974 and the polarized spectra of quadrate Cr(III) (abstracts
 * without numbers), trans-[Cr(en)2(CN)2]+ and trans-[CrF2([15]aneN4)]+
 * (abstracts: "fitted with Dq, Dt, Ds" without the values), Wentworth &
 * Piper 1965 and trans-[Co(en)2Cl2]+ / trans-[CoCl2(NH3)4]+ (one band at
 * 15 200 cm-1 named, no Dq, Ds, Dt), Martin, Tucker & Kassman 1965
 * (K2PtCl4: the orbital order dx2−y2 > dxy > dxz,yz > dz2 in the abstract,
 * no band table), [PdCl4]2- and [Ni(CN)4]2- (quantum-chemical and
 * crystal-exciton papers, no ligand-field parameters), Cs3CoCl5 / [CoCl4]2-
 * (abstracts only). The stored pages give each paper's opening, where the
 * band tables never are; no number was taken from memory for a check.
 *
 * Searched a third time (the page's tetragonal fit, issue 15 item 5; the
 * `search` tool, corpora pages, docs and code, new angles): Proc. Indian
 * Acad. Sci. / J. Chem. Sci. (ias.ac.in: the Cu(II) case above again, no
 * Cr(III), Co(III) or planar Ni(II) crystal spectrum), SciELO (Cr3+ in
 * K2PdCl4: spin-Hamiltonian parameters only, no band table), J-STAGE and
 * Bull. Chem. Soc. Jpn. (dichroism of trans-[Co(en)2Cl2]+ salts: no band
 * energies in the abstract), Z. Naturforsch. (tetracyanoplatinate exciton
 * spectra only), theses (Cowman, Caltech 1974, and an Iowa State 1984
 * dissertation on M(A)4MX4 salts: square-planar Pt/Pd polarized spectra,
 * abstracts without band tables or Ds, Dt), Rahman 1971 (trans-[Cr(H2O)4F2]+
 * analysed with D4 matrices: abstract only), Perumareddi's quadrate Cr(III)
 * papers and trans-[Cr(en)2(CN)2]+ (fitted Dq, Dt, Ds named, values not in
 * the abstracts), Ballhausen's polarized spectra of Ni(CN)4 2- salts
 * (conference abstract, no numbers), Souissi & Kammoun, Materials Sciences
 * and Applications 2 (2011) 1121 (trans-CoCl2(H2O)4, Co(II) not Co(III):
 * abstract and references only), Cu(II)-doped Mg K phosphate (three bands
 * and "tetragonal parameters evaluated", values not in the abstract),
 * [AuCl4]- and Croatica Chemica Acta (no tetragonal analysis found), and
 * the code corpus for data files of published spectra (none). No band list
 * with its published Dq, Ds, Dt was readable; nothing was taken from memory.
 * The tetrahedral Co(II) case is analysed in spin-orbit-cobalt.test.ts:
 * why its fitted ζ exceeds the free ion's, with the engine's own numbers.
 *
 * Searched a fourth time (the `search` tool, corpora pages, docs and code, plus
 * find_string, about 30 look-ups, none repeating the lists above): J.-H. Choi's
 * Bull. Korean Chem. Soc. / J. Korean Chem. Soc. / koreascience pages (cis- and
 * trans-[Cr(cyclam)X2]+, trans-[CrX2([15]aneN4)]+ (X = F, Cl; J. Korean Chem.
 * Soc. 47 (2003) 109), [Cr(trans-diammac)]3+, cis-[Cr(cyclam)F2]+: abstracts
 * only, "ligand field analysis" and "strong σ- and π-donor" without Dq, Ds, Dt
 * or eσ, eπ values); trans-[CrCl2(Me2tn)2]Cl (Spectrochim. Acta A, 2007;
 * daneshyari abstract: "resolved band maxima ... fitted with a secular
 * determinant for a quartet energy state of the d3 configuration in a
 * tetragonal field", no numbers), trans-[Cr(Me2tn)2Cl2]2ZnCl4 (Z. Anorg. Allg.
 * Chem. 2011, doi 10.1002/zaac.201100029) and trans-[Cr(tn)2Cl2]ClO4 (Choi,
 * Takayama & Suzuki, J. Struct. Chem., pp. 395-399): the same, abstracts
 * without numbers — these are the best leads if the full text can be had;
 * trans-[Cr(en)2(CN)2]+, trans-[Cr(cyclam)(CN)2]+, trans-[Cr(NH3)4(CN)2]+
 * ("UV-Vis absorption study of some tetragonal chromium(III) complexes": Dq,
 * Dt, Ds fitted, values not in the abstract; dicyano, not dihalo); Baker &
 * Phillips 1966 again, through the page of the following article in the same
 * issue (the datapdf pages open with the tail of the preceding paper: not
 * stored); Wentworth & Piper 1965 (not stored); trans-[CoCl2(NH3)n(H2O)4−n]Cl
 * polarized spectra (one band, 15 200 cm-1, no parameters); Ni(II) planar and
 * tetragonal (Hitchman-type CLF and AOM abstracts: eσ, eπ named, not given);
 * [Ni(CN)4]2- (Hummel, Halpern-Manners & Gray, Inorg. Chem. 45 (2006) 7397:
 * band positions re-assigned by TD-DFT, no ligand-field parameters); Pramana /
 * CNKI abstracts of doped crystals (Cr3+ in ruby with Dq, B, C, trigonal v:
 * trigonal, not tetragonal); Academia.edu table pages (a Ru(III) table only);
 * the docs corpus (its hits are programs of the kind the house rules keep out
 * of this project; not read); the code corpus and find_string for complex
 * names (no data file of a published tetragonal analysis). Still no band list
 * with its published Dq, Ds, Dt readable; nothing was taken from memory.
 */
import { describe, expect, it } from 'vitest';
import type { CliIo } from '../../src/cli/command.js';
import { runCli } from '../../src/cli/main.js';
import { fitTetragonal } from '../../src/fit-tetragonal/index.js';

async function cli(argv: string[]): Promise<{ code: number; out: string }> {
  let out = '';
  const io: CliIo = { stdout: (t) => (out += t), stderr: () => undefined, isTty: false, cwd: process.cwd(), env: {} };
  return { code: await runCli(argv, io), out };
}

describe('tetragonal fit on published spectra', () => {
  it('tetragonally elongated Cu(II): [Cu(en)2]S2O3, three d–d bands, published d-orbital assignment', () => {
    // Polarized crystal spectrum of bisethylenediamine copper(II) thiosulfate, Proc. Indian Acad. Sci. (Chem. Sci.) 88(3),
    // 143–147, https://www.ias.ac.in/describe/article/jcsc/088/03/0143-0147: bands at 14.30, 15.60 and 19.10 kK assigned
    // (their axes, hole in d_xy) to d_xy → d_z², d_xy → d_x²−y² and d_xy → d_xz,yz in D4h. In the axes of issue 15 (ligands
    // on x and y, hole in b1g = x²−y²) that is b1g ← a1g (z²) 14 300, b1g ← b2g (xy) 15 600, b1g ← eg (xz, yz) 19 100 cm-1.
    const [toA1g, toB2g, toEg] = [14300, 15600, 19100];
    // The published assignment read through the one-electron convention of issue 15 (common practice, closed forms, not the
    // engine): b1g − a1g = 4Ds + 5Dt, b1g − b2g = 10Dq, b1g − eg = 10Dq + 3Ds − 5Dt.
    const dq = toB2g / 10;
    const ds = (toA1g + toEg - toB2g) / 7;
    const dt = (toA1g - 4 * ds) / 5;
    const r = fitTetragonal({ ion: 'Cu2+', bands: [toA1g, toB2g, toEg] });
    expect(r.groundTerm).toBe('2B1g');
    expect(r.assignments.map((a) => [a.observed, a.term])).toEqual([[14300, '2A1g'], [15600, '2B2g'], [19100, '2Eg']]);
    // The bands are given to 0.01 kK (10 cm-1): Dq to 1 cm-1, Ds and Dt to a few cm-1.
    expect(Math.abs(r.dq - dq)).toBeLessThanOrEqual(1);
    expect(Math.abs(r.ds - ds)).toBeLessThanOrEqual(5);
    expect(Math.abs(r.dt - dt)).toBeLessThanOrEqual(5);
    expect(r.status).toBe('exact');
    // Three bands, three parameters: the compressed alternative fits as well and the result says so.
    expect(r.warnings.join(' ')).toMatch(/another assignment fits as well/);
  });

  it('the same band set through `fieldgap fit --symmetry tetragonal --json`', async () => {
    // Same source and derivation as above: Dq = 1 560, Ds = 17 800/7, Dt = (14 300 − 4·Ds)/5 cm-1.
    const { code, out } = await cli(['fit', '--ion', 'Cu2+', '--symmetry', 'tetragonal', '--bands', '14300,15600,19100', '--json']);
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.dq).toBeCloseTo(1560, 0);
    expect(json.ds).toBeCloseTo(17800 / 7, 0);
    expect(json.dt).toBeCloseTo((14300 - (4 * 17800) / 7) / 5, 0);
    expect(json.groundTerm).toBe('2B1g');
  });

  // Best lead (header, fourth search): trans-[CrCl2(Me2tn)2]Cl, Spectrochim. Acta A (2007; authors not on the stored page): band maxima fitted in a tetragonal d3 field.
  it.todo('trans-dihalo tetragonal Cr(III) or Co(III): band maxima with published Dq, Ds, Dt (not found, see the header)');
  it.todo('square-planar d8 ([PtCl4]2-, [PdCl4]2- or [Ni(CN)4]2-): band maxima with published Dq, Ds, Dt (not found)');
  it.todo('tetrahedral Co(II): the 4A2 → 4T1(P) multiplet with a published ζ (not found; see spin-orbit-cobalt.test.ts for why the fitted ζ is high)');
});
