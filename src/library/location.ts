import { invalidArgument } from '../errors.js';
import { resolveDataDir } from './data-dir.js';
import type { LibraryLocation } from './library.js';

export interface LocationSources {
  /** `--data DIR`, if given. */
  dataFlag?: string | undefined;
  /** `--database URL`, if given. */
  databaseFlag?: string | undefined;
  /** The process environment: FIELDGAP_DATABASE_URL and FIELDGAP_DATA are read. */
  env?: Record<string, string | undefined>;
  cwd: string;
}

/**
 * Where the library lives, the same rule for the CLI and the service:
 * `--database postgres://…`, else `$FIELDGAP_DATABASE_URL` (a PostgreSQL
 * library), else the data folder of resolveDataDir (SQLite, the default).
 * `--database` and `--data` together are refused: one library at a time.
 */
export function resolveLibraryLocation({ dataFlag, databaseFlag, env = {}, cwd }: LocationSources): LibraryLocation {
  if (databaseFlag !== undefined && dataFlag !== undefined) {
    throw invalidArgument('--database', '--database and --data name two libraries: give one');
  }
  const fromEnv = env['FIELDGAP_DATABASE_URL'];
  const url = databaseFlag ?? (dataFlag === undefined && fromEnv !== undefined && fromEnv.trim() !== '' ? fromEnv : undefined);
  if (url !== undefined) return { engine: 'postgres', url: postgresUrl(url, databaseFlag !== undefined ? '--database' : 'FIELDGAP_DATABASE_URL') };
  return { engine: 'sqlite', dataDir: resolveDataDir({ flag: dataFlag, env, cwd }) };
}

/** A postgres:// or postgresql:// URL, or a clear error naming where it came from (without echoing a password). */
function postgresUrl(text: string, where: string): string {
  const trimmed = text.trim();
  let parsed: URL;
  try {
    parsed = new URL(trimmed);
  } catch {
    throw invalidArgument(where, `${where}: expected a URL such as postgres://user@host:5432/fieldgap`);
  }
  if (parsed.protocol !== 'postgres:' && parsed.protocol !== 'postgresql:') {
    throw invalidArgument(where, `${where}: expected a postgres:// URL, got a ${parsed.protocol.replace(/:$/, '')} URL`);
  }
  return trimmed;
}

/** The location as a user may see it: the folder, or the database URL without its password. */
export function describeLocation(location: LibraryLocation): string {
  if (location.engine === 'sqlite') return location.dataDir;
  const url = new URL(location.url);
  if (url.password) url.password = '***';
  return url.toString();
}
