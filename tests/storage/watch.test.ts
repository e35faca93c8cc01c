import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync, appendFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app.js';
import { openLibrary } from '../../src/library/library.js';
import { captureLogger } from '../server/helpers.js';

/**
 * `fieldgap watch` on an instrument folder: 50 spectra dropped in (some
 * written slowly, in pieces), each stored once, the files untouched, and a
 * restart that stores nothing twice. The spectra are the invented demo
 * spectrum with a distinct comment line each.
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const ENTRY = fileURLToPath(new URL('./helpers/cli-entry.ts', import.meta.url));
const SPECTRUM = readFileSync(join(ROOT, 'spectra-demo', 'cr-aqua.csv'));

let dir: string;
let folder: string;
let dataDir: string;
beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-watch-'));
  folder = join(dir, 'instrument');
  dataDir = join(dir, 'lib');
  mkdirSync(folder);
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

interface Watcher {
  child: ChildProcess;
  lines: string[];
  /** Resolves once `predicate` holds for the lines printed so far. */
  until(predicate: (lines: string[]) => boolean): Promise<void>;
  stop(): Promise<number | null>;
}

function startWatch(...extra: string[]): Watcher {
  // A second of stillness before a file counts as complete: far longer than the pauses of the slow writes below.
  const child = spawn(process.execPath, ['--import', 'tsx', ENTRY, 'watch', folder, '--ion', 'Cr3+', '--formula', '[Cr(H2O)6]3+', '--data', dataDir, '--interval', '200', '--settle', '5', ...extra], {
    cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: string[] = [];
  const waiting: { predicate: (l: string[]) => boolean; resolve: () => void }[] = [];
  let pending = '';
  child.stdout!.setEncoding('utf8').on('data', (chunk: string) => {
    pending += chunk;
    const parts = pending.split('\n');
    pending = parts.pop()!;
    lines.push(...parts);
    for (const w of waiting.filter((x) => x.predicate(lines))) w.resolve();
  });
  const closed = new Promise<number | null>((resolve) => child.once('close', resolve));
  return {
    child, lines,
    until: (predicate) => (predicate(lines) ? Promise.resolve() : new Promise<void>((resolve, reject) => {
      waiting.push({ predicate, resolve });
      void closed.then(() => reject(new Error(`watch ended early:\n${lines.join('\n')}`)));
    })),
    stop: async () => {
      child.kill('SIGTERM');
      return closed;
    },
  };
}

function spectrumFile(i: number): Buffer {
  return Buffer.concat([Buffer.from(`# run ${i}\n`), SPECTRUM]);
}

const saved = (lines: string[]) => lines.filter((l) => /^run-\d+\.csv: saved #\d+ /.test(l));

describe('fieldgap watch', () => {
  it('stores each of 50 files once (some written slowly), never touches them, and resumes without duplicates', { timeout: 600_000 }, async () => {
    const watcher = startWatch();
    await watcher.until((l) => l.some((x) => x.startsWith('watching ')));
    for (let i = 0; i < 50; i++) {
      const name = join(folder, `run-${i}.csv`);
      const bytes = spectrumFile(i);
      if (i % 5 === 0) {
        // written in three pieces, as an instrument that streams its export
        const third = Math.floor(bytes.length / 3);
        writeFileSync(name, bytes.subarray(0, third));
        await new Promise((resolve) => setTimeout(resolve, 30));
        appendFileSync(name, bytes.subarray(third, 2 * third));
        await new Promise((resolve) => setTimeout(resolve, 30));
        appendFileSync(name, bytes.subarray(2 * third));
      } else {
        writeFileSync(name, bytes);
      }
    }
    const before = new Map(readdirSync(folder).map((n) => [n, { sha: sha(readFileSync(join(folder, n))), mtime: statSync(join(folder, n)).mtimeMs }]));
    await watcher.until((l) => saved(l).length >= 50);
    expect(await watcher.stop()).toBe(0);
    expect(watcher.lines.filter((l) => / not stored: /.test(l))).toEqual([]);
    expect(new Set(saved(watcher.lines).map((l) => l.split(':')[0])).size).toBe(50);
    // one line per file, with the fit
    expect(saved(watcher.lines)[0]).toMatch(/^run-\d+\.csv: saved #\d+ {3}10Dq = \d+ ± \d+ cm-1/);

    // The files are as they were.
    for (const [name, was] of before) {
      expect(sha(readFileSync(join(folder, name)))).toBe(was.sha);
      expect(statSync(join(folder, name)).mtimeMs).toBe(was.mtime);
    }

    // A restart stores nothing twice; a new file is stored.
    const again = startWatch();
    await again.until((l) => l.some((x) => x.startsWith('50 files already in the library: ')));
    writeFileSync(join(folder, 'run-50.csv'), spectrumFile(50));
    await again.until((l) => saved(l).length >= 1);
    expect(await again.stop()).toBe(0);
    expect(saved(again.lines).map((l) => l.split(':')[0])).toEqual(['run-50.csv']);

    const library = await openLibrary(dataDir);
    try {
      const all = await library.listAll();
      expect(all).toHaveLength(51);
      expect(new Set(all.map((r) => r.original.sha256)).size).toBe(51);
      for (const r of all) expect(r.original.sha256).toBe(sha(spectrumFile(Number(r.sample.split('-')[1]))));
      expect(all[0]).toMatchObject({ formula: '[Cr(H2O)6]3+', ligands: ['H2O'], ion: 'Cr3+' });
    } finally {
      await library.close();
    }
  });

  it('--into stores in a service, which analyses the files; --once takes the files there now', { timeout: 300_000 }, async () => {
    const app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir });
    const server = createServer(app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      for (let i = 0; i < 3; i++) writeFileSync(join(folder, `run-${i}.csv`), spectrumFile(i));
      writeFileSync(join(folder, 'notes.csv'), 'not a spectrum\n');
      const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const run = async () => {
        const child = spawn(process.execPath, ['--import', 'tsx', ENTRY, 'watch', folder, '--ion', 'Cr3+', '--into', url, '--once'], { cwd: ROOT });
        let out = '';
        child.stdout!.setEncoding('utf8').on('data', (c: string) => (out += c));
        const code = await new Promise((resolve) => child.once('close', resolve));
        return { code, lines: out.trim().split('\n') };
      };
      const first = await run();
      expect(first.code).toBe(0);
      expect(saved(first.lines)).toHaveLength(3);
      expect(first.lines.filter((l) => l.startsWith('notes.csv: not stored: '))).toHaveLength(1);
      const second = await run();
      expect(saved(second.lines)).toHaveLength(0);
      expect(second.lines).toContain('3 files already in the library: run-0.csv, run-1.csv, run-2.csv');
      const page = (await (await fetch(`${url}/api/v1/analyses`)).json()) as { total: number };
      expect(page.total).toBe(3);
    } finally {
      await new Promise((resolve) => server.close(resolve));
      await app.close();
    }
  });

  it('stores every spectrum of a multi-column file, one record each, locally and --into a service; a second pass stores none again', { timeout: 300_000 }, async () => {
    // spectra-demo/cr-series.csv: the invented demo scenario, three y columns (en, urea, NCS), which analyze and series read as three spectra.
    const series = readFileSync(join(ROOT, 'spectra-demo', 'cr-series.csv'));
    writeFileSync(join(folder, 'cr-series.csv'), series);
    const LABELS = ['cr-series.csv#1 (Cr-en absorbance)', 'cr-series.csv#2 (Cr-urea absorbance)', 'cr-series.csv#3 (Cr-NCS absorbance)'];
    const run = async (...target: string[]) => {
      const child = spawn(process.execPath, ['--import', 'tsx', ENTRY, 'watch', folder, '--ion', 'Cr3+', ...target, '--once'], { cwd: ROOT });
      let out = '';
      child.stdout!.setEncoding('utf8').on('data', (c: string) => (out += c));
      const code = await new Promise((resolve) => child.once('close', resolve));
      return { code, lines: out.trim().split('\n') };
    };
    const app = createApp({ pool: 'in-process', logger: captureLogger().logger, staticDir: false, dataDir: join(dir, 'service-lib') });
    const server = createServer(app);
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      for (const target of [['--data', dataDir], ['--into', url]]) {
        const first = await run(...target);
        expect(first.code).toBe(0);
        expect(first.lines.filter((l) => / saved #\d+ /.test(l)).map((l) => l.split(': saved')[0])).toEqual(LABELS);
        const second = await run(...target);
        expect(second.lines.filter((l) => / saved #\d+ /.test(l))).toHaveLength(0);
        expect(second.lines).toContain(`3 files already in the library: ${LABELS.join(', ')}`);
      }
      const library = await openLibrary(dataDir);
      try {
        const page = await library.list({});
        expect(page.total).toBe(3);
        const records = await Promise.all(page.analyses.map((a) => library.get(a.id)));
        expect(records.map((r) => r.options.column).sort()).toEqual([1, 2, 3]);
        expect(records.map((r) => r.sample).sort()).toEqual(['cr-series: Cr-NCS absorbance', 'cr-series: Cr-en absorbance', 'cr-series: Cr-urea absorbance']);
        // Three different spectra, three different fits: not one column stored three times.
        expect(new Set(records.map((r) => r.summary.tenDq)).size).toBe(3);
        for (const r of records) expect(r.original.sha256).toBe(sha(series));
      } finally {
        await library.close();
      }
      const remote = (await (await fetch(`${url}/api/v1/analyses`)).json()) as { total: number };
      expect(remote.total).toBe(3);
    } finally {
      await new Promise((resolve) => server.close(resolve));
      await app.close();
    }
  });

  it('names what is wrong in one line', async () => {
    const run = spawn(process.execPath, ['--import', 'tsx', ENTRY, 'watch', join(dir, 'nope'), '--ion', 'Cr3+'], { cwd: ROOT });
    let err = '';
    run.stderr!.setEncoding('utf8').on('data', (c: string) => (err += c));
    const code = await new Promise((resolve) => run.once('close', resolve));
    expect(code).toBe(2);
    expect(err).toMatch(/^fieldgap watch: .*nope: no such folder\n$/);
  });
});

function sha(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}
