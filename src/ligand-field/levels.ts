import { FieldgapError } from '../errors.js';
import { IRREP_DIMENSION } from './cubic-group.js';
import { IRREP_COLUMNS, irrepBlocks, type IrrepBlocks } from './irrep-blocks.js';
import { levelKey, levelLabel, termName, irrepName } from './labels.js';
import { levelSpectrum, type LevelSpectrum } from './level-spectrum.js';
import { parentTableFor } from './parent-tables.js';
import { hundTwoSpin, spinStateChoice } from './spin-state.js';
import type { FieldParameters, Geometry, Level, LevelsResult, SpinState } from './types.js';
import { treesAlphaOf, treesIrrepBlocks, treesParentTable } from './trees-correction.js';
import { validateD, validateFieldParameters, validateGeometry } from './validate.js';

/**
 * Cluster tolerance in cm-1: far below any physical splitting, far above
 * round-off (eigenvalues are good to ~1e-15 of the matrix norm, itself below
 * this scale).
 */
export function energyTolerance({ dq, b, c }: FieldParameters): number {
  return 1e-9 * (10 * Math.abs(dq) + 20 * b + 10 * c);
}

function closedShell(d: number, geometry: Geometry, params: FieldParameters): LevelsResult {
  const term = termName(1, 'A1', geometry);
  const level: Level = {
    energy: 0, term, multiplicity: 1, irrep: irrepName('A1', geometry), cubicIrrep: 'A1',
    degeneracy: 1, parent: '1S', label: levelLabel(term, '1S'), rank: 0,
  };
  return {
    d, geometry, ...pick(params), groundTerm: term, spinState: 'no-choice', unpairedElectrons: 0, levels: [level],
    notes: [`d${d} is a closed configuration (1A1${geometry === 'octahedral' ? 'g' : ''} only): it has no ligand-field transitions`],
  };
}

function pick({ dq, b, c }: FieldParameters): FieldParameters {
  return { dq, b, c };
}

/** 2S, irrep column and rank of a level packed in one number: its identity among all levels. */
function identity(twoS: number, irrep: number, rank: number): number {
  return 64 * (5 * (twoS + 1) + irrep) + rank;
}

/** [dq, b, c, alpha]: the three-operator blocks read the first three. */
const coefficients = new Float64Array(4);

/**
 * Sorted position → position in the output. Normally the identity; at Dq = 0
 * a free-ion term's components coincide, and they are listed in the order
 * they take as soon as the field is on, so the ground level is the one a
 * Dq → 0 limit gives (5T2g, not 5Eg, for octahedral d6). Ranks stay those
 * of the Dq = 0 order.
 */
function freeIonOrder(blocks: IrrepBlocks, b: number, c: number, alpha: number, tol: number): (spectrum: LevelSpectrum) => number[] {
  coefficients.set([1e-6 * b, b, c, alpha]);
  const onset = levelSpectrum(blocks, coefficients, tol);
  const position = new Map<number, number>();
  for (let p = 0; p < onset.count; p++) position.set(identity(onset.twoS[p]!, onset.irrep[p]!, onset.rank[p]!), p);
  return ({ count, energy, twoS, irrep, rank }) => {
    const at = (p: number): number => position.get(identity(twoS[p]!, irrep[p]!, rank[p]!))!;
    return Array.from({ length: count }, (_, p) => p).sort((x, y) => energy[x]! - energy[y]! || at(x) - at(y));
  };
}

/**
 * All (2S+1, Γ) levels of d^n in a cubic field, with energies in cm-1 above
 * the ground level, labelled by term, parent free-ion term and rank.
 *
 * params: Dq, B, C in cm-1 (Dq ≥ 0, B > 0, C ≥ 0); the geometry sets the sign
 * of the field. Order: ascending energy; exact ties (levels within the
 * cluster tolerance share one energy) by higher spin, then A1, A2, E, T1,
 * T2. The per-(d, geometry) operator matrices and work arrays, and the label
 * tables per C/B (parent-tables.ts), are built once and cached, so a call
 * costs five small diagonalisations per spin and the result objects; the
 * caches hold no per-call state, so a result depends on the arguments only.
 * d0 and d10 give the single 1A1(g) level and a note.
 */
export function computeLevels(d: number, geometry: Geometry, params: FieldParameters): LevelsResult {
  validateD(d);
  validateGeometry(geometry);
  validateFieldParameters(params);
  if (d === 0 || d === 10) return closedShell(d, geometry, params);
  const { dq, b, c } = params;
  const alpha = treesAlphaOf(params);
  const table = alpha === 0 ? parentTableFor(d, c / b) : treesParentTable(d, b, c, alpha);
  const blocks = alpha === 0 ? irrepBlocks(d, geometry) : treesIrrepBlocks(d, geometry);
  const tol = energyTolerance(params);
  const reorder = dq === 0 ? freeIonOrder(blocks, b, c, alpha, tol) : undefined;
  coefficients[0] = dq;
  coefficients[1] = b;
  coefficients[2] = c;
  coefficients[3] = alpha;
  const spectrum = levelSpectrum(blocks, coefficients, tol);
  const order = reorder?.(spectrum);
  const labels = table.labels(geometry);
  const levels: Level[] = new Array<Level>(spectrum.count);
  const groundPosition = order ? order[0]! : 0;
  const groundEnergy = spectrum.energy[groundPosition]!;
  const groundTwoS = spectrum.twoS[groundPosition]!;
  for (let out = 0; out < spectrum.count; out++) {
    const p = order ? order[out]! : out;
    const multiplicity = spectrum.twoS[p]! + 1;
    const irrep = IRREP_COLUMNS[spectrum.irrep[p]!]!;
    const rank = spectrum.rank[p]!;
    const key = levelKey(multiplicity, irrep);
    const parent = table.parents[key]?.[rank];
    const label = labels[key]?.[rank];
    if (parent === undefined || label === undefined) {
      throw new FieldgapError('internal', `no free-ion parent for level ${multiplicity}${irrep} #${rank}`);
    }
    const energy = spectrum.energy[p]! - groundEnergy;
    levels[out] = {
      energy: energy < tol ? 0 : energy,
      term: termName(multiplicity, irrep, geometry),
      multiplicity,
      irrep: irrepName(irrep, geometry),
      cubicIrrep: irrep,
      degeneracy: multiplicity * IRREP_DIMENSION[irrep],
      parent,
      label,
      rank,
    };
  }
  const groundLevel = levels[0]!;
  let spinState: SpinState = 'no-choice';
  if (spinStateChoice(d, geometry)) spinState = groundTwoS === hundTwoSpin(d) ? 'high-spin' : 'low-spin';
  const notes: string[] = [];
  if (dq === 0) notes.push('Dq = 0: the free ion; each level is one cubic component of a free-ion term');
  else if (levels.length > 1 && levels[1]!.energy === 0) {
    notes.push(`the ground level is degenerate: ${levels.filter((l) => l.energy === 0).map((l) => l.label).join(', ')} coincide`);
  }
  return {
    d, geometry, ...pick(params), groundTerm: groundLevel.term, spinState, unpairedElectrons: groundTwoS,
    levels, notes,
  };
}
