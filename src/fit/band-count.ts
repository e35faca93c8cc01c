/**
 * The most bands one fit takes. A d^n complex shows at most three
 * spin-allowed d–d bands in cubic symmetry, a few sharp spin-forbidden ones
 * and Jahn–Teller or spin–orbit components (common practice): ten covers a
 * real spectrum. Every band more multiplies the assignments the fit has to
 * weigh, so longer lists (a peak list pasted whole, a script error) are
 * refused at the edges (CLI --bands, REST bands) before any work.
 */
import { invalidArgument } from '../errors.js';

export const MAX_FIT_BANDS = 10;

/** The message for a list of `count` bands (count > MAX_FIT_BANDS). */
export function tooManyBandsMessage(count: number, path: string): string {
  return `${path}: ${count} bands given; a fit takes at most ${MAX_FIT_BANDS} (the d–d bands of one complex, with shoulders and spin-forbidden bands); leave out solvent, impurity and charge-transfer bands`;
}

/** Throws invalid-argument naming `path` when count exceeds MAX_FIT_BANDS. */
export function checkFitBandCount(count: number, path: string): void {
  if (count > MAX_FIT_BANDS) throw invalidArgument(path, tooManyBandsMessage(count, path));
}
