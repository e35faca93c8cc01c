import { expect, it } from 'vitest';
import { usersResolver } from '../../server/security/auth.js';
import { rememberVerifiedTokens } from '../../server/security/verified-tokens.js';
import { FieldgapError } from '../../src/errors.js';
import type { RecordScope } from '../../src/library/users.js';

/**
 * Issue 17 (audit): with users, every token was checked against the database,
 * so an outage answered 503 even on routes that need no database. Tokens
 * verified shortly before the outage are now remembered (server/security/
 * verified-tokens.ts); these tests pin down the bounds: time, size, removal.
 * A stand-in users table that can be taken down; the clock is the test's.
 */

function standInUsers() {
  const tokens = new Map<string, RecordScope>([
    ['alice-token-0123456789', { user: 'alice', group: 'labA', admin: false }],
    ['bob-token-0123456789ab', { user: 'bob', group: 'labB', admin: false }],
  ]);
  const state = { down: false, lookups: 0 };
  const unavailable = () => new FieldgapError('storage-unavailable', 'the library database cannot be reached; try again shortly', 'library');
  return {
    tokens, state,
    store: {
      resolveToken: async (token: string) => {
        state.lookups++;
        if (state.down) throw unavailable();
        return tokens.get(token);
      },
      count: async () => {
        if (state.down) throw unavailable();
        return tokens.size;
      },
    },
  };
}

it('a token verified before an outage still names its user during it, for at most the time allowed', async () => {
  const users = standInUsers();
  let now = 1_000_000;
  const resolve = usersResolver(users.store, undefined, { ttlMs: 60_000, now: () => now });
  expect(await resolve('alice-token-0123456789')).toMatchObject({ id: 'alice', scope: { group: 'labA' } });
  users.state.down = true;
  now += 59_000;
  expect(await resolve('alice-token-0123456789')).toMatchObject({ id: 'alice', scope: { group: 'labA' } });
  // Never verified (bob), or verified too long ago: the outage shows, as 503's storage-unavailable, never as a 401.
  await expect(Promise.resolve(resolve('bob-token-0123456789ab'))).rejects.toMatchObject({ code: 'storage-unavailable' });
  now += 2_000;
  await expect(Promise.resolve(resolve('alice-token-0123456789'))).rejects.toMatchObject({ code: 'storage-unavailable' });
});

it('while the database answers it is asked every time: a removed user is refused at once', async () => {
  const users = standInUsers();
  const resolve = usersResolver(users.store, undefined, { ttlMs: 60_000, now: () => 0 });
  expect(await resolve('alice-token-0123456789')).toBeDefined();
  users.tokens.delete('alice-token-0123456789');
  expect(await resolve('alice-token-0123456789')).toBeUndefined();
  expect(users.state.lookups).toBe(2);
  // And forgotten: an outage right after the removal does not bring the user back.
  users.state.down = true;
  await expect(Promise.resolve(resolve('alice-token-0123456789'))).rejects.toMatchObject({ code: 'storage-unavailable' });
});

it('remembers at most maxEntries tokens, dropping the least recently verified', async () => {
  const known = new Set(Array.from({ length: 50 }, (_, i) => `token-number-${i}`));
  let down = false;
  const resolve = rememberVerifiedTokens(async (token) => {
    if (down) throw new FieldgapError('storage-unavailable', 'away', 'library');
    return known.has(token) ? { id: token } : undefined;
  }, { maxEntries: 10, now: () => 0 });
  for (const token of known) await resolve(token);
  expect(resolve.size()).toBe(10);
  down = true;
  expect(await resolve('token-number-49')).toEqual({ id: 'token-number-49' });
  await expect(resolve('token-number-0')).rejects.toMatchObject({ code: 'storage-unavailable' });
});

it('other failures are not hidden by the memory', async () => {
  let fail = false;
  const resolve = rememberVerifiedTokens(async () => {
    if (fail) throw new FieldgapError('storage-broken', 'the library is damaged', 'library');
    return { id: 'x' };
  });
  await resolve('some-token-0123456789');
  fail = true;
  await expect(resolve('some-token-0123456789')).rejects.toMatchObject({ code: 'storage-broken' });
});
