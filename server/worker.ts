/**
 * The worker-thread side of the pool (piscina loads this file): runs one
 * task with the pure core and returns plain JSON. Nothing here touches files
 * or the network.
 */
import { dispatchTask, markStarted, TASK_FLAG, type Outcome, type WorkerRequest } from './tasks.js';

/** Answer of a task whose client left before it started; the pool has already answered for it. */
const ABANDONED: Outcome = { ok: false, error: { code: 'client-left', message: 'dropped: nobody waits for the answer', path: '' } };

export default function runInWorker({ task, abandoned, json }: WorkerRequest): Outcome {
  if (Atomics.load(abandoned, TASK_FLAG.ABANDONED) === 1) return ABANDONED;
  markStarted(abandoned);
  return dispatchTask(task, json === true);
}
