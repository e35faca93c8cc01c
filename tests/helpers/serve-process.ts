/**
 * `fieldgap serve` (or server/main.ts) as a child process, for the tests that
 * need a real process: a second instance, another user, a signal. It is
 * ready when it prints "serving on URL"; there is no clock: a slow start on
 * a busy machine is only slow, and a process that ends first fails with
 * what it wrote.
 */
import { spawn, type ChildProcess } from 'node:child_process';

export interface ServeProcess {
  child: ChildProcess;
  /** The URL it printed, with its trailing slash: "http://127.0.0.1:PORT/". */
  url: string;
  /** Everything it has written to stdout so far. */
  readonly stdout: string;
  /** Everything it has written to stderr so far. */
  readonly stderr: string;
  /** Settles when the process has closed, with its exit code (null after a signal). */
  closed: Promise<number | null>;
  /** SIGTERM, then its exit code once it has closed. */
  stop(): Promise<number | null>;
}

/** Starts `command` (program and arguments) and waits for its "serving on" line. */
export async function startServeProcess(command: readonly string[], options: { cwd?: string; env?: NodeJS.ProcessEnv } = {}): Promise<ServeProcess> {
  const [program, ...args] = command;
  if (program === undefined) throw new Error('startServeProcess: no command');
  const child = spawn(program, args, { cwd: options.cwd, env: options.env ?? process.env, stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  child.stdout!.setEncoding('utf8').on('data', (chunk: string) => (stdout += chunk));
  child.stderr!.setEncoding('utf8').on('data', (chunk: string) => (stderr += chunk));
  const closed = new Promise<number | null>((resolve) => child.once('close', (code) => resolve(code)));
  const url = await new Promise<string>((resolve, reject) => {
    const look = (): void => {
      const match = /serving on (http:\/\/[^\s/?#]+\/)/.exec(stdout);
      if (match) {
        child.stdout!.off('data', look);
        resolve(match[1]!);
      }
    };
    child.stdout!.on('data', look);
    void closed.then((code) => reject(new Error(`serve ended (${code}) before listening: ${stdout}${stderr}`)));
  });
  return {
    child,
    url,
    get stdout() {
      return stdout;
    },
    get stderr() {
      return stderr;
    },
    closed,
    async stop() {
      child.kill('SIGTERM');
      return closed;
    },
  };
}
