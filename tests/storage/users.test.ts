import { createHash } from 'node:crypto';
import { expect, it } from 'vitest';
import { SCHEMA_VERSION } from '../../src/library/migrations.js';
import { forEachEngine, libraryPerTest } from './helpers/engines.js';
import { handBuiltRecord } from './helpers/records.js';
import { runCliCaptured } from '../helpers/cli-run.js';

/**
 * Users and groups in the library (schema step 4) and `fieldgap users`, on
 * both engines. The records are hand-built (numbers made up,
 * helpers/records.ts): these tests check who sees what.
 */

forEachEngine('users and groups in the library', (engine) => {
  const fresh = libraryPerTest(engine, { open: false });

  function cli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
    return runCliCaptured(['users', ...args], { cwd: fresh.where.dir, env: { ...fresh.where.env } });
  }

  it('users add | list | token | remove manage the users; the token is printed once and stored as its SHA-256', async () => {
    expect((await cli('add', 'alice', '--group', 'labA')).code).toBe(0);
    expect((await cli('add', 'root', '--group', 'ops', '--admin')).code).toBe(0);
    const token = await cli('token', 'alice');
    expect(token.code).toBe(0);
    const text = token.out.trim();
    expect(text).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(await fresh.where.scalar(`SELECT count(*) FROM tokens WHERE sha256 = '${createHash('sha256').update(text).digest('hex')}'`)).toBe(1);
    const listed = JSON.parse((await cli('list', '--json')).out) as { name: string; group: string; admin: boolean; tokens: number }[];
    expect(listed.map(({ name, group, admin, tokens }) => ({ name, group, admin, tokens }))).toEqual([
      { name: 'alice', group: 'labA', admin: false, tokens: 1 },
      { name: 'root', group: 'ops', admin: true, tokens: 0 },
    ]);
    const library = await fresh.where.open();
    try {
      expect(await library.users.resolveToken(text)).toEqual({ user: 'alice', group: 'labA', admin: false });
      expect((await cli('remove', 'alice')).code).toBe(0);
      expect(await library.users.resolveToken(text)).toBeUndefined();
      expect(await fresh.where.scalar('SELECT count(*) FROM tokens')).toBe(0);
    } finally {
      await library.close();
    }
  });

  it('refuses a taken name, a missing group, a bad name and an unknown user with a clear message (exit 2)', async () => {
    await cli('add', 'alice', '--group', 'labA');
    const again = await cli('add', 'alice', '--group', 'labB');
    expect(again.code).toBe(2);
    expect(again.err).toMatch(/"alice" already exists/);
    expect((await cli('add', 'bob')).err).toMatch(/--group/);
    expect((await cli('add', 'bad name', '--group', 'g')).err).toMatch(/user: expected/);
    expect((await cli('add', 'bob', '--group', "g'; drop")).err).toMatch(/group: expected/);
    expect((await cli('token', 'nobody')).err).toMatch(/no user "nobody"/);
    expect((await cli('remove', 'nobody')).code).toBe(2);
  });

  it('a scoped view sees its group only; an administrator every record; records keep owner and group', async () => {
    const library = await fresh.where.open();
    try {
      await library.users.add('alice', 'labA');
      const a = library.scoped({ user: 'alice', group: 'labA', admin: false });
      const b = library.scoped({ user: 'bob', group: 'labB', admin: false });
      const admin = library.scoped({ user: 'root', group: 'ops', admin: true });
      const mine = await a.add(handBuiltRecord({ sample: 'a1' }));
      const theirs = await b.add(handBuiltRecord({ sample: 'b1' }, 21_000));
      expect((await a.list()).analyses.map((r) => r.id)).toEqual([mine.id]);
      expect((await a.listAll()).map((r) => r.id)).toEqual([mine.id]);
      expect((await admin.list()).total).toBe(2);
      expect((await library.list()).total).toBe(2);
      for (const attempt of [() => a.get(theirs.id), () => a.getOriginal(theirs.id), () => a.update(theirs.id, { note: 'x' }), () => a.remove(theirs.id)]) {
        await expect(attempt()).rejects.toMatchObject({ code: 'not-found', path: 'id' });
      }
      expect((await library.get(theirs.id)).note).toBe(theirs.note);
      expect(await fresh.where.scalar(`SELECT count(*) FROM analyses WHERE id = ${theirs.id} AND owner = 'bob' AND group_name = 'labB'`)).toBe(1);
      // Closing a view leaves the library open.
      await a.close();
      expect((await library.list()).total).toBe(2);
    } finally {
      await library.close();
    }
  });

  it('two instances opening a fresh library at once apply the users step once', async () => {
    const [one, two] = await Promise.all([fresh.where.open(), fresh.where.open()]);
    try {
      // One after the other: two SQLite connections of one process would wait on each other's lock synchronously.
      await one.users.add('alice', 'labA');
      await two.users.add('bob', 'labB');
      expect((await one.users.list()).map((u) => u.name)).toEqual(['alice', 'bob']);
      const version = engine === 'sqlite' ? await fresh.where.scalar('PRAGMA user_version') : await fresh.where.scalar('SELECT version FROM fieldgap_schema');
      expect(version).toBe(SCHEMA_VERSION);
    } finally {
      await one.close();
      await two.close();
    }
  });
});
