import { FieldgapError } from '../errors.js';

/** The path every storage error names: the library, never a file path of the machine it runs on. */
export const LIBRARY_PATH = 'library';

/**
 * Turns SQLite's failures into FieldgapError, so a user sees "the disk
 * holding the library is full" rather than a driver stack trace. Messages
 * never carry the library file's path (it would reach the service's users);
 * the path of every such error is "library". Anything that is not an SQLite
 * error (or a FieldgapError) passes unchanged.
 */
export function translateSqliteError(error: unknown): unknown {
  if (error instanceof FieldgapError) return error;
  const code = (error as { code?: unknown } | null)?.code;
  if (typeof code !== 'string' || !code.startsWith('SQLITE_')) {
    if (error instanceof TypeError && /database connection is not open/.test(error.message)) {
      return new FieldgapError('internal', 'the library was used after it was closed', LIBRARY_PATH);
    }
    return error;
  }
  // SQLite's messages name no path ("database disk image is malformed"), but keep only the code to be sure.
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
    return new FieldgapError('timeout', `the library stayed locked by another process too long; try again (${code})`, LIBRARY_PATH);
  }
  if (code.startsWith('SQLITE_NOTADB') || code.startsWith('SQLITE_CORRUPT')) {
    return new FieldgapError('storage-broken', `the library's file is damaged or is not a fieldgap library (${code})`, LIBRARY_PATH);
  }
  if (code.startsWith('SQLITE_FULL')) {
    return new FieldgapError('storage-full', `the disk holding the library is full; nothing was saved (${code})`, LIBRARY_PATH);
  }
  if (code.startsWith('SQLITE_READONLY') || code.startsWith('SQLITE_PERM')) {
    return new FieldgapError('storage-read-only', `the library is read-only here: it can be read but not changed (${code})`, LIBRARY_PATH);
  }
  if (code.startsWith('SQLITE_CANTOPEN')) {
    return new FieldgapError('storage-unavailable', `the library's file cannot be opened (${code})`, LIBRARY_PATH);
  }
  if (code.startsWith('SQLITE_IOERR')) {
    return new FieldgapError('storage-broken', `the library's disk failed to read or write (${code})`, LIBRARY_PATH);
  }
  return new FieldgapError('internal', `library storage failed (${code})`, LIBRARY_PATH);
}
