/**
 * The hard cases of issue 13 (the fit half): published band sets that the
 * cm-1 penalties got wrong, visible-only band sets, and honesty when the bands
 * cannot fix a parameter. Band maxima and parameters are recalled, not read:
 * each line says "from memory" and names where they are usually quoted from.
 * The search tool was asked for them (hexaaqua Mn(II), [NiCl4]2-): it found
 * the studies (e.g. Koplitz, Kim & McClure, "Temperature dependence of 10Dq
 * for aqueous hexaaquomanganese(II)") but not their numbers. Band maxima it
 * found later for other ions are cited beside them (docs/sources.md).
 *
 * Each check fails on a wrong assignment or a wrong root: those move 10Dq or
 * B by far more than the tolerances.
 */
import { describe, expect, it } from 'vitest';
import { fitBands, type FitInput, type FitResult } from '../../src/fit/index.js';

function within(actual: number | null, expected: number, fraction: number): void {
  expect(actual).not.toBeNull();
  expect(Math.abs(actual! - expected) / expected).toBeLessThanOrEqual(fraction);
}

/** The probabilities of a result add up: the chosen one, its alternatives (a subset) and the spin states. */
function probabilitiesAddUp(r: FitResult): void {
  expect(r.probability).toBeGreaterThan(0);
  expect(r.probability + r.alternatives.reduce((s, a) => s + a.probability, 0)).toBeLessThanOrEqual(1 + 1e-3);
  const states = Object.values(r.spinStateProbabilities);
  expect(states.reduce((s, v) => s + (v ?? 0), 0)).toBeCloseTo(1, 3);
  for (const a of r.alternatives) expect(a.probability).toBeLessThanOrEqual(r.probability);
}

// from memory: [Mn(H2O)6]2+ quartet bands 18 900 (4T1g(G)), 23 100 (4T2g(G)), 25 000 (4A1g,4Eg(G)), 28 000 (4T2g(D)),
// 29 700 (4Eg(D)) cm-1; the analysis gives 10Dq ≈ 8 500, B ≈ 671, C ≈ 3 710 cm-1 (Heidt, Koster & Johnson, "Experimental and
// crystal field study of the absorption spectrum of manganous perchlorate", J. Am. Chem. Soc. 1958; quoted in Lever,
// Inorganic Electronic Spectroscopy, 2nd ed., 1984). B and C found: Ballhausen's F2 = 1200, F4 = 106 cm-1 for this ion
// (quoted on https://www.ppdoc.com/periodical/3f3c46c77bc81eb81e7815cc0f322624.html) give B = F2 − 5F4 = 670, C = 35F4 = 3710.
const MN_AQUA = [18900, 23100, 25000, 28000, 29700];
const MN_TEN_DQ = 8500;

describe('hexaaqua Mn(II): every band spin-forbidden', () => {
  const cases: Array<[string, FitInput]> = [
    ['unflagged', { ion: 'Mn2+', bands: MN_AQUA }],
    ['flagged :sf', { ion: 'Mn2+', bands: MN_AQUA.map((p) => `${p}:sf`).join(',') }],
    ['unflagged, --free-c', { ion: 'Mn2+', bands: MN_AQUA, freeC: true }],
    ['flagged :sf, --free-c', { ion: 'Mn2+', bands: MN_AQUA.map((p) => `${p}:sf`).join(','), freeC: true }],
  ];
  it.each(cases)('%s: 10Dq within 3% of the published analysis, every band explained, high-spin', (_name, input) => {
    const r = fitBands(input);
    within(r.tenDq, MN_TEN_DQ, 0.03);
    expect(r.assignments.length).toBe(5);
    expect(r.unassigned).toEqual([]);
    expect(r.spinState).toBe('high-spin');
    expect(r.spinStateProbabilities['high-spin']).toBeGreaterThan(0.99);
    // C/B is estimated (asked for, or because five bands fit the free ion's 3.46 poorly): near the published 5.5.
    expect(r.cMode).toBe('free');
    expect(r.cOverB!).toBeGreaterThan(4.5);
    probabilitiesAddUp(r);
  });

  it('flagging the bands :sf, the honest flag, gives the same answer as leaving them unflagged', () => {
    const plain = fitBands({ ion: 'Mn2+', bands: MN_AQUA });
    const flagged = fitBands({ ion: 'Mn2+', bands: MN_AQUA.map((p) => `${p}:sf`).join(',') });
    expect(flagged.tenDq).toBe(plain.tenDq);
    expect(flagged.b).toBe(plain.b);
  });
});

