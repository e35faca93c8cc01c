/**
 * A signal that fires when the client goes away before its answer is sent,
 * so the pool drops (or stops) work nobody waits for: a client that gives
 * up after a few seconds does not leave a queue of dead analyses behind.
 */
import type { Response } from 'express';

export function clientGoneSignal(res: Response): AbortSignal {
  const controller = new AbortController();
  res.once('close', () => {
    if (!res.writableFinished) controller.abort();
  });
  return controller.signal;
}
