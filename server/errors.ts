/**
 * The service's side of errors: FieldgapError codes → HTTP status (the one
 * place that map lives), the JSON error body, and zod issues turned into a
 * FieldgapError that names the field. The core never sees any of this.
 */
import type { z } from 'zod';
import { FieldgapError, isFieldgapError, type ErrorCode } from '../src/errors.js';

/** The body of every error answer: `{ "error": { "code", "message", "path" } }`, with `problems` (each with its field) when a request has several bad fields. */
export interface ErrorBody {
  error: { code: ErrorCode; message: string; path: string; problems?: Array<{ path: string; message: string }> };
}

/**
 * The work could not start because every worker is busy and the queue is
 * full: answered 503 (try again later), whereas a task that ran out of its
 * time limit is answered 504.
 */
export class ServiceBusyError extends FieldgapError {
  constructor(message = 'the server is busy: too many analyses are waiting; try again shortly') {
    super('busy', message, '');
  }
}

/**
 * A bug inside a task (or a worker that died): carries the original message and stack for the log;
 * the client gets the generic internal-error answer.
 */
export class TaskBugError extends FieldgapError {
  readonly detail: string;
  constructor(message: string, detail: string) {
    super('internal', message, '');
    this.detail = detail;
  }
}

/**
 * The client closed the connection before the answer was ready: its task is
 * dropped from the queue (or stopped) and nothing is sent back.
 */
export class RequestAbortedError extends FieldgapError {
  constructor() {
    super('client-left', 'the client closed the connection before the answer was ready', '');
  }
}

const STATUS: Record<ErrorCode, number> = {
  'invalid-argument': 400,
  'parse-error': 400,
  'unsupported-format': 415,
  unexplained: 422,
  'not-found': 404,
  'too-large': 413,
  timeout: 504,
  busy: 503,
  // 499 "client closed request" (a common practice, not a standard status): logged, never sent.
  'client-left': 499,
  'permission-denied': 403,
  'storage-full': 507,
  'storage-read-only': 507,
  'storage-unavailable': 503,
  'storage-broken': 500,
  unauthorized: 401,
  forbidden: 403,
  internal: 500,
};

/** The HTTP status for an error the service answers with. */
export function httpStatusFor(error: FieldgapError): number {
  return STATUS[error.code];
}

/** The JSON body for a FieldgapError. */
export function errorBody(error: FieldgapError): ErrorBody {
  if (error instanceof RequestProblemsError) return { error: { ...error.toJSON(), problems: error.problems } };
  return { error: error.toJSON() };
}

/** The generic answer to a bug: the details go to the log, never to the client. */
export const INTERNAL_ERROR = new FieldgapError(
  'internal',
  'internal error: the server could not complete this request (the details are in its log)',
);

/** Any thrown value as the FieldgapError to answer with (bugs become INTERNAL_ERROR). */
export function toFieldgapError(error: unknown): FieldgapError {
  return isFieldgapError(error) ? error : INTERNAL_ERROR;
}

/** ["bands", 2, "position"] → "bands[2].position". */
export function formatIssuePath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const key of path) {
    if (typeof key === 'number') out += `[${key}]`;
    else out += out === '' ? String(key) : `.${String(key)}`;
  }
  return out;
}

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let value = input;
  for (const key of path) {
    if (value === null || typeof value !== 'object') return undefined;
    value = (value as Record<PropertyKey, unknown>)[key];
  }
  return value;
}

/**
 * A short description of a request value for an error message, without
 * walking into it (a value nested thousands of levels deep would overflow
 * JSON.stringify's stack): scalars as JSON, arrays and objects by size.
 */
export function describeValue(value: unknown): string {
  if (value === undefined) return 'nothing';
  if (Array.isArray(value)) return value.length === 0 ? 'an empty array' : `an array of ${value.length} item${value.length === 1 ? '' : 's'}`;
  if (value !== null && typeof value === 'object') return 'an object';
  if (typeof value === 'bigint' || typeof value === 'function' || typeof value === 'symbol') return typeof value;
  const text = JSON.stringify(value) ?? typeof value;
  return text.length > 40 ? `${text.slice(0, 37)}...` : text;
}

type Issue = z.core.$ZodIssue;

