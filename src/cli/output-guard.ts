/**
 * Output files against input files: a batch never writes its summary over a
 * spectrum it reads. An output that names one of the inputs is refused,
 * unless that input is recognisably an earlier run's own output (a summary
 * written into the folder being analysed): then it is no spectrum, so it is
 * left out of the inputs and replaced.
 */
import { closeSync, existsSync, openSync, readSync, realpathSync, statSync, writeFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { FieldgapError } from '../errors.js';

export interface OutputFile {
  /** The option that names it, for the error: "--csv". */
  option: string;
  /** As the user gave it (relative to cwd, or absolute). */
  path: string;
  /** The first line of a file this command writes there, so an earlier run's output is recognised. */
  firstLine?: string;
}

/** The file's real path (links and "./" resolved), or undefined when it does not exist. */
function realPathOf(path: string): string | undefined {
  return existsSync(path) ? realpathSync(path) : undefined;
}

/** Whether the file starts with `line` and a line break (reads at most that much). */
function startsWithLine(path: string, line: string): boolean {
  const wanted = Buffer.from(`${line}\n`);
  const head = Buffer.alloc(wanted.length + 1);
  const fd = openSync(path, 'r');
  try {
    const read = readSync(fd, head, 0, head.length, 0);
    const text = head.subarray(0, read).toString('utf8');
    return text.startsWith(`${line}\n`) || text.startsWith(`${line}\r\n`);
  } finally {
    closeSync(fd);
  }
}

/**
 * The inputs (paths relative to cwd) that remain once no output is written
 * over one of them; throws an invalid-argument error naming the option when
 * an output would replace a spectrum or two outputs name the same file.
 */
export function inputsApartFromOutputs(inputs: string[], outputs: OutputFile[], cwd: string): string[] {
  let kept = inputs;
  const taken = new Map<string, string>();
  for (const output of outputs) {
    checkWritable(output, cwd);
    const existing = realPathOf(resolve(cwd, output.path));
    const real = existing ?? resolve(cwd, output.path);
    const other = taken.get(real);
    if (other !== undefined) {
      throw new FieldgapError('invalid-argument', `${output.path} is also the file of ${other}: give each output its own file`, output.option);
    }
    taken.set(real, output.option);
    // Every input exists, so only an existing output can be one of them.
    if (existing === undefined) continue;
    const clash = kept.filter((input) => realPathOf(resolve(cwd, input)) === real);
    if (clash.length === 0) continue;
    if (output.firstLine !== undefined && startsWithLine(real, output.firstLine)) {
      kept = kept.filter((input) => !clash.includes(input));
      continue;
    }
    throw new FieldgapError(
      'invalid-argument',
      `${output.path} is one of the spectra to analyse: writing there would replace it; choose another file name`,
      output.option,
    );
  }
  if (kept.length === 0) {
    throw new FieldgapError('not-found', 'no spectrum files left to analyse once the earlier summary is set aside', 'FILES');
  }
  return kept;
}

/** Checked before a long batch starts, so its results are not lost to a typo in the output's folder. */
function checkWritable(output: OutputFile, cwd: string): void {
  const full = resolve(cwd, output.path);
  if (existsSync(full) && statSync(full).isDirectory()) {
    throw new FieldgapError('invalid-argument', `${output.path} is a folder: give a file name`, output.option);
  }
  const folder = dirname(full);
  if (!existsSync(folder) || !statSync(folder).isDirectory()) {
    throw new FieldgapError('not-found', `the folder of ${output.path} does not exist`, output.option);
  }
}

/** Writes an output file, with an error naming the option and the reason when it cannot. */
export function writeOutputFile(output: Pick<OutputFile, 'option' | 'path'>, text: string, cwd: string): void {
  try {
    writeFileSync(resolve(cwd, output.path), text);
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const why = code === 'EACCES' || code === 'EPERM' ? 'permission denied' : code === 'ENOSPC' ? 'the disk is full' : `cannot be written (${code ?? 'unknown error'})`;
    throw new FieldgapError(code === 'EACCES' || code === 'EPERM' ? 'permission-denied' : 'invalid-argument', `${output.path}: ${why}`, output.option);
  }
}
