import { invalidArgument } from '../errors.js';
import { blockHamiltonianInto } from './block-spectra.js';
import { doubleGroupBlocks, type DoubleGroupIrrep } from './double-group-blocks.js';
import { createEigenWorkspace, symmetricEigen, symmetricEigenvaluesInPlace, type EigenWorkspace } from './eigen-symmetric.js';
import { computeLevels } from './levels.js';
import { CHANNEL_D4_IRREPS, D4_DIMENSION, tetragonalBlocks, type D4Irrep } from './tetragonal-blocks.js';
import { tetragonalLevelsFast } from './tetragonal-levels.js';
import { tetragonalSpectrum, type TetragonalSpectrum } from './tetragonal-spectrum.js';
import type { CubicIrrep, FieldParameters, Geometry } from './types.js';
import { validateD, validateFieldParameters, validateFinite, validateGeometry } from './validate.js';

/**
 * Levels of d^n beyond the cubic field: a tetragonal field (Ds, Dt, the
 * convention of tetragonal-field.ts: positive Ds and Dt elongate along z)
 * and spin–orbit coupling ζ Σ l·s (ζ the one-electron constant, cm-1,
 * ≥ 0; more-than-half-filled shells get their inverted multiplets from the
 * many-electron algebra, not from a sign of ζ).
 *
 * Three regimes, one result shape:
 * - Ds = Dt = ζ = 0: the cubic levels of levels.ts, unchanged.
 * - ζ = 0, Ds or Dt ≠ 0 (octahedral only): (2S+1, Γ) levels, Γ an irrep
 *   of D4h (A1g, A2g, B1g, B2g, Eg); parent = the octahedral level it comes
 *   from as (Ds, Dt) → 0 at fixed Dq, B, C: the i-th lowest (S, Γ) level
 *   ends on the i-th lowest (S, Γ) component of the octahedral levels (O →
 *   D4: A1 → A1, A2 → B1, E → A1 + B1, T1 → A2 + E, T2 → B2 + E), by the
 *   non-crossing rule along the one-parameter path t·(Ds, Dt), as labels.ts
 *   argues for Dq.
 * - ζ > 0: levels of the double group (Bethe's Γ names): O' (or Td', the
 *   same labels on d^n) when Ds = Dt = 0, Γ1..Γ8; D4' otherwise, Γ1..Γ7.
 *   parent = the spin-free level (the same Dq, Ds, Dt, B, C at ζ = 0) with
 *   the largest weight Σ|<spin-free state|level>|² in the level's
 *   eigenvector, and parentWeight that weight (0..1). Degenerate spin-free
 *   levels cannot be told apart by weight: their names are joined with "+".
 * Energies in cm-1 above the ground level; degeneracies add up to C(10, n).
 */
export interface TetragonalParameters extends FieldParameters {
  /** Tetragonal Ds, cm-1 (any sign). Default 0. */
  ds?: number | undefined;
  /** Tetragonal Dt, cm-1 (any sign). Default 0. */
  dt?: number | undefined;
  /** One-electron spin–orbit constant ζ, cm-1, ≥ 0. Default 0 (off). */
  zeta?: number | undefined;
}

/** All six parameters present. */
export interface ResolvedParameters extends FieldParameters {
  ds: number;
  dt: number;
  zeta: number;
}

export type SiteGroup = 'Oh' | 'Td' | 'D4h' | "O'" | "Td'" | "D4'";

export interface FieldLevel {
  /** cm-1 above the ground level. */
  energy: number;
  /** Number of states. */
  degeneracy: number;
  /** "A2g" (D4h), "T1g" (Oh), "T1" (Td) or a double-group irrep "Γ8". */
  irrep: string;
  /** Octahedral parent ("4T1g(F)") in D4h; spin-free parent with spin–orbit; free-ion term ("4F") in a cubic field. */
  parent: string;
  /** With spin–orbit: the weight of the parent in the level (0..1); 1 otherwise. */
  parentWeight: number;
  /** "4A2g", "Γ8". */
  term: string;
  /** 2S+1; with spin–orbit, that of the dominant parent. */
  multiplicity: number;
  /** For display: "4A2g[4T1g(F)]", "Γ8[4T1(F) 97%]". */
  label: string;
  /**
   * With spin–orbit only: the weight (0..1) of every spin-free parent that
   * holds at least PARENT_WEIGHT_FLOOR of the level, the dominant one
   * included. A level whose dominant parent is a doublet can hold a large
   * share of a quartet (2T1(G) beside 4T1(P) in tetrahedral Co(II)): it
   * borrows that quartet's intensity, and a fit may put a band on it.
   */
  parentWeights?: Readonly<Record<string, number>>;
}

