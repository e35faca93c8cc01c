import { describe, expect, it } from 'vitest';
import { predictComplex } from '../../src/series/predict.js';

/**
 * The complexes of issue 14's "Done when": d-count, spin state and unpaired
 * electrons as every inorganic textbook gives them. Each row names its source
 * on the line; "common practice" is the textbook consensus with no single source.
 * 'no-choice' means d^n has one spin state in that geometry.
 */
type Row = [formula: string, d: number, spin: 'high-spin' | 'low-spin' | 'no-choice', unpaired: number, geometry: string];
const TEXTBOOK: Row[] = [
  ['[Fe(H2O)6]2+', 6, 'high-spin', 4, 'octahedral'], // common practice
  ['[Fe(CN)6]4-', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[CoF6]3-', 6, 'high-spin', 4, 'octahedral'], // common practice: the textbook high-spin Co(III)
  ['K3[CoF6]', 6, 'high-spin', 4, 'octahedral'], // common practice
  ['[Co(NH3)6]3+', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[Co(NO2)6]3-', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[CoI6]3-', 6, 'high-spin', 4, 'octahedral'], // common practice: iodide weakest field
  ['[CrI6]3-', 3, 'no-choice', 3, 'octahedral'], // common practice
  ['[Cu(en)2(H2O)2]2+', 9, 'no-choice', 1, 'octahedral'], // common practice
  ['[Mn(CN)6]3-', 4, 'low-spin', 2, 'octahedral'], // common practice
  ['[Mn(H2O)6]2+', 5, 'high-spin', 5, 'octahedral'], // common practice
  ['[Fe(H2O)6]3+', 5, 'high-spin', 5, 'octahedral'], // common practice
  ['[Fe(CN)6]3-', 5, 'low-spin', 1, 'octahedral'], // common practice
  ['[Ni(CN)4]2-', 8, 'low-spin', 0, 'square-planar'], // common practice: square planar, diamagnetic
  ['[NiCl4]2-', 8, 'no-choice', 2, 'tetrahedral'], // common practice: tetrahedral, paramagnetic
  ['[PtCl4]2-', 8, 'low-spin', 0, 'square-planar'], // common practice
  ['[Co(H2O)6]2+', 7, 'high-spin', 3, 'octahedral'], // common practice
  ['[CoCl4]2-', 7, 'no-choice', 3, 'tetrahedral'], // common practice
  ['Cr(CO)6', 6, 'low-spin', 0, 'octahedral'], // common practice: Cr(0), diamagnetic
  ['[Fe(phen)3]2+', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[Ru(NH3)6]2+', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[Cr(H2O)6]2+', 4, 'high-spin', 4, 'octahedral'], // common practice
  ['[Mn(H2O)6]3+', 4, 'high-spin', 4, 'octahedral'], // common practice
  ['[TiF6]2-', 0, 'no-choice', 0, 'octahedral'], // common practice: d0
  ['[Ti(H2O)6]3+', 1, 'no-choice', 1, 'octahedral'], // common practice: d1
  ['[V(H2O)6]3+', 2, 'no-choice', 2, 'octahedral'], // common practice: d2
  ['[Zn(H2O)6]2+', 10, 'no-choice', 0, 'octahedral'], // common practice: d10
  ['[Cu(CN)4]3-', 10, 'no-choice', 0, 'tetrahedral'], // common practice: d10 Cu(I)
  // Beyond the list:
  ['[Cu(NH3)4]2+', 9, 'no-choice', 1, 'square-planar'], // common practice
  ['[Mn(acac)3]', 4, 'high-spin', 4, 'octahedral'], // common practice: the Jahn–Teller example
  ['[Co(H2O)6]3+', 6, 'low-spin', 0, 'octahedral'], // common practice: the aqua exception
  ['[Co(bpy)3]2+', 7, 'high-spin', 3, 'octahedral'], // common practice
  ['[Fe(bpy)3]2+', 6, 'low-spin', 0, 'octahedral'], // common practice
  ['[FeCl4]-', 5, 'high-spin', 5, 'tetrahedral'], // common practice
  ['[IrCl6]2-', 5, 'low-spin', 1, 'octahedral'], // common practice
  ['[Ni(dtc)2]', 8, 'low-spin', 0, 'square-planar'], // common practice: Ni(S2CNEt2)2 diamagnetic
  ['[Ni(PPh3)2Cl2]', 8, 'no-choice', 2, 'tetrahedral'], // common practice: the paramagnetic tetrahedral isomer
];

describe('textbook complexes: d-count, spin state, unpaired electrons', () => {
  for (const [formula, d, spin, unpaired, geometry] of TEXTBOOK) {
    it(`${formula}: d${d}, ${spin}, ${unpaired} unpaired, ${geometry}`, () => {
      const p = predictComplex(formula);
      expect(p.d).toBe(d);
      expect(p.spinState.value).toBe(spin);
      expect(p.unpairedElectrons.value).toBe(unpaired);
      expect(p.occupation.unpairedElectrons).toBe(unpaired);
      expect(p.geometry.value).toBe(geometry);
      expect(p.spinOnlyMoment.value).toBeCloseTo(Math.sqrt(unpaired * (unpaired + 2)), 12);
      // Every estimate carries an uncertainty and every factor a source.
      expect(p.tenDq.uncertainty).toBeGreaterThan(0);
      if (p.b) expect(p.b.uncertainty).toBeGreaterThan(0);
      for (const l of p.ligands) {
        expect(l.fFactor.source.length, l.key).toBeGreaterThan(10);
        expect(l.fFactor.uncertainty, l.key).toBeGreaterThan(0);
        expect(l.hFactor.source.length, l.key).toBeGreaterThan(10);
      }
      expect(p.metalFactors.g.source.length).toBeGreaterThan(10);
      expect(p.sources.length).toBeGreaterThan(0);
    });
  }

  it('ground terms of some of them', () => {
    const terms: [string, string][] = [
      ['[Fe(H2O)6]2+', '5T2g'], // common practice
      ['[Fe(CN)6]3-', '2T2g'], // common practice
      ['[Mn(CN)6]3-', '3T1g'], // common practice
      ['[Cr(H2O)6]2+', '5Eg'], // common practice
      ['[NiCl4]2-', '3T1'], // common practice: tetrahedral Ni(II) 3T1(F)
      ['[Co(H2O)6]2+', '4T1g'], // common practice
    ];
    for (const [formula, term] of terms) expect(predictComplex(formula).groundTerm.value, formula).toBe(term);
  });
});

describe('the decision and its margin', () => {
  it('names the rule that decided, and lets the numbers decide where no rule applies', () => {
    expect(predictComplex('[PtCl4]2-').geometryRule?.id).toBe('square-planar-d8-heavy');
    expect(predictComplex('[Ni(CN)4]2-').geometryRule?.id).toBe('square-planar-d8-strong-field');
    expect(predictComplex('[NiCl4]2-').geometryRule?.id).toBe('tetrahedral-halide-M2');
    expect(predictComplex('[Fe(CN)6]4-').spinDecision.rule?.id).toBe('cyanide-carbonyl-strong-field');
    expect(predictComplex('[CoF6]3-').spinDecision.rule?.id).toBe('halide-weak-field');
    expect(predictComplex('[Ru(NH3)6]2+').spinDecision.rule?.id).toBe('row-2-3-low-spin');
    const numbers = predictComplex('[Co(NH3)6]3+').spinDecision;
    expect(numbers.decidedBy).toBe('numbers');
    expect(numbers.numbers?.probabilities.lowSpin).toBeGreaterThan(0.99);
    expect(numbers.borderline).toBe(false);
  });

  it('borderline says so: g placed so that 10Dq sits on the crossover', () => {
    // Internal consistency, not an outside check: the crossover is the engine's own.
    const probe = predictComplex('[Fe(NH3)6]2+');
    const crossover = probe.spinDecision.numbers?.crossoverTenDq as number;
    const p = predictComplex('[Fe(NH3)6]2+', { g: crossover / 1.25 });
    expect(p.spinDecision.decidedBy).toBe('numbers');
    expect(p.spinDecision.borderline).toBe(true);
    expect(p.spinDecision.numbers?.probabilities.lowSpin).toBeCloseTo(0.5, 6);
    expect(p.spinDecision.summary).toMatch(/^borderline/);
    expect(p.warnings.join(' ')).toMatch(/borderline spin state/);
  });

  it('the probability follows ln(10Dq / crossover) / σ through Φ', () => {
    const n = predictComplex('[Fe(acac)3]').spinDecision.numbers;
    expect(n).not.toBeNull();
    const z = Math.log(n!.tenDq / n!.crossoverTenDq) / n!.sigmaLog;
    expect(n!.margin).toBeCloseTo(z, 12);
    expect(n!.probabilities.lowSpin + n!.probabilities.highSpin).toBeCloseTo(1, 12);
  });

  it('shows why: occupation, LFSE, pairing energy beside 10Dq, orbital contribution', () => {
    const co = predictComplex('[Co(NH3)6]3+');
    expect(co.occupation.configuration).toBe('t2g^6 eg^0');
    expect(co.lfse.deltaUnits).toBeCloseTo(-2.4, 12); // common practice: low-spin d6 LFSE = −2.4 Δo
    expect(co.spinDecision.numbers?.pairingEnergy?.expression).toBe('2.5B + 4C'); // Griffith (1961), from memory
    const fe = predictComplex('[Fe(H2O)6]2+');
    expect(fe.occupation.configuration).toBe('t2g^4 eg^2');
    expect(fe.lfse.deltaUnits).toBeCloseTo(-0.4, 12); // common practice: high-spin d6 LFSE = −0.4 Δo
    expect(fe.orbitalContribution.expected).toBe(true); // common practice: 5T2g ground term
    expect(predictComplex('[Ni(NH3)6]2+').orbitalContribution.expected).toBe(false); // common practice: 3A2g
    expect(predictComplex('[CoCl4]2-').orbitalContribution.expected).toBe(false); // common practice: 4A2
  });

  it('estimated factors say so', () => {
    const p = predictComplex('[CoI6]3-');
    expect(p.ligands[0]?.fFactor.kind).toBe('estimate');
    expect(p.ligands[0]?.fFactor.source).toMatch(/estimate from the spectrochemical series, wide uncertainty/);
    const nitrito = predictComplex('[Co(ONO)6]3-').ligands[0]!;
    const nitro = predictComplex('[Co(NO2)6]3-').ligands[0]!;
    expect(nitro.fFactor.kind).toBe('published');
    expect(nitrito.f).toBeLessThan(nitro.f); // common practice: nitrito-O is weaker field than nitro-N
  });
});
