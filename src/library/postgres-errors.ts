import { FieldgapError } from '../errors.js';
import { LIBRARY_PATH } from './sqlite-errors.js';

/** Network failures of the client library (node's errno codes): the server is not reachable. */
const UNREACHABLE = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN', 'EPIPE']);

/**
 * Turns PostgreSQL's failures (SQLSTATE codes, see the PostgreSQL manual's
 * appendix "PostgreSQL Error Codes") and connection failures into
 * FieldgapError. Messages name no host, user or password: the connection
 * string stays with whoever started the service.
 */
export function translatePostgresError(error: unknown): unknown {
  if (error instanceof FieldgapError) return error;
  const code = (error as { code?: unknown } | null)?.code;
  const message = error instanceof Error ? error.message : '';
  if (typeof code === 'string' && UNREACHABLE.has(code)) return unavailable(code);
  if (/Connection terminated|connection timeout|timeout exceeded when trying to connect|Client has encountered a connection error/i.test(message)) {
    return unavailable('connection lost');
  }
  if (typeof code !== 'string' || !/^[0-9A-Z]{5}$/.test(code)) return error;
  const kind = code.slice(0, 2);
  // 08: connection exception; 57P01-57P03: the server is shutting down or starting; 53300: too many connections.
  if (kind === '08' || code === '57P01' || code === '57P02' || code === '57P03' || code === '53300') return unavailable(code);
  if (code === '53100') return new FieldgapError('storage-full', `the disk holding the library's database is full; nothing was saved (${code})`, LIBRARY_PATH);
  if (code === '25006' || code === '42501') {
    return new FieldgapError('storage-read-only', `the library's database refuses this change (read-only or not permitted, ${code})`, LIBRARY_PATH);
  }
  // 40001 serialization failure, 40P01 deadlock, 55P03 lock not available, 57014 statement timeout.
  if (code === '40001' || code === '40P01' || code === '55P03' || code === '57014') {
    return new FieldgapError('timeout', `the library was busy with other writers; try again (${code})`, LIBRARY_PATH);
  }
  // XX: internal error (XX001 data corrupted, XX002 index corrupted); 42P01: a table is missing.
  if (kind === 'XX' || code === '42P01') return new FieldgapError('storage-broken', `the library's database is damaged or not a fieldgap library (${code})`, LIBRARY_PATH);
  if (code === '3D000' || code === '28000' || code === '28P01') {
    return new FieldgapError('storage-unavailable', `the library's database refused the connection: no such database or wrong credentials (${code})`, LIBRARY_PATH);
  }
  return new FieldgapError('internal', `library storage failed (${code})`, LIBRARY_PATH);
}

function unavailable(detail: string): FieldgapError {
  return new FieldgapError('storage-unavailable', `the library's database cannot be reached; try again when it is back (${detail})`, LIBRARY_PATH);
}
