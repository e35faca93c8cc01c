import { describe, expect, it } from 'vitest';
import { FieldgapError } from '../../src/errors.js';
import { angularOverlapField, type AngularOverlapLigand } from '../../src/ligand-field/angular-overlap.js';
import { cubicFieldOrbitalMatrix } from '../../src/ligand-field/cubic-field.js';
import { symmetricEigenvalues } from '../../src/ligand-field/eigen-symmetric.js';
import { computeFieldLevels } from '../../src/ligand-field/field-levels.js';
import { generalFieldLevels } from '../../src/ligand-field/general-field-levels.js';
import { computeLevels } from '../../src/ligand-field/levels.js';
import {
  cubicOrbitalField, fieldInMlBasis, realFieldInMlBasis, realOrbitalInMl, tetragonalOrbitalField,
} from '../../src/ligand-field/orbital-field.js';
import { dsOrbitalMatrix, dtOrbitalMatrix } from '../../src/ligand-field/tetragonal-field.js';
import { seededRandom } from '../reference/seeded-random.js';

/** Every state as (energy, 2S+1), sorted: levels that list coincident states differently compare equal. */
function states(levels: ReadonlyArray<{ energy: number; multiplicity: number; degeneracy: number }>): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (const l of levels) for (let k = 0; k < l.degeneracy; k++) out.push([l.energy, l.multiplicity]);
  return out.sort((a, b) => a[0] - b[0] || a[1] - b[1]);
}

function expectSameStates(actual: Array<[number, number]>, expected: Array<[number, number]>, tol: number): void {
  expect(actual.length).toBe(expected.length);
  // Spins of states closer than tol may pair up in either order: compare energies, then the spin content per energy.
  actual.forEach(([e], i) => expect(Math.abs(e - expected[i]![0])).toBeLessThan(tol));
  const spins = (list: Array<[number, number]>): number[] => list.map(([, m]) => m).sort((a, b) => a - b);
  expect(spins(actual)).toEqual(spins(expected));
}

