/**
 * Which tasks may use the pool's quick lane (when every general worker is
 * taken): those whose cost is bounded by
 * their kind and size, whatever the numbers in them (within the edge's
 * limits), at well under a tenth of a second of CPU. A cheap request then
 * never waits behind minutes of analyses or long band lists.
 *
 * Measured on the development machine (warm): levels ≤ 1 ms; a d5 diagram
 * (252 determinants) of 500 steps ~40 ms; a fit of up to 4 bands ≤ ~120 ms.
 */
import type { Task } from './tasks.js';

/** Determinants of d^n: 10 choose n. */
function determinantCount(d: number): number {
  let count = 1;
  for (let k = 0; k < d; k++) count = (count * (10 - k)) / (k + 1);
  return count;
}

/** Largest diagram (steps × determinants) for the quick lane: a d5 diagram of 500 steps. */
export const QUICK_DIAGRAM_WORK = 252 * 500;
/** Largest band list of a fit for the quick lane. */
export const QUICK_FIT_BANDS = 4;

export function isQuickTask(task: Task): boolean {
  switch (task.kind) {
    case 'levels':
      return true;
    case 'diagram':
      return task.input.steps * determinantCount(task.input.d) <= QUICK_DIAGRAM_WORK;
    case 'fit':
      return task.input.bands.length <= QUICK_FIT_BANDS;
    default:
      return false;
  }
}
