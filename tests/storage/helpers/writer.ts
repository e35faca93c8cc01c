/**
 * A child process for the concurrency and crash tests:
 *   node --import tsx writer.ts LIBRARY TAG COUNT
 * adds COUNT records (COUNT 0: forever) to the library at LIBRARY (a data
 * folder, or a postgres:// URL), printing
 * "TAG ID" on its own line only after each add has committed, so every id
 * the parent has read is an acknowledged write. It prints "ready" once the
 * library is open and waits for a line on stdin before writing, so the
 * parent can start several writers at the same moment.
 */
import { writeSync } from 'node:fs';
import { openLibraryAt } from '../../../src/library/library.js';
import { handBuiltRecord } from './records.js';

const [where, tag, countText] = process.argv.slice(2);
if (!where || !tag || countText === undefined) {
  process.stderr.write('usage: writer.ts LIBRARY TAG COUNT\n');
  process.exit(2);
}
const count = Number(countText);
const pause = new Int32Array(new SharedArrayBuffer(4));
const library = await openLibraryAt(/^postgres(ql)?:\/\//.test(where) ? { engine: 'postgres', url: where } : { engine: 'sqlite', dataDir: where });
writeSync(1, 'ready\n');
await new Promise<void>((resolve) => process.stdin.once('data', () => resolve()));
process.stdin.destroy();
for (let i = 0; count === 0 || i < count; i++) {
  const content = new TextEncoder().encode(`${tag} ${i}\n`.repeat(64));
  const saved = await library.add(handBuiltRecord({ sample: `${tag}-${i}`, content }));
  // writeSync, not process.stdout.write: the line must be out before the next add, even if we are killed then.
  writeSync(1, `${tag} ${saved.id}\n`);
  // A short pause, as between real users' saves: without it one writer
  // re-takes the lock at once while the others sleep in SQLite's busy
  // handler, and the writes never interleave.
  Atomics.wait(pause, 0, 0, 2);
}
await library.close();
