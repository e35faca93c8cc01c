import { isFieldgapError } from '../errors.js';
import type { CliIo, ServiceRunner } from './command.js';
import { commands } from './commands/index.js';
import { pipeWriter } from './pipe-output.js';
import { packageVersion } from '../version.js';


function helpText(): string {
  const width = Math.max(...commands.map((c) => c.name.length), 8);
  const lines = commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`);
  return [
    'fieldgap: ligand-field parameters from UV-vis-NIR spectra of d1-d9 complexes',
    '',
    'Usage: fieldgap COMMAND [options]      fieldgap COMMAND --help for its options',
    '',
    'Commands:',
    ...lines,
    '',
    'Energies are in cm-1 unless an option says otherwise.',
    '',
  ].join('\n');
}

/**
 * Runs one command line and returns the exit code. Every FieldgapError becomes
 * one line on stderr and exit code 2; anything else is a bug, reported as one
 * line too: a stack trace never reaches the user (set FIELDGAP_DEBUG=1 to see it).
 */
export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    io.stdout(helpText());
    return name === undefined ? 2 : 0;
  }
  if (name === '--version' || name === '-v') {
    io.stdout(`${packageVersion()}\n`);
    return 0;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.stderr(`fieldgap: unknown command "${name}" (try fieldgap --help)\n`);
    return 2;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(command.usage.endsWith('\n') ? command.usage : `${command.usage}\n`);
    return 0;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    if (isFieldgapError(error)) {
      const where = error.path && !error.message.startsWith(error.path) ? `${error.path}: ` : '';
      io.stderr(`fieldgap ${name}: ${where}${error.message}\n`);
      return 2;
    }
    if (io.env['FIELDGAP_DEBUG']) io.stderr(`${(error as Error)?.stack ?? String(error)}\n`);
    const message = error instanceof Error ? error.message : String(error);
    io.stderr(`fieldgap ${name}: internal error: ${message}\n`);
    return 2;
  }
}

/** The process entry point used by bin/fieldgap, which passes the service's runner for `serve`. */
export async function main(runService?: ServiceRunner): Promise<void> {
  const io: CliIo = {
    // A reader that leaves early (`| head`) ends the output quietly.
    stdout: pipeWriter(process.stdout),
    stderr: pipeWriter(process.stderr),
    // The progress bar goes to stderr: drawn only when both streams are a terminal, so neither a pipe nor a log file gets it.
    isTty: Boolean(process.stdout.isTTY && process.stderr.isTTY),
    cwd: process.cwd(),
    env: process.env,
    ...(runService ? { runService } : {}),
  };
  const code = await runCli(process.argv.slice(2), io);
  process.exitCode = code;
}
