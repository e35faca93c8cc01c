import { blockHamiltonianInto } from './block-spectra.js';
import { doubleGroupBlocks, type DoubleGroupIrrep } from './double-group-blocks.js';
import { createEigenWorkspace, symmetricEigen, symmetricEigenvaluesInPlace, type EigenWorkspace } from './eigen-symmetric.js';
import { fieldTolerance, PARENT_WEIGHT_FLOOR, type FieldLevel, type ResolvedParameters } from './field-level-types.js';
import { spinFreeFieldLevels } from './tetragonal-spin-free.js';
import type { Geometry } from './types.js';

/**
 * The levels of d^n with spin–orbit coupling (ζ > 0): one D4' block per
 * double-group irrep (double-group-blocks.ts), eigenvalues only for fits and
 * diagrams, and the labelled levels with their spin-free parents and weights
 * (O' names when the site is cubic). Conventions in field-level-types.ts.
 */

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

export function spinOrbitLevels(d: number, geometry: Geometry, p: ResolvedParameters): FieldLevel[] {
  const tol = fieldTolerance(p);
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