/** Parents below this weight in a spin–orbit level are left out of parentWeights. */
export const PARENT_WEIGHT_FLOOR = 0.01;

export interface FieldLevelsResult {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  ds: number;
  dt: number;
  zeta: number;
  symmetry: 'cubic' | 'tetragonal';
  spinOrbit: boolean;
  group: SiteGroup;
  groundTerm: string;
  levels: FieldLevel[];
  notes: string[];
}

/** Cluster tolerance, cm-1: far below any physical splitting, far above round-off. */
function tolerance(p: ResolvedParameters): number {
  return 1e-9 * (10 * Math.abs(p.dq) + 20 * p.b + 10 * p.c + 10 * Math.abs(p.ds) + 10 * Math.abs(p.dt) + 5 * p.zeta);
}

/** Checks the parameters; every failure names its field. */
export function validateTetragonalParameters(geometry: Geometry, params: TetragonalParameters): ResolvedParameters {
  validateFieldParameters(params);
  const { ds = 0, dt = 0, zeta = 0 } = params;
  validateFinite(ds, 'ds');
  validateFinite(dt, 'dt');
  validateFinite(zeta, 'zeta', { min: 0 });
  if (geometry === 'tetrahedral' && (ds !== 0 || dt !== 0)) {
    throw invalidArgument(ds !== 0 ? 'ds' : 'dt', 'Ds and Dt describe a tetragonally distorted octahedron: use the octahedral geometry (a distorted tetrahedron, D2d, is not supported)');
  }
  return { dq: params.dq, b: params.b, c: params.c, ds, dt, zeta };
}

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
  const tol = tolerance(p);
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
  const tol = tolerance(p);
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

/** Bethe names of the D4' irreps. */
const D4_DOUBLE_NAMES: Readonly<Record<DoubleGroupIrrep, string>> = {
  A1: 'Γ1', A2: 'Γ2', B1: 'Γ3', B2: 'Γ4', E: 'Γ5', "E'1/2": 'Γ6', "E'3/2": 'Γ7',
};

/**
 * O' irreps from the D4' content of a cubic cluster (O' → D4': Γ1 → A1,
 * Γ2 → B1, Γ3 → A1 + B1, Γ4 → A2 + E, Γ5 → B2 + E, Γ6 → E'1/2,
 * Γ7 → E'3/2, Γ8 → E'1/2 + E'3/2). Greedy: pairs first, then singles; an
 * accidental coincidence of several O' levels is split into its parts.
 */
function cubicDoubleGroupNames(content: DoubleGroupIrrep[]): string[] {
  const left = [...content];
  const take = (a: DoubleGroupIrrep, b: DoubleGroupIrrep): boolean => {
    const i = left.indexOf(a);
    const j = left.indexOf(b);
    if (i < 0 || j < 0) return false;
    left.splice(Math.max(i, j), 1);
    left.splice(Math.min(i, j), 1);
    return true;
  };
  const names: string[] = [];
  for (const [a, b, name] of [["E'1/2", "E'3/2", 'Γ8'], ['A2', 'E', 'Γ4'], ['B2', 'E', 'Γ5'], ['A1', 'B1', 'Γ3']] as const) {
    while (take(a, b)) names.push(name);
  }
  const single: Partial<Record<DoubleGroupIrrep, string>> = { A1: 'Γ1', B1: 'Γ2', "E'1/2": 'Γ6', "E'3/2": 'Γ7' };
  for (const irrep of left) names.push(single[irrep] ?? `?${irrep}`);
  return names;
}

interface SoState {
  energy: number;
  irrep: DoubleGroupIrrep;
  degeneracy: number;
  /** Weight per spin-free parent name. */
  weights: Map<string, number>;
}

