import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { LIBRARY_FILE, openLibrary } from '../../src/library/library.js';
import { startServeProcess } from '../helpers/serve-process.js';
import { handBuiltRecord } from './helpers/records.js';

/**
 * A data folder this user may not write (a read-only share, an archive):
 * `library list` and the service read it; writes fail with a clear message.
 * Run as another user when the tests run as root (root may write anything).
 */
const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const ENTRY = fileURLToPath(new URL('./helpers/cli-entry.ts', import.meta.url));
const AS_ROOT = process.getuid?.() === 0;
const RUN_AS = AS_ROOT ? ['runuser', '-u', 'nobody', '--'] : [];
const canDropRights = !AS_ROOT || spawnSync('runuser', ['-u', 'nobody', '--', 'true']).status === 0;

let dir: string;
let dataDir: string;
beforeEach(async () => {
  dir = mkdtempSync(join(tmpdir(), 'fieldgap-ro-'));
  chmodSync(dir, 0o755);
  dataDir = join(dir, 'lib');
  const library = await openLibrary(dataDir);
  await library.add(handBuiltRecord({ sample: 'archived aqua' }));
  await library.close();
  chmodSync(join(dataDir, LIBRARY_FILE), 0o444);
  chmodSync(dataDir, 0o555);
});
afterEach(() => {
  chmodSync(dataDir, 0o755);
  rmSync(dir, { recursive: true, force: true });
});

function fieldgap(...args: string[]): { code: number | null; out: string; err: string } {
  const [command, ...rest] = [...RUN_AS, process.execPath, '--import', 'tsx', ENTRY, ...args];
  const run = spawnSync(command!, rest, { cwd: ROOT, encoding: 'utf8', env: { ...process.env, FIELDGAP_DATA: '' } });
  return { code: run.status, out: run.stdout, err: run.stderr };
}

describe.runIf(canDropRights)('a read-only data folder', () => {
  // Each child process compiles the sources with tsx: seconds on a busy machine, so the limit is generous (not tight).
  it('lists and shows, refuses a change in one line without a path, and leaves the folder as it was', { timeout: 180_000 }, () => {
    const before = readdirSync(dataDir).sort();
    const bytes = readFileSync(join(dataDir, LIBRARY_FILE));
    const list = fieldgap('library', 'list', '--data', dataDir);
    expect(list.err).toBe('');
    expect(list.code).toBe(0);
    expect(list.out).toContain('archived aqua');
    expect(fieldgap('library', 'show', '1', '--data', dataDir).out).toMatch(/^#1  archived aqua/);
    const remove = fieldgap('library', 'remove', '1', '--data', dataDir);
    expect(remove.code).toBe(2);
    expect(remove.err).toMatch(/^fieldgap library: library: the library is read-only here/);
    expect(remove.err).not.toContain(dir);
    expect(readdirSync(dataDir).sort()).toEqual(before);
    expect(Buffer.compare(readFileSync(join(dataDir, LIBRARY_FILE)), bytes)).toBe(0);
  });

  it('serves reads; a write answers 507 with a message and no path', { timeout: 180_000 }, async () => {
    const serve = await startServeProcess([...RUN_AS, process.execPath, '--import', 'tsx', ENTRY, 'serve', '--port', '0', '--data', dataDir], { cwd: ROOT });
    const url = serve.url;
    try {
      const list = await fetch(`${url}api/v1/analyses`);
      expect(list.status).toBe(200);
      expect(((await list.json()) as { total: number }).total).toBe(1);
      const health = (await (await fetch(`${url}api/v1/health`)).json()) as { library: unknown };
      expect(health.library).toEqual({ engine: 'sqlite', readOnly: true, reachable: true });
      const remove = await fetch(`${url}api/v1/analyses/1`, { method: 'DELETE', headers: { 'X-Requested-With': 'fieldgap' } });
      const text = await remove.text();
      expect(remove.status).toBe(507);
      expect(JSON.parse(text)).toMatchObject({ error: { code: 'storage-read-only', path: 'library' } });
      expect(text).not.toContain(dir);
    } finally {
      await serve.stop();
    }
  });
});
