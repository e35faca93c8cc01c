import { mulberry32 } from '../../src/spectrum/random.js';

/** The project's seeded generator (mulberry32), so random tests repeat exactly. Returns numbers in [0, 1). */
export const seededRandom = mulberry32;

/**
 * A linear congruential generator (the Numerical Recipes constants
 * 1 664 525 and 1 013 904 223, modulo 2^32), seeded, numbers in [0, 1): the
 * generator the series tests drew their records with first, kept so their
 * seeded data stays what it was.
 */
export function seededLcg(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1_664_525) + 1_013_904_223) >>> 0;
    return state / 2 ** 32;
  };
}