const eigenScratch: { size: number; h: Float64Array; values: Float64Array; eigen: EigenWorkspace } = {
  size: 0, h: new Float64Array(0), values: new Float64Array(0), eigen: createEigenWorkspace(1),
};

/** One level of a D4' block with spin–orbit: energy on the Hamiltonian's zero, block irrep, states per level, rank in its block. */
export interface RawDoubleGroupLevel {
  energy: number;
  irrep: DoubleGroupIrrep;
  degeneracy: number;
  rank: number;
}

/**
 * Every level of the D4' blocks with spin–orbit (each Kramers pair or E
 * once, with its degeneracy), ascending. The fast path for fits and
 * diagrams: eigenvalues only. Identity along a path: (irrep, rank).
 */
export function doubleGroupRawLevels(d: number, geometry: Geometry, p: ResolvedParameters): RawDoubleGroupLevel[] {
  const { blocks } = doubleGroupBlocks(d, geometry);
  const coefficients = [p.dq, p.ds, p.dt, p.b, p.c, p.zeta];
  const out: RawDoubleGroupLevel[] = [];
  for (const { block, degeneracy, irrep } of blocks) {
    const n = block.size;
    if (eigenScratch.size < n) {
      eigenScratch.size = n;
      eigenScratch.h = new Float64Array(n * n);
      eigenScratch.values = new Float64Array(n);
      eigenScratch.eigen = createEigenWorkspace(n);
    }
    blockHamiltonianInto(block, coefficients, eigenScratch.h);
    symmetricEigenvaluesInPlace(eigenScratch.h, n, eigenScratch.values, eigenScratch.eigen);
    for (let rank = 0; rank < n; rank++) out.push({ energy: eigenScratch.values[rank]!, irrep, degeneracy, rank });
  }
  out.sort((x, y) => x.energy - y.energy);
  return out;
}

/** Ascending energies (cm-1, Hamiltonian's zero) and degeneracies of the levels with spin–orbit (see doubleGroupRawLevels). */
export function spinOrbitEnergies(d: number, geometry: Geometry, p: ResolvedParameters): { energies: Float64Array; degeneracies: Int32Array } {
  const raw = doubleGroupRawLevels(d, geometry, p);
  return { energies: Float64Array.from(raw, (r) => r.energy), degeneracies: Int32Array.from(raw, (r) => r.degeneracy) };
}

