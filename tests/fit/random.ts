import { mulberry32 } from '../../src/spectrum/random.js';

/** The project's seeded generator (mulberry32), so random tests repeat exactly. Returns numbers in [0, 1). */
export const seededRandom = mulberry32;

/** Uniform in [lo, hi). */
export function uniform(random: () => number, lo: number, hi: number): number {
  return lo + (hi - lo) * random();
}
