/**
 * A request that declares a body larger than any route accepts is answered
 * 413 at once, before a byte of it is read, and its connection is closed so
 * the rest is never received (a slow sender could otherwise hold the
 * connection until the server's request timeout).
 */
import type { NextFunction, Request, Response } from 'express';
import { FieldgapError } from '../../src/errors.js';

function describeBytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MiB` : `${bytes} bytes`;
}

/** The middleware: 413 for a Content-Length over maxBytes. */
export function declaredLengthGuard(maxBytes: number) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const header = req.headers['content-length'];
    const declared = header === undefined ? 0 : Number(header);
    if (Number.isFinite(declared) && declared <= maxBytes) return next();
    res.set('Connection', 'close');
    next(new FieldgapError('too-large', `Content-Length: the request body (${header}) is larger than the limit of ${describeBytes(maxBytes)}`, 'Content-Length'));
  };
}
