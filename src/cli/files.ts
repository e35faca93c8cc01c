import { readdirSync, readFileSync, statSync } from 'node:fs';
import { extname, join, relative, resolve, sep } from 'node:path';
import { FieldgapError } from '../errors.js';

/** File endings taken from a folder; a file named explicitly is read whatever its ending. */
export const SPECTRUM_EXTENSIONS = ['.csv', '.tsv', '.txt', '.dat', '.asc', '.prn', '.jdx', '.dx', '.jcamp'];

/**
 * Expands the FILES-or-DIRS arguments into a sorted list of files. A folder
 * contributes the spectrum files directly inside it and in its subfolders
 * (hidden entries skipped). A path that does not exist is an error naming it.
 */
export function expandInputPaths(paths: string[], cwd: string): string[] {
  const files: string[] = [];
  for (const given of paths) {
    const full = resolve(cwd, given);
    let stats;
    try {
      stats = statSync(full);
    } catch {
      throw new FieldgapError('not-found', `no such file or folder`, given);
    }
    if (stats.isDirectory()) {
      const found = filesInFolder(full, relative(cwd, full));
      if (found.length === 0) {
        throw new FieldgapError('not-found', `folder holds no spectrum files (${SPECTRUM_EXTENSIONS.join(' ')})`, given);
      }
      files.push(...found);
    } else {
      files.push(given);
    }
  }
  return files;
}

/**
 * The spectrum files under `folder`, as paths relative to the working folder
 * (`shown` is the folder's own, "" for the working folder itself). The
 * prefix is joined by hand, not by path.join/relative per file: those
 * normalise every path character by character, and on a folder of 10 000
 * files the garbage grew the young generation by about 16 MB, which stayed
 * in a batch's peak memory (bench/batch.ts). An entry name holds no
 * separator, so prefix + sep + name is what join and relative would give.
 */
function filesInFolder(folder: string, shown: string): string[] {
  const out: string[] = [];
  const prefix = shown === '' ? '' : `${shown}${sep}`;
  for (const entry of readdirSync(folder, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name))) {
    if (entry.name.startsWith('.')) continue;
    if (entry.isDirectory()) out.push(...filesInFolder(join(folder, entry.name), `${prefix}${entry.name}`));
    else if (entry.isFile() && SPECTRUM_EXTENSIONS.includes(extname(entry.name).toLowerCase())) out.push(`${prefix}${entry.name}`);
  }
  return out;
}

/** Reads a file as bytes (never writes it), with an error naming it. */
export function readInputFile(path: string, cwd: string): Uint8Array {
  try {
    return readFileSync(resolve(cwd, path));
  } catch (error) {
    throw readError(error, path);
  }
}

/** A failed read as the error that says what happened: missing (not-found), refused (permission-denied), a folder, or unreadable. */
export function readError(error: unknown, path: string): FieldgapError {
  const code = (error as NodeJS.ErrnoException).code;
  if (code === 'ENOENT') return new FieldgapError('not-found', 'no such file', path);
  if (code === 'EACCES' || code === 'EPERM') return new FieldgapError('permission-denied', 'permission denied: fieldgap may not read this file', path);
  if (code === 'EISDIR') return new FieldgapError('invalid-argument', 'is a folder', path);
  return new FieldgapError('parse-error', `cannot be read (${code ?? 'unknown error'})`, path);
}
