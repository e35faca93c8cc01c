import { freeIonBlocks, type OperatorBlock } from './blocks.js';
import { createEigenWorkspace, symmetricEigenvaluesInPlace } from './eigen-symmetric.js';
import { levelKey, levelLabel, termName } from './labels.js';
import { cubicComponentsOfL } from './term-splitting.js';
import type { CubicIrrep, FreeIonTerm, Geometry } from './types.js';

/**
 * Free-ion (Russell–Saunders) terms of d^n at Dq = 0.
 *
 * At Dq = 0 both M_S and M_L are conserved. A term (2S+1)L contributes one
 * eigenvalue to every block with |M_S| ≤ S, |M_L| ≤ L, so the terms with
 * (S, L) are the eigenvalues of block (M_S = S, M_L = L) less those of
 * (S+1, L) and (S, L+1) plus those of (S+1, L+1). blocks.ts gets them at
 * once: H on the states of (M_S = S, M_L = L) killed by S+ and L+, one
 * dimension per term (1×1 for most, 3×3 for the three 2D of d5). Repeated
 * terms come from one block, so their ascending eigenvalues number them.
 *
 * Energies are cm-1 above the lowest term; F0 (Racah A) is dropped.
 */

export const L_LETTERS = 'SPDFGHIKLM';

export function orbitalLetter(L: number): string {
  const letter = L_LETTERS[L];
  if (letter === undefined) throw new RangeError(`no term letter for L = ${L}`);
  return letter;
}

/** The (2S+1)L symbol without its repetition number: "4F". */
export function termSymbol(multiplicity: number, L: number): string {
  return `${multiplicity}${orbitalLetter(L)}`;
}

/** One cubic component of a free-ion term, with its level key and display labels. */
export interface TermComponent {
  key: number;
  irrep: CubicIrrep;
  label: Readonly<Record<Geometry, string>>;
}

/** A free-ion term with what the level labelling needs from it. */
export interface TermRecord {
  term: FreeIonTerm;
  components: readonly TermComponent[];
}

interface TermBlock {
  block: OperatorBlock;
  multiplicity: number;
  L: number;
  /** Term name of the i-th eigenvalue: "4F", or "2D1", "2D2", … when repeated. */
  names: string[];
  /** Cubic components of the i-th term. */
  components: TermComponent[][];
}

const termBlockCache = new Map<number, TermBlock[]>();

/** The per-d^n term blocks with their names and component labels, built once. */
function termBlocks(n: number): TermBlock[] {
  let hit = termBlockCache.get(n);
  if (hit) return hit;
  hit = freeIonBlocks(n).map((block) => {
    const multiplicity = block.twoS + 1;
    const L = block.label;
    const symbol = termSymbol(multiplicity, L);
    const names = Array.from({ length: block.size }, (_, i) => (block.size > 1 ? `${symbol}${i + 1}` : symbol));
    const components = names.map((name) =>
      cubicComponentsOfL(L).map((irrep) => ({
        key: levelKey(multiplicity, irrep),
        irrep,
        label: {
          octahedral: levelLabel(termName(multiplicity, irrep, 'octahedral'), name),
          tetrahedral: levelLabel(termName(multiplicity, irrep, 'tetrahedral'), name),
        },
      })),
    );
    return { block, multiplicity, L, names, components };
  });
  termBlockCache.set(n, hit);
  return hit;
}

const CLOSED_SHELL: TermRecord[] = [
  {
    term: { term: '1S', multiplicity: 1, L: 0, energy: 0 },
    components: [{ key: levelKey(1, 'A1'), irrep: 'A1', label: { octahedral: '1A1g(S)', tetrahedral: '1A1(S)' } }],
  },
];

/** One free-ion term of d^n in block order (the order of termBlocks, then ascending within a block). */
export interface TermEntry {
  /** "4F", or "2D1" when repeated. */
  name: string;
  multiplicity: number;
  L: number;
  components: readonly TermComponent[];
}

const entryCache = new Map<number, TermEntry[]>();

