/**
 * The CLI at the ends of the range: `levels`, `diagram` and `fit` refuse
 * values no complex has (B = 1e-150, Dq = 1e300, ten thousand bands) with
 * one line naming the option and exit 2, never "internal error".
 */
import { describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/main.js';
import { capturedIo, type CapturedIo } from '../helpers/cli-run.js';
import { parseFitArgs } from '../../src/cli/commands/fit.js';
import { MAX_FIT_BANDS } from '../../src/fit/band-count.js';

const io = (): CapturedIo => capturedIo();

describe('CLI ranges', () => {
  it.each([
    [['levels', '--d', '3', '--dq', '1700', '--b', '1e-150', '--c', '2800'], '--b'],
    [['levels', '--d', '3', '--dq', '1700', '--b', '1e300', '--c', '2800'], '--b'],
    [['levels', '--d', '3', '--dq', '1e300', '--b', '700', '--c', '2800'], '--dq'],
    [['levels', '--d', '3', '--dq', '1700', '--b', '700', '--c', '1e300'], '--c'],
    [['levels', '--d', '3', '--dq', '1700', '--b', '700', '--c-over-b', '1e300'], '--c-over-b'],
    [['diagram', '--d', '5', '--max-dq-over-b', '1e300'], '--max-dq-over-b'],
    [['diagram', '--d', '5', '--c-over-b', '1e300'], '--c-over-b'],
    [['fit', '--ion', 'Cr3+', '--bands', '17400,24600', '--c', '1e300'], '--c'],
  ])('%j: one line naming %s, exit 2', async (argv, option) => {
    const run = io();
    expect(await runCli(argv, run)).toBe(2);
    expect(run.err).toContain(option);
    expect(run.err).not.toMatch(/internal error/);
    expect(run.err.trim().split('\n')).toHaveLength(1);
  });

  it('refuses ten thousand bands while reading the options, before any fit', () => {
    const bands = Array.from({ length: 10_000 }, (_, i) => String(9000 + 2 * i)).join(',');
    expect(() => parseFitArgs(['--ion', 'Cr3+', '--bands', bands])).toThrow(
      expect.objectContaining({ code: 'invalid-argument', path: '--bands', message: expect.stringContaining(`at most ${MAX_FIT_BANDS}`) }),
    );
    const allowed = Array.from({ length: MAX_FIT_BANDS }, (_, i) => String(9000 + 2000 * i)).join(',');
    expect(parseFitArgs(['--ion', 'Cr3+', '--bands', allowed]).input.bands).toHaveLength(MAX_FIT_BANDS);
  });
});
