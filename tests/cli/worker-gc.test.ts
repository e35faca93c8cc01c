import { describe, expect, it } from 'vitest';
import { collectEvery, findGc } from '../../src/cli/worker-gc.js';

describe('collectEvery', () => {
  it('collects on every n-th call only', () => {
    let collections = 0;
    const after = collectEvery(3, () => void collections++);
    const seen: number[] = [];
    for (let i = 1; i <= 10; i++) {
      after();
      seen.push(collections);
    }
    expect(seen).toEqual([0, 0, 1, 1, 1, 2, 2, 2, 3, 3]);
  });

  it("finds V8's full collector in a thread started without --expose-gc", () => {
    // Without it, collectEvery would silently do nothing: make that visible here.
    const gc = findGc();
    expect(typeof gc).toBe('function');
    gc!();
  });
});
