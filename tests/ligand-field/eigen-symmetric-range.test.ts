/**
 * The eigensolver at the ends of the double range: scaling the matrix by s
 * scales its eigenvalues by s (an invariant, no pinned numbers), for s from
 * 1e-150 to 1e300, where the unscaled QL iteration under- or overflowed and
 * "did not converge". Non-finite input is a FieldgapError, never a bare Error.
 */
import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { EigenConvergenceError, symmetricEigen, symmetricEigenvalues } from '../../src/ligand-field/eigen-symmetric.js';
import { randomSymmetricMatrix } from '../helpers/random-symmetric-matrix.js';
import { seededRandom } from '../reference/seeded-random.js';

describe('symmetric eigensolver over the double range', () => {
  it.each([1e-300, 1e-150, 1e-20, 1e20, 1e150, 1e300])('eigenvalues of s·A are s times those of A, s = %s', (s) => {
    const random = seededRandom(7);
    for (const n of [2, 5, 12, 30]) {
      const a = randomSymmetricMatrix(n, random);
      const base = symmetricEigenvalues(a, n);
      const scaled = symmetricEigenvalues(a.map((v) => v * s), n);
      for (let i = 0; i < n; i++) expect(scaled[i]! / s).toBeCloseTo(base[i]!, 10);
      const { values, vectors } = symmetricEigen(a.map((v) => v * s), n);
      for (let i = 0; i < n; i++) expect(values[i]! / s).toBeCloseTo(base[i]!, 10);
      // Eigenvectors stay orthonormal: VᵀV = I.
      for (let i = 0; i < n; i++)
        for (let j = 0; j < n; j++) {
          let dot = 0;
          for (let k = 0; k < n; k++) dot += vectors[k * n + i]! * vectors[k * n + j]!;
          expect(dot).toBeCloseTo(i === j ? 1 : 0, 10);
        }
    }
  });

  it.each([-300, -129, -128, -60, -1, 1, 17, 60, 128, 129, 300])('eigenvalues of 2^%i·A are exactly 2^k times those of A (scaled or not, no bit changes)', (k) => {
    // The solver leaves matrices within 2^±128 unscaled: that is only sound if every step is exact under a power-of-two scaling.
    const random = seededRandom(11);
    for (const n of [3, 7, 18, 30]) {
      const a = randomSymmetricMatrix(n, random);
      const base = symmetricEigenvalues(a, n);
      const scaled = symmetricEigenvalues(a.map((v) => v * 2 ** k), n);
      expect(Array.from(scaled)).toEqual(Array.from(base, (v) => v * 2 ** k));
    }
  });

  it('keeps a matrix of mixed tiny and ordinary entries exact (diagonal: eigenvalues are the entries)', () => {
    const a = Float64Array.from([1e-150, 0, 0, 0, 700, 0, 0, 0, 1e-300]);
    expect(Array.from(symmetricEigenvalues(a, 3))).toEqual([1e-300, 1e-150, 700]);
  });

  it('refuses a non-finite entry with a FieldgapError naming the entry', () => {
    const a = Float64Array.from([1, Number.NaN, Number.NaN, 1]);
    expect(() => symmetricEigenvalues(a, 2)).toThrow(FieldgapError);
    expect(() => symmetricEigen(Float64Array.from([Number.POSITIVE_INFINITY, 0, 0, 1]), 2)).toThrow(/entry \(0, 0\) is Infinity/);
  });

  it('reports non-convergence as a typed error', () => {
    const error = new EigenConvergenceError(12);
    expect(error).toBeInstanceOf(FieldgapError);
    expect(error.toJSON()).toMatchObject({ code: 'internal' });
    expect(error.message).toMatch(/did not converge .* order 12/);
  });
});
