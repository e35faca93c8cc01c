import { describe, expect, it } from 'vitest';
import { cubicBlockEigenvalues } from '../../src/ligand-field/block-spectra.js';
import { cubicBlocks } from '../../src/ligand-field/blocks.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { dShellRepulsionIntegrals, integralIndex } from '../../src/ligand-field/repulsion.js';
import { seededRandom } from '../reference/seeded-random.js';

const binomial = (n: number, k: number): number => (k < 0 || k > n ? 0 : k === 0 ? 1 : (binomial(n - 1, k - 1) * n) / k);

/**
 * Tr H over all C(10, n) determinants without diagonalising: every pair of
 * spin-orbitals {p, q} is occupied in C(8, n−2) determinants and adds <pq||pq>;
 * the cubic field is traceless (so it adds nothing).
 */
function traceOfHamiltonian(n: number, b: number, c: number): number {
  const { coefB, coefC } = dShellRepulsionIntegrals();
  let pairSum = 0;
  for (let p = 0; p < 10; p++)
    for (let q = p + 1; q < 10; q++) {
      const [op, oq] = [p % 5, q % 5];
      const direct = coefB[integralIndex(op, oq, op, oq)]! * b + coefC[integralIndex(op, oq, op, oq)]! * c;
      const sameSpin = p < 5 === q < 5;
      const exchange = sameSpin ? coefB[integralIndex(op, oq, oq, op)]! * b + coefC[integralIndex(op, oq, oq, op)]! * c : 0;
      pairSum += direct - exchange;
    }
  return binomial(8, n - 2) * pairSum;
}

describe('level bookkeeping', () => {
  const random = seededRandom(2024);
  for (const geometry of ['octahedral', 'tetrahedral'] as const)
    for (let d = 1; d <= 9; d++) {
      it(`${geometry} d${d}: Σ degeneracy = C(10, n) and Σ degeneracy·E = Tr H − C(10, n)·E0`, () => {
        const params = { dq: 2500 * random(), b: 500 + 600 * random(), c: 2000 + 2500 * random() };
        const result = computeLevels(d, geometry, params);
        const states = binomial(10, d);
        expect(result.levels.reduce((sum, l) => sum + l.degeneracy, 0)).toBe(states);
        const values = cubicBlockEigenvalues(cubicBlocks(d, geometry), [params.dq, params.b, params.c]);
        const ground = Math.min(...values.flat().map((v) => (v.length ? v[0]! : Infinity)));
        const weighted = result.levels.reduce((sum, l) => sum + l.degeneracy * l.energy, 0);
        const trace = traceOfHamiltonian(d, params.b, params.c);
        expect(weighted).toBeCloseTo(trace - states * ground, 5);
        expect(result.levels[0]!.energy).toBe(0);
        for (const level of result.levels) expect(level.degeneracy).toBe(level.multiplicity * { A1: 1, A2: 1, E: 2, T1: 3, T2: 3 }[level.cubicIrrep]);
      });
    }
});
