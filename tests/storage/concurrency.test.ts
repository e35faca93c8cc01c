import Database from 'better-sqlite3';
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { LIBRARY_FILE, openLibrary } from '../../src/library/library.js';

const WRITER = fileURLToPath(new URL('./helpers/writer.ts', import.meta.url));
const ROOT = fileURLToPath(new URL('../..', import.meta.url));

let dir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-conc-'));
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

interface Writer {
  child: ChildProcess;
  /** Ids in the order the writer acknowledged them. */
  ids: number[];
  /** Resolves when the library is open and the writer waits for go(). */
  ready: Promise<void>;
  go: () => void;
  done: Promise<number | null>;
}

function startWriter(tag: string, count: number): Writer {
  const child = spawn(process.execPath, ['--import', 'tsx', WRITER, dir, tag, String(count)], {
    cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'],
  });
  let markReady!: () => void;
  const ready = new Promise<void>((resolve) => (markReady = resolve));
  const ids: number[] = [];
  let pending = '';
  let errors = '';
  child.stdout!.setEncoding('utf8').on('data', (chunk: string) => {
    pending += chunk;
    const lines = pending.split('\n');
    pending = lines.pop()!;
    for (const line of lines) {
      if (line === 'ready') markReady();
      else ids.push(Number(line.split(' ')[1]));
    }
  });
  child.stderr!.setEncoding('utf8').on('data', (chunk: string) => (errors += chunk));
  const done = new Promise<number | null>((resolve) =>
    child.on('close', (code) => {
      if (code !== 0 && code !== null) console.error(errors);
      resolve(code);
    }),
  );
  return { child, ids, ready, go: () => child.stdin!.end('go\n'), done };
}

describe('several processes writing at once', () => {
  it('loses nothing: every acknowledged id is there, once', async () => {
    const writers = ['w1', 'w2', 'w3', 'w4'].map((tag) => startWriter(tag, 25));
    await Promise.all(writers.map((w) => w.ready));
    for (const w of writers) w.go();
    const codes = await Promise.all(writers.map((w) => w.done));
    expect(codes).toEqual([0, 0, 0, 0]);
    const acknowledged = writers.flatMap((w) => w.ids);
    expect(acknowledged).toHaveLength(100);
    expect(new Set(acknowledged).size).toBe(100);

    // the writers really did interleave: some writer's ids are not one unbroken run
    expect(writers.some((w) => w.ids.at(-1)! - w.ids[0]! > 24)).toBe(true);

    const library = openLibrary(dir);
    try {
      const all = library.listAll();
      expect(all).toHaveLength(100);
      expect(all.map((a) => a.id).sort((a, b) => a - b)).toEqual([...acknowledged].sort((a, b) => a - b));
      // each writer's records are its own: sample name and original agree
      for (const w of ['w1', 'w4']) {
        const mine = library.listAll({ query: `${w}-` });
        expect(mine).toHaveLength(25);
        for (const record of mine) {
          const i = record.sample.split('-')[1];
          const bytes = new TextEncoder().encode(`${w} ${i}\n`.repeat(64));
          expect(record.original.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
        }
      }
    } finally {
      library.close();
    }
  });
});

describe('a writer killed mid-stream', () => {
  it('leaves a library that passes integrity_check and holds every acknowledged id', async () => {
    const writer = startWriter('k', 0);
    await writer.ready;
    writer.go();
    await new Promise<void>((resolve) => {
      const timer = setInterval(() => {
        if (writer.ids.length >= 40) {
          clearInterval(timer);
          resolve();
        }
      }, 5);
    });
    writer.child.kill('SIGKILL');
    expect(await writer.done).toBeNull();
    const acknowledged = [...writer.ids];

    const db = new Database(join(dir, LIBRARY_FILE));
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      expect(db.pragma('foreign_key_check')).toEqual([]);
    } finally {
      db.close();
    }
    const library = openLibrary(dir);
    try {
      for (const id of acknowledged) expect(library.get(id).sample).toMatch(/^k-\d+$/);
      // at most one add can have committed after its id line was lost with the process
      expect(library.list().total - acknowledged.length).toBeLessThanOrEqual(1);
      expect(library.list().total).toBeGreaterThanOrEqual(acknowledged.length);
    } finally {
      library.close();
    }
  });
});
