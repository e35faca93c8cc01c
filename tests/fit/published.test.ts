/**
 * Fits of published band maxima against the parameters derived from them in
 * the literature. Most texts were not at hand while writing: band maxima and
 * parameters recalled are marked "from memory" with where they are usually
 * quoted from. What a search found is cited beside the recalled numbers:
 * Jørgensen's g(metal) (Modern Aspects of Ligand Field Theory, 1971,
 * pp. 347–348, via chemprof.tripod.com/fghk.htm) is by definition 10Dq of the
 * hexaaqua ion (f(H2O) = 1), and f·g estimates other ligands; Ballhausen's
 * F2, F4 for [Mn(H2O)6]2+; and one measured band list with its published Dq
 * (Ni2+ in MgO, Phys. Rev. 1958); further found band maxima are listed with
 * their addresses and differences in docs/sources.md.
 *
 * Tolerances: 10Dq within 3% and B within 10% of the quoted values (the
 * quoted analyses differ from ours in C/B and in which bands they use, and
 * recalled numbers carry their own error), except where a comment says why a
 * check is looser. Each check fails if the assignment goes wrong: a wrong
 * assignment moves 10Dq or B by far more than these tolerances.
 */
import { describe, expect, it } from 'vitest';
import { fitBands, type FitInput, type FitResult } from '../../src/fit/index.js';

function within(actual: number | null, expected: number, fraction: number): void {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected) / expected).toBeLessThanOrEqual(fraction);
}

function fit(input: FitInput): FitResult {
  return fitBands(input);
}

