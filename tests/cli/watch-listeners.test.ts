import { getEventListeners } from 'node:events';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, expect, it } from 'vitest';
import { pause, watchFolder } from '../../src/cli/commands/watch.js';

/**
 * Issue 17 (audit): `watch` added one abort listener per poll and never took
 * it off, so a watcher left running grew without bound (and node warned
 * "MaxListenersExceeded" after ten polls). The polls are counted through the
 * one line the watcher prints on every poll of a folder it cannot read;
 * nothing here waits on the clock.
 */

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-watch-listeners-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const noSink = {
  stored: async () => [],
  save: async () => {
    throw new Error('nothing to save in this test');
  },
  close: async () => undefined,
};

it('keeps at most one abort listener on the signal however many polls it makes', async () => {
  const stop = new AbortController();
  const counts: number[] = [];
  const POLLS = 40;
  // A folder that is not there: every poll prints one "cannot read the folder" line.
  await watchFolder(join(dir, 'absent'), noSink, {
    stdout: () => undefined,
    stderr: () => {
      counts.push(getEventListeners(stop.signal, 'abort').length);
      if (counts.length >= POLLS) stop.abort();
    },
  }, { interval: 1, settle: 1, once: false, signal: stop.signal });
  expect(counts).toHaveLength(POLLS);
  expect(Math.max(...counts)).toBeLessThanOrEqual(1);
});

it('pause: its listener is gone once the time is up, and an abort ends it early', async () => {
  const stop = new AbortController();
  await pause(1, stop.signal);
  expect(getEventListeners(stop.signal, 'abort')).toHaveLength(0);
  const waiting = pause(3_600_000, stop.signal);
  expect(getEventListeners(stop.signal, 'abort')).toHaveLength(1);
  stop.abort();
  await waiting;
  expect(getEventListeners(stop.signal, 'abort')).toHaveLength(0);
});
