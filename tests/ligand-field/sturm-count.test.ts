import { describe, expect, it } from 'vitest';
import { symmetricEigen, symmetricTridiagonalInPlace } from '../../src/ligand-field/eigen-symmetric.js';
import { tridiagonalCountBelow } from '../../src/ligand-field/sturm-count.js';
import { seededRandom } from '../reference/seeded-random.js';

/** Reference: the eigenvalues of the full matrix (symmetricEigen, the accumulated QL path), counted. */
function countBelowByEigenvalues(a: Float64Array, n: number, x: number): number {
  return symmetricEigen(a, n).values.filter((v) => v < x).length;
}

describe('Sturm count on the tridiagonal form', () => {
  it('equals the number of eigenvalues below x, for random symmetric matrices of order 1..20 and every gap between eigenvalues', () => {
    const random = seededRandom(41);
    for (let trial = 0; trial < 200; trial++) {
      const n = 1 + (trial % 20);
      const scale = 10 ** (8 * random() - 4);
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++)
        for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = scale * (2 * random() - 1);
      const values = symmetricEigen(a, n).values;
      const d = new Float64Array(n);
      const e = new Float64Array(n);
      const factor = symmetricTridiagonalInPlace(Float64Array.from(a), n, d, e);
      // Probe below, above and between consecutive eigenvalues (midpoints), where the answer is unambiguous.
      const probes = [values[0]! - scale, values[n - 1]! + scale];
      for (let k = 1; k < n; k++) if (values[k]! - values[k - 1]! > 1e-9 * scale) probes.push((values[k]! + values[k - 1]!) / 2);
      for (const x of probes) expect(tridiagonalCountBelow(d, e, n, x * factor)).toBe(countBelowByEigenvalues(a, n, x));
    }
  });

  it('counts a repeated eigenvalue once per multiplicity and survives a zero pivot', () => {
    // diag(1, 1, 2, 3) rotated is still tridiagonal-reducible; the probe at exactly 1 hits zero pivots.
    const n = 4;
    const a = new Float64Array([1, 0, 0, 0, 0, 1, 0, 0, 0, 0, 2, 0, 0, 0, 0, 3]);
    const d = new Float64Array(n);
    const e = new Float64Array(n);
    const factor = symmetricTridiagonalInPlace(Float64Array.from(a), n, d, e);
    expect(tridiagonalCountBelow(d, e, n, 1.5 * factor)).toBe(2);
    expect(tridiagonalCountBelow(d, e, n, 2.5 * factor)).toBe(3);
    expect(tridiagonalCountBelow(d, e, n, 0.5 * factor)).toBe(0);
    const atOne = tridiagonalCountBelow(d, e, n, 1 * factor);
    expect(Number.isInteger(atOne) && atOne >= 0 && atOne <= 2).toBe(true);
    expect(tridiagonalCountBelow(d, e, 0, 0)).toBe(0);
  });
});
