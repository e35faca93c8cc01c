/**
 * Tokens verified recently, kept so a database outage does not stop the
 * stateless part of the service. With users, a token is checked against the
 * users table on every request; while the database is away that check cannot
 * be made, and without this memory every request (fit, levels, diagram,
 * predict) would answer 503 although none of them needs the database.
 *
 * Why "stale if error" and not a plain cache: the database is still asked on
 * every request while it answers, so removing a user (or a token) takes
 * effect at once on every instance whose database is reachable. Only when
 * the lookup fails with storage-unavailable is the remembered answer used,
 * and only if it was verified at most `ttlMs` ago. A user removed just
 * before an outage may thus keep using this instance's stateless routes for
 * at most `ttlMs` after their last verified request; library routes answer
 * 503 during the outage anyway, so no record is reachable that way.
 *
 * Bounded in size and time: at most `maxEntries` tokens (the least recently
 * verified dropped first), each for `ttlMs`. Kept by SHA-256 of the token,
 * never the token itself. One memory per process: instances do not share
 * it (each has verified its own requests).
 */
import { createHash } from 'node:crypto';
import { isFieldgapError } from '../../src/errors.js';
import type { Identity, IdentityResolver } from './auth.js';

export interface VerifiedTokenOptions {
  /** How long a verified token is trusted during an outage, ms. Default 10 minutes. */
  ttlMs?: number;
  /** Most tokens remembered. Default 1000. */
  maxEntries?: number;
  /** The clock, ms (tests give their own). Default Date.now. */
  now?: () => number;
}

export const VERIFIED_TOKEN_TTL_MS = 10 * 60_000;
export const VERIFIED_TOKEN_MAX = 1000;

/** `resolve`, answering from its recent verified answers when the database is unavailable. */
export function rememberVerifiedTokens(resolve: IdentityResolver, options: VerifiedTokenOptions = {}): IdentityResolver & { readonly size: () => number } {
  const { ttlMs = VERIFIED_TOKEN_TTL_MS, maxEntries = VERIFIED_TOKEN_MAX, now = Date.now } = options;
  // A Map keeps insertion order: re-inserting on each verification makes the first key the least recently verified.
  const verified = new Map<string, { identity: Identity; at: number }>();
  const resolver = async (token: string): Promise<Identity | undefined> => {
    const key = createHash('sha256').update(token, 'utf8').digest('hex');
    let identity: Identity | undefined;
    try {
      identity = await resolve(token);
    } catch (error) {
      if (!isFieldgapError(error) || error.code !== 'storage-unavailable') throw error;
      const known = verified.get(key);
      if (known !== undefined && now() - known.at <= ttlMs) return known.identity;
      verified.delete(key);
      throw error;
    }
    verified.delete(key);
    if (identity !== undefined) {
      verified.set(key, { identity, at: now() });
      while (verified.size > maxEntries) verified.delete(verified.keys().next().value!);
    }
    return identity;
  };
  return Object.assign(resolver, { size: () => verified.size });
}
