import type { PoolClient } from 'pg';
import { LIBRARY_PATH } from './engine.js';
import { migrationRun, SCHEMA_VERSION } from './migrations.js';

/**
 * migrationRun (migrations.ts: the one list of steps and the one logic) on
 * a PostgreSQL database: the version in the one-row table `fieldgap_schema`,
 * each step in a transaction that first takes an advisory lock. The lock is
 * per schema (the key hashes its name), so libraries in separate schemas of
 * one database do not wait on each other.
 */

/** The schema version of the database `client` is connected to (0: none yet). */
export async function postgresSchemaVersion(client: PoolClient): Promise<number> {
  const table = await client.query<{ t: string | null }>(`SELECT to_regclass('fieldgap_schema')::text AS t`);
  if (table.rows[0]?.t == null) return 0;
  const row = await client.query<{ version: number }>('SELECT version FROM fieldgap_schema');
  return row.rows[0]?.version ?? 0;
}

/** Brings the database up to `target` (default: the latest); see migrationRun. */
export async function migratePostgres(client: PoolClient, target = SCHEMA_VERSION): Promise<void> {
  const run = migrationRun('postgres', LIBRARY_PATH, target);
  let open = false;
  try {
    let request = run.next();
    while (!request.done) {
      const r = request.value;
      let answer = 0;
      if (r.kind === 'version') {
        answer = await postgresSchemaVersion(client);
      } else if (r.kind === 'begin') {
        await client.query('BEGIN');
        open = true;
        await client.query(`SELECT pg_advisory_xact_lock(hashtext('fieldgap migrations ' || current_schema()))`);
        // Made under the lock, so two instances on a fresh database do not both create it.
        await client.query('CREATE TABLE IF NOT EXISTS fieldgap_schema (version integer NOT NULL)');
        answer = await postgresSchemaVersion(client);
      } else if (r.kind === 'apply') {
        await client.query(r.sql);
      } else if (r.kind === 'set-version') {
        await client.query('DELETE FROM fieldgap_schema');
        await client.query('INSERT INTO fieldgap_schema (version) VALUES ($1)', [r.version]);
      } else {
        await client.query('COMMIT');
        open = false;
      }
      request = run.next(answer);
    }
  } catch (error) {
    if (open) await client.query('ROLLBACK').catch(() => undefined);
    throw error;
  }
}
