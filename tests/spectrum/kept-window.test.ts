/** The window of the data kept (kept-window.ts): which end a masked stretch moves, and which red end stays open. */
import { describe, expect, it } from 'vitest';
import { keptWindow } from '../../src/spectrum/kept-window.js';

const kept = Float64Array.of(8000, 9000, 30000, 38000);

describe('keptWindow', () => {
  it('is the measured range when no masked stretch reaches an end', () => {
    expect(keptWindow([4000, 40000], [{ from: 20000, to: 21000, reason: 'negative' }], kept))
      .toEqual({ window: [4000, 40000], lowEndMask: null, highEndMask: null, redEndOpen: true });
  });
  it('moves a masked end to the kept data; a negative red end is closed', () => {
    expect(keptWindow([4000, 40000], [{ from: 4000, to: 7950, reason: 'negative' }, { from: 38100, to: 40000, reason: 'saturated' }], kept))
      .toEqual({ window: [8000, 38000], lowEndMask: 'negative', highEndMask: 'saturated', redEndOpen: false });
  });
  it('leaves a saturated red end open (the band continues there) and closes one masked at a step', () => {
    expect(keptWindow([4000, 40000], [{ from: 4000, to: 7950, reason: 'saturated' }], kept).redEndOpen).toBe(true);
    expect(keptWindow([4000, 40000], [{ from: 4000, to: 7950, reason: 'detector-step' }], kept).redEndOpen).toBe(false);
  });
});
