import { describe, expect, it } from 'vitest';
import { predictComplex, type Prediction } from '../../src/series/predict.js';
import { errorOf } from '../helpers/errors.js';


/** Every object with a `value` in the prediction must say it is an estimate and how it was made. */
function expectAllMarked(p: Prediction): void {
  for (const key of ['geometry', 'tenDq', 'beta', 'b', 'c', 'spinState', 'unpairedElectrons', 'groundTerm', 'spinOnlyMoment'] as const) {
    const e = p[key];
    if (e === null) continue;
    expect(e.estimate, key).toBe(true);
    expect(e.method.length, key).toBeGreaterThan(5);
  }
  expect(p.estimate).toBe(true);
}

describe('predictComplex against measured complexes', () => {
  // Tolerance 10%: Jørgensen's factorisation is good to a few per cent (common practice).
  // Caveat: the factor tables were themselves fitted to many complexes; these are checks of the
  // method and of the looked-up tables, not a blind test.
  const measured: [string, number, string][] = [
    ['[Cr(NH3)6]3+', 21550, 'from memory (Lever 1984)'],
    ['[Co(NH3)6]3+', 22870, 'Lever 1984, recalled'],
    ['[Ni(en)3]2+', 11500, 'from memory (Lever 1984)'],
    ['[Rh(NH3)6]3+', 34100, 'from memory (Lever 1984)'],
  ];
  for (const [formula, tenDq, source] of measured) {
    it(`${formula}: 10Dq within 10% of ${tenDq} cm-1 (${source})`, () => {
      const p = predictComplex(formula);
      expect(Math.abs(p.tenDq.value - tenDq) / tenDq).toBeLessThan(0.1);
      expect(p.tenDq.unit).toBe('cm-1');
      expectAllMarked(p);
    });
  }

  it('[Co(NH3)6]3+: B within 10% of the measured 615 cm-1, low-spin, diamagnetic', () => {
    const p = predictComplex('[Co(NH3)6]3+');
    expect(Math.abs((p.b?.value ?? 0) - 615) / 615).toBeLessThan(0.1); // from memory (Lever 1984)
    expect(p.ion).toBe('Co3+');
    expect(p.d).toBe(6);
    expect(p.oxidationState).toBe(3);
    expect(p.ligands.map((l) => [l.key, l.count, l.f])).toEqual([['NH3', 6, 1.25]]); // Jørgensen (1971), pp. 347–348
    expect(p.spinState.value).toBe('low-spin'); // common practice
    expect(p.unpairedElectrons.value).toBe(0);
    expect(p.groundTerm.value).toBe('1A1g');
    expect(p.spinOnlyMoment.value).toBe(0);
  });

  it('spin states of textbook complexes (common practice)', () => {
    const cases: [string, string, number, string][] = [
      ['K3[Fe(CN)6]', 'low-spin', 1, '2T2g'], // common practice
      ['[Fe(H2O)6]3+', 'high-spin', 5, '6A1g'], // common practice
      ['[Mn(H2O)6]SO4', 'high-spin', 5, '6A1g'], // common practice
      ['[Co(CN)6]3-', 'low-spin', 0, '1A1g'], // common practice
      ['[Cr(H2O)6]Cl3', 'no-choice', 3, '4A2g'], // common practice
      ['[CoCl4]2-', 'no-choice', 3, '4A2'], // common practice: tetrahedral Co(II) is 4A2
      ['[Ni(NH3)6]Cl2', 'no-choice', 2, '3A2g'], // common practice
    ];
    for (const [formula, spin, n, ground] of cases) {
      const p = predictComplex(formula);
      expect(p.spinState.value, formula).toBe(spin);
      expect(p.unpairedElectrons.value, formula).toBe(n);
      expect(p.groundTerm.value, formula).toBe(ground);
      expect(p.spinOnlyMoment.value, formula).toBeCloseTo(Math.sqrt(n * (n + 2)), 12);
      expect(p.spinOnlyMoment.unit).toBe('μB');
      expectAllMarked(p);
    }
  });
});