/** The terms of d^n (1..9) in block order, built once. */
export function termEntries(n: number): readonly TermEntry[] {
  let hit = entryCache.get(n);
  if (!hit) {
    hit = termBlocks(n).flatMap(({ multiplicity, L, names, components }) =>
      names.map((name, i) => ({ name, multiplicity, L, components: components[i]! })),
    );
    entryCache.set(n, hit);
  }
  return hit;
}

const scratch = { h: new Float64Array(9), values: new Float64Array(3), eigen: createEigenWorkspace(3) };

/**
 * Energies of the terms of d^n (1..9) at B = 1 and C = cOverB, in block
 * order (termEntries), on the repulsion's own zero (F0 dropped), into out.
 */
export function termEnergiesUnitBInto(n: number, cOverB: number, out: Float64Array): Float64Array {
  let t = 0;
  for (const { block } of termBlocks(n)) {
    const [opB, opC] = block.operators as [Float64Array, Float64Array];
    const size = block.size;
    if (size === 1) {
      out[t++] = opB[0]! + cOverB * opC[0]!;
      continue;
    }
    if (scratch.h.length < size * size) {
      scratch.h = new Float64Array(size * size);
      scratch.values = new Float64Array(size);
      scratch.eigen = createEigenWorkspace(size);
    }
    for (let i = 0; i < size * size; i++) scratch.h[i] = opB[i]! + cOverB * opC[i]!;
    symmetricEigenvaluesInPlace(scratch.h, size, scratch.values, scratch.eigen);
    for (let i = 0; i < size; i++) out[t++] = scratch.values[i]!;
  }
  return out;
}

/**
 * Term indices (block order) sorted by ascending energy, ties by higher
 * multiplicity, then higher L; Array.prototype.sort is stable, so full ties
 * keep block order. The one ordering rule of the free-ion terms.
 */
export function termOrder(entries: readonly TermEntry[], energies: Float64Array): number[] {
  return entries
    .map((_, i) => i)
    .sort((x, y) => energies[x]! - energies[y]! || entries[y]!.multiplicity - entries[x]!.multiplicity || entries[y]!.L - entries[x]!.L);
}

/** Terms of d^n at B = 1 and C = cOverB, ascending, energies from the lowest term. */
function termRecordsAtUnitB(n: number, cOverB: number): TermRecord[] {
  if (n === 0 || n === 10) return CLOSED_SHELL;
  const entries = termEntries(n);
  const energies = termEnergiesUnitBInto(n, cOverB, new Float64Array(entries.length));
  const order = termOrder(entries, energies);
  const ground = energies[order[0]!]!;
  return order.map((i) => {
    const { name, multiplicity, L, components } = entries[i]!;
    return { term: { term: name, multiplicity, L, energy: energies[i]! - ground }, components };
  });
}

const cache = new Map<number, Map<number, TermRecord[]>>();
const CACHE_LIMIT = 64;

/**
 * Free-ion term records at unit B for C/B = cOverB, cached per d^n and exact
 * C/B (least recently used dropped beyond 64): energies are homogeneous of
 * degree 1 in (B, C), so names and order depend on C/B only.
 * The returned arrays are shared: do not modify.
 */
export function freeIonRecordsUnitB(n: number, cOverB: number): readonly TermRecord[] {
  let perN = cache.get(n);
  if (!perN) cache.set(n, (perN = new Map()));
  let hit = perN.get(cOverB);
  if (hit) {
    perN.delete(cOverB);
  } else {
    hit = termRecordsAtUnitB(n, cOverB);
    if (perN.size >= CACHE_LIMIT) perN.delete(perN.keys().next().value!);
  }
  perN.set(cOverB, hit);
  return hit;
}

/** Free-ion terms of d^n with Racah B and C (cm-1), ascending energy; inputs assumed valid (b > 0). */
export function freeIonTermsUnchecked(n: number, b: number, c: number): FreeIonTerm[] {
  return freeIonRecordsUnitB(n, c / b).map(({ term }) => ({ ...term, energy: term.energy * b }));
}
