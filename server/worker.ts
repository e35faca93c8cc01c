/**
 * The worker-thread side of the pool (piscina loads this file): runs one
 * task with the pure core and returns plain JSON. Nothing here touches files
 * or the network.
 */
import { dispatchTask, type Outcome, type Task } from './tasks.js';

export default function runInWorker(task: Task): Outcome {
  return dispatchTask(task);
}
