import type { TermComponent } from './free-ion-terms.js';
import type { CubicIrrep, Geometry } from './types.js';

/**
 * Names of levels and their free-ion parents.
 *
 * Parent rule. Along a path Dq = 0 → Dq at fixed B and C, levels of the same
 * (S, Γ) never cross (non-crossing rule: they are eigenvalues of one block
 * of a Hamiltonian that depends on one parameter, and generic same-symmetry
 * levels repel). So their energy order is the same at every Dq, and the i-th
 * lowest (S, Γ) level is the one that, followed continuously to Dq → 0,
 * ends on the i-th lowest (S, Γ) component of the free-ion terms, the terms
 * taken in ascending energy and each split by L → Γ (S→A1, P→T1, D→E+T2,
 * F→A2+T1+T2, …). tests/ligand-field/labels.test.ts checks both halves:
 * no same-(S, Γ) gap closes along a fine Dq path, and at small Dq each
 * level sits next to its parent term's energy.
 */
export interface ParentTable {
  /** levelKey(2S+1, Γ) → parent term names, in the order of the levels' rank. */
  parents: Array<string[] | undefined>;
  /** levelKey(2S+1, Γ) → display labels ("4T1g(P)") by rank, for a geometry. */
  labels(geometry: Geometry): Array<string[] | undefined>;
  /** Number of (S, Γ) levels d^n has. */
  expected(twoS: number, irrep: CubicIrrep): number;
}

const IRREP_INDEX: Readonly<Record<CubicIrrep, number>> = { A1: 0, A2: 1, E: 2, T1: 3, T2: 4 };

/** A small integer naming (2S+1, Γ): 5·multiplicity + irrep index. */
export function levelKey(multiplicity: number, irrep: CubicIrrep): number {
  return 5 * multiplicity + IRREP_INDEX[irrep];
}

/** A free-ion term as the parent table needs it: its name and cubic components. */
export interface NamedTerm {
  name: string;
  components: readonly TermComponent[];
}

/** The parent sequences of free-ion terms listed in ascending energy (see parent-tables.ts for the cache). */
export function parentTableOf(terms: readonly NamedTerm[]): ParentTable {
  const parents: Array<string[] | undefined> = [];
  const labels: Record<Geometry, Array<string[] | undefined>> = { octahedral: [], tetrahedral: [] };
  for (const { name, components } of terms)
    for (const { key, label } of components) {
      (parents[key] ??= []).push(name);
      (labels.octahedral[key] ??= []).push(label.octahedral);
      (labels.tetrahedral[key] ??= []).push(label.tetrahedral);
    }
  return {
    parents,
    labels: (geometry) => labels[geometry],
    expected: (twoS, irrep) => parents[levelKey(twoS + 1, irrep)]?.length ?? 0,
  };
}

/** "T1g" (octahedral: all d^n states are gerade) or "T1" (tetrahedral: no inversion centre). */
export function irrepName(irrep: CubicIrrep, geometry: Geometry): string {
  return geometry === 'octahedral' ? GERADE[irrep] : irrep;
}

const GERADE: Readonly<Record<CubicIrrep, string>> = { A1: 'A1g', A2: 'A2g', E: 'Eg', T1: 'T1g', T2: 'T2g' };

const termNames: Record<Geometry, string[]> = { octahedral: [], tetrahedral: [] };

/** "4T1g" (interned by level key). */
export function termName(multiplicity: number, irrep: CubicIrrep, geometry: Geometry): string {
  const names = termNames[geometry];
  const key = levelKey(multiplicity, irrep);
  return (names[key] ??= `${multiplicity}${irrepName(irrep, geometry)}`);
}

const labelCache = new Map<string, string>();

/** "4T1g(P)", "2T2g(D2)": the term with its parent's letter (and repetition number). Interned. */
export function levelLabel(term: string, parent: string): string {
  const key = `${term}|${parent}`;
  let label = labelCache.get(key);
  if (label === undefined) {
    label = `${term}(${parent.replace(/^\d+/, '')})`;
    labelCache.set(key, label);
  }
  return label;
}
