import Database from 'better-sqlite3';
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { LIBRARY_FILE } from '../../src/library/library.js';
import { forEachEngine, libraryPerTest, type TestLibrary } from './helpers/engines.js';

const WRITER = fileURLToPath(new URL('./helpers/writer.ts', import.meta.url));
const ROOT = fileURLToPath(new URL('../..', import.meta.url));

interface Writer {
  child: ChildProcess;
  /** Ids in the order the writer acknowledged them. */
  ids: number[];
  /** Resolves when the library is open and the writer waits for go(). */
  ready: Promise<void>;
  go: () => void;
  done: Promise<number | null>;
  /** Resolves once the writer has acknowledged at least n ids. */
  acknowledged: (n: number) => Promise<void>;
}

function startWriter(where: TestLibrary, tag: string, count: number): Writer {
  const target = where.location.engine === 'sqlite' ? where.location.dataDir : where.location.url;
  const child = spawn(process.execPath, ['--import', 'tsx', WRITER, target, tag, String(count)], {
    cwd: ROOT, stdio: ['pipe', 'pipe', 'pipe'],
  });
  let markReady!: () => void;
  const ready = new Promise<void>((resolve) => (markReady = resolve));
  const ids: number[] = [];
  const waiting: { n: number; resolve: () => void }[] = [];
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
    for (const w of waiting.filter((x) => ids.length >= x.n)) w.resolve();
  });
  child.stderr!.setEncoding('utf8').on('data', (chunk: string) => (errors += chunk));
  const done = new Promise<number | null>((resolve) =>
    child.on('close', (code) => {
      if (code !== 0 && code !== null) console.error(errors);
      resolve(code);
    }),
  );
  const acknowledged = (n: number) => (ids.length >= n ? Promise.resolve() : new Promise<void>((resolve) => waiting.push({ n, resolve })));
  return { child, ids, ready, go: () => child.stdin!.end('go\n'), done, acknowledged };
}

/** The engine's own consistency checks: SQLite's integrity_check and foreign_key_check, PostgreSQL's amcheck on every index. */
async function engineChecks(where: TestLibrary): Promise<void> {
  if (where.location.engine === 'sqlite') {
    const db = new Database(join(where.location.dataDir, LIBRARY_FILE));
    try {
      expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
      expect(db.pragma('foreign_key_check')).toEqual([]);
    } finally {
      db.close();
    }
    return;
  }
  // PostgreSQL manual, amcheck: bt_index_check raises an error on a corrupt B-tree index.
  await where.exec('CREATE EXTENSION IF NOT EXISTS amcheck');
  const checked = await where.scalar(`SELECT count(bt_index_check(c.oid)) FROM pg_index i JOIN pg_class c ON c.oid = i.indexrelid
    JOIN pg_am a ON a.oid = c.relam WHERE a.amname = 'btree' AND c.relnamespace = current_schema()::regnamespace`);
  expect(checked).toBeGreaterThanOrEqual(4);
}

/** Rows that a lost write could leave half-made: an analysis without its original or revision, a revision without its result. */
async function halfMade(where: TestLibrary): Promise<number> {
  return where.scalar(`SELECT
    (SELECT count(*) FROM analyses a WHERE NOT EXISTS (SELECT 1 FROM originals o WHERE o.analysis_id = a.id))
  + (SELECT count(*) FROM analyses a WHERE NOT EXISTS (SELECT 1 FROM revisions r WHERE r.analysis_id = a.id))
  + (SELECT count(*) FROM revisions r WHERE NOT EXISTS (SELECT 1 FROM results x WHERE x.revision_id = r.id)) AS n`);
}

forEachEngine('the library under concurrent writers', (engine) => {
  // A fresh location with no library yet: the four writers below create it at once (migrations under a lock).
  const fresh = libraryPerTest(engine, { open: false });

  describe('several processes writing at once', () => {
    it('loses nothing: every acknowledged id is there, once', async () => {
      const writers = ['w1', 'w2', 'w3', 'w4'].map((tag) => startWriter(fresh.where, tag, 25));
      await Promise.all(writers.map((w) => w.ready));
      for (const w of writers) w.go();
      const codes = await Promise.all(writers.map((w) => w.done));
      expect(codes).toEqual([0, 0, 0, 0]);
      const acknowledged = writers.flatMap((w) => w.ids);
      expect(acknowledged).toHaveLength(100);
      expect(new Set(acknowledged).size).toBe(100);

      // the writers really did interleave: some writer's ids are not one unbroken run
      expect(writers.some((w) => w.ids.at(-1)! - w.ids[0]! > 24)).toBe(true);

      const library = await fresh.where.open();
      try {
        const all = await library.listAll();
        expect(all).toHaveLength(100);
        expect(all.map((a) => a.id).sort((a, b) => a - b)).toEqual([...acknowledged].sort((a, b) => a - b));
        // each writer's records are its own: sample name and original agree
        for (const w of ['w1', 'w4']) {
          const mine = await library.listAll({ query: `${w}-` });
          expect(mine).toHaveLength(25);
          for (const record of mine) {
            const i = record.sample.split('-')[1];
            const bytes = new TextEncoder().encode(`${w} ${i}\n`.repeat(64));
            expect(record.original.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
          }
        }
      } finally {
        await library.close();
      }
    });
  });

  describe('a writer killed mid-stream', () => {
    it('leaves a library that passes the engine\'s checks and holds every acknowledged id', async () => {
      const writer = startWriter(fresh.where, 'k', 0);
      await writer.ready;
      writer.go();
      await writer.acknowledged(40);
      writer.child.kill('SIGKILL');
      expect(await writer.done).toBeNull();
      const acknowledged = [...writer.ids];

      await engineChecks(fresh.where);
      expect(await halfMade(fresh.where)).toBe(0);
      const library = await fresh.where.open();
      try {
        for (const id of acknowledged) expect((await library.get(id)).sample).toMatch(/^k-\d+$/);
        // at most one add can have committed after its id line was lost with the process
        expect((await library.list()).total - acknowledged.length).toBeLessThanOrEqual(1);
        expect((await library.list()).total).toBeGreaterThanOrEqual(acknowledged.length);
      } finally {
        await library.close();
      }
    });
  });
});
