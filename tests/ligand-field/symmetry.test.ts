import { describe, expect, it } from 'vitest';
import { cubicBlockEigenvalues } from '../../src/ligand-field/block-spectra.js';
import { cubicBlocks } from '../../src/ligand-field/blocks.js';
import { dShellMasks, maskTwoMs } from '../../src/ligand-field/determinants.js';
import { clusterIrrepsByCharacters } from '../../src/ligand-field/cluster-characters.js';
import { CHANNEL_PATTERN, CUBIC_IRREPS, irrepFromChannelCounts, reduceCubicCharacters } from '../../src/ligand-field/cubic-group.js';
import { cubicFieldOrbitalMatrix } from '../../src/ligand-field/cubic-field.js';
import { dShellRepulsionIntegrals } from '../../src/ligand-field/repulsion.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from '../../src/ligand-field/rotations.js';
import { oneBodyBlockMatrix, twoBodyBlockMatrix } from '../../src/ligand-field/slater-condon.js';
import { cubicComponentsOfL } from '../../src/ligand-field/term-splitting.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { seededRandom } from '../reference/seeded-random.js';

describe('the group O', () => {
  it('character table rows reduce to themselves', () => {
    const table = { A1: [1, 1, 1, 1, 1], T2: [3, 0, -1, -1, 1], E: [2, -1, 2, 0, 0] }; // common practice (character table of O)
    expect(reduceCubicCharacters(table.A1)).toEqual({ A1: 1, A2: 0, E: 0, T1: 0, T2: 0 });
    expect(reduceCubicCharacters(table.T2)).toEqual({ A1: 0, A2: 0, E: 0, T1: 0, T2: 1 });
    expect(reduceCubicCharacters([3, 0, 3, 1, 1])).toEqual({ A1: 1, A2: 0, E: 1, T1: 0, T2: 0 }); // A1 + E
    expect(() => reduceCubicCharacters([2, 0, 0, 0, 0])).toThrow();
  });

  it('channel patterns: each single irrep is recognised, sums are not', () => {
    for (const irrep of CUBIC_IRREPS) expect(irrepFromChannelCounts(CHANNEL_PATTERN[irrep])).toBe(irrep);
    expect(irrepFromChannelCounts([2, 0, 0, 1, 0])).toBeUndefined(); // A1 + E
    expect(irrepFromChannelCounts([0, 1, 2, 0, 1])).toBeUndefined(); // T1 + T2
  });

  it('channel patterns agree with the characters of O restricted to C4(z) and C2(x)', () => {
    // χ(C4) = n(k0) − n(k2); χ(C2x) = n(k0+) − n(k0−) + n(k2+) − n(k2−) (k = ±1 pairs swap: trace 0); χ(C2x) = χ(C2) class.
    const table = { A1: [1, 1, 1, 1, 1], A2: [1, 1, 1, -1, -1], E: [2, -1, 2, 0, 0], T1: [3, 0, -1, 1, -1], T2: [3, 0, -1, -1, 1] }; // common practice (character table of O)
    for (const irrep of CUBIC_IRREPS) {
      const [a, b, c, d, e] = CHANNEL_PATTERN[irrep] as [number, number, number, number, number];
      expect(a + b + 2 * c + d + e).toBe(table[irrep][0]);
      expect(a + b - d - e).toBe(table[irrep][3]);
      expect(a - b + d - e).toBe(table[irrep][2]);
    }
  });

  it('free-ion L splits in O as in the standard correlation table', () => {
    // Bethe (1929) branching of SO(3) → O; common practice (as listed in ligand-field texts)
    expect(cubicComponentsOfL(0)).toEqual(['A1']);
    expect(cubicComponentsOfL(1)).toEqual(['T1']);
    expect(cubicComponentsOfL(2)).toEqual(['E', 'T2']);
    expect(cubicComponentsOfL(3)).toEqual(['A2', 'T1', 'T2']);
    expect(cubicComponentsOfL(4)).toEqual(['A1', 'E', 'T1', 'T2']);
    expect(cubicComponentsOfL(5)).toEqual(['E', 'T1', 'T1', 'T2']);
    expect(cubicComponentsOfL(6)).toEqual(['A1', 'A2', 'E', 'T1', 'T2', 'T2']);
  });
});

describe('rotations of determinants', () => {
  it('commute with the full M_S Hamiltonian (d3, M_S = 1/2, and d6, M_S = 0)', () => {
    const { coefB, coefC } = dShellRepulsionIntegrals();
    for (const [n, geometry] of [[3, 'octahedral'], [6, 'tetrahedral']] as const) {
      const masks = dShellMasks(n).filter((m) => maskTwoMs(m) === n % 2);
      const size = masks.length;
      const h = oneBodyBlockMatrix(masks, cubicFieldOrbitalMatrix(geometry));
      const hb = twoBodyBlockMatrix(masks, coefB);
      const hc = twoBodyBlockMatrix(masks, coefC);
      for (let i = 0; i < h.length; i++) h[i] = 1500 * h[i]! + 700 * hb[i]! + 3000 * hc[i]!;
      for (const name of ['c3', 'c2prime', 'c4'] as const) {
        const r = determinantRotation(masks, dOrbitalRotation(ROTATIONS[name]));
        let worst = 0;
        for (let i = 0; i < size; i++)
          for (let j = 0; j < size; j++) {
            let re = 0;
            let im = 0;
            for (let k = 0; k < size; k++) {
              re += r.re[i * size + k]! * h[k * size + j]! - h[i * size + k]! * r.re[k * size + j]!;
              im += r.im[i * size + k]! * h[k * size + j]! - h[i * size + k]! * r.im[k * size + j]!;
            }
            worst = Math.max(worst, Math.abs(re), Math.abs(im));
          }
        expect(worst).toBeLessThan(1e-8);
      }
    }
  });

  it('characters of every level agree with its C4-count label (d2–d8, seeded random parameters)', () => {
    const random = seededRandom(42);
    for (const geometry of ['octahedral', 'tetrahedral'] as const)
      for (const d of [2, 3, 4, 5, 6, 7, 8]) {
        const params = { dq: 500 + 2000 * random(), b: 500 + 500 * random(), c: 2000 + 2000 * random() };
        const blocks = cubicBlocks(d, geometry);
        const coefficients = [params.dq, params.b, params.c];
        const ground = Math.min(...cubicBlockEigenvalues(blocks, coefficients).flat().map((v) => (v.length ? v[0]! : Infinity)));
        const tol = 1e-6 * params.b;
        // Levels of one spin at one energy (e.g. 4A1g + 4Eg in d5) are checked together.
        const groups = new Map<string, { twoS: number; energy: number; irreps: Record<string, number>; counts: number[] }>();
        for (const level of computeLevels(d, geometry, params).levels) {
          const key = `${level.multiplicity}:${level.energy.toFixed(3)}`;
          const group = groups.get(key) ?? { twoS: level.multiplicity - 1, energy: level.energy, irreps: { A1: 0, A2: 0, E: 0, T1: 0, T2: 0 }, counts: [0, 0, 0, 0, 0] };
          group.irreps[level.cubicIrrep]! += 1;
          CHANNEL_PATTERN[level.cubicIrrep].forEach((n, k) => (group.counts[k]! += n));
          groups.set(key, group);
        }
        for (const [key, group] of groups) {
          const s = blocks.twoSValues.indexOf(group.twoS);
          const e = ground + group.energy;
          const counts = clusterIrrepsByCharacters(blocks, s, coefficients, e - tol, e + tol, group.counts);
          expect(counts, `${geometry} d${d} ${key}`).toEqual(group.irreps);
        }
      }
  });
});