describe('tetrahedral [NiCl4]2-', () => {
  // from memory: ν2 (3T1(F) → 3A2) ≈ 7 550 and ν3 (3T1(F) → 3T1(P)) ≈ 14 250 cm-1, ν1 in the infrared not measured;
  // the analysis gives 10Dq ≈ 4 100 cm-1 (Gill & Nyholm, J. Chem. Soc. 1959; quoted in Lever, Inorganic Electronic
  // Spectroscopy, 2nd ed., 1984).
  it('gives 10Dq within 3% of the published analysis, as tetrahedral or from its formula', () => {
    const byGeometry = fitBands({ ion: 'Ni2+', geometry: 'tetrahedral', bands: [7550, 14250] });
    within(byGeometry.tenDq, 4100, 0.03);
    expect(byGeometry.assignments.map((a) => a.label)).toEqual(['3A2(F)', '3T1(P)']);
    const byFormula = fitBands({ formula: '[NiCl4]2-', bands: [7550, 14250] });
    expect(byFormula.geometry).toBe('tetrahedral');
    within(byFormula.tenDq, 4100, 0.03);
    expect(byFormula.ligands).toEqual(['Cl']);
    expect(byFormula.notes.join(' ')).toMatch(/geometry tetrahedral guessed/);
  });

  it('does not call 3T1(P), the strong visible band, two-electron', () => {
    const r = fitBands({ ion: 'Ni2+', geometry: 'tetrahedral', bands: [7550, 14250] });
    expect(r.predicted.find((p) => p.label === '3T1(P)')!.twoElectron).toBe(false);
  });
});

describe('hexaaqua Co(II) is high-spin', () => {
  it('from its near-infrared and visible bands', () => {
    // from memory: 8 100 (4T2g), 19 400 (4T1g(P)) cm-1 (Lever, Inorganic Electronic Spectroscopy, 2nd ed., 1984); found
    // 512 nm = 19 531 (+0.7 %, docs/sources.md CO-AQUA-IASJ)
    const r = fitBands({ ion: 'Co2+', bands: [8100, 19400] });
    expect(r.spinState).toBe('high-spin');
    expect(r.spinStateProbabilities['high-spin']).toBeGreaterThan(0.9);
    probabilitiesAddUp(r);
  });

  it('from a visible-only band with its shoulder (380–780 nm), with and without the formula', () => {
    // from memory: the visible band near 19 400 cm-1 (515 nm) with a shoulder near 21 550 cm-1 (Lever, 1984); 380–780 nm window
    for (const extra of [{}, { formula: '[Co(H2O)6]2+' }]) {
      const r = fitBands({ ion: 'Co2+', bands: '19400, 21550:sh', window: { min: 1e7 / 780, max: 1e7 / 380 }, ...extra });
      expect(r.spinState).toBe('high-spin');
      expect(r.spinStateProbabilities['high-spin']).toBeGreaterThan(0.9);
      // The published 10Dq is about 9 300 cm-1 (Lever, 1984, from memory; Jørgensen's g(Co2+) = 9 000 cm-1, the hexaaqua
      // ion's 10Dq in Modern Aspects of Ligand Field Theory, 1971, pp. 347–348): a low-spin reading would give about 20 000.
      expect(r.tenDq).toBeLessThan(12_000);
    }
  });

  it('keeps 4A2g, which has no one-electron partner of its symmetry, as the weak two-electron band', () => {
    const r = fitBands({ ion: 'Co2+', bands: [8100, 19400] });
    expect(r.predicted.find((p) => p.label === '4A2g(F)')!.twoElectron).toBe(true);
    expect(r.predicted.find((p) => p.label === '4T1g(P)')!.twoElectron).toBe(false);
  });
});

