import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, expect, it } from 'vitest';
import { startServeProcess, type ServeProcess } from '../helpers/serve-process.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';

/**
 * Several service instances over one PostgreSQL library (issue 17): two
 * `fieldgap serve` processes on their own ports, four writers across them,
 * one instance killed with SIGKILL mid-write and restarted. Every record
 * acknowledged (201) must be there, intact, seen from both, and
 * PostgreSQL's own index checks (amcheck) clean.
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const ENTRY = fileURLToPath(new URL('./helpers/cli-entry.ts', import.meta.url));
const SPECTRUM = readFileSync(join(ROOT, 'spectra-demo', 'cr-aqua.csv'));

type Instance = ServeProcess;

function startInstance(database: string): Promise<Instance> {
  return startServeProcess([process.execPath, '--import', 'tsx', ENTRY, 'serve', '--port', '0', '--database', database], {
    cwd: ROOT, env: { ...process.env, FIELDGAP_LOG_LEVEL: 'warn' },
  });
}

interface Writer {
  acked: Map<number, string>;
  /** Answers other than 201 (a busy or timed-out service under load: retried, never acknowledged). */
  refused: number[];
  ended: boolean;
  done: Promise<void>;
}

/**
 * Posts records one after another until told to stop or its instance is
 * gone; `acked` holds the ids answered 201 with their original's SHA-256.
 * A 503 or 504 (a busy machine) is not an acknowledgement: the same record
 * is tried again. Any other answer ends the writer (and fails the test).
 */
function writer(instance: () => Instance, tag: string, stop: { now: boolean }): Writer {
  const w: Writer = { acked: new Map(), refused: [], ended: false, done: Promise.resolve() };
  const acked = w.acked;
  w.done = (async () => {
    for (let i = 0; !stop.now && i < 200; i++) {
      // Each record's original differs (a comment line), so each has its own SHA-256.
      const bytes = Buffer.concat([Buffer.from(`# ${tag} ${i}\n`), SPECTRUM]);
      let res: Response;
      try {
        res = await fetch(`${instance().url}api/v1/analyses?ion=Cr3%2B&sample=${tag}-${i}&fileName=cr.csv`, {
          method: 'POST', body: bytes, headers: { 'Content-Type': 'text/csv' },
        });
      } catch {
        return; // the instance is gone: nothing more from this writer
      }
      if (res.status === 503 || res.status === 504) {
        await res.arrayBuffer();
        w.refused.push(res.status);
        i--;
        continue;
      }
      if (res.status !== 201) {
        w.refused.push(res.status);
        return;
      }
      const body = (await res.json()) as { id: number };
      acked.set(body.id, createHash('sha256').update(bytes).digest('hex'));
    }
  })().finally(() => {
    w.ended = true;
  });
  return w;
}

forEachEngine('several instances over one library', (engine) => {
  const fresh = libraryPerTest(engine, { open: false });
  const instances: Instance[] = [];
  // Registered after libraryPerTest, so it runs before the library is removed.
  afterEach(async () => {
    for (const i of instances.splice(0)) {
      i.child.kill('SIGTERM');
      await i.closed;
    }
  });

  // Child processes compile the sources with tsx and analyse real spectra: minutes on a busy machine, not a tight limit.
  it.runIf(engine === 'postgres')('four writers on two instances, one killed and restarted: every acknowledged record on both', { timeout: 600_000 }, async () => {
    if (fresh.where.location.engine !== 'postgres') return;
    const database = fresh.where.location.url;
    let a = await startInstance(database);
    const b = await startInstance(database);
    instances.push(b);
    const stop = { now: false };
    const writers = [writer(() => a, 'a1', stop), writer(() => a, 'a2', stop), writer(() => b, 'b1', stop), writer(() => b, 'b2', stop)];

    // Kill instance a once each writer has records in: mid-write for its two writers.
    await until(() => writers.every((w) => w.acked.size >= 2), writers);
    a.child.kill('SIGKILL');
    await a.closed;
    await until(() => writers[2]!.acked.size + writers[3]!.acked.size >= 8, writers.slice(2));
    a = await startInstance(database);
    instances.push(a);
    stop.now = true;
    await Promise.all(writers.map((w) => w.done));

    const acked = new Map<number, string>();
    for (const w of writers) for (const [id, sha] of w.acked) acked.set(id, sha);
    expect(acked.size).toBeGreaterThanOrEqual(16);
    // b's writers ran to the end on their own: only 503/504 (retried), never another answer
    for (const w of writers.slice(2)) expect(w.refused.filter((s) => s !== 503 && s !== 504)).toEqual([]);
    for (const instance of [a, b]) {
      const list = (await (await fetch(`${instance.url}api/v1/analyses?limit=1000`)).json()) as { total: number; analyses: { id: number; original: { sha256: string } }[] };
      const byId = new Map(list.analyses.map((r) => [r.id, r.original.sha256]));
      for (const [id, sha] of acked) expect(byId.get(id)).toBe(sha);
      // at most one record per killed writer may have committed after its answer was lost
      expect(list.total - acked.size).toBeLessThanOrEqual(2);
    }
    // originals byte for byte, read through the other instance
    const [someId, sha] = [...acked][0]!;
    const original = Buffer.from(await (await fetch(`${b.url}api/v1/analyses/${someId}/original`)).arrayBuffer());
    expect(createHash('sha256').update(original).digest('hex')).toBe(sha);

    // PostgreSQL manual, amcheck: bt_index_check raises an error on a corrupt B-tree index.
    await fresh.where.exec('CREATE EXTENSION IF NOT EXISTS amcheck');
    expect(await fresh.where.scalar(`SELECT count(bt_index_check(c.oid)) FROM pg_index i JOIN pg_class c ON c.oid = i.indexrelid
      JOIN pg_am m ON m.oid = c.relam WHERE m.amname = 'btree' AND c.relnamespace = current_schema()::regnamespace`)).toBeGreaterThanOrEqual(4);
    expect(await fresh.where.scalar(`SELECT
      (SELECT count(*) FROM analyses a WHERE NOT EXISTS (SELECT 1 FROM originals o WHERE o.analysis_id = a.id))
    + (SELECT count(*) FROM revisions r WHERE NOT EXISTS (SELECT 1 FROM results x WHERE x.revision_id = r.id)) AS n`)).toBe(0);
  });
});

/** Waits for a condition on the writers' progress; fails at once if one of `watched` ended before it held. */
async function until(condition: () => boolean, watched: Writer[]): Promise<void> {
  while (!condition()) {
    const ended = watched.find((w) => w.ended);
    if (ended) throw new Error(`a writer ended early (answers: ${ended.refused.join(', ') || 'none'}; acknowledged ${ended.acked.size})`);
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}
