import { computeLevels } from './levels.js';
import { fieldTolerance, type FieldLevel, type ResolvedParameters } from './field-level-types.js';
import { CHANNEL_D4_IRREPS, D4_DIMENSION, tetragonalBlocks, type D4Irrep } from './tetragonal-blocks.js';
import { tetragonalLevelsFast } from './tetragonal-levels.js';
import { tetragonalSpectrum, type TetragonalSpectrum } from './tetragonal-spectrum.js';
import type { CubicIrrep, Geometry } from './types.js';

/**
 * The spin-free levels of d^n with a tetragonal field (Ds, Dt; ζ ignored):
 * the energies fits and diagrams evaluate, the raw and the labelled levels
 * (parents by the non-crossing rule, see field-level-types.ts), and the slow
 * labelled path that is both the Dq = 0 case and the tests' reference.
 */

const GERADE_D4H: Readonly<Record<D4Irrep, string>> = { A1: 'A1g', A2: 'A2g', E: 'Eg', B1: 'B1g', B2: 'B2g' };

/** O → D4 (C4 along z, C2' along x). */
const O_TO_D4: Readonly<Record<CubicIrrep, readonly D4Irrep[]>> = {
  A1: ['A1'], A2: ['B1'], E: ['A1', 'B1'], T1: ['A2', 'E'], T2: ['B2', 'E'],
};

/** One spin-free tetragonal level before labelling: energy on the Hamiltonian's zero, 2S, channel (CHANNEL_D4_IRREPS) and rank in its block. */
export interface RawTetragonalLevel {
  energy: number;
  twoS: number;
  channel: number;
  rank: number;
}

const tetragonalCoefficients = new Float64Array(5);

/**
 * The spin-free (S, D4 irrep) levels of d^n (1..9), octahedral geometry, at
 * Dq, B, C, Ds, Dt (ζ ignored), in the fixed order of tetragonal-spectrum.ts
 * (unsorted, ground marked): what fits and diagrams evaluate. The arrays are
 * reused by the next call for the same d.
 */
export function tetragonalEnergies(d: number, p: ResolvedParameters): TetragonalSpectrum {
  tetragonalCoefficients[0] = p.dq;
  tetragonalCoefficients[1] = p.b;
  tetragonalCoefficients[2] = p.c;
  tetragonalCoefficients[3] = p.ds;
  tetragonalCoefficients[4] = p.dt;
  return tetragonalSpectrum(tetragonalBlocks(d), tetragonalCoefficients);
}

/**
 * Every spin-free (S, D4 irrep) level of d^n (1..9) in the octahedral
 * geometry at Dq, B, C, Ds, Dt (ζ ignored), ascending (ties: higher spin,
 * then channel). Identity of a level along any path: (twoS, channel, rank).
 * Objects made from tetragonalSpectrum's typed arrays and sorted: for the
 * hot loops (fits, diagrams) tetragonalSpectrum itself is cheaper.
 */
export function tetragonalRawLevels(d: number, p: ResolvedParameters): RawTetragonalLevel[] {
  const { count, energy, twoS, channel, rank } = tetragonalEnergies(d, p);
  const raw = new Array<RawTetragonalLevel>(count);
  for (let i = 0; i < count; i++) raw[i] = { energy: energy[i]!, twoS: twoS[i]!, channel: channel[i]!, rank: rank[i]! };
  raw.sort((x, y) => x.energy - y.energy || y.twoS - x.twoS || x.channel - y.channel);
  return raw;
}

/**
 * The spin-free levels at the parameters (ζ ignored): cubic or tetragonal.
 * Energies from the ground level.
 */
export function spinFreeFieldLevels(d: number, geometry: Geometry, p: ResolvedParameters): FieldLevel[] {
  if (p.ds === 0 && p.dt === 0) {
    return computeLevels(d, geometry, p).levels.map((level) => ({
      energy: level.energy, degeneracy: level.degeneracy, irrep: level.irrep, parent: level.parent, parentWeight: 1,
      term: level.term, multiplicity: level.multiplicity, label: level.label,
    }));
  }
  const tol = fieldTolerance(p);
  if (p.dq !== 0) return tetragonalLevelsFast(d, p.dq, p.b, p.c, p.ds, p.dt, tol);
  return spinFreeTetragonalLevelsViaCubic(d, p);
}

/**
 * The tetragonal spin-free levels the slow, plain way: a labelled cubic
 * evaluation (computeLevels) gives the octahedral parents by (2S+1, D4
 * irrep) in ascending order, and the sorted tetragonal levels take them by
 * rank. Used at Dq = 0 (where only computeLevels orders a term's components)
 * and as the reference of tetragonal-levels.ts in the tests.
 */
export function spinFreeTetragonalLevelsViaCubic(d: number, p: ResolvedParameters): FieldLevel[] {
  const cubic = computeLevels(d, 'octahedral', p).levels;
  // (2S+1, D4 irrep) → octahedral parents in ascending energy.
  const parents = new Map<string, string[]>();
  for (const level of cubic)
    for (const irrep of O_TO_D4[level.cubicIrrep]) {
      const key = `${level.multiplicity}${irrep}`;
      let list = parents.get(key);
      if (!list) parents.set(key, (list = []));
      list.push(level.label);
    }
  const raw = tetragonalRawLevels(d, p);
  const tol = fieldTolerance(p);
  const ground = raw[0]!.energy;
  return raw.map(({ energy, twoS, channel, rank }) => {
    const irrep = CHANNEL_D4_IRREPS[channel]!;
    const multiplicity = twoS + 1;
    const parent = parents.get(`${multiplicity}${irrep}`)?.[rank] ?? '?';
    const term = `${multiplicity}${GERADE_D4H[irrep]}`;
    const relative = energy - ground;
    return {
      energy: relative < tol ? 0 : relative, degeneracy: multiplicity * D4_DIMENSION[irrep], irrep: GERADE_D4H[irrep],
      parent, parentWeight: 1, term, multiplicity, label: `${term}[${parent}]`,
    };
  });
}
