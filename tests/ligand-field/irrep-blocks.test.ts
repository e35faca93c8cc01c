import { describe, expect, it } from 'vitest';
import { cubicBlockEigenvalues } from '../../src/ligand-field/block-spectra.js';
import { cubicBlocks, type OperatorBlock } from '../../src/ligand-field/blocks.js';
import { maskTwoMs, dShellMasks } from '../../src/ligand-field/determinants.js';
import { IRREP_COLUMNS, irrepBlocks } from '../../src/ligand-field/irrep-blocks.js';
import { energyTolerance } from '../../src/ligand-field/levels.js';
import { parentTableFor } from '../../src/ligand-field/parent-tables.js';
import { determinantRotation, dOrbitalRotation, ROTATIONS } from '../../src/ligand-field/rotations.js';
import { computeLevels } from '../../src/ligand-field/index.js';
import { sortedChannelLevels } from '../reference/channel-levels.js';
import { seededRandom } from '../reference/seeded-random.js';

const GEOMETRIES = ['octahedral', 'tetrahedral'] as const;
const ALL_D = [1, 2, 3, 4, 5, 6, 7, 8, 9];

/** Block basis vector j as real components over all M_S = S determinants (closed under rotations). */
function embedded(block: OperatorBlock, j: number, all: readonly number[]): Float64Array {
  const v = new Float64Array(all.length);
  block.masks.forEach((mask, i) => (v[all.indexOf(mask)] = block.basis[i * block.size + j]!));
  return v;
}

/** <u| R |v> for a rotation of determinants (real u, v): [re, im]. */
function matrixElement(r: { re: Float64Array; im: Float64Array }, u: Float64Array, v: Float64Array): [number, number] {
  const n = u.length;
  let re = 0;
  let im = 0;
  for (let a = 0; a < n; a++)
    for (let b = 0; b < n; b++) {
      re += u[a]! * r.re[a * n + b]! * v[b]!;
      im += u[a]! * r.im[a * n + b]! * v[b]!;
    }
  return [re, im];
}

const sortedCopy = (values: ArrayLike<number>): number[] => Array.from(values).sort((x, y) => x - y);

