/**
 * The worker-thread side of the pool (piscina loads this file): runs one
 * task with the pure core and returns plain JSON. Nothing here touches files
 * or the network.
 */
import { dispatchTask, type Outcome, type WorkerRequest } from './tasks.js';

/** Answer of a task whose client left before it started; the pool has already answered for it. */
const ABANDONED: Outcome = { ok: false, error: { code: 'timeout', message: 'dropped: nobody waits for the answer', path: '' } };

export default function runInWorker({ task, abandoned }: WorkerRequest): Outcome {
  if (Atomics.load(abandoned, 0) === 1) return ABANDONED;
  return dispatchTask(task);
}