describe('hexaaqua Ni(II) from its two visible bands', () => {
  // 13 800 (3T1g(F)) and 25 300 (3T1g(P)) cm-1, ν1 = 10Dq ≈ 8 500 cm-1 lies beyond 780 nm (found: all three in a thesis
  // chapter on Ni(II) spectra, 123docz.net/trich-doan/2479124, docs/sources.md NI-AQUA-VN). From the two visible bands
  // alone, Underhill & Billing's equations (Nature 210 (1966) 834, found; see tests/ligand-field/closed-forms.test.ts)
  // give Dq = 824 and B = 958 cm-1 (worked here: 340Dq² − 18·39 100·Dq + 13 800·25 300 = 0, lower root), 10Dq = 8 240.
  it('gives 10Dq 8 000–9 000 cm-1 and β < 1, with or without the measured range', () => {
    for (const window of [undefined, { min: 1e7 / 780, max: 1e7 / 380 }]) {
      const r = fitBands({ ion: 'Ni2+', bands: [13800, 25300], ...(window ? { window } : {}) });
      expect(r.assignments.map((a) => a.label)).toEqual(['3T1g(F)', '3T1g(P)']);
      expect(r.tenDq).toBeGreaterThanOrEqual(8000);
      expect(r.tenDq).toBeLessThanOrEqual(9000);
      expect(r.beta!).toBeLessThan(1);
      // β > 0.35: not the second root of the two equations (β ≈ 0.1), which the β prior rules out.
      expect(r.beta!).toBeGreaterThan(0.35);
      expect(r.predicted.find((p) => p.label === '3T1g(P)')!.twoElectron).toBe(false);
    }
  });

  it('says ν1 lies outside the measured range instead of charging for it', () => {
    const r = fitBands({ ion: 'Ni2+', bands: [13800, 25300], window: { min: 1e7 / 780, max: 1e7 / 380 } });
    expect(r.skipped.find((s) => s.label === '3T2g(F)')!.reason).toMatch(/outside the measured range/);
    expect(r.penalties.filter((p) => p.rule === 'skipped-transition')).toEqual([]);
    expect(r.window).toEqual({ min: 1e7 / 780, max: 1e7 / 380 });
  });

  it('a strong transition predicted inside the measured range with no band costs the assignment that skips it', () => {
    // 3T1g(F) and 3T1g(P) taken as ν1 and ν2 would predict ν3 inside the window, where no band is.
    const r = fitBands({ ion: 'Ni2+', bands: [13800, 25300], window: { min: 1e7 / 780, max: 1e7 / 380 } }, { maxAlternatives: 10 });
    for (const alt of r.alternatives) expect(alt.score).toBeGreaterThan(r.score);
  });
});

describe('tetrahedral Co(II)', () => {
  it('B is not high: within 5% of the published analysis', () => {
    // from memory: [CoCl4]2- ν2 ≈ 5 500, ν3 ≈ 14 700 cm-1 → Δt ≈ 3 200, B ≈ 710 cm-1 (Lever, 1984; Cotton & Wilkinson)
    const r = fitBands({ ion: 'Co2+', geometry: 'tetrahedral', bands: '5500:e=60, 14700:e=600' });
    within(r.b, 710, 0.05);
    within(r.tenDq, 3200, 0.03);
    expect(r.assignments.every((a) => a.spinAllowed)).toBe(true);
    expect(r.predicted.find((p) => p.label === '4T1(P)')!.twoElectron).toBe(false);
    // ε 60 and 600 are typical of tetrahedral spin-allowed bands: no intensity term worth a warning.
    expect(r.penalties.filter((p) => p.rule === 'intensity' && p.amount > 4)).toEqual([]);
  });
});