const OCTAHEDRON: Array<[number, number, number]> = [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
const TETRAHEDRON: Array<[number, number, number]> = [[1, 1, 1], [1, -1, -1], [-1, 1, -1], [-1, -1, 1]];

describe('the one-electron field matrix (real d orbitals) and its producers', () => {
  it('the real-orbital → |m_l> change of basis is unitary', () => {
    const { re, im } = realOrbitalInMl();
    for (let i = 0; i < 5; i++)
      for (let j = 0; j < 5; j++) {
        let r = 0;
        let m = 0;
        for (let k = 0; k < 5; k++) {
          r += re[k * 5 + i]! * re[k * 5 + j]! + im[k * 5 + i]! * im[k * 5 + j]!;
          m += re[k * 5 + i]! * im[k * 5 + j]! - im[k * 5 + i]! * re[k * 5 + j]!;
        }
        expect(r).toBeCloseTo(i === j ? 1 : 0, 15);
        expect(m).toBeCloseTo(0, 15);
      }
  });

  it('the cubic and tetragonal producers give the engine exactly its hand-derived |m_l> operators', () => {
    // Hand-derived |m_l> forms (Condon–Shortley; the Y40 combination of the octahedral potential, common practice):
    // Dq: <±2|V|±2> = 1, <±1|V|±1> = −4, <0|V|0> = 6, <2|V|−2> = 5; Ds diag(2, −1, −2, −1, 2); Dt diag(−1, 4, −6, 4, −1).
    const dq = new Float64Array(25);
    [[0, 0, 1], [4, 4, 1], [1, 1, -4], [3, 3, -4], [2, 2, 6], [0, 4, 5], [4, 0, 5]].forEach(([i, j, v]) => (dq[i! * 5 + j!] = v!));
    const diag = (values: number[]): Float64Array => {
      const m = new Float64Array(25);
      values.forEach((v, i) => (m[i * 6] = v));
      return m;
    };
    expect(Array.from(realFieldInMlBasis(cubicOrbitalField(1, 'octahedral')))).toEqual(Array.from(dq));
    expect(Array.from(realFieldInMlBasis(cubicOrbitalField(1, 'tetrahedral')))).toEqual(Array.from(dq, (v) => (v === 0 ? 0 : -v)));
    expect(Array.from(cubicFieldOrbitalMatrix('octahedral'))).toEqual(Array.from(dq));
    expect(Array.from(dsOrbitalMatrix())).toEqual(Array.from(diag([2, -1, -2, -1, 2])));
    expect(Array.from(dtOrbitalMatrix())).toEqual(Array.from(diag([-1, 4, -6, 4, -1])));
    expect(Array.from(realFieldInMlBasis(tetragonalOrbitalField(0, 1, 0)))).toEqual(Array.from(diag([2, -1, -2, -1, 2])));
  });

  it('a field that is not real in |m_l> is refused by the blocked engine, naming the field', () => {
    const f = new Float64Array(25);
    f[0 * 5 + 4] = f[4 * 5 + 0] = 100; // z² mixed with xy: no C2 about x.
    expect(Math.max(...Array.from(fieldInMlBasis(f).im, Math.abs))).toBeGreaterThan(1);
    expect(() => realFieldInMlBasis(f)).toThrow(FieldgapError);
    expect(() => realFieldInMlBasis(f)).toThrow(/imaginary/);
  });
});

describe('angular overlap producer', () => {
  // The AOM (C. E. Schäffer, "The angular overlap model of the ligand field: theory and applications",
  // Pure Appl. Chem. 24, 361 (1970)): each ligand adds e_σ F_σ² + e_π F_π² per orbital. Derivation of the
  // check values: octahedron — z² overlaps the two axial ligands fully (1 each) and the four equatorial ones
  // by −½ (¼ each): 3e_σ; x²−y²: four × (√3/2)² = 3e_σ; xz: π with ±z and ±x, 1 each: 4e_π. So
  // 10Dq = 3e_σ − 4e_π. Tetrahedron (ligands on alternate cube corners): the t2 set (xy, xz, yz) has
  // F_σ² = (√3·⅓)² = ⅓ per ligand → (4/3)e_σ, and π Σ F_π² = 2/9 per ligand → (8/9)e_π; the e set has no σ
  // overlap and π Σ F_π² = 2/3 per ligand → (8/3)e_π. So E(t2) − E(e) = (4/3)e_σ − (16/9)e_π = (4/9)(3e_σ − 4e_π),
  // i.e. 10Dq = −(4/9)(3e_σ − 4e_π) on the octahedral sign scale.
  const ligands = (positions: Array<[number, number, number]>, eSigma: number, ePi: number): AngularOverlapLigand[] =>
    positions.map(([x, y, z]) => ({ x, y, z, eSigma, ePi }));

  it('octahedral ML6: e_g at 3e_σ, t2g at 4e_π, 10Dq = 3e_σ − 4e_π', () => {
    const values = Array.from(symmetricEigenvalues(angularOverlapField(ligands(OCTAHEDRON, 7000, 900)), 5));
    [3600, 3600, 3600, 21000, 21000].forEach((v, i) => expect(values[i]).toBeCloseTo(v, 8));
    expect(values[4]! - values[0]!).toBeCloseTo(3 * 7000 - 4 * 900, 8);
  });

  it('tetrahedral ML4: e at (8/3)e_π, t2 at (4/3)e_σ + (8/9)e_π, E(t2) − E(e) = (4/9)(3e_σ − 4e_π)', () => {
    const [eSigma, ePi] = [4000, 1200];
    const values = Array.from(symmetricEigenvalues(angularOverlapField(ligands(TETRAHEDRON, eSigma, ePi)), 5));
    [(8 / 3) * ePi, (8 / 3) * ePi].forEach((v, i) => expect(values[i]).toBeCloseTo(v, 8));
    for (let i = 2; i < 5; i++) expect(values[i]).toBeCloseTo((4 / 3) * eSigma + (8 / 9) * ePi, 8);
    expect(values[4]! - values[0]!).toBeCloseTo((4 / 9) * (3 * eSigma - 4 * ePi), 8);
  });

  it('names a bad ligand by its index', () => {
    const pathOf = (f: () => unknown): string => {
      try {
        f();
      } catch (error) {
        expect(error).toBeInstanceOf(FieldgapError);
        return (error as FieldgapError).path;
      }
      return 'no error';
    };
    expect(pathOf(() => angularOverlapField([{ x: 1, y: 0, z: 0, eSigma: 5000 }, { x: 0, y: 0, z: 0, eSigma: 5000 }]))).toBe('ligands[1]');
    expect(pathOf(() => angularOverlapField([{ x: 1, y: 0, z: 0, eSigma: Number.NaN }]))).toBe('ligands[0].eSigma');
  });
});

describe('general-field engine (any OrbitalField, real-orbital determinants)', () => {
  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9])('d%i: a cubic field gives computeLevels, a tetragonal one computeFieldLevels, a cubic AOM one computeLevels at 10Dq = 3e_σ − 4e_π', (d) => {
    // Checks of two independent paths of this engine (real-orbital dense vs |m_l> symmetry blocks), not outside values.
    const random = seededRandom(300 + d);
    const b = 600 + 400 * random();
    const c = b * (3.5 + random());
    const dq = 500 + 2500 * random();
    const tol = 1e-8 * (10 * dq + 20 * b + 10 * c);
    for (const geometry of ['octahedral', 'tetrahedral'] as const) {
      expectSameStates(states(generalFieldLevels(d, cubicOrbitalField(dq, geometry), b, c)), states(computeLevels(d, geometry, { dq, b, c }).levels), tol);
    }
    const [ds, dt] = [600 * (random() - 0.3), 300 * (random() - 0.3)];
    expectSameStates(
      states(generalFieldLevels(d, tetragonalOrbitalField(dq, ds, dt), b, c)),
      states(computeFieldLevels(d, 'octahedral', { dq, b, c, ds, dt }).levels),
      tol,
    );
    const [eSigma, ePi] = [6000 + 2000 * random(), 1000 * random()];
    const aom = angularOverlapField(OCTAHEDRON.map(([x, y, z]) => ({ x, y, z, eSigma, ePi })));
    expectSameStates(states(generalFieldLevels(d, aom, b, c)), states(computeLevels(d, 'octahedral', { dq: (3 * eSigma - 4 * ePi) / 10, b, c }).levels), tol);
  });

  it('levels of a low-symmetry complex do not depend on how it is turned in space', () => {
    const random = seededRandom(42);
    const complex: AngularOverlapLigand[] = [
      { x: 1, y: 0.1, z: 0, eSigma: 6500, ePi: 1200 }, { x: -1, y: 0, z: 0.2, eSigma: 6000, ePi: 800 },
      { x: 0, y: 1, z: 0, eSigma: 5200, ePi: 300 }, { x: 0.1, y: -1, z: 0, eSigma: 7000, ePi: 1500 },
      { x: 0, y: 0.2, z: 1.1, eSigma: 3000, ePi: 0 },
    ];
    // A random rotation from a random unit quaternion.
    const [a, bq, cq, dq] = (() => {
      const q = [random() - 0.5, random() - 0.5, random() - 0.5, random() - 0.5];
      const n = Math.hypot(...q);
      return q.map((v) => v / n) as [number, number, number, number];
    })();
    const r = [
      [a * a + bq * bq - cq * cq - dq * dq, 2 * (bq * cq - a * dq), 2 * (bq * dq + a * cq)],
      [2 * (bq * cq + a * dq), a * a - bq * bq + cq * cq - dq * dq, 2 * (cq * dq - a * bq)],
      [2 * (bq * dq - a * cq), 2 * (cq * dq + a * bq), a * a - bq * bq - cq * cq + dq * dq],
    ];
    const turned = complex.map((l) => ({ ...l, x: r[0]![0]! * l.x + r[0]![1]! * l.y + r[0]![2]! * l.z, y: r[1]![0]! * l.x + r[1]![1]! * l.y + r[1]![2]! * l.z, z: r[2]![0]! * l.x + r[2]![1]! * l.y + r[2]![2]! * l.z }));
    for (const d of [2, 3, 7, 8]) {
      const here = generalFieldLevels(d, angularOverlapField(complex), 800, 3400);
      const there = generalFieldLevels(d, angularOverlapField(turned), 800, 3400);
      expect(there.length).toBe(here.length);
      here.forEach((level, i) => {
        expect(there[i]!.energy).toBeCloseTo(level.energy, 6);
        expect(there[i]!.multiplicity).toBe(level.multiplicity);
      });
      // Five different ligands, no symmetry: nothing but spin and Kramers degeneracy is left.
      expect(here.every((l) => l.degeneracy === l.multiplicity)).toBe(true);
    }
  });
});
