import { FieldgapError } from '../../src/errors.js';
import { cubicBlockEigenvalues } from '../../src/ligand-field/block-spectra.js';
import { irrepBlocks } from '../../src/ligand-field/irrep-blocks.js';
import { energyTolerance } from '../../src/ligand-field/levels.js';
import { parentTableFor } from '../../src/ligand-field/parent-tables.js';
import { CHANNEL_D4_IRREPS, D4_DIMENSION, tetragonalBlocks, type D4Irrep } from '../../src/ligand-field/tetragonal-blocks.js';
import { tetragonalSpectrum } from '../../src/ligand-field/tetragonal-spectrum.js';

/**
 * Reference for tests: the labelled tetragonal path as it stood on main
 * before the per-d^n plan of src/ligand-field/tetragonal-levels.ts (commit
 * 562098f), kept unchanged apart from its imports and name, so the tests can
 * show that the faster path gives the same levels, parents and labels on
 * every d^n. Method: eigenvalues of every cubic irrep block at Dq, B, C;
 * per (S, D4 channel) the cubic parent names merged in ascending cubic
 * energy into fresh arrays; the tetragonal levels sorted; one object per
 * level, then (tetragonalLevelsMainAsFieldLevels) a second with the strings.
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
export function tetragonalLevelsMain(d: number, dq: number, b: number, c: number, ds: number, dt: number, tol: number): SpinFreeTetragonalLevel[] {
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

const GERADE_D4H: Readonly<Record<D4Irrep, string>> = { A1: 'A1g', A2: 'A2g', E: 'Eg', B1: 'B1g', B2: 'B2g' };

/** The FieldLevel objects main's spinFreeFieldLevels made from tetragonalLevelsMain (same mapping, copied). */
export function tetragonalLevelsMainAsFieldLevels(d: number, dq: number, b: number, c: number, ds: number, dt: number, tol: number) {
  return tetragonalLevelsMain(d, dq, b, c, ds, dt, tol).map(({ energy, twoS, irrep, parent, degeneracy }) => {
    const term = `${twoS + 1}${GERADE_D4H[irrep]}`;
    return { energy, degeneracy, irrep: GERADE_D4H[irrep], parent, parentWeight: 1, term, multiplicity: twoS + 1, label: `${term}[${parent}]` };
  });
}
