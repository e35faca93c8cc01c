import { invalidArgument } from '../errors.js';

/**
 * The shape every CLI command has. A command parses its own arguments (with
 * node:util parseArgs, see options.ts), does its file access, calls the pure
 * core, and writes to the streams it is given, so tests can run it in process.
 */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** True when stdout is a terminal (progress bars only then). */
  isTty: boolean;
  cwd: string;
  env: Record<string, string | undefined>;
  /**
   * Runs the REST service (`fieldgap serve`) until it is stopped. src/cli and
   * server/ never import each other: the program entry (bin/fieldgap), which
   * alone knows both, supplies this; without it `serve` says it is unavailable.
   */
  runService?: ServiceRunner;
}

/** The service's own entry, given the serve arguments; returns the exit code. */
export type ServiceRunner = (argv: string[], io: CliIo) => Promise<number>;

export interface Command {
  name: string;
  /** One line for `fieldgap --help`. */
  summary: string;
  /** Full usage text for `fieldgap NAME --help`. */
  usage: string;
  /** Returns the exit code: 0 success, 1 some items failed (batch), 2 bad input, 3 analysed but nothing to fit (analyze, one spectrum). */
  run(argv: string[], io: CliIo): Promise<number>;
}

/** A subcommand's handler (`library add`, `users token`): the arguments after its name. */
export type SubcommandHandler = (argv: string[], io: CliIo) => Promise<number>;

/**
 * Runs `fieldgap COMMAND SUB ...` on the handler named SUB; a missing or
 * unknown subcommand is one usage error that lists the known ones.
 */
export function runSubcommand(command: string, handlers: Readonly<Record<string, SubcommandHandler>>, argv: string[], io: CliIo): Promise<number> {
  const [sub, ...rest] = argv;
  const handler = sub === undefined ? undefined : handlers[sub];
  if (!handler) {
    const what = sub === undefined ? 'a subcommand is needed' : `unknown subcommand "${sub}"`;
    throw invalidArgument(command, `${what}: one of ${Object.keys(handlers).join(', ')} (see fieldgap ${command} --help)`);
  }
  return handler(rest, io);
}