describe('predictComplex: methods', () => {
  it('mixed ligands: the rule of average environment, weighted by coordination positions', () => {
    const p = predictComplex('[Co(en)2Cl2]+');
    expect(p.tenDq.value).toBeCloseTo((18200 * (4 * 1.28 + 2 * 0.78)) / 6, 9);
    expect(p.tenDq.method).toMatch(/rule of average environment/);
    expect(p.beta?.value).toBeCloseTo(1 - 0.35 * ((4 * 1.5 + 2 * 2.0) / 6), 12);
  });

  it('tetrahedral: 4/9 of the octahedral f·g, with a warning', () => {
    const p = predictComplex('[CoCl4]2-');
    expect(p.tenDq.value).toBeCloseTo((4 / 9) * 0.78 * 9000, 9);
    expect(p.warnings.join(' ')).toMatch(/4\/9/);
  });

  it('B and C from β and the free-ion table keep the free-ion C/B', () => {
    const p = predictComplex('[Cr(NH3)6]3+');
    expect(p.beta?.value).toBeCloseTo(1 - 1.4 * 0.21, 12);
    expect(p.b?.value).toBeCloseTo((1 - 1.4 * 0.21) * 918, 9);
    expect((p.c?.value ?? 0) / (p.b?.value ?? 1)).toBeCloseTo(3850 / 918, 12);
    expect(p.sources.join(' ')).toMatch(/Jørgensen.*1971/);
  });

  it("the user's own factors and k win over the tables, and say where they come from", () => {
    const own = predictComplex('[Co(NH3)6]3+', { factors: { NH3: { f: 1.3, h: 1.0, source: 'from your library (2 analyses)' } } });
    expect(own.tenDq.value).toBeCloseTo(1.3 * 18200, 9);
    expect(own.beta?.value).toBeCloseTo(1 - 0.35, 12);
    expect(own.ligands[0]?.fFactor).toMatchObject({ kind: 'user', source: 'f(NH3) from your library (2 analyses)' });
    const co2 = predictComplex('[Co(H2O)6]2+', { k: 0.2 });
    expect(co2.b?.value).toBeCloseTo(0.8 * 1115, 9);
    expect(co2.spinState.value).toBe('high-spin'); // common practice: [Co(H2O)6]2+ is high-spin
  });

  it('4d and 5d ions without a free-ion B0: no B, and the row rule decides', () => {
    const rh = predictComplex('[Rh(NH3)6]3+');
    expect(rh.b).toBeNull();
    expect(rh.spinState.value).toBe('low-spin'); // common practice
    expect(rh.spinDecision).toMatchObject({ decidedBy: 'rule', borderline: false });
    expect(rh.spinDecision.rule?.id).toBe('row-2-3-low-spin');
  });

  it('the geometry override reaches square planar, and a square-planar d8 is diamagnetic', () => {
    const p = predictComplex('[Ni(NH3)4]2+', { geometry: 'square-planar' });
    expect(p.geometry).toMatchObject({ value: 'square-planar', method: 'given by the user' });
    expect(p.unpairedElectrons.value).toBe(0); // common practice: square-planar d8 is diamagnetic
    expect(p.occupation.sets.map((s) => [s.name, s.electrons])).toEqual([['xz,yz', 4], ['z2', 2], ['xy', 2], ['x2-y2', 0]]);
    const tet = predictComplex('[Ni(NH3)4]2+');
    expect(tet.geometry.value).toBe('tetrahedral');
    expect(tet.warnings.join(' ')).toMatch(/often square planar; tetrahedral assumed \(override with --geometry square-planar\)/);
  });
});

describe('predictComplex: errors', () => {
  it('names a missing geometry and formula errors', () => {
    const geometry = errorOf(() => predictComplex('[Ag(NH3)2]+'));
    expect(geometry.path).toBe('geometry');
    expect(geometry.message).toMatch(/coordination number 2 of \[Ag\(NH3\)2\]\+: give the geometry/);
    expect(errorOf(() => predictComplex('[Co(NH3)6')).code).toBe('parse-error');
  });
});
