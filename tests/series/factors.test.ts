import { describe, expect, it } from 'vitest';
import { combine, fitLigandFactors } from '../../src/series/factors.js';
import { averageEnvironmentFactor, averageEnvironmentTenDq } from '../../src/series/average-environment.js';
import { jorgensenF, jorgensenG } from '../../src/chemistry/jorgensen.js';
import { parseIon } from '../../src/chemistry/ions.js';

describe('fitLigandFactors', () => {
  it('f(NH3) fitted on Cr(III) predicts [Ni(NH3)6]2+ and [Co(NH3)6]3+, which were not fitted, within 10%', () => {
    const fit = fitLigandFactors([
      { sample: '[Cr(NH3)6]3+', ligand: 'NH3', ion: 'Cr3+', tenDq: 21550, tenDqUncertainty: 200 }, // from memory (Lever 1984)
    ]);
    const nh3 = fit.factors.find((f) => f.ligand === 'NH3');
    expect(nh3?.f).toBeCloseTo(21550 / 17400, 12);
    expect(nh3?.fUncertainty).toBeCloseTo(200 / 17400, 12);
    expect(nh3?.tabulatedF).toBe(1.25);
    const f = nh3?.f ?? Number.NaN;
    // Tolerance 10%: the factorisation is good to a few per cent (common practice).
    const ni = f * (jorgensenG(parseIon('Ni2+')) as number);
    expect(Math.abs(ni - 10750) / 10750).toBeLessThan(0.1); // [Ni(NH3)6]2+ 10Dq = 10 750 cm-1 (Lever 1984, recalled)
    const co = f * (jorgensenG(parseIon('Co3+')) as number);
    expect(Math.abs(co - 22870) / 22870).toBeLessThan(0.1); // [Co(NH3)6]3+ 10Dq ≈ 22 870 cm-1 (Lever 1984, recalled)
  });

  it('averages several analyses of one ligand by inverse variance and fits h', () => {
    const fit = fitLigandFactors(
      [
        { sample: 'A', ligand: 'L1', tenDq: 17000, tenDqUncertainty: 100, beta: 0.8, betaUncertainty: 0.01 },
        { sample: 'B', ligand: 'L1', tenDq: 17400, tenDqUncertainty: 200, beta: 0.78, betaUncertainty: 0.02 },
      ],
      { ion: 'Cr3+' },
    );
    const l1 = fit.factors[0]!;
    const w1 = 1 / 100 ** 2;
    const w2 = 1 / 200 ** 2;
    expect(l1.f).toBeCloseTo((w1 * 17000 + w2 * 17400) / (w1 + w2) / 17400, 12);
    expect(l1.fUncertainty).toBeCloseTo(1 / Math.sqrt(w1 + w2) / 17400, 12);
    expect(l1.fFrom).toEqual([0, 1]);
    const v1 = 1 / 0.01 ** 2;
    const v2 = 1 / 0.02 ** 2;
    expect(l1.h).toBeCloseTo((v1 * 0.2 + v2 * 0.22) / (v1 + v2) / 0.21, 12); // k(Cr3+) = 0.21: Jørgensen, Modern Aspects of Ligand Field Theory (1971)
    expect(l1.tabulatedF).toBeUndefined();
  });

  it('recovers an unknown ligand from a mixed complex by the rule of average environment (round trip)', () => {
    const g = 18200;
    const fX = 1.11;
    const fNH3 = jorgensenF('NH3') as number;
    const tenDq = averageEnvironmentTenDq([{ factor: fNH3, positions: 4 }, { factor: fX, positions: 2 }], g);
    const fit = fitLigandFactors([
      { sample: 'mix', ion: 'Co3+', ligands: [{ ligand: 'NH3', count: 4 }, { ligand: 'X', count: 2 }], tenDq },
    ]);
    expect(fit.factors).toHaveLength(1);
    expect(fit.factors[0]!.ligand).toBe('X');
    expect(fit.factors[0]!.f).toBeCloseTo(fX, 12);
  });

  it('counts coordination positions of chelates', () => {
    const tenDq = averageEnvironmentTenDq([{ factor: 1.28, positions: 4 }, { factor: 0.9, positions: 2 }], 17400);
    const fit = fitLigandFactors([{ sample: 'cis', ion: 'Cr3+', ligands: [{ ligand: 'en', count: 2 }, { ligand: 'Y', count: 2 }], tenDq }]);
    expect(fit.factors[0]!.f).toBeCloseTo(0.9, 12);
  });

  it('notes analyses that give nothing and errors without g', () => {
    const fit = fitLigandFactors([
      { sample: 'all known', ion: 'Cr3+', ligands: [{ ligand: 'NH3', count: 5 }, { ligand: 'Cl', count: 1 }], tenDq: 19000 },
      { sample: 'two unknown', ion: 'Cr3+', ligands: [{ ligand: 'P', count: 3 }, { ligand: 'Q', count: 3 }], tenDq: 19000 },
    ]);
    expect(fit.factors).toEqual([]);
    expect(fit.notes).toEqual([
      'analyses[0] (all known): every ligand already has an f: gives no f',
      'analyses[1] (two unknown): more than one ligand without an f: gives no f',
    ]);
    expect(() => fitLigandFactors([{ sample: 'a', ligand: 'F', tenDq: 1, ion: 'Cu2+' }])).toThrow(/no tabulated g for Cu2\+/);
    expect(() => fitLigandFactors([{ sample: 'a', ligand: 'F', tenDq: 1 }])).toThrow(/name the metal ion/);
    expect(fitLigandFactors([{ sample: 'a', ligand: 'F', tenDq: 9000, ion: 'Cu2+' }], { g: 12000 }).factors[0]!.f).toBeCloseTo(0.75, 12);
  });
});

describe('combine and the average environment', () => {
  it('equal uncertainties: the plain mean and σ/√n', () => {
    const c = combine([{ value: 1, sigma: 2 }, { value: 3, sigma: 2 }, { value: 5, sigma: 2 }, { value: 7, sigma: 2 }]);
    expect(c.value).toBeCloseTo(4, 12);
    expect(c.sigma).toBeCloseTo(1, 12);
  });
  it('without uncertainties: the standard deviation of the mean', () => {
    const c = combine([{ value: 1, sigma: undefined }, { value: 3, sigma: undefined }]);
    expect(c.value).toBe(2);
    expect(c.sigma).toBeCloseTo(1, 12);
    expect(combine([{ value: 1, sigma: undefined }]).sigma).toBeUndefined();
  });
  it('a homoleptic environment gives the ligand factor itself; weights are positions', () => {
    expect(averageEnvironmentFactor([{ factor: 1.25, positions: 6 }])).toBe(1.25);
    expect(averageEnvironmentFactor([{ factor: 1, positions: 3 }, { factor: 2, positions: 3 }])).toBe(1.5);
    expect(averageEnvironmentFactor([])).toBeNaN();
  });
});
