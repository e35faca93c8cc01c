import { blockPart, type OperatorBlock } from './blocks.js';
import { cubicFieldOrbitalMatrix } from './cubic-field.js';
import { dShellMasks, maskMl, maskTwoMs } from './determinants.js';
import { dShellRepulsionIntegrals } from './repulsion.js';
import { twoBodyBlockMatrix } from './slater-condon.js';
import { c2xWithSpinMatrix, spinFreeSpinOrbitalMatrix, spinOrbitalOneBodyMatrix, spinOrbitSpinOrbitalMatrix } from './spin-orbit.js';
import { dsOrbitalMatrix, dtOrbitalMatrix } from './tetragonal-field.js';
import type { Geometry } from './types.js';

/**
 * The d^n Hamiltonian with spin–orbit coupling in blocks of the double group
 * D4' (C4 along z, C2' along x), over determinants (real symmetric, see
 * spin-orbit.ts). H = Dq·V_cubic + Ds·V_s + Dt·V_t + B·H_B + C·H_C + ζ·H_so.
 *
 * C4(z) is e^(−iπ·2M_J/4) on a determinant, and every term changes M_J by a
 * multiple of 4 (the cubic field couples m_l with m_l ± 4), so the
 * determinants fall into classes by 2M_J mod 8. Time reversal (and C2')
 * maps class c onto class −c mod 8 with the same energies, so only half of
 * them are diagonalised:
 *   odd n: class 1 (M_J ≡ ±½ mod 4) holds one state of each Γ6 (E'1/2)
 *     Kramers pair, class 3 (M_J ≡ ±3/2) one of each Γ7 (E'3/2) pair;
 *   even n: class 2 (M_J ≡ 1 mod 4) one row of each E; class 0 (M_J ≡ 0)
 *     splits by C2(x) parity into A1 (+) and A2 (−); class 4 (M_J ≡ 2)
 *     into B1 (+) and B2 (−).
 * Bethe/Koster names in D4': Γ1 A1, Γ2 A2, Γ3 B1, Γ4 B2, Γ5 E, Γ6 E'1/2,
 * Γ7 E'3/2. For d5 the 252 determinants split into four classes of 63, and
 * two 63×63 blocks are diagonalised.
 */
export type DoubleGroupIrrep = 'A1' | 'A2' | 'B1' | 'B2' | 'E' | "E'1/2" | "E'3/2";

export interface DoubleGroupBlock {
  irrep: DoubleGroupIrrep;
  /** States per level: 1 for A, B; 2 for E and the Kramers pairs. */
  degeneracy: number;
  block: OperatorBlock;
}

export interface DoubleGroupBlocks {
  n: number;
  geometry: Geometry;
  blocks: DoubleGroupBlock[];
  /** Total number of states, C(10, n). */
  states: number;
}

/** Parameter order of the operators of every block. */
export const DOUBLE_GROUP_PARAMETERS = ['dq', 'ds', 'dt', 'b', 'c', 'zeta'] as const;

function twoMj(mask: number): number {
  return 2 * maskMl(mask) + maskTwoMs(mask);
}

function identity(n: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let i = 0; i < n; i++) out[i * n + i] = 1;
  return out;
}

const cache = new Map<string, DoubleGroupBlocks>();

/** The double-group blocks of d^n (1..9) in a geometry, built once and cached. */
export function doubleGroupBlocks(n: number, geometry: Geometry): DoubleGroupBlocks {
  const key = `${n}:${geometry}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const { coefB, coefC } = dShellRepulsionIntegrals();
  const oneBody = [
    spinFreeSpinOrbitalMatrix(cubicFieldOrbitalMatrix(geometry)),
    spinFreeSpinOrbitalMatrix(dsOrbitalMatrix()),
    spinFreeSpinOrbitalMatrix(dtOrbitalMatrix()),
  ];
  const so = spinOrbitSpinOrbitalMatrix();
  const all = dShellMasks(n);
  const classOf = (mask: number): number => (((twoMj(mask) % 8) + 8) % 8);
  const makeBlock = (cls: number): OperatorBlock => {
    const masks = all.filter((m) => classOf(m) === cls);
    const operators = [
      ...oneBody.map((h) => spinOrbitalOneBodyMatrix(masks, masks, h)),
      twoBodyBlockMatrix(masks, coefB),
      twoBodyBlockMatrix(masks, coefC),
      spinOrbitalOneBodyMatrix(masks, masks, so),
    ];
    return { twoS: -1, label: cls, masks, size: masks.length, basis: identity(masks.length), operators };
  };
  const blocks: DoubleGroupBlock[] = [];
  if (n % 2 === 1) {
    blocks.push({ irrep: "E'1/2", degeneracy: 2, block: makeBlock(1) });
    blocks.push({ irrep: "E'3/2", degeneracy: 2, block: makeBlock(3) });
  } else {
    for (const [cls, plus, minus] of [[0, 'A1', 'A2'], [4, 'B1', 'B2']] as const) {
      const whole = makeBlock(cls);
      const parity = c2xWithSpinMatrix(whole.masks);
      blocks.push({ irrep: plus, degeneracy: 1, block: blockPart(whole, parity, (v) => v > 0) });
      blocks.push({ irrep: minus, degeneracy: 1, block: blockPart(whole, parity, (v) => v < 0) });
    }
    blocks.push({ irrep: 'E', degeneracy: 2, block: makeBlock(2) });
  }
  const result: DoubleGroupBlocks = { n, geometry, blocks, states: all.length };
  cache.set(key, result);
  return result;
}