describe('fitBands on published spectra', () => {
  it('d2 [V(H2O)6]3+', () => {
    // from memory: bands 17 800 and 25 700 cm-1, 10Dq ≈ 18 900, B ≈ 620 cm-1 (the classic Tanabe–Sugano worked example; cf. Lever, Inorganic Electronic Spectroscopy, 2nd ed., 1984)
    const r = fit({ ion: 'V3+', bands: [17800, 25700] });
    expect(r.assignments.map((a) => a.label)).toEqual(['3T2g(F)', '3T1g(P)']);
    within(r.tenDq, 18900, 0.03);
    within(r.b, 620, 0.1);
    expect(r.groundTerm).toBe('3T1g');
  });

  it('d3 [Cr(H2O)6]3+ and [Cr(NH3)6]3+', () => {
    // from memory: [Cr(H2O)6]3+ 17 400, 24 600 cm-1 → 10Dq = 17 400, B ≈ 725 cm-1 (Lever, Inorganic Electronic Spectroscopy, 2nd ed., 1984);
    // 10Dq confirmed: Jørgensen's g(Cr3+) = 17 400 cm-1 (Modern Aspects of Ligand Field Theory, 1971, pp. 347–348)
    const aqua = fit({ ion: 'Cr3+', bands: [17400, 24600] });
    expect(aqua.assignments.map((a) => a.label)).toEqual(['4T2g(F)', '4T1g(F)']);
    within(aqua.tenDq, 17400, 0.03);
    within(aqua.b, 725, 0.1);
    expect(aqua.lfse.dq).toBe(-12);
    // from memory: [Cr(NH3)6]3+ 21 550, 28 500 cm-1 → 10Dq = 21 550, B ≈ 657 cm-1 (Lever, 1984);
    // Jørgensen (1971) f(NH3)·g(Cr3+) = 1.25 × 17 400 = 21 750 (an estimate, 0.9 % from 21 550)
    const ammine = fit({ ion: 'Cr(III)', bands: [21550, 28500] });
    within(ammine.tenDq, 21550, 0.03);
    within(ammine.b, 657, 0.1);
  });

  it('d5 high-spin [Mn(H2O)6]2+ from its spin-forbidden quartet bands, C free', () => {
    // from memory: 18 900 (4T1g(G)), 23 100 (4T2g(G)), 25 000 (4A1g,4Eg(G)), 28 000 (4T2g(D)), 29 700 (4Eg(D)) cm-1;
    // 10Dq ≈ 8500 cm-1 (cf. Lever, 1984; Figgis & Hitchman, Ligand Field Theory and Its Applications, 2000).
    // B and C found: Ballhausen's fit of this ion, F2 = 1200 and F4 = 106 cm-1 (quoted on
    // https://www.ppdoc.com/periodical/3f3c46c77bc81eb81e7815cc0f322624.html), gives B = F2 − 5F4 = 670 and C = 35F4 = 3710
    // (Racah's relations, common practice).
    const r = fit({ ion: 'Mn2+', bands: [18900, 23100, 25000, 28000, 29700], freeC: true });
    expect(r.spinState).toBe('high-spin');
    expect(r.groundTerm).toBe('6A1g');
    expect(r.assignments.every((a) => !a.spinAllowed)).toBe(true);
    const byObserved = new Map(r.assignments.map((a) => [a.observed, a]));
    expect(byObserved.get(25000)!.label === '4A1g(G)' || byObserved.get(25000)!.label === '4Eg(G)').toBe(true);
    expect(byObserved.get(29700)!.label).toBe('4Eg(D)');
    within(r.b, 671, 0.1);
    within(r.c, 3710, 0.1);
    // 10Dq of d5 is loosely determined (the quartet energies depend on it only through the 4T levels): 5%.
    within(r.tenDq, 8500, 0.05);
    expect(r.unpairedElectrons).toBe(5);
    expect(r.spinOnlyMoment).toBeCloseTo(5.92, 2); // common practice: √35 μB
  });

  it('d6 low-spin [Co(NH3)6]3+', () => {
    // from memory: 21 050 (1T1g), 29 550 (1T2g) cm-1 → 10Dq ≈ 22 870, B ≈ 615 cm-1 (Lever, 1984);
    // Jørgensen (1971) f(NH3)·g(Co3+) = 1.25 × 18 200 = 22 750 (an estimate, 0.5 % from 22 870)
    const r = fit({ ion: 'Co3+', bands: [21050, 29550] });
    expect(r.spinState).toBe('low-spin');
    expect(r.groundTerm).toBe('1A1g');
    expect(r.assignments.map((a) => a.term)).toEqual(['1T1g', '1T2g']);
    within(r.tenDq, 22870, 0.03);
    within(r.b, 615, 0.1);
    expect(r.unpairedElectrons).toBe(0);
    expect(r.lfse).toMatchObject({ dq: -24, configuration: 't2g^6 eg^0', extraPairs: 2 });
    expect(r.crossover!.fittedDqOverB).toBeGreaterThan(r.crossover!.dqOverB);
  });

  it('d7 high-spin [Co(H2O)6]2+, ν2 (the weak two-electron 4A2g band) not given', () => {
    // from memory: 8 100 (4T2g), 19 400 (4T1g(P)) cm-1 → Dq = 920 (10Dq 9200), B ≈ 825 cm-1 (Lever, 1984);
    // Jørgensen's g(Co2+) = 9 000 cm-1 (1971), the hexaaqua ion's 10Dq in his table: 2 % below 9 200
    // found: aqueous CoCl2·6H2O band at 512 nm = 19 531 cm-1 ("Infrared, mid infrared and UV–visible spectra study of
    // cobalt chloride CoCl2·6H2O", www.iasj.net/iasj/article/131143): differs from 19 400 by +0.7 %
    const r = fit({ ion: 'Co2+', bands: [8100, 19400] });
    expect(r.spinState).toBe('high-spin');
    expect(r.assignments.map((a) => a.label)).toEqual(['4T2g(F)', '4T1g(P)']);
    expect(r.skipped.some((s) => s.label === '4A2g(F)' && /two-electron/.test(s.reason))).toBe(true);
    within(r.tenDq, 9200, 0.03);
    within(r.b, 825, 0.1);
    expect(r.lfse.configuration).toBe('t2g^5 eg^2');
  });

  it('d7 high-spin [Co(H2O)6]2+ with the weak ν2 given takes it as 4A2g', () => {
    // from memory: 8 100, 16 000 (weak shoulder), 19 400 cm-1 (Lever, 1984); 19 400 found within 0.7 % (see above)
    const r = fit({ ion: 'Co2+', bands: [8100, { position: 16000, flags: ['shoulder'] }, 19400] });
    expect(r.assignments.map((a) => a.label)).toEqual(['4T2g(F)', '4A2g(F)', '4T1g(P)']);
    expect(r.status).toBe('converged');
  });

  it('d7 tetrahedral [CoCl4]2-, ν1 in the infrared not given', () => {
    // from memory: ν2 (4A2 → 4T1(F)) ≈ 5 500, ν3 (4A2 → 4T1(P)) ≈ 14 700 cm-1; Δt ≈ 3 200, B ≈ 710 cm-1
    // (Lever, 1984; Cotton, Wilkinson et al., Advanced Inorganic Chemistry). ν2 is a broad spin–orbit multiplet whose
    // quoted maximum varies (5 500–5 800 cm-1), which moves the fitted Δt by about 6%: the check uses 5 500.
    const r = fit({ ion: 'Co2+', geometry: 'tetrahedral', bands: [5500, 14700] });
    expect(r.groundTerm).toBe('4A2');
    expect(r.assignments.map((a) => a.label)).toEqual(['4T1(F)', '4T1(P)']);
    expect(r.skipped[0]).toMatchObject({ label: '4T2(F)' });
    expect(r.skipped[0]!.energy).toBeLessThan(5000);
    within(r.tenDq, 3200, 0.03);
    within(r.b, 710, 0.1);
    expect(r.lfse).toMatchObject({ dq: -12, configuration: 'e^4 t2^3' });
  });

  it('d8 [Ni(H2O)6]2+ and [Ni(NH3)6]2+ from three bands', () => {
    // [Ni(H2O)6]2+ 8 500, 13 800, 25 300 cm-1, found as such in a thesis chapter on Ni(II) spectra
    // (123docz.net/trich-doan/2479124-pho-hap-thu-electron-cua-phuc-chat-ni-ii.htm); 10Dq ≈ 8 500 follows (10Dq = ν1 for
    // d8), B ≈ 930 cm-1 from memory (Lever, 1984);
    // Jørgensen's g(Ni2+) = 8 700 cm-1 (1971), the hexaaqua ion's 10Dq in his table: 2.4 % above 8 500
    const aqua = fit({ ion: 'Ni2+', bands: [8500, 13800, 25300] });
    expect(aqua.assignments.map((a) => a.label)).toEqual(['3T2g(F)', '3T1g(F)', '3T1g(P)']);
    within(aqua.tenDq, 8500, 0.03);
    within(aqua.b, 930, 0.1);
    expect(aqua.status).toBe('converged');
    expect(aqua.uncertainty.b).toBeGreaterThan(0);
    // from memory: [Ni(NH3)6]2+ 10 750, 17 500, 28 200 cm-1 → 10Dq ≈ 10 750, B ≈ 880 cm-1 (Lever, 1984);
    // Jørgensen (1971) f(NH3)·g(Ni2+) = 1.25 × 8 700 = 10 875 (an estimate, 1.2 % from 10 750)
    const ammine = fit({ ion: 'Ni2+', bands: [10750, 17500, 28200] });
    within(ammine.tenDq, 10750, 0.03);
    within(ammine.b, 880, 0.1);
  });

  // Ni2+ in MgO, a measured band list with its published analysis: "Paramagnetic and Optical Spectra of Divalent Nickel in
  // Cubic Crystalline Fields", Phys. Rev. (1958) (W. Low, author from memory), abstract via
  // https://preview.concepedia.online/publication/W4254481442: eight lines at 8600, 13 400, 14 800, 21 550, 24 500, 25 950,
  // 28 300 and 34 500 cm-1, fitted with Dq = 860, E_P = 13 000 (so B ≈ 867), λ = −245 cm-1. The three spin-allowed lines
  // (3T2g, 3T1g(F), 3T1g(P); the abstract does not say which line is which: this reading is common practice for d8).
  const MGO_NI = [8600, 13400, 24500];
  it('d8 Ni2+ in MgO (measured lines): the three spin-allowed bands get the spin-allowed triplet assignment', () => {
    const r = fit({ ion: 'Ni2+', bands: MGO_NI });
    expect(r.assignments.map((a) => a.label)).toEqual(['3T2g(F)', '3T1g(F)', '3T1g(P)']);
    within(r.b, 867, 0.1); // E_P / 15 from the paper's fit
    // 10Dq within 5 %: measured 8 225 (−4.4 %) on this branch, see the 3 % check below.
    within(r.tenDq, 8600, 0.05);
  });
  // The three lines alone do not fit together in the cubic model (rms ≈ 270 cm-1: it puts 3T1g(F) at 14 185 cm-1 at the
  // paper's Dq and B, against the 13 400 line), so the least squares moves 10Dq to 8 225 (−4.4 %, the test above). The
  // paper lists the 14 800 line too: 13 400 and 14 800 are the spin–orbit-mixed 3T1g(F)/1Eg(D) pair, whose barycentre
  // (14 100) is the spin-allowed energy (common practice for Ni(II), the "double band" of its visible spectrum). With
  // the four measured lines the fit reads the pair as one split band and lands on the published Dq and E_P.
  const MGO_NI_LINES = [8600, 13400, 14800, 24500]; // the measured lines of the abstract below 25 000 cm-1 but 21 550 (a singlet)
  it('d8 Ni2+ in MgO, the measured lines with the 13 400/14 800 pair: 10Dq within 3 % of Dq = 860, B within 3 % of E_P/15', () => {
    const r = fit({ ion: 'Ni2+', bands: MGO_NI_LINES });
    within(r.tenDq, 8600, 0.03); // Dq = 860, the paper's fit
    within(r.b, 867, 0.03); // E_P = 13 000 = 15B, the paper's fit
    expect(r.assignments.map((a) => a.label)).toEqual(['3T2g(F)', '3T1g(F)', '3T1g(P)']);
  });

  it('d9 [Cu(H2O)6]2+: 10Dq from the one band, B not determinable', () => {
    // one broad band near 12 500 cm-1 (Lever, 1984, from memory)
    const r = fit({ ion: 'Cu2+', bands: [12500] });
    expect(r.tenDq).toBe(12500);
    expect(r.b).toBeNull();
    expect(r.beta).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/B is not determinable/);
  });
});
