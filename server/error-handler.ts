/**
 * The last two middlewares: unknown routes answer 404, and every error
 * becomes `{ "error": { code, message, path } }` with the status from
 * httpStatusFor. A bug is logged with its stack and answered with a generic
 * message: no stack trace or internal message ever reaches the client.
 */
import type { NextFunction, Request, Response } from 'express';
import type { Logger } from 'pino';
import { FieldgapError, isFieldgapError } from '../src/errors.js';
import { errorBody, httpStatusFor, INTERNAL_ERROR, RequestAbortedError, ServiceBusyError, TaskBugError } from './errors.js';

interface HttpishError {
  type?: unknown;
  status?: unknown;
  statusCode?: unknown;
  limit?: unknown;
  message?: unknown;
}

function describeLimit(limit: unknown): string {
  if (typeof limit !== 'number') return 'the limit';
  return limit >= 1024 * 1024 ? `the limit of ${Math.round((limit / (1024 * 1024)) * 10) / 10} MiB` : `the limit of ${limit} bytes`;
}

/** Errors from Express's body parsers and router, as FieldgapErrors (undefined for anything else). */
export function fromHttpError(error: unknown): FieldgapError | undefined {
  if (error === null || typeof error !== 'object') return undefined;
  const e = error as HttpishError;
  switch (e.type) {
    case 'entity.too.large':
      return new FieldgapError('too-large', `body: the request body is larger than ${describeLimit(e.limit)}`, 'body');
    case 'entity.parse.failed':
      return new FieldgapError('parse-error', `body: the JSON body could not be parsed (${String(e.message)})`, 'body');
    case 'encoding.unsupported':
      return new FieldgapError('unsupported-format', `Content-Encoding: ${String(e.message)}`, 'Content-Encoding');
    case 'charset.unsupported':
      return new FieldgapError('unsupported-format', `Content-Type: ${String(e.message)}`, 'Content-Type');
    case 'request.aborted':
      return new FieldgapError('invalid-argument', 'body: the request was aborted before its body arrived', 'body');
    default:
      break;
  }
  const status = typeof e.status === 'number' ? e.status : typeof e.statusCode === 'number' ? e.statusCode : 0;
  // Express's own 4xx errors (a path parameter that is not valid percent-encoding, ...) are about the request.
  if (status >= 400 && status < 500) {
    return new FieldgapError('invalid-argument', `request: ${String(e.message)}`, 'request');
  }
  return undefined;
}

/** 404 for any route nobody answered. */
export function notFoundHandler(req: Request, _res: Response, next: NextFunction): void {
  next(new FieldgapError('not-found', `no such endpoint: ${req.method} ${req.path} (see /api/v1/openapi.json)`, req.path));
}

export function errorHandler(logger: Logger) {
  return (error: unknown, req: Request, res: Response, next: NextFunction): void => {
    if (res.headersSent) {
      next(error);
      return;
    }
    // Nobody to answer: the request logger notes the abort.
    if (error instanceof RequestAbortedError || res.destroyed) return;
    const known = isFieldgapError(error) ? error : fromHttpError(error);
    let answer: FieldgapError;
    if (known === undefined || known.code === 'internal') {
      const detail = error instanceof TaskBugError ? error.detail : error instanceof Error ? error.stack : String(error);
      logger.error({ method: req.method, url: req.originalUrl, err: detail }, 'internal error');
      answer = INTERNAL_ERROR;
    } else {
      answer = known;
    }
    if (answer instanceof ServiceBusyError || answer.code === 'storage-unavailable') res.set('Retry-After', '5');
    // The operator must hear of a damaged, full or unreachable library; the client gets the message only.
    if (answer.code.startsWith('storage-') && answer.code !== 'storage-read-only') {
      logger.error({ method: req.method, url: req.originalUrl, code: answer.code }, answer.message);
    }
    // A body we will not read: close the connection rather than receive the rest of it.
    if (answer.code === 'too-large' && !req.complete) res.set('Connection', 'close');
    res.status(httpStatusFor(answer)).json(errorBody(answer));
  };
}
