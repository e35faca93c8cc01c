import { invalidArgument } from '../../errors.js';
import { runSubcommand, type CliIo, type Command } from '../command.js';
import { parseCommandArgs } from '../options.js';
import { terminalSafe } from '../terminal-text.js';
import type { Library } from '../../library/library.js';
import { textTableLines } from '../../report/text-table.js';

/**
 * `fieldgap users`: the users and groups of a shared library, kept in the
 * library itself (SQLite or PostgreSQL), so every service instance over it
 * knows them at once. A service bound beyond loopback resolves tokens
 * against them; on loopback nothing changes (no login).
 *
 * Tokens are shown once, when made: the library keeps only their SHA-256.
 */

const DATA = { data: { type: 'string' }, database: { type: 'string' } } as const;

const USAGE = `Usage: fieldgap users SUBCOMMAND [options] [--data DIR | --database URL]

Users and groups of the results library. A service bound beyond loopback
(serve --host 0.0.0.0) asks every request for a user's token once users
exist; each user sees the records of their group, an administrator all.

  users add NAME --group G [--admin]
                     a new user in group G (names: letters, digits, . _ @ -)
  users list [--json]
                     every user, their group, role and number of tokens
  users token NAME   a new access token for NAME, printed once (the library
                     keeps only its SHA-256); earlier tokens stay valid
  users remove NAME  the user and their tokens (their records stay with the group)

Options:
  --data DIR        folder of the results library (default $FIELDGAP_DATA, else ./fieldgap-data)
  --database URL    a PostgreSQL results library (default $FIELDGAP_DATABASE_URL)
`;

type Handler = (argv: string[], io: CliIo) => Promise<number>;

async function withLibrary<T>(flags: { data?: string | undefined; database?: string | undefined }, io: CliIo, fn: (library: Library) => Promise<T>): Promise<T> {
  const [{ resolveLibraryLocation }, { openLibraryAt }] = await Promise.all([import('../../library/location.js'), import('../../library/library.js')]);
  const library = await openLibraryAt(resolveLibraryLocation({ dataFlag: flags.data, databaseFlag: flags.database, env: io.env, cwd: io.cwd }));
  try {
    return await fn(library);
  } finally {
    await library.close();
  }
}

function oneName(positionals: string[], sub: string): string {
  if (positionals.length !== 1) throw invalidArgument('NAME', `users ${sub}: expected one user NAME, got ${positionals.length}`);
  return positionals[0]!;
}

const SUBCOMMANDS: Record<string, Handler> = {
  add: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { group: { type: 'string' }, admin: { type: 'boolean' }, ...DATA }, true);
    const name = oneName(positionals, 'add');
    if (values.group === undefined) throw invalidArgument('--group', 'users add: --group G is required (the group whose records the user sees)');
    const user = await withLibrary(values, io, (library) => library.users.add(name, values.group!, values.admin ?? false));
    io.stdout(`added user ${user.name} in group ${user.group}${user.admin ? ' (administrator)' : ''}; make a token with: fieldgap users token ${user.name}\n`);
    return 0;
  },
  list: async (argv, io) => {
    const { values } = parseCommandArgs(argv, { json: { type: 'boolean' }, ...DATA });
    const users = await withLibrary(values, io, (library) => library.users.list());
    if (values.json) {
      io.stdout(`${JSON.stringify(users, null, 2)}\n`);
      return 0;
    }
    if (users.length === 0) {
      io.stdout('no users: the service runs in single-user mode (loopback) or with its one access token\n');
      return 0;
    }
    const rows = [['NAME', 'GROUP', 'ROLE', 'TOKENS', 'CREATED'], ...users.map((u) => [u.name, u.group, u.admin ? 'admin' : 'user', String(u.tokens), u.createdAt])];
    for (const line of textTableLines(rows)) io.stdout(`${terminalSafe(line)}\n`);
    return 0;
  },
  token: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...DATA }, true);
    const name = oneName(positionals, 'token');
    const token = await withLibrary(values, io, (library) => library.users.newToken(name));
    io.stdout(`${token}\n`);
    io.stderr(`fieldgap: a new token for ${name}; it is shown only now (send it as "Authorization: Bearer TOKEN")\n`);
    return 0;
  },
  remove: async (argv, io) => {
    const { values, positionals } = parseCommandArgs(argv, { ...DATA }, true);
    const name = oneName(positionals, 'remove');
    await withLibrary(values, io, (library) => library.users.remove(name));
    io.stdout(`removed user ${name} and their tokens\n`);
    return 0;
  },
};

export const usersCommand: Command = {
  name: 'users',
  summary: "manage the library's users, groups and access tokens (for a service beyond loopback)",
  usage: USAGE,
  async run(argv, io) {
    return runSubcommand('users', SUBCOMMANDS, argv, io);
  },
};
