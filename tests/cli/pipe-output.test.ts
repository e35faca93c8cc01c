/**
 * `fieldgap diagram --csv | head`: the reader closes the pipe after a few
 * lines; the command must end quietly (exit 0, nothing on stderr), not die
 * with an EPIPE stack trace. Run as a real process whose stdout the test
 * closes after the first chunk: an event, not a delay.
 */
import { spawn } from 'node:child_process';
import { PassThrough } from 'node:stream';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { pipeWriter } from '../../src/cli/pipe-output.js';

const RUN_CLI = fileURLToPath(new URL('./fixtures/run-cli.ts', import.meta.url));

describe('output to a closed pipe', () => {
  it('ends `diagram --csv` quietly when the reader leaves after the first chunk', async () => {
    const child = spawn(process.execPath, ['--import', 'tsx', RUN_CLI, 'diagram', '--d', '2', '--csv', '--steps', '20000'], {
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stderr = '';
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    const exit = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    // The first chunk of output, or the end of a process that printed none.
    const first = await Promise.race([
      new Promise<string>((resolve) => child.stdout.once('data', (chunk: Buffer) => resolve(chunk.toString()))),
      exit.then((code) => `exited ${code} before any output; stderr: ${stderr}`),
    ]);
    expect(first).toMatch(/^dq_over_b,/);
    child.stdout.destroy();
    expect(await exit).toBe(0);
    expect(stderr).not.toMatch(/EPIPE|Error|at /);
  });

  it('drops output after EPIPE and rethrows other stream errors', () => {
    const stream = new PassThrough();
    const written: string[] = [];
    stream.on('data', (chunk: Buffer) => written.push(chunk.toString()));
    const write = pipeWriter(stream);
    write('a');
    stream.emit('error', Object.assign(new Error('write EPIPE'), { code: 'EPIPE' }));
    write('b');
    expect(written.join('')).toBe('a');
    const other = new PassThrough();
    pipeWriter(other);
    expect(() => other.emit('error', Object.assign(new Error('disk'), { code: 'EIO' }))).toThrow('disk');
  });
});