describe('one block per (S, Γ)', () => {
  it.each(ALL_D)('d%i: each block has as many states as the free-ion terms give (S, Γ) levels', (d) => {
    const table = parentTableFor(d, 4.5);
    for (const geometry of GEOMETRIES) {
      const blocks = irrepBlocks(d, geometry);
      blocks.twoSValues.forEach((twoS, s) => {
        IRREP_COLUMNS.forEach((irrep, column) => {
          expect(blocks.blocks[s]![column]!.size, `${geometry} 2S=${twoS} ${irrep}`).toBe(table.expected(twoS, irrep));
        });
      });
    }
  });

  it('basis vectors carry their irrep: A1 and A2 are fixed or sign-flipped by C3, C4, C2′; E rows give ⟨C3⟩ = −½ (d2–d8)', () => {
    // Characters of O: A1 [C3, C4, C2′] = [1, 1, 1], A2 = [1, −1, −1]; E: C3 θ = −½θ + (√3/2)ε. common practice (character table of O)
    const expected = { A1: { c3: 1, c4: 1, c2prime: 1 }, A2: { c3: 1, c4: -1, c2prime: -1 } } as const;
    for (const geometry of GEOMETRIES)
      for (const d of [2, 3, 4, 5, 6, 7, 8]) {
        const blocks = irrepBlocks(d, geometry);
        blocks.twoSValues.forEach((twoS, s) => {
          const all = dShellMasks(d).filter((m) => maskTwoMs(m) === twoS);
          const rotations = Object.fromEntries(
            (['c3', 'c4', 'c2prime'] as const).map((name) => [name, determinantRotation(all, dOrbitalRotation(ROTATIONS[name]))]),
          );
          for (const irrep of ['A1', 'A2'] as const) {
            const block = blocks.blocks[s]![IRREP_COLUMNS.indexOf(irrep)]!;
            for (let j = 0; j < block.size; j++) {
              const u = embedded(block, j, all);
              for (const name of ['c3', 'c4', 'c2prime'] as const) {
                const [re, im] = matrixElement(rotations[name]!, u, u);
                expect(re, `${geometry} d${d} ${twoS + 1}${irrep} #${j} ${name}`).toBeCloseTo(expected[irrep][name], 10);
                expect(im).toBeCloseTo(0, 10);
              }
            }
          }
          const e = blocks.blocks[s]![IRREP_COLUMNS.indexOf('E')]!;
          for (let i = 0; i < e.size; i++)
            for (let j = 0; j < e.size; j++) {
              const [re] = matrixElement(rotations.c3!, embedded(e, i, all), embedded(e, j, all));
              expect(re, `${geometry} d${d} ${twoS + 1}E (${i}, ${j})`).toBeCloseTo(i === j ? -0.5 : 0, 10);
            }
        });
      }
  });

  it('block spectra rebuild the channel spectra: k0+ = A1 ∪ E, k2+ = A2 ∪ E, k0− = T1, k1 = T1 ∪ T2, k2− = T2 (seeded random Dq, B, C)', () => {
    const random = seededRandom(77);
    for (const geometry of GEOMETRIES)
      for (const d of ALL_D) {
        const coefficients = [3000 * random(), 400 + 800 * random(), 1500 + 3000 * random()];
        const byIrrep = cubicBlockEigenvalues(irrepBlocks(d, geometry), coefficients).map((row) => row.map((v) => Array.from(v)));
        const byChannel = cubicBlockEigenvalues(cubicBlocks(d, geometry), coefficients).map((row) => row.map(sortedCopy));
        byIrrep.forEach(([a1, a2, e, t1, t2], s) => {
          const union = [sortedCopy([...a1!, ...e!]), t1!, sortedCopy([...t1!, ...t2!]), sortedCopy([...a2!, ...e!]), t2!];
          union.forEach((values, channel) => {
            const reference = byChannel[s]![channel]!;
            expect(values.length, `${geometry} d${d} spin ${s} channel ${channel}`).toBe(reference.length);
            values.forEach((v, i) => expect(Math.abs(v - reference[i]!)).toBeLessThan(1e-9 * (1 + Math.abs(v))));
          });
        });
      }
  });
});

describe('fast labelling = channel blocks named by counts and characters (tests/reference/channel-levels.ts)', () => {
  it.each(GEOMETRIES)('%s d1–d9, seeded random parameters (Dq from 0 to 3500 cm-1, some tiny): same levels in the same order', (geometry) => {
    const random = seededRandom(geometry === 'octahedral' ? 11 : 12);
    for (const d of ALL_D)
      for (let t = 0; t < 12; t++) {
        const b = 400 + 800 * random();
        const params = { dq: t === 0 ? 1e-3 * random() : 3500 * random(), b, c: b * (3 + 2.5 * random()) };
        const tol = energyTolerance(params);
        const reference = sortedChannelLevels(cubicBlocks(d, geometry), [params.dq, params.b, params.c], tol, parentTableFor(d, params.c / params.b).expected);
        const levels = computeLevels(d, geometry, params).levels;
        expect(levels.map((l) => `${l.multiplicity}${l.cubicIrrep}`), `${geometry} d${d} ${JSON.stringify(params)}`).toEqual(
          reference.map((r) => `${r.twoS + 1}${r.irrep}`),
        );
        const ground = reference[0]!.energy;
        const scale = 10 * params.dq + 20 * params.b + 10 * params.c;
        levels.forEach((l, i) => expect(Math.abs(l.energy - (reference[i]!.energy - ground))).toBeLessThanOrEqual(1e-12 * scale));
      }
  });

  it('d5: 4A1g(G) and 4Eg(G) come out with one energy at every Dq, listed A1 first', () => {
    for (const dq of [0, 100, 900, 1700, 2600]) {
      const levels = computeLevels(5, 'octahedral', { dq, b: 800, c: 3600 }).levels;
      const a1 = levels.findIndex((l) => l.label === '4A1g(G)');
      const e = levels.findIndex((l) => l.label === '4Eg(G)');
      expect(e, `Dq = ${dq}`).toBe(a1 + 1);
      expect(levels[e]!.energy).toBe(levels[a1]!.energy);
    }
  });
});
