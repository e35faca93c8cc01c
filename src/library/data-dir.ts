import { isAbsolute, resolve } from 'node:path';
import { invalidArgument } from '../errors.js';

/** The folder name used when neither --data nor FIELDGAP_DATA names one. */
export const DEFAULT_DATA_DIR = 'fieldgap-data';

export interface DataDirSources {
  /** The value of `--data DIR`, if given. Wins over everything else. */
  flag?: string | undefined;
  /** The process environment; only `FIELDGAP_DATA` is read. An empty value counts as unset. */
  env?: Record<string, string | undefined>;
  /** The folder relative paths are taken from (the working directory). */
  cwd: string;
}

/**
 * Where the results library lives, the same rule for the CLI and the service:
 * `--data DIR`, else `$FIELDGAP_DATA`, else `./fieldgap-data`, each resolved
 * against `cwd`. Returns an absolute path; touches no file (the library
 * creates the folder when it opens).
 */
export function resolveDataDir({ flag, env = {}, cwd }: DataDirSources): string {
  if (flag !== undefined) {
    if (flag.trim() === '') throw invalidArgument('--data', '--data: expected a folder, got an empty value');
    return absolute(flag, cwd);
  }
  const fromEnv = env['FIELDGAP_DATA'];
  if (fromEnv !== undefined && fromEnv.trim() !== '') return absolute(fromEnv, cwd);
  return resolve(cwd, DEFAULT_DATA_DIR);
}

function absolute(path: string, cwd: string): string {
  return isAbsolute(path) ? resolve(path) : resolve(cwd, path);
}
