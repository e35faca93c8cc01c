import { createHash, randomBytes } from 'node:crypto';
import { FieldgapError, invalidArgument } from '../errors.js';
import type { SqlEngine } from './engine.js';

/**
 * Users and groups of a shared library (schema step 4). A user belongs to
 * one group and sees that group's records; an administrator sees all. Each
 * user holds any number of access tokens; the library keeps only their
 * SHA-256 (lower-case hex), so the token is shown once, when made, and a
 * copy of the database lets no one in.
 */

export interface UserInfo {
  name: string;
  group: string;
  admin: boolean;
  /** ISO 8601, UTC. */
  createdAt: string;
  /** How many tokens the user holds. */
  tokens: number;
}

/** Whose records a request may see and in whose name it adds: what the service's identity becomes. */
export interface RecordScope {
  user: string;
  group: string;
  /** Sees and changes every record (adds in its own group). */
  admin: boolean;
}

export interface UserStore {
  /** Adds a user; 'invalid-argument' when the name is taken. */
  add(name: string, group: string, admin?: boolean): Promise<UserInfo>;
  /** Every user, by name. */
  list(): Promise<UserInfo[]>;
  /** A new token for the user (the only time it is seen); older tokens stay valid. */
  newToken(name: string): Promise<string>;
  /** Removes the user and their tokens; their records stay with their group. */
  remove(name: string): Promise<void>;
  /** Whose token this is, or undefined for a token nobody holds. */
  resolveToken(token: string): Promise<RecordScope | undefined>;
  /** How many users are defined (0: the single-user or single-token mode). */
  count(): Promise<number>;
}

const NAME = /^[A-Za-z0-9][A-Za-z0-9._@-]{0,63}$/;

/** Checks a user or group name: 1–64 of letters, digits, ".", "_", "@", "-", starting with a letter or digit. */
export function checkName(what: 'user' | 'group', name: unknown): string {
  if (typeof name !== 'string' || !NAME.test(name)) {
    throw invalidArgument(what, `${what}: expected 1 to 64 letters, digits, ".", "_", "@" or "-" (starting with a letter or digit), got ${JSON.stringify(name)}`);
  }
  return name;
}

/** The stored form of a token: lower-case hex SHA-256 of its UTF-8 text. */
export function tokenHash(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

interface UserRow {
  name: string;
  group_name: string;
  is_admin: number | boolean;
  created_at: string;
  tokens: number | string;
}

function userFromRow(row: UserRow): UserInfo {
  return { name: row.name, group: row.group_name, admin: Boolean(row.is_admin), createdAt: row.created_at, tokens: Number(row.tokens) };
}

function noSuchUser(name: string): FieldgapError {
  return new FieldgapError('not-found', `no user "${name}" in the library`, 'user');
}

export function userStoreOver(engine: SqlEngine): UserStore {
  const admin = (flag: boolean) => (engine.dialect === 'postgres' ? flag : flag ? 1 : 0);
  const listSql = `SELECT u.name, u.group_name, u.is_admin, u.created_at,
    (SELECT CAST(count(*) AS INTEGER) FROM tokens t WHERE t.user_name = u.name) AS tokens FROM users u`;

  return {
    add: async (name, group, isAdmin = false) => {
      checkName('user', name);
      checkName('group', group);
      const now = new Date().toISOString();
      await engine.write(async (tx) => {
        if (await tx.get('SELECT name FROM users WHERE name = ?', [name])) {
          throw invalidArgument('user', `user: a user "${name}" already exists`);
        }
        await tx.run('INSERT INTO users (name, group_name, is_admin, created_at) VALUES (?, ?, ?, ?)', [name, group, admin(isAdmin), now]);
      });
      return { name, group, admin: isAdmin, createdAt: now, tokens: 0 };
    },

    list: () => engine.read(async (tx) => (await tx.all<UserRow>(`${listSql} ORDER BY u.name`)).map(userFromRow)),

    newToken: async (name) => {
      checkName('user', name);
      const token = randomBytes(32).toString('base64url');
      await engine.write(async (tx) => {
        if (!(await tx.get('SELECT name FROM users WHERE name = ?', [name]))) throw noSuchUser(name);
        await tx.run('INSERT INTO tokens (sha256, user_name, created_at) VALUES (?, ?, ?)', [tokenHash(token), name, new Date().toISOString()]);
      });
      return token;
    },

    remove: async (name) => {
      checkName('user', name);
      await engine.write(async (tx) => {
        // Explicit: SQLite cascades only with foreign_keys on, and this must not depend on it.
        await tx.run('DELETE FROM tokens WHERE user_name = ?', [name]);
        const gone = await tx.all('DELETE FROM users WHERE name = ? RETURNING name', [name]);
        if (gone.length === 0) throw noSuchUser(name);
      });
    },

    resolveToken: async (token) => {
      const row = await engine.read((tx) =>
        tx.get<{ name: string; group_name: string; is_admin: number | boolean }>(
          'SELECT u.name, u.group_name, u.is_admin FROM tokens t JOIN users u ON u.name = t.user_name WHERE t.sha256 = ?',
          [tokenHash(token)],
        ),
      );
      return row && { user: row.name, group: row.group_name, admin: Boolean(row.is_admin) };
    },

    count: () => engine.read(async (tx) => Number((await tx.get<{ n: number }>('SELECT CAST(count(*) AS INTEGER) AS n FROM users'))!.n)),
  };
}
