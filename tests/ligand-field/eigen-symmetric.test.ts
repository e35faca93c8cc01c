import { eigs } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  createEigenWorkspace, symmetricEigen, symmetricEigenvalues, symmetricEigenvaluesInPlace,
} from '../../src/ligand-field/eigen-symmetric.js';
import { randomSymmetricMatrix } from '../helpers/random-symmetric-matrix.js';
import { seededRandom } from '../reference/seeded-random.js';

const sizes = [1, 2, 3, 4, 7, 12, 25, 40];

describe('symmetric eigen-solver (Householder + implicit QL)', () => {
  it.each(sizes)('n = %i: A·V = V·D and VᵀV = I on seeded random matrices', (n) => {
    const random = seededRandom(n);
    for (let trial = 0; trial < 3; trial++) {
      const a = randomSymmetricMatrix(n, random);
      const { values, vectors } = symmetricEigen(a, n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          let av = 0;
          let vv = 0;
          for (let k = 0; k < n; k++) {
            av += a[i * n + k]! * vectors[k * n + j]!;
            vv += vectors[k * n + i]! * vectors[k * n + j]!;
          }
          expect(Math.abs(av - vectors[i * n + j]! * values[j]!)).toBeLessThan(1e-12 * n);
          expect(Math.abs(vv - (i === j ? 1 : 0))).toBeLessThan(1e-12 * n);
        }
      for (let j = 1; j < n; j++) expect(values[j]!).toBeGreaterThanOrEqual(values[j - 1]!);
    }
  });

  it.each(sizes)('n = %i: eigenvalues match mathjs eigs', (n) => {
    const random = seededRandom(100 + n);
    const a = randomSymmetricMatrix(n, random);
    const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
    const reference = (eigs(rows).values as number[]).slice().sort((x, y) => x - y); // mathjs 15 eigs as reference
    const fast = symmetricEigenvalues(a, n);
    const full = symmetricEigen(a, n).values;
    reference.forEach((value, i) => {
      expect(fast[i]!).toBeCloseTo(value, 11);
      expect(full[i]!).toBeCloseTo(value, 11);
    });
  });

  it('handles degenerate and already-diagonal matrices', () => {
    const n = 6;
    const a = new Float64Array(n * n);
    [3, 1, 1, 1, -2, 3].forEach((v, i) => (a[i * n + i] = v));
    expect(Array.from(symmetricEigenvalues(a, n))).toEqual([-2, 1, 1, 1, 3, 3]);
    const ones = new Float64Array(16).fill(1); // eigenvalues 4, 0, 0, 0
    const values = symmetricEigenvalues(ones, 4);
    [0, 0, 0, 4].forEach((v, i) => expect(values[i]!).toBeCloseTo(v, 13));
  });

  it('in-place variant with a reused workspace gives the same values and leaves the output sorted', () => {
    const random = seededRandom(7);
    const ws = createEigenWorkspace(20);
    const out = new Float64Array(20);
    for (const n of [20, 5, 13]) {
      const a = randomSymmetricMatrix(n, random);
      const expected = symmetricEigenvalues(a, n);
      symmetricEigenvaluesInPlace(Float64Array.from(a), n, out, ws);
      for (let i = 0; i < n; i++) expect(out[i]!).toBeCloseTo(expected[i]!, 13);
    }
  });
});

describe('closed forms of orders 1 and 2 (the eigenvalue fast path)', () => {
  // Reference: symmetricEigen, which always takes the general Householder + QL path.
  it('agree with the general path on seeded random and extreme 2×2 matrices', () => {
    const random = seededRandom(2024);
    const cases: number[][] = [
      [3, 0, 0, 3], [1, 1e-17, 1e-17, 1], [1e300, 5e299, 5e299, -1e300], [1e-300, 2e-300, 2e-300, 0], [-7, 4, 4, 2],
    ];
    for (let t = 0; t < 200; t++) {
      const scale = 10 ** (12 * random() - 6);
      const q = scale * (2 * random() - 1);
      cases.push([scale * (2 * random() - 1), q, q, scale * (2 * random() - 1)]);
    }
    const values = new Float64Array(2);
    for (const c of cases) {
      const a = Float64Array.from(c);
      symmetricEigenvaluesInPlace(Float64Array.from(a), 2, values);
      const reference = symmetricEigen(a, 2).values;
      const norm = Math.max(...c.map(Math.abs));
      expect(values[0]).toBeLessThanOrEqual(values[1]!);
      for (let i = 0; i < 2; i++) expect(Math.abs(values[i]! - reference[i]!)).toBeLessThanOrEqual(8e-16 * norm);
    }
  });

  it('order 1 returns the entry and refuses a non-finite one', () => {
    const values = new Float64Array(1);
    symmetricEigenvaluesInPlace(Float64Array.from([-2.5]), 1, values);
    expect(values[0]).toBe(-2.5);
    expect(() => symmetricEigenvaluesInPlace(Float64Array.from([Number.NaN]), 1, values)).toThrow(/entry \(0, 0\) is NaN/);
    expect(() => symmetricEigenvaluesInPlace(Float64Array.from([1, 0, Number.POSITIVE_INFINITY, 1]), 2, new Float64Array(2))).toThrow(/entry \(1, 0\) is Infinity/);
  });
});
