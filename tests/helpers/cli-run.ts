/**
 * The CLI run in process, its output kept as text: what a terminal would
 * show on stdout and stderr. Not a terminal (isTty false); cwd and env are the
 * test's to give (an empty env by default, so no FIELDGAP_* of the machine
 * running the tests leaks in).
 */
import type { CliIo } from '../../src/cli/command.js';
import { runCli } from '../../src/cli/main.js';

/** A CliIo that collects what is written: `out` (stdout) and `err` (stderr) so far. */
export type CapturedIo = CliIo & { out: string; err: string };

export function capturedIo(options: Partial<Omit<CliIo, 'stdout' | 'stderr'>> = {}): CapturedIo {
  const io: CapturedIo = {
    out: '',
    err: '',
    isTty: false,
    cwd: process.cwd(),
    env: {},
    ...options,
    stdout: (text) => {
      io.out += text;
    },
    stderr: (text) => {
      io.err += text;
    },
  };
  return io;
}

/** Runs one command line (`argv` without the program name); its exit code and output. */
export async function runCliCaptured(argv: readonly string[], options: Partial<Omit<CliIo, 'stdout' | 'stderr'>> = {}): Promise<{ code: number; out: string; err: string }> {
  const io = capturedIo(options);
  const code = await runCli([...argv], io);
  return { code, out: io.out, err: io.err };
}
