import { freeIonBlocks } from './blocks.js';
import { symmetricEigenvalues } from './eigen-symmetric.js';
import type { FreeIonTerm } from './types.js';

/**
 * Free-ion (Russell–Saunders) terms of d^n at Dq = 0.
 *
 * At Dq = 0 both M_S and M_L are conserved. A term (2S+1)L contributes one
 * eigenvalue to every block with |M_S| ≤ S, |M_L| ≤ L, so the terms with
 * (S, L) are the eigenvalues of block (M_S = S, M_L = L) less those of
 * (S+1, L) and (S, L+1) plus those of (S+1, L+1). blocks.ts gets them at
 * once: H on the states of (M_S = S, M_L = L) killed by S+ and L+, one
 * dimension per term (1×1 for most, 3×3 for the three 2D of d5).
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

/** Terms of d^n at B = 1 and C = cOverB, energies from the lowest term. */
function freeIonTermsAtUnitB(n: number, cOverB: number): FreeIonTerm[] {
  if (n === 0 || n === 10) return [{ term: '1S', multiplicity: 1, L: 0, energy: 0 }];
  const terms: Array<Omit<FreeIonTerm, 'term'> & { symbol: string; repeated: boolean }> = [];
  for (const block of freeIonBlocks(n)) {
    const h = new Float64Array(block.size * block.size);
    for (let i = 0; i < h.length; i++) h[i] = block.operators[0]![i]! + cOverB * block.operators[1]![i]!;
    const multiplicity = block.twoS + 1;
    const energies = block.size === 1 ? h : symmetricEigenvalues(h, block.size);
    for (const energy of energies) {
      terms.push({ multiplicity, L: block.label, energy, symbol: termSymbol(multiplicity, block.label), repeated: block.size > 1 });
    }
  }
  terms.sort((x, y) => x.energy - y.energy || y.multiplicity - x.multiplicity || y.L - x.L);
  const ground = terms[0]!.energy;
  const seen = new Map<string, number>();
  return terms.map((t) => {
    const index = (seen.get(t.symbol) ?? 0) + 1;
    seen.set(t.symbol, index);
    return { term: t.repeated ? `${t.symbol}${index}` : t.symbol, multiplicity: t.multiplicity, L: t.L, energy: t.energy - ground };
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