/**
 * The most telling issue of a failed union: the branch that got furthest
 * into the value (an object whose field is wrong beats "expected a number").
 */
function bestUnionIssue(issue: Issue & { code: 'invalid_union' }): Issue | undefined {
  let best: Issue | undefined;
  for (const branch of issue.errors) {
    const first = branch[0];
    if (first === undefined) continue;
    if (best === undefined || first.path.length > best.path.length) best = first;
  }
  if (best === undefined) return undefined;
  return { ...best, path: [...issue.path, ...best.path] };
}

/**
 * zod's default range message ("Too small: expected number to be >=0") in
 * words a user reads: "must be ≥ 0", "at most 10 items". A schema's own
 * message is kept (undefined here).
 */
function rangeWords(issue: Issue): string | undefined {
  if ((issue.code !== 'too_small' && issue.code !== 'too_big') || !/^Too (small|big): /.test(issue.message)) return undefined;
  const small = issue.code === 'too_small';
  const bound = String(small ? issue.minimum : issue.maximum);
  if (issue.origin === 'number' || issue.origin === 'bigint') {
    return `must be ${small ? (issue.inclusive ? '≥' : '>') : issue.inclusive ? '≤' : '<'} ${bound}`;
  }
  const unit = issue.origin === 'array' || issue.origin === 'set' ? 'item' : issue.origin === 'string' ? 'character' : undefined;
  return unit === undefined ? undefined : `must have ${small ? 'at least' : 'at most'} ${bound} ${unit}${bound === '1' ? '' : 's'}`;
}

/** One zod issue as a sentence that starts with the field it is about. */
function issueMessage(issue: Issue, input: unknown): { path: string; message: string } {
  if (issue.code === 'invalid_union') {
    const inner = bestUnionIssue(issue);
    if (inner) return issueMessage(inner, input);
  }
  if (issue.code === 'unrecognized_keys') {
    const where = formatIssuePath(issue.path);
    const key = issue.keys[0] ?? '';
    const path = where === '' ? key : `${where}.${key}`;
    const keys = issue.keys.map((k) => `"${k}"`).join(', ');
    return { path, message: `${path}: unknown field${issue.keys.length > 1 ? 's' : ''} ${keys}` };
  }
  const path = formatIssuePath(issue.path) || 'body';
  const got = valueAt(input, issue.path);
  let detail = issue.message.replace(/^Invalid input: /, '');
  if (issue.code === 'invalid_type') {
    detail = got === undefined ? `is required (${issue.expected})` : `expected ${issue.expected}, got ${describeValue(got)}`;
  } else if (issue.code === 'invalid_value' || issue.code === 'too_big' || issue.code === 'too_small') {
    detail = `${rangeWords(issue) ?? detail.replace(/^Invalid option: /, '')}, got ${describeValue(got)}`;
  }
  return { path, message: `${path}: ${detail}` };
}

/** One problem of a request with several: the field and the sentence about it (which starts with the field). */
export interface RequestProblem {
  path: string;
  message: string;
}

/**
 * A request with more than one bad field: the message lists every problem
 * ("conc: must be > 0, got -0.1; path: expected number, got \"x\""), `path`
 * is the first one's, and the error body carries them all as `problems`.
 */
export class RequestProblemsError extends FieldgapError {
  readonly problems: RequestProblem[];
  constructor(problems: RequestProblem[]) {
    super('invalid-argument', problems.map((p) => p.message).join('; '), problems[0]?.path ?? 'body');
    this.problems = problems;
  }
}

/** A failed zod parse as one FieldgapError('invalid-argument') naming the bad field, or every bad field when there are several. */
export function zodToFieldgapError(error: z.ZodError, input: unknown): FieldgapError {
  const problems: RequestProblem[] = [];
  for (const issue of error.issues) {
    const problem = issueMessage(issue, input);
    // zod may report one field twice (conc > 0 and conc ≥ 1e-7): the first, the plainer, is enough.
    if (!problems.some((p) => p.path === problem.path)) problems.push(problem);
  }
  const first = problems[0];
  if (first === undefined) return new FieldgapError('invalid-argument', 'invalid request', 'body');
  if (problems.length === 1) return new FieldgapError('invalid-argument', first.message, first.path);
  return new RequestProblemsError(problems);
}
