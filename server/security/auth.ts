/**
 * Access tokens. On loopback the service needs none (only this machine's
 * users reach it, and the Host and Origin guards keep web pages out); bound
 * beyond loopback, every request must carry a token, whatever its source
 * address: scripts as `Authorization: Bearer TOKEN`, the page as a cookie it
 * receives when the user opens the printed URL `…/?token=TOKEN` once.
 *
 * Who a token belongs to is decided by an IdentityResolver, so that a list
 * of users (or groups) can replace the single token without touching the
 * middleware. The identity is left in res.locals.identity for the routes.
 */
import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import { FieldgapError } from '../../src/errors.js';

/** Who sent a request. */
export interface Identity {
  /** Stable name of the holder: "local" for loopback without a token, "token" for the single service token. */
  id: string;
}

/** Maps a presented token to its holder, or undefined for a token nobody holds. Must not throw. */
export type IdentityResolver = (token: string) => Identity | undefined;

/** The identity of every request when no token is required (loopback). */
export const LOCAL_IDENTITY: Identity = Object.freeze({ id: 'local' });

/** The cookie that carries the token for the page. */
export const TOKEN_COOKIE = 'fieldgap_token';

/** A new random token: 32 bytes, base64url (43 characters). */
export function generateToken(): string {
  return randomBytes(32).toString('base64url');
}

function digest(text: string): Buffer {
  return createHash('sha256').update(text, 'utf8').digest();
}

/** The resolver of a service with one token; compared in constant time (over hashes, so the length leaks nothing). */
export function singleTokenResolver(token: string, identity: Identity = { id: 'token' }): IdentityResolver {
  if (token.length < 16) throw new FieldgapError('invalid-argument', '--token: an access token needs at least 16 characters', '--token');
  const expected = digest(token);
  return (presented) => (timingSafeEqual(digest(presented), expected) ? identity : undefined);
}

/** The value of one cookie from a Cookie header ("a=1; fieldgap_token=…"). */
export function cookieValue(header: string | undefined, name: string): string | undefined {
  if (header === undefined) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) {
      const value = part.slice(eq + 1).trim();
      try {
        return decodeURIComponent(value);
      } catch {
        return value;
      }
    }
  }
  return undefined;
}

/** The token a request presents: `Authorization: Bearer …`, else the page's cookie. */
export function presentedToken(req: Request): string | undefined {
  const authorization = req.headers.authorization;
  const bearer = authorization === undefined ? undefined : /^Bearer\s+(\S+)\s*$/i.exec(authorization)?.[1];
  return bearer ?? cookieValue(req.headers.cookie, TOKEN_COOKIE);
}

function unauthorized(): FieldgapError {
  return new FieldgapError(
    'unauthorized',
    'Authorization: this fieldgap service needs its access token: send "Authorization: Bearer TOKEN", or open the address it printed at start (…/?token=TOKEN) in the browser',
    'Authorization',
  );
}

/**
 * The middleware. Without a resolver every request is LOCAL_IDENTITY. With
 * one, a request needs a token the resolver knows (401 otherwise); a page
 * request `GET /?token=…` with a good token sets the cookie and redirects to
 * the same address without the token, so it leaves the address bar.
 */
export function authenticate(resolve: IdentityResolver | undefined) {
  return (req: Request, res: Response, next: NextFunction): void => {
    if (resolve === undefined) {
      res.locals['identity'] = LOCAL_IDENTITY;
      return next();
    }
    const inQuery = req.method === 'GET' && !req.path.startsWith('/api/') ? req.query['token'] : undefined;
    if (typeof inQuery === 'string' && resolve(inQuery) !== undefined) {
      res.cookie(TOKEN_COOKIE, inQuery, { httpOnly: true, sameSite: 'strict', path: '/' });
      const rest = new URLSearchParams(req.originalUrl.split('?')[1] ?? '');
      rest.delete('token');
      const query = rest.toString();
      // Only a path of this server: "//other.example/" would send the browser elsewhere.
      const path = /^\/(?![/\\])/.test(req.path) ? req.path : '/';
      res.redirect(303, `${path}${query === '' ? '' : `?${query}`}`);
      return;
    }
    const token = presentedToken(req);
    const identity = token === undefined ? undefined : resolve(token);
    if (identity === undefined) {
      res.set('WWW-Authenticate', 'Bearer realm="fieldgap"');
      return next(unauthorized());
    }
    res.locals['identity'] = identity;
    next();
  };
}
