import { FieldgapError } from '../errors.js';

/**
 * Turns SQLite's failures into FieldgapError naming the library file, so a
 * user sees "library.sqlite: busy ..." rather than a driver stack trace.
 * Anything that is not an SQLite error (or a FieldgapError) passes unchanged.
 */
export function translateSqliteError(error: unknown, file: string): unknown {
  if (error instanceof FieldgapError) return error;
  const code = (error as { code?: unknown } | null)?.code;
  if (typeof code !== 'string' || !code.startsWith('SQLITE_')) {
    if (error instanceof TypeError && /database connection is not open/.test(error.message)) {
      return new FieldgapError('internal', 'the library was used after it was closed', file);
    }
    return error;
  }
  const detail = (error as Error).message;
  if (code.startsWith('SQLITE_BUSY') || code.startsWith('SQLITE_LOCKED')) {
    return new FieldgapError('timeout', `the library stayed locked by another process too long; try again (${detail})`, file);
  }
  if (code.startsWith('SQLITE_NOTADB') || code.startsWith('SQLITE_CORRUPT')) {
    return new FieldgapError('unsupported-format', `not a readable fieldgap library (${detail})`, file);
  }
  if (code.startsWith('SQLITE_FULL')) {
    return new FieldgapError('too-large', `the disk holding the library is full (${detail})`, file);
  }
  if (code.startsWith('SQLITE_READONLY') || code.startsWith('SQLITE_CANTOPEN') || code.startsWith('SQLITE_PERM')) {
    return new FieldgapError('invalid-argument', `the library cannot be opened for writing here (${detail})`, file);
  }
  return new FieldgapError('internal', `library storage failed: ${detail}`, file);
}
