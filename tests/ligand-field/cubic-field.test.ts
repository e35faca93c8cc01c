import { describe, expect, it } from 'vitest';
import { cubicFieldOrbitalMatrix } from '../../src/ligand-field/cubic-field.js';
import { symmetricEigenvalues } from '../../src/ligand-field/eigen-symmetric.js';
import { dOrbitalRotation, ROTATIONS, type ComplexMatrix } from '../../src/ligand-field/rotations.js';

/** (A·B) for complex A and real B (5×5), and (B·A). */
function products(a: ComplexMatrix, b: Float64Array): { ab: [Float64Array, Float64Array]; ba: [Float64Array, Float64Array] } {
  const n = 5;
  const ab: [Float64Array, Float64Array] = [new Float64Array(25), new Float64Array(25)];
  const ba: [Float64Array, Float64Array] = [new Float64Array(25), new Float64Array(25)];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++)
      for (let k = 0; k < n; k++) {
        ab[0][i * n + j] = ab[0][i * n + j]! + a.re[i * n + k]! * b[k * n + j]!;
        ab[1][i * n + j] = ab[1][i * n + j]! + a.im[i * n + k]! * b[k * n + j]!;
        ba[0][i * n + j] = ba[0][i * n + j]! + b[i * n + k]! * a.re[k * n + j]!;
        ba[1][i * n + j] = ba[1][i * n + j]! + b[i * n + k]! * a.im[k * n + j]!;
      }
  return { ab, ba };
}

function commutatorNorm(d: ComplexMatrix, v: Float64Array): number {
  const { ab, ba } = products(d, v);
  let sum = 0;
  for (let i = 0; i < 25; i++) sum += (ab[0][i]! - ba[0][i]!) ** 2 + (ab[1][i]! - ba[1][i]!) ** 2;
  return Math.sqrt(sum);
}

describe('cubic field operator of one d electron', () => {
  it('octahedral: e_g at +6Dq (twice), t2g at −4Dq (three times), so 10Dq = E(eg) − E(t2g)', () => {
    const values = Array.from(symmetricEigenvalues(cubicFieldOrbitalMatrix('octahedral'), 5));
    [-4, -4, -4, 6, 6].forEach((v, i) => expect(values[i]!).toBeCloseTo(v, 13)); // common practice (crystal-field splitting of d orbitals)
  });

  it('tetrahedral: e at −6Dq, t2 at +4Dq', () => {
    const values = Array.from(symmetricEigenvalues(cubicFieldOrbitalMatrix('tetrahedral'), 5));
    [-6, -6, 4, 4, 4].forEach((v, i) => expect(values[i]!).toBeCloseTo(v, 13)); // common practice
  });

  it('is traceless (the barycentre rule)', () => {
    const v = cubicFieldOrbitalMatrix('octahedral');
    expect(v[0]! + v[6]! + v[12]! + v[18]! + v[24]!).toBe(0);
  });
});

describe('d-orbital rotations D^(2)(R), same phase convention as the field', () => {
  it.each(Object.keys(ROTATIONS) as Array<keyof typeof ROTATIONS>)('%s is unitary', (name) => {
    const d = dOrbitalRotation(ROTATIONS[name]);
    for (let i = 0; i < 5; i++)
      for (let j = 0; j < 5; j++) {
        let re = 0;
        let im = 0;
        for (let k = 0; k < 5; k++) {
          // (D†D)_ij = Σ conj(D_ki) D_kj
          re += d.re[k * 5 + i]! * d.re[k * 5 + j]! + d.im[k * 5 + i]! * d.im[k * 5 + j]!;
          im += d.re[k * 5 + i]! * d.im[k * 5 + j]! - d.im[k * 5 + i]! * d.re[k * 5 + j]!;
        }
        expect(re).toBeCloseTo(i === j ? 1 : 0, 13);
        expect(im).toBeCloseTo(0, 13);
      }
  });

  it('C4 about z is diagonal with e^(−i m π/2): the k = M_L mod 4 labels', () => {
    const d = dOrbitalRotation(ROTATIONS.c4);
    for (let m = -2; m <= 2; m++) {
      const i = m + 2;
      expect(d.re[i * 5 + i]!).toBeCloseTo(Math.cos((-m * Math.PI) / 2), 13);
      expect(d.im[i * 5 + i]!).toBeCloseTo(Math.sin((-m * Math.PI) / 2), 13);
    }
  });

  it('the cubic field commutes with C3 [111], C2′ [110] and C4 z', () => {
    for (const geometry of ['octahedral', 'tetrahedral'] as const) {
      const v = cubicFieldOrbitalMatrix(geometry);
      for (const name of ['c3', 'c2prime', 'c4', 'c2'] as const) {
        expect(commutatorNorm(dOrbitalRotation(ROTATIONS[name]), v)).toBeLessThan(1e-12);
      }
    }
  });

  it('a field with the wrong sign of <2|V|−2> (axes turned by 45°) does not commute with C3', () => {
    const wrong = cubicFieldOrbitalMatrix('octahedral');
    wrong[0 * 5 + 4] = -5;
    wrong[4 * 5 + 0] = -5;
    expect(commutatorNorm(dOrbitalRotation(ROTATIONS.c3), wrong)).toBeGreaterThan(1);
  });
});