function spinOrbitLevels(d: number, geometry: Geometry, p: ResolvedParameters): FieldLevel[] {
  const tol = tolerance(p);
  const spinFree = spinFreeFieldLevels(d, geometry, p);
  const { blocks } = doubleGroupBlocks(d, geometry);
  const withSo = [p.dq, p.ds, p.dt, p.b, p.c, p.zeta];
  const without = [p.dq, p.ds, p.dt, p.b, p.c, 0];
  const solved = blocks.map(({ block }) => {
    const n = block.size;
    const h = new Float64Array(n * n);
    blockHamiltonianInto(block, withSo, h);
    const full = symmetricEigen(h, n);
    blockHamiltonianInto(block, without, h);
    const free = symmetricEigen(h, n);
    return { n, full, free };
  });
  const freeGround = Math.min(...solved.filter((s) => s.n > 0).map((s) => s.free.values[0]!));
  // Spin-free names by energy: coincident spin-free levels share one name.
  const matchTol = Math.max(1e3 * tol, 1e-6);
  const nameAt = (energy: number): string => {
    const names = spinFree.filter((level) => Math.abs(level.energy - energy) <= matchTol).map((level) => level.label);
    return names.length > 0 ? [...new Set(names)].join('+') : '?';
  };
  const states: SoState[] = [];
  blocks.forEach(({ irrep, degeneracy }, b) => {
    const { n, full, free } = solved[b]!;
    // Clusters of the ζ = 0 eigenvalues: one spin-free level (or a coincident set) each.
    const clusterName: string[] = [];
    for (let i = 0; i < n; i++) clusterName.push(nameAt(free.values[i]! - freeGround));
    for (let j = 0; j < n; j++) {
      const weights = new Map<string, number>();
      for (let i = 0; i < n; i++) {
        let overlap = 0;
        for (let k = 0; k < n; k++) overlap += free.vectors[k * n + i]! * full.vectors[k * n + j]!;
        const name = clusterName[i]!;
        weights.set(name, (weights.get(name) ?? 0) + overlap * overlap);
      }
      states.push({ energy: full.values[j]!, irrep, degeneracy, weights });
    }
  });
  states.sort((x, y) => x.energy - y.energy);
  const ground = states[0]!.energy;
  const cubic = p.ds === 0 && p.dt === 0;
  const levels: FieldLevel[] = [];
  const multiplicityOf = (name: string): number => Number.parseInt(name, 10) || 0;
  const pushLevel = (energy: number, irrep: string, degeneracy: number, weights: Map<string, number>): void => {
    let parent = '?';
    let weight = -1;
    const parentWeights: Record<string, number> = {};
    for (const [name, w] of weights) {
      if (w > weight) [parent, weight] = [name, w];
      if (w >= PARENT_WEIGHT_FLOOR) parentWeights[name] = Math.min(1, w);
    }
    const relative = energy - ground;
    levels.push({
      energy: relative < tol ? 0 : relative, degeneracy, irrep, parent, parentWeight: Math.min(1, weight), term: irrep,
      multiplicity: multiplicityOf(parent), label: `${irrep}[${parent} ${Math.round(100 * Math.min(1, weight))}%]`, parentWeights,
    });
  };
  if (!cubic) {
    for (const s of states) pushLevel(s.energy, D4_DOUBLE_NAMES[s.irrep], s.degeneracy, s.weights);
    return levels;
  }
  // Cubic site: D4' levels that coincide form one O' level.
  for (let from = 0; from < states.length; ) {
    let to = from + 1;
    while (to < states.length && states[to]!.energy - states[to - 1]!.energy <= tol) to++;
    const cluster = states.slice(from, to);
    const names = cubicDoubleGroupNames(cluster.map((s) => s.irrep));
    const energy = cluster.reduce((sum, s) => sum + s.energy, 0) / cluster.length;
    const degeneracy = cluster.reduce((sum, s) => sum + s.degeneracy, 0);
    const weights = new Map<string, number>();
    for (const s of cluster) for (const [name, w] of s.weights) weights.set(name, (weights.get(name) ?? 0) + (w * s.degeneracy) / degeneracy);
    // One name per O' level; an accidental coincidence lists them all.
    pushLevel(energy, names.join('+'), degeneracy, weights);
    from = to;
  }
  return levels;
}

/** The levels of d^n (0..10) in a cubic or tetragonal field, with or without spin–orbit coupling (see above). */
export function computeFieldLevels(d: number, geometry: Geometry, params: TetragonalParameters): FieldLevelsResult {
  validateD(d);
  validateGeometry(geometry);
  const p = validateTetragonalParameters(geometry, params);
  const symmetry = p.ds === 0 && p.dt === 0 ? 'cubic' : 'tetragonal';
  const spinOrbit = p.zeta > 0;
  const cubicGroup: SiteGroup = geometry === 'octahedral' ? 'Oh' : 'Td';
  const group: SiteGroup =
    symmetry === 'tetragonal' ? (spinOrbit ? "D4'" : 'D4h') : spinOrbit ? (geometry === 'octahedral' ? "O'" : "Td'") : cubicGroup;
  const notes: string[] = [];
  let levels: FieldLevel[];
  if (d === 0 || d === 10) {
    const irrep = spinOrbit ? 'Γ1' : symmetry === 'tetragonal' ? 'A1g' : geometry === 'octahedral' ? 'A1g' : 'A1';
    const term = spinOrbit ? irrep : `1${irrep}`;
    levels = [{ energy: 0, degeneracy: 1, irrep, parent: '1S', parentWeight: 1, term, multiplicity: 1, label: `${term}[1S]` }];
    notes.push(`d${d} is a closed configuration: it has no ligand-field transitions`);
  } else {
    levels = spinOrbit ? spinOrbitLevels(d, geometry, p) : spinFreeFieldLevels(d, geometry, p);
  }
  if (symmetry === 'tetragonal') {
    notes.push('tetragonal field: a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt');
  }
  if (spinOrbit) notes.push('spin–orbit coupling on: levels are labelled by the double group, with their dominant spin-free parent and its weight');
  return { d, geometry, ...p, symmetry, spinOrbit, group, groundTerm: levels[0]!.term, levels, notes };
}
