import { dShellMasks, maskTwoMs } from './determinants.js';
import { symmetricEigenvalues } from './eigen-symmetric.js';
import { realOrbitalInMl, type OrbitalField } from './orbital-field.js';
import { dShellRepulsionIntegrals, integralIndex } from './repulsion.js';
import { oneBodyBlockMatrix, twoBodyBlockMatrix } from './slater-condon.js';
import { gramMatrix, nullSpaceBasis, oneBodyTransitionMatrix, projectMatrix, SPIN_RAISING } from './spin-projection.js';
import { validateD } from './validate.js';
import { invalidArgument } from '../errors.js';

/**
 * The spin-free levels of d^n in any one-electron field (an OrbitalField:
 * real d orbitals, cm-1), whatever its symmetry: the general engine that a
 * ligand-position model (angular-overlap.ts) feeds. Exact and plain, no
 * symmetry blocking beyond spin: the determinants are built on the real
 * orbitals z², xz, yz, x²−y², xy (bit i, i + 5 as in determinants.ts, i now
 * the real-orbital index), where both the field and the repulsion are real;
 * for each S, the M_S = S determinants killed by S+ (spin-projection.ts)
 * hold each spin-S multiplet once. H = field + B·H_B + C·H_C, with the
 * repulsion integrals of repulsion.ts carried to the real orbitals by the
 * unitary of orbital-field.ts (they come out real).
 *
 * Cost: one dense eigenproblem per spin, at most 75×75 (d5 doublets):
 * milliseconds, for fitting a geometry, not for the hot loops the blocked
 * engine serves. Levels within tol (1e-9 of the parameter scale) are one
 * level; degeneracy = (2S+1) × coincident states. Energies from the ground.
 */
export interface GeneralFieldLevel {
  /** cm-1 above the ground level. */
  energy: number;
  multiplicity: number;
  degeneracy: number;
}

interface SpinBlock {
  twoS: number;
  masks: number[];
  basis: Float64Array;
  size: number;
  /** Projected B and C operators. */
  repulsionB: Float64Array;
  repulsionC: Float64Array;
}

let realIntegrals: { coefB: Float64Array; coefC: Float64Array } | undefined;

/** <ab|cd> over real orbitals = Σ U*[m1][a] U*[m2][b] U[m3][c] U[m4][d] <m1 m2|m3 m4>; imaginary parts vanish (checked). */
export function realOrbitalRepulsionIntegrals(): { coefB: Float64Array; coefC: Float64Array } {
  if (realIntegrals) return realIntegrals;
  const { coefB, coefC } = dShellRepulsionIntegrals();
  const { re, im } = realOrbitalInMl();
  const transform = (g: Float64Array): Float64Array => {
    // Four one-index steps; complex numbers as [re, im] arrays of 625.
    let curRe = Float64Array.from(g);
    let curIm = new Float64Array(625);
    for (let position = 0; position < 4; position++) {
      const conjugate = position < 2;
      const nextRe = new Float64Array(625);
      const nextIm = new Float64Array(625);
      for (let index = 0; index < 625; index++) {
        const digits = [Math.floor(index / 125), Math.floor(index / 25) % 5, Math.floor(index / 5) % 5, index % 5];
        const real = digits[position]!;
        let sumRe = 0;
        let sumIm = 0;
        for (let m = 0; m < 5; m++) {
          digits[position] = m;
          const source = integralIndex(digits[0]!, digits[1]!, digits[2]!, digits[3]!);
          const ur = re[m * 5 + real]!;
          const ui = conjugate ? -im[m * 5 + real]! : im[m * 5 + real]!;
          sumRe += ur * curRe[source]! - ui * curIm[source]!;
          sumIm += ur * curIm[source]! + ui * curRe[source]!;
        }
        digits[position] = real;
        nextRe[index] = sumRe;
        nextIm[index] = sumIm;
      }
      curRe = nextRe;
      curIm = nextIm;
    }
    for (let i = 0; i < 625; i++) if (Math.abs(curIm[i]!) > 1e-12) throw new RangeError('real-orbital repulsion integral with an imaginary part');
    return curRe;
  };
  realIntegrals = { coefB: transform(coefB), coefC: transform(coefC) };
  return realIntegrals;
}

const cache: Array<SpinBlock[] | undefined> = [];

function spinBlocks(n: number): SpinBlock[] {
  const hit = cache[n];
  if (hit) return hit;
  const { coefB, coefC } = realOrbitalRepulsionIntegrals();
  const all = dShellMasks(n);
  const blocks: SpinBlock[] = [];
  for (let twoS = n % 2; twoS <= Math.min(n, 10 - n); twoS += 2) {
    const masks = all.filter((m) => maskTwoMs(m) === twoS);
    const upper = all.filter((m) => maskTwoMs(m) === twoS + 2);
    const gram = gramMatrix(oneBodyTransitionMatrix(upper, masks, SPIN_RAISING), upper.length, masks.length);
    const { basis, dimension } = nullSpaceBasis(gram, masks.length);
    if (dimension === 0) continue;
    const project = (m: Float64Array): Float64Array => projectMatrix(m, basis, masks.length, dimension);
    blocks.push({
      twoS, masks, basis, size: dimension,
      repulsionB: project(twoBodyBlockMatrix(masks, coefB)), repulsionC: project(twoBodyBlockMatrix(masks, coefC)),
    });
  }
  cache[n] = blocks;
  return blocks;
}

/** All spin-free levels of d^n (1..9) in the field, ascending (ties: higher spin first). b > 0, c ≥ 0 in cm-1. */
export function generalFieldLevels(d: number, field: OrbitalField, b: number, c: number): GeneralFieldLevel[] {
  validateD(d);
  if (d === 0 || d === 10) return [{ energy: 0, multiplicity: 1, degeneracy: 1 }];
  if (field.length !== 25 || !Array.from(field).every(Number.isFinite)) throw invalidArgument('field', 'a 5×5 matrix of finite numbers (cm-1) is needed');
  let scale = 20 * Math.abs(b) + 10 * Math.abs(c);
  for (const v of field) scale += Math.abs(v);
  const tol = 1e-9 * scale;
  const states: Array<{ energy: number; twoS: number }> = [];
  for (const block of spinBlocks(d)) {
    const h = projectMatrix(oneBodyBlockMatrix(block.masks, field), block.basis, block.masks.length, block.size);
    for (let i = 0; i < h.length; i++) h[i] = h[i]! + b * block.repulsionB[i]! + c * block.repulsionC[i]!;
    for (const energy of symmetricEigenvalues(h, block.size)) states.push({ energy, twoS: block.twoS });
  }
  states.sort((x, y) => x.energy - y.energy || y.twoS - x.twoS);
  const ground = states[0]!.energy;
  const levels: GeneralFieldLevel[] = [];
  const open = new Map<number, GeneralFieldLevel & { last: number }>();
  for (const { energy, twoS } of states) {
    const previous = open.get(twoS);
    if (previous && energy - previous.last <= tol) {
      previous.degeneracy += twoS + 1;
      previous.last = energy;
      continue;
    }
    const level = { energy: Math.max(0, energy - ground < tol ? 0 : energy - ground), multiplicity: twoS + 1, degeneracy: twoS + 1, last: energy };
    open.set(twoS, level);
    levels.push(level);
  }
  return levels.map(({ energy, multiplicity, degeneracy }) => ({ energy, multiplicity, degeneracy }));
}
