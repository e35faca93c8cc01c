/**
 * One set of work arrays for the band fit (BandModelWork of band-model.ts),
 * reused from one xyRefineBands call to the next instead of allocated for
 * each: a batch or a service analyses thousands of spectra a thread, each with
 * a handful of trial fits, and a fresh Jacobian (n × q doubles) each time was
 * garbage for the collector. Safe because a fit runs to its end before the
 * next starts on the same thread (nothing in it is asynchronous or
 * re-entrant) and keeps none of these arrays in its result; the products read
 * each Jacobian column only inside its window, which every call rewrites, so
 * values left from an earlier fit are never read.
 */
import { bandModelWork, type BandModelWork } from './band-model.js';

/** Largest Jacobian kept between calls, in doubles (8 MB); a larger one is allocated for its call alone. */
const KEEP_LIMIT = 1 << 20;

let kept: BandModelWork | null = null;

/** Work arrays for n points and q parameters (each at least that long), valid until the next call on this thread. */
export function reusedBandModelWork(n: number, q: number): BandModelWork {
  if (kept !== null && kept.jacobian.length >= n * q && kept.residuals.length >= n && kept.from.length >= q) return kept;
  if (n * q > KEEP_LIMIT) return bandModelWork(n, q);
  // Grown to the larger of what was kept and what is asked, so alternating sizes do not reallocate.
  const nKept = Math.max(n, kept?.residuals.length ?? 0);
  const qKept = Math.max(q, kept?.from.length ?? 0);
  kept = nKept * qKept > KEEP_LIMIT ? bandModelWork(n, q) : bandModelWork(nKept, qKept);
  return kept;
}
