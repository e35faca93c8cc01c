/**
 * A full garbage collection every so many tasks of a worker thread, so a long
 * batch holds no more memory than a short one. Measured (bench/batch.ts): a
 * worker's live heap stays at about 18 MB whatever the batch's length, but V8
 * lets dead objects pile up in the old generation between its own major
 * collections, so the heap, and the process's peak memory, grew with the
 * number of files (119 MB for 100 files, 182 MB for 10 000). A collection
 * costs a few ms against the seconds of analysis between two.
 *
 * A worker thread cannot be started with --expose-gc (V8 options in a
 * worker's execArgv are refused), so the flag is set at run time and `gc` is
 * taken from a fresh context, where it exists once the flag is on. When that
 * is not possible, nothing is collected early and nothing else changes.
 */
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';

/** V8's full collection as a function, or undefined when it cannot be had. */
export function findGc(): (() => void) | undefined {
  const existing = (globalThis as { gc?: () => void }).gc;
  if (typeof existing === 'function') return existing;
  try {
    setFlagsFromString('--expose-gc');
    const gc = runInNewContext('gc') as unknown;
    return typeof gc === 'function' ? (gc as () => void) : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Returns a function to call after each task: it runs `gc` (default: V8's
 * full collection, when it can be had) every `every` calls.
 */
export function collectEvery(every: number, gc: (() => void) | undefined = findGc()): () => void {
  let count = 0;
  return () => {
    if (gc === undefined || ++count < every) return;
    count = 0;
    gc();
  };
}
