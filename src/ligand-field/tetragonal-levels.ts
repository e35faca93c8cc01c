import { FieldgapError } from '../errors.js';
import { cubicBlockEigenvalues } from './block-spectra.js';
import { irrepBlocks } from './irrep-blocks.js';
import { energyTolerance } from './levels.js';
import { parentTableFor } from './parent-tables.js';
import { CHANNEL_D4_IRREPS, D4_DIMENSION, tetragonalBlocks, type D4Irrep } from './tetragonal-blocks.js';
import { tetragonalSpectrum } from './tetragonal-spectrum.js';

/**
 * The labelled spin-free levels of d^n (1..9) in a tetragonal field
 * (octahedral parent geometry, Dq ≠ 0), fast: no cubic Level objects and no
 * string keys on the way. Each level is (2S+1, D4h irrep) with its
 * octahedral parent: the i-th lowest (S, Γ4) level's parent is the i-th
 * lowest octahedral (S, Γ) level whose O → D4 reduction holds Γ4 (the
 * non-crossing rule along t·(Ds, Dt), see field-levels.ts). The D4 channel
 * of each octahedral irrep (O → D4: A1 → A1, A2 → B1, E → A1 + B1,
 * T1 → A2 + E, T2 → B2 + E), read backwards, says which cubic (S, Γ) lists
 * are merged for each channel: A1 ← A1, E; A2 ← T1; E ← T1, T2;
 * B1 ← A2, E; B2 ← T2. The cubic energies are the eigenvalues of the
 * irrep blocks (irrep-blocks.ts) at Dq, B, C, the names those of
 * computeLevels (parent-tables.ts): rank r of (S, Γ) is the r-th eigenvalue
 * of its block. Equal energies (within computeLevels' cluster tolerance)
 * merge in irrep-column order, as computeLevels sorts ties. The slow
 * reference (computeLevels, then lists by (S, Γ4)) is
 * spinFreeTetragonalLevelsViaCubic in field-levels.ts, which also serves
 * Dq = 0; tests/ligand-field/tetragonal-levels.test.ts compares the two.
 */
export interface SpinFreeTetragonalLevel {
  /** cm-1 above the ground level (0 within tol). */
  energy: number;
  twoS: number;
  irrep: D4Irrep;
  /** The octahedral parent's label, "4T1g(F)". */
  parent: string;
  degeneracy: number;
}

/** D4 channel (CHANNEL_D4_IRREPS index) → the cubic irrep columns (A1, A2, E, T1, T2 = 0..4) that hold it. */
const CUBIC_SOURCES: readonly (readonly number[])[] = [[0, 2], [3], [3, 4], [1, 2], [4]];

const cubicCoefficients = new Float64Array(3);
const coefficients = new Float64Array(5);

/** The parents of one (S, channel), ascending, by merging the sorted cubic lists (one or two). */
function channelParents(
  first: Float64Array, second: Float64Array | undefined, firstNames: readonly string[] | undefined, secondNames: readonly string[] | undefined, tol: number,
): string[] {
  if (first.length === 0 && (!second || second.length === 0)) return [];
  if (!second) return firstNames!.slice(0, first.length);
  const out: string[] = [];
  let i = 0;
  let j = 0;
  while (i < first.length || j < second.length) {
    // Ties within tol go to the first list (the lower irrep column), as computeLevels orders them.
    if (j >= second.length || (i < first.length && first[i]! <= second[j]! + tol)) out.push(firstNames![i++]!);
    else out.push(secondNames![j++]!);
  }
  return out;
}

/**
 * The levels, ascending (ties: higher spin, then channel), energies from the
 * ground level; tol (cm-1) zeroes round-off at the ground. dq ≠ 0: at Dq = 0
 * the octahedral order of a term's components is that of the limit Dq → 0
 * (levels.ts), which only computeLevels knows.
 */
export function tetragonalLevelsFast(d: number, dq: number, b: number, c: number, ds: number, dt: number, tol: number): SpinFreeTetragonalLevel[] {
  const mergeTol = energyTolerance({ dq, b, c });
  const cubic = irrepBlocks(d, 'octahedral');
  cubicCoefficients[0] = dq;
  cubicCoefficients[1] = b;
  cubicCoefficients[2] = c;
  const cubicValues = cubicBlockEigenvalues(cubic, cubicCoefficients);
  const labels = parentTableFor(d, c / b).labels('octahedral');
  const blocks = tetragonalBlocks(d);
  // parents[8·twoS + channel]: the parent names of that (S, channel) in ascending order.
  const parents: string[][] = [];
  const spins = cubic.twoSValues;
  for (let s = 0; s < spins.length; s++) {
    const twoS = spins[s]!;
    const values = cubicValues[s]!;
    for (let channel = 0; channel < 5; channel++) {
      const [a, b2] = CUBIC_SOURCES[channel]!;
      const base = 5 * (twoS + 1);
      parents[8 * twoS + channel] = b2 === undefined
        ? channelParents(values[a!]!, undefined, labels[base + a!], undefined, mergeTol)
        : channelParents(values[a!]!, values[b2]!, labels[base + a!], labels[base + b2], mergeTol);
    }
  }
  coefficients.set(cubicCoefficients);
  coefficients[3] = ds;
  coefficients[4] = dt;
  const spectrum = tetragonalSpectrum(blocks, coefficients);
  const { count, energy, twoS, channel, rank } = spectrum;
  // Positions come highest spin first, then by channel, each block ascending: a
  // stable insertion sort on energy alone gives the tie order (higher spin, then channel).
  const order = orderScratch.length >= count ? orderScratch : (orderScratch = new Int32Array(count));
  for (let p = 0; p < count; p++) {
    const e = energy[p]!;
    let q = p - 1;
    while (q >= 0 && energy[order[q]!]! > e) {
      order[q + 1] = order[q]!;
      q--;
    }
    order[q + 1] = p;
  }
  const ground = energy[order[0]!]!;
  const levels = new Array<SpinFreeTetragonalLevel>(count);
  for (let k = 0; k < count; k++) {
    const i = order[k]!;
    const parent = parents[8 * twoS[i]! + channel[i]!]?.[rank[i]!];
    if (parent === undefined) throw new FieldgapError('internal', `no octahedral parent for tetragonal level ${twoS[i]! + 1}${CHANNEL_D4_IRREPS[channel[i]!]} #${rank[i]}`);
    const irrep = CHANNEL_D4_IRREPS[channel[i]!]!;
    const relative = energy[i]! - ground;
    levels[k] = { energy: relative < tol ? 0 : relative, twoS: twoS[i]!, irrep, parent, degeneracy: (twoS[i]! + 1) * D4_DIMENSION[irrep] };
  }
  return levels;
}

let orderScratch = new Int32Array(0);
