import { freeIonBlocks } from './blocks.js';
import { symmetricEigenvalues } from './eigen-symmetric.js';
import type { FreeIonTerm } from './types.js';

/**
 * Free-ion (Russell–Saunders) terms of d^n at Dq = 0.
 *
 * At Dq = 0 both M_S and M_L are conserved, so H splits into (M_S, M_L)
 * blocks. A term (2S+1)L contributes one eigenvalue to every block with
 * |M_S| ≤ S, |M_L| ≤ L; so at each distinct energy the number of terms with
 * (S, L) is N(S, L) − N(S+1, L) − N(S, L+1) + N(S+1, L+1), with N(M_S, M_L)
 * the number of eigenvalues at that energy in block (M_S, M_L).
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

interface Tagged {
  energy: number;
  s: number;
  ml: number;
}

/** Terms of d^n at B = 1 and C = cOverB, energies from the lowest term. */
function freeIonTermsAtUnitB(n: number, cOverB: number): FreeIonTerm[] {
  if (n === 0 || n === 10) return [{ term: '1S', multiplicity: 1, L: 0, energy: 0 }];
  const fib = freeIonBlocks(n);
  const tagged: Tagged[] = [];
  fib.blocks.forEach((row, s) =>
    row.forEach((block, ml) => {
      if (block.size === 0) return;
      const h = new Float64Array(block.size * block.size);
      for (let i = 0; i < h.length; i++) h[i] = block.operators[0]![i]! + cOverB * block.operators[1]![i]!;
      for (const energy of symmetricEigenvalues(h, block.size)) tagged.push({ energy, s, ml });
    }),
  );
  tagged.sort((x, y) => x.energy - y.energy);
  const tol = 1e-9 * (20 + 10 * cOverB);
  const terms: Omit<FreeIonTerm, 'term'>[] = [];
  const rows = fib.twoMsValues.length;
  const width = fib.maxMl + 1;
  for (let start = 0; start < tagged.length; ) {
    let end = start + 1;
    while (end < tagged.length && tagged[end]!.energy - tagged[end - 1]!.energy <= tol) end++;
    const count = new Int32Array((rows + 1) * (width + 1));
    let mean = 0;
    for (let i = start; i < end; i++) {
      count[tagged[i]!.s * (width + 1) + tagged[i]!.ml]!++;
      mean += tagged[i]!.energy;
    }
    mean /= end - start;
    const at = (s: number, ml: number): number => count[s * (width + 1) + ml]!;
    for (let s = 0; s < rows; s++)
      for (let L = 0; L < width; L++) {
        const terms_ = at(s, L) - at(s + 1, L) - at(s, L + 1) + at(s + 1, L + 1);
        for (let t = 0; t < terms_; t++) terms.push({ multiplicity: fib.twoMsValues[s]! + 1, L, energy: mean });
      }
    start = end;
  }
  terms.sort((x, y) => x.energy - y.energy || y.multiplicity - x.multiplicity || y.L - x.L);
  const ground = terms[0]!.energy;
  const occurrences = new Map<string, number>();
  for (const t of terms) occurrences.set(termSymbol(t.multiplicity, t.L), (occurrences.get(termSymbol(t.multiplicity, t.L)) ?? 0) + 1);
  const seen = new Map<string, number>();
  return terms.map((t) => {
    const symbol = termSymbol(t.multiplicity, t.L);
    const index = (seen.get(symbol) ?? 0) + 1;
    seen.set(symbol, index);
    const term = occurrences.get(symbol)! > 1 ? `${symbol}${index}` : symbol;
    return { term, multiplicity: t.multiplicity, L: t.L, energy: t.energy - ground };
  });
}

const cache = new Map<string, FreeIonTerm[]>();
const CACHE_LIMIT = 64;

/**
 * Free-ion terms at unit B for C/B = cOverB, cached: energies are homogeneous
 * of degree 1 in (B, C), so names and order depend on C/B only.
 */
export function freeIonTermsUnitB(n: number, cOverB: number): readonly FreeIonTerm[] {
  const key = `${n}:${cOverB}`;
  let hit = cache.get(key);
  if (!hit) {
    hit = freeIonTermsAtUnitB(n, cOverB);
    if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
    cache.set(key, hit);
  }
  return hit;
}

/** Free-ion terms of d^n with Racah B and C (cm-1), ascending energy; inputs assumed valid (b > 0). */
export function freeIonTermsUnchecked(n: number, b: number, c: number): FreeIonTerm[] {
  return freeIonTermsUnitB(n, c / b).map((t) => ({ ...t, energy: t.energy * b }));
}
