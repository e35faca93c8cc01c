import { FieldgapError } from '../errors.js';
import { cubicBlocks } from './blocks.js';
import { freeIonRecordsUnitB } from './free-ion.js';
import { CUBIC_IRREPS, IRREP_DIMENSION } from './cubic-group.js';
import { levelKey, levelLabel, parentTable, termName, irrepName } from './labels.js';
import { rawLevels, type RawLevel } from './level-symmetry.js';
import { hundTwoSpin, spinStateChoice } from './spin-state.js';
import type { FieldParameters, Geometry, Level, LevelsResult, SpinState } from './types.js';
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

const IRREP_ORDER = new Map(CUBIC_IRREPS.map((irrep, i) => [irrep, i]));

/** Ascending energy; ties by higher spin, then irrep order A1, A2, E, T1, T2. */
function byEnergy(x: RawLevel, y: RawLevel): number {
  return x.energy - y.energy || y.twoS - x.twoS || IRREP_ORDER.get(x.irrep)! - IRREP_ORDER.get(y.irrep)!;
}

/**
 * All (2S+1, Γ) levels of d^n in a cubic field, with energies in cm-1 above
 * the ground level, labelled by term, parent free-ion term and rank.
 *
 * params: Dq, B, C in cm-1 (Dq ≥ 0, B > 0, C ≥ 0); the geometry sets the sign
 * of the field. The per-(d, geometry) operator matrices are built once and
 * cached, so repeated calls cost a handful of small diagonalisations.
 * d0 and d10 give the single 1A1(g) level and a note.
 */
export function computeLevels(d: number, geometry: Geometry, params: FieldParameters): LevelsResult {
  validateD(d);
  validateGeometry(geometry);
  validateFieldParameters(params);
  if (d === 0 || d === 10) return closedShell(d, geometry, params);
  const { dq, b, c } = params;
  const table = parentTable(freeIonRecordsUnitB(d, c / b));
  const blocks = cubicBlocks(d, geometry);
  const tol = energyTolerance(params);
  const ranked = rankLevels(rawLevels(blocks, [dq, b, c], tol, table.expected));
  if (dq === 0) {
    // At Dq = 0 a free-ion term's components coincide; list them in the order
    // they take as soon as the field is on, so the ground level is the one a
    // Dq → 0 limit gives (5T2g, not 5Eg, for octahedral d6).
    const onset = rankLevels(rawLevels(blocks, [1e-6 * b, b, c], tol, table.expected));
    const position = new Map(onset.map((r, i) => [rankedKey(r), i]));
    ranked.sort((x, y) => x.energy - y.energy || position.get(rankedKey(x))! - position.get(rankedKey(y))!);
  }
  const ground = ranked[0]!;
  const labels = table.labels(geometry);
  const levels: Level[] = ranked.map((r) => {
    const multiplicity = r.twoS + 1;
    const key = levelKey(multiplicity, r.irrep);
    const parent = table.parents[key]?.[r.rank];
    const label = labels[key]?.[r.rank];
    if (parent === undefined || label === undefined) {
      throw new FieldgapError('internal', `no free-ion parent for level ${multiplicity}${r.irrep} #${r.rank}`);
    }
    const energy = r.energy - ground.energy;
    return {
      energy: energy < tol ? 0 : energy,
      term: termName(multiplicity, r.irrep, geometry),
      multiplicity,
      irrep: irrepName(r.irrep, geometry),
      cubicIrrep: r.irrep,
      degeneracy: multiplicity * IRREP_DIMENSION[r.irrep],
      parent,
      label,
      rank: r.rank,
    };
  });
  const groundLevel = levels[0]!;
  let spinState: SpinState = 'no-choice';
  if (spinStateChoice(d, geometry)) spinState = ground.twoS === hundTwoSpin(d) ? 'high-spin' : 'low-spin';
  const notes: string[] = [];
  if (dq === 0) notes.push('Dq = 0: the free ion; each level is one cubic component of a free-ion term');
  else if (levels.length > 1 && levels[1]!.energy === 0) {
    notes.push(`the ground level is degenerate: ${levels.filter((l) => l.energy === 0).map((l) => l.label).join(', ')} coincide`);
  }
  return {
    d, geometry, ...pick(params), groundTerm: groundLevel.term, spinState, unpairedElectrons: ground.twoS,
    levels, notes,
  };
}

interface RankedLevel extends RawLevel {
  rank: number;
}

/** Position of a level among all levels: (2S+1, Γ) key and rank packed in one number. */
function rankedKey(r: RankedLevel): number {
  return 64 * levelKey(r.twoS + 1, r.irrep) + r.rank;
}

/** Sorts by energy and numbers the levels of each (S, Γ) from 0 upwards (in place). */
function rankLevels(raw: RawLevel[]): RankedLevel[] {
  raw.sort(byEnergy);
  const ranks = new Int32Array(64);
  const ranked = raw as RankedLevel[];
  for (const r of ranked) r.rank = ranks[levelKey(r.twoS + 1, r.irrep)]!++;
  return ranked;
}
