import { describe, expect, it } from 'vitest';
import { condonShortleyCk } from '../../src/ligand-field/gaunt.js';
import { wigner3j } from '../../src/ligand-field/wigner3j.js';

describe('Wigner 3j by the Racah formula', () => {
  it('known values', () => {
    expect(wigner3j(2, 2, 2, 0, 0, 0)).toBeCloseTo(-Math.sqrt(2 / 35), 14); // Edmonds, Angular Momentum in Quantum Mechanics (1957), closed form for (j1 j2 j3; 0 0 0) (recalled), by hand: −√(2!·2!·2!/7!)·3!/(1!·1!·1!); outside values: the SymPy checks below
    expect(wigner3j(1, 1, 0, 0, 0, 0)).toBeCloseTo(-1 / Math.sqrt(3), 14); // (j j 0; m −m 0) = (−1)^(j−m)/√(2j+1), common practice
    expect(wigner3j(2, 2, 0, 1, -1, 0)).toBeCloseTo(-1 / Math.sqrt(5), 14); // same closed form
    expect(wigner3j(2, 2, 4, 0, 0, 0)).toBeCloseTo(Math.sqrt(2 / 35), 14); // Edmonds (1957) closed form for (j1 j2 j3; 0 0 0), evaluated by hand: √(4!·4!/9!)·4!/(2!·2!)
  });

  it('agrees with values from SymPy (a general-purpose library used as reference)', () => {
    // sympy.physics.wigner.wigner_3j docstring: wigner_3j(2, 6, 4, 0, 0, 0) = sqrt(715)/143
    // (github.com/sympy/sympy, sympy/physics/wigner.py; found via the search tool).
    expect(wigner3j(2, 6, 4, 0, 0, 0)).toBeCloseTo(Math.sqrt(715) / 143, 14);
    // sympy/physics/tests/test_clebsch_gordan.py: ⟨2 2; 2 1|3 3⟩ = 1/√2, ⟨1 1; 1 0|2 1⟩ = 1/√2, ⟨1 1; 0 1|1 1⟩ = −1/√2,
    // ⟨2 2; 2 2|4 4⟩ = 1, turned into 3j symbols by (j1 j2 J; m1 m2 −M) = (−1)^(j1−j2+M) ⟨j1 m1 j2 m2|J M⟩/√(2J+1)
    // (the standard relation, common practice).
    expect(wigner3j(2, 2, 3, 2, 1, -3)).toBeCloseTo(-1 / Math.sqrt(14), 14);
    expect(wigner3j(1, 1, 2, 1, 0, -1)).toBeCloseTo(-1 / Math.sqrt(10), 14);
    expect(wigner3j(1, 1, 1, 0, 1, -1)).toBeCloseTo(1 / Math.sqrt(6), 14);
    expect(wigner3j(2, 2, 4, 2, 2, -4)).toBeCloseTo(1 / 3, 14);
  });

  it('selection rules give zero', () => {
    expect(wigner3j(2, 2, 2, 1, 1, 1)).toBe(0);
    expect(wigner3j(2, 2, 5, 0, 0, 0)).toBe(0);
    expect(wigner3j(2, 1, 1, 2, -1, 0)).toBe(0);
  });

  it('orthogonality: Σ_{m1,m2} (j1 j2 j3; m1 m2 m3)(j1 j2 j3b; m1 m2 m3) = δ/(2j3+1)', () => {
    for (const [j1, j2] of [[2, 2], [2, 3], [1, 2]] as const)
      for (let j3 = Math.abs(j1 - j2); j3 <= j1 + j2; j3++)
        for (let j3b = Math.abs(j1 - j2); j3b <= j1 + j2; j3b++) {
          let sum = 0;
          const m3 = 0;
          for (let m1 = -j1; m1 <= j1; m1++) sum += wigner3j(j1, j2, j3, m1, -m1, m3) * wigner3j(j1, j2, j3b, m1, -m1, m3);
          expect(sum).toBeCloseTo(j3 === j3b ? 1 / (2 * j3 + 1) : 0, 13);
        }
  });
});

describe('Condon–Shortley c^k(2 m, 2 m′)', () => {
  // Condon & Shortley, The Theory of Atomic Spectra (1935), Table 1^6 (d-d): the table lists
  // c^0, √49·c^2 and √441·c^4 as signed integers or signed square roots; entries as recalled
  // from that table (from memory), including signs. Rows checked: all ten (m, m′) with m ≥ |m′| or m′ = −m.
  const table: Array<[number, number, number, number, number]> = [
    // m, m′, c^0, 7·c^2, 21·c^4
    [2, 2, 1, -2, 1],
    [2, 1, 0, Math.sqrt(6), -Math.sqrt(5)],
    [2, 0, 0, -2, Math.sqrt(15)],
    [1, 1, 1, 1, -4],
    [1, 0, 0, 1, Math.sqrt(30)],
    [0, 0, 1, 2, 6],
    [2, -2, 0, 0, Math.sqrt(70)],
    [2, -1, 0, 0, -Math.sqrt(35)],
    [1, -1, 0, -Math.sqrt(6), -Math.sqrt(40)],
  ];
  it.each(table)('c^k(2 %i, 2 %i)', (m, mp, c0, c2, c4) => {
    expect(condonShortleyCk(0, 2, m, 2, mp)).toBeCloseTo(c0, 14);
    expect(condonShortleyCk(2, 2, m, 2, mp) * 7).toBeCloseTo(c2, 13);
    expect(condonShortleyCk(4, 2, m, 2, mp) * 21).toBeCloseTo(c4, 13);
  });

  it('the brief\'s two anchors: c^2(2,2;2,2) = −2/7, c^4(2,2;2,2) = 1/21', () => {
    expect(condonShortleyCk(2, 2, 2, 2, 2)).toBeCloseTo(-2 / 7, 15); // Condon & Shortley (1935), Table 1^6
    expect(condonShortleyCk(4, 2, 2, 2, 2)).toBeCloseTo(1 / 21, 15); // Condon & Shortley (1935), Table 1^6
  });

  it('symmetries: c^k(m′, m) = (−1)^(m−m′) c^k(m, m′), c^k(−m, −m′) = c^k(m, m′)', () => {
    for (const k of [0, 2, 4])
      for (let m = -2; m <= 2; m++)
        for (let mp = -2; mp <= 2; mp++) {
          const sign = (m - mp) % 2 === 0 ? 1 : -1;
          expect(condonShortleyCk(k, 2, mp, 2, m)).toBeCloseTo(sign * condonShortleyCk(k, 2, m, 2, mp), 14);
          expect(condonShortleyCk(k, 2, -m, 2, -mp)).toBeCloseTo(condonShortleyCk(k, 2, m, 2, mp), 14);
        }
  });
});