describe('honest when the bands cannot fix a parameter', () => {
  it('C free with no C-sensitive band: C fixed at its prior, said so, never a huge uncertainty', () => {
    // d8 octahedral triplets depend on Dq and B only (common practice: the Tanabe–Sugano triplet levels of d8).
    const r = fitBands({ ion: 'Ni2+', bands: [8500, 13800, 25300], freeC: true });
    expect(r.cMode).toBe('ratio');
    expect(r.undetermined.map((u) => u.parameter)).toEqual(['c']);
    expect(r.undetermined[0]!.action).toMatch(/C\/B fixed at 4\.64/);
    expect(r.warnings.join(' ')).toMatch(/C is not determined by these bands/);
    expect(r.uncertainty.c!).toBeLessThan(0.1 * r.c!);
  });

  it('a parameter whose uncertainty is as large as itself is listed as not fixed, with a warning', () => {
    // Not an outside check: the Cr(III) aqua maxima (Lever 1984, from memory) given with a σ of 3 000 cm-1 each.
    const r = fitBands({ ion: 'Cr3+', bands: '17400±3000, 24600±3000' });
    expect(r.uncertainty.b!).toBeGreaterThan(0.5 * r.b!);
    expect(r.undetermined.map((u) => u.parameter)).toContain('b');
    expect(r.warnings.join(' ')).toMatch(/B = \d+ cm-1 is not determined by these bands/);
    // The same maxima with the default σ fix B well: nothing listed.
    expect(fitBands({ ion: 'Cr3+', bands: [17400, 24600] }).undetermined).toEqual([]);
  });

  it('one band: 10Dq only, B not reported and listed as undetermined', () => {
    const r = fitBands({ ion: 'Cu2+', bands: [12500] });
    expect(r.b).toBeNull();
    expect(r.undetermined.map((u) => u.parameter)).toEqual(['b']);
  });

  it('a free C that the bands fix only loosely is not reported as fitted', () => {
    // Three V3+ bands where only ν3 depends on C weakly: C either fixed at its prior or fitted with σ(C) < 25% of C.
    const r = fitBands({ ion: 'V3+', bands: [17800, 25700, 38000], freeC: true });
    if (r.cMode === 'free') expect(r.uncertainty.c!).toBeLessThan(0.25 * r.c!);
    else expect(r.undetermined.some((u) => u.parameter === 'c')).toBe(true);
  });
});

describe('ligand priors', () => {
  it('give the Jørgensen expectation and name it', () => {
    // Jørgensen's f(H2O) = 1, g(Ni2+) = 8 700 cm-1 (Modern Aspects of Ligand Field Theory, 1971, pp. 347–348, looked up:
    // see src/chemistry/jorgensen.ts)
    const r = fitBands({ ion: 'Ni2+', bands: [13800, 25300], ligands: 'H2O' });
    expect(r.ligands).toEqual(['H2O']);
    const tenDq = r.penalties.find((p) => p.rule === 'ten-dq');
    if (tenDq) expect(tenDq.detail).toMatch(/against 8700 expected from the ligands/);
    expect(r.tenDq).toBeGreaterThanOrEqual(8000);
  });

  it('reject a ligand they do not know, naming it', () => {
    expect(() => fitBands({ ion: 'Ni2+', bands: [13800, 25300], ligands: 'H2O,foo' })).toThrow(/ligand 2 \("foo"\)/);
    expect(() => fitBands({ ion: 'Cr3+', formula: '[Co(H2O)6]2+', bands: [17400, 24600] })).toThrow(/Co2\+, but the ion given is Cr3\+/);
  });
});

describe('a window reaching into the near UV', () => {
  it('does not let the many unseen doublets of low-spin d7 out-score the right spin state', () => {
    // Not an outside check: bands of the project's own engine for low-spin d7 at Dq = 2139, B = 670, C/B = 4.5
    // (2T1g(G), 2T2g(G), 2T1g(P) at 19 278, 19 956, 23 805 cm-1, rounded as a band finder reports them).
    const bands = '19400, 20000, 23800';
    const without = fitBands({ ion: 'Co2+', bands });
    const withWindow = fitBands({ ion: 'Co2+', bands, window: { min: 1e7 / 1100, max: 1e7 / 200 } });
    expect(without.spinState).toBe('low-spin');
    expect(withWindow.spinState).toBe('low-spin');
    expect(withWindow.spinStateProbabilities['low-spin']).toBeGreaterThan(0.5);
    // Only the lowest strong transition missing above the highest band is charged (a charge-transfer tail may hide it).
    expect(withWindow.penalties.filter((p) => p.rule === 'skipped-transition').length).toBeLessThanOrEqual(1);
  });
});
