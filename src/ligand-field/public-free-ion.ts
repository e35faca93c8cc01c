import { freeIonTermsUnchecked } from './free-ion-terms.js';
import type { FreeIonTerm } from './types.js';
import { validateD, validateFinite } from './validate.js';

/**
 * The free-ion (Russell–Saunders) terms of d^n with Racah B and C in cm-1
 * (B > 0, C ≥ 0), ascending energy from the ground term. A term that occurs
 * more than once is numbered by ascending energy: "2D1", "2D2", "2D3".
 */
export function freeIonTerms(d: number, b: number, c: number): FreeIonTerm[] {
  validateD(d);
  validateFinite(b, 'b', { min: 0, exclusiveMin: true });
  validateFinite(c, 'c', { min: 0 });
  return freeIonTermsUnchecked(d, b, c);
}
