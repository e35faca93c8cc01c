/**
 * The one error type of fieldgap's core.
 *
 * Every failure the user can cause (bad option, unparseable file, a band list
 * that no model explains) is a FieldgapError with a machine-readable `code`,
 * a `path` naming where the problem is (an option, a file and line, a JSON
 * field such as "bands[2].position"), and a message a chemist can act on.
 * The core knows nothing of HTTP: server/ maps codes to status codes, the CLI
 * maps every code to exit status 2.
 */
/** Every error code, once: the type, the service's status map and the OpenAPI enum derive from it. */
export const ERROR_CODES = [
  /** An option or field has a wrong type, range or value. */
  'invalid-argument',
  /** A file or text could not be read as a spectrum or formula. */
  'parse-error',
  /** The input is in a form fieldgap does not read. */
  'unsupported-format',
  /** Valid input that no ligand-field model explains (no assignment fits). */
  'unexplained',
  /** A stored record or file that does not exist. */
  'not-found',
  /** Input over a documented size limit. */
  'too-large',
  /** Work that exceeded its time limit. */
  'timeout',
  /** Work refused before it started because every worker is busy and the queue is full (HTTP 503); try again shortly. */
  'busy',
  /** The client closed the connection before the answer was ready (HTTP 499, never sent: nobody is listening). */
  'client-left',
  /** A file or folder fieldgap may not read or write (the operating system refused access). */
  'permission-denied',
  /** The results library cannot store more: its disk is full (HTTP 507). */
  'storage-full',
  /** The results library is read-only here (a read-only data folder or database user): reads work, writes do not (HTTP 507). */
  'storage-read-only',
  /** The results library's database cannot be reached now (HTTP 503); try again later. */
  'storage-unavailable',
  /** The results library is damaged or not a fieldgap library (HTTP 500). */
  'storage-broken',
  /** A request without a valid access token (the service off loopback). */
  'unauthorized',
  /** A request the service refuses whoever sends it (a foreign Host or Origin). */
  'forbidden',
  /** A bug: something fieldgap should never do. */
  'internal',
] as const;

export type ErrorCode = (typeof ERROR_CODES)[number];

export class FieldgapError extends Error {
  override readonly name = 'FieldgapError';
  readonly code: ErrorCode;
  /** Where the problem is: "--dq", "bands[1]", "spectrum.csv:14:2"; "" when nowhere in particular. */
  readonly path: string;

  constructor(code: ErrorCode, message: string, path = '') {
    super(message);
    this.code = code;
    this.path = path;
  }

  toJSON(): { code: ErrorCode; message: string; path: string } {
    return { code: this.code, message: this.message, path: this.path };
  }
}

export function isFieldgapError(value: unknown): value is FieldgapError {
  return value instanceof FieldgapError;
}

/** Shorthand for the most common failure: a bad option or field. */
export function invalidArgument(path: string, message: string): FieldgapError {
  return new FieldgapError('invalid-argument', message, path);
}
