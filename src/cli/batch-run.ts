/**
 * Runs a batch's tasks with a bounded number in flight and hands their
 * results on in the order of the list, whatever order they finish in. The
 * window bounds both the work queued on the threads and the results held
 * while an earlier one is still running, so memory does not grow with the
 * length of the list. `take` may be async (a database write): the next
 * result is taken once it is done.
 */
export async function runInOrder<T, R>(
  items: readonly T[],
  run: (item: T) => Promise<R>,
  take: (result: R, item: T, index: number) => void | Promise<void>,
  window: number,
): Promise<void> {
  const inFlight: Promise<R>[] = [];
  let next = 0;
  for (let done = 0; done < items.length; done++) {
    while (next < items.length && inFlight.length < Math.max(1, window)) {
      const started = run(items[next++]!);
      // Awaited below in turn; until then a failure must not count as unhandled.
      started.catch(() => {});
      inFlight.push(started);
    }
    await take(await inFlight.shift()!, items[done]!, done);
  }
}
