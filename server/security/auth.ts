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
import type { RecordScope, UserStore } from '../../src/library/users.js';
import { rememberVerifiedTokens, type VerifiedTokenOptions } from './verified-tokens.js';

/** Who sent a request. */
export interface Identity {
  /** Stable name of the holder: "local" for loopback without a token, "token" for the single service token, else the user's name. */
  id: string;
  /** For a user of the library's users table: their group and whether they administer; absent: sees every record (single-user modes). */
  scope?: RecordScope;
}

/**
 * Maps a presented token to its holder, or undefined for a token nobody
 * holds. May answer later (a lookup in the library); rejects only when it
 * cannot tell (the database unreachable: a 503, never a 401).
 */
export type IdentityResolver = (token: string) => Identity | undefined | Promise<Identity | undefined>;

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

/**
 * The resolver of a service with users (fieldgap users): a token names the
 * user who holds it, with their group. While no user is defined, the single
 * service token (when given) is accepted instead, so a service started before
 * its users keeps working; once users exist, only their tokens are.
 */
export function usersResolver(users: Pick<UserStore, 'resolveToken' | 'count'>, single?: IdentityResolver, remember?: VerifiedTokenOptions): IdentityResolver {
  // Through a database outage, tokens verified shortly before keep the stateless routes open (verified-tokens.ts says why and how long).
  return rememberVerifiedTokens(async (token) => {
    const scope = await users.resolveToken(token);
    if (scope !== undefined) return { id: scope.user, scope };
    if (single === undefined || (await users.count()) > 0) return undefined;
    return single(token);
  }, remember);
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
    'Authorization: this fieldgap service needs an access token: your user\'s token (fieldgap users token NAME) or, while it has no users, the one it printed at start; send "Authorization: Bearer TOKEN", or open …/?token=TOKEN once in the browser',
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
  return async (req: Request, res: Response, next: NextFunction): Promise<void> => {
    if (resolve === undefined) {
      res.locals['identity'] = LOCAL_IDENTITY;
      return next();
    }
    try {
      await check(resolve, req, res, next);
    } catch (error) {
      next(error);
    }
  };
}

async function check(resolve: IdentityResolver, req: Request, res: Response, next: NextFunction): Promise<void> {
  const inQuery = req.method === 'GET' && !req.path.startsWith('/api/') ? req.query['token'] : undefined;
  if (typeof inQuery === 'string' && (await resolve(inQuery)) !== undefined) {
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
  const identity = token === undefined ? undefined : await resolve(token);
  if (identity === undefined) {
    res.set('WWW-Authenticate', 'Bearer realm="fieldgap"');
    return next(unauthorized());
  }
  res.locals['identity'] = identity;
  next();
}
