import pg from 'pg';
import { FieldgapError } from '../errors.js';
import type { SqlEngine, SqlTx } from './engine.js';
import { migratePostgres } from './postgres-migrations.js';
import { translatePostgresError } from './postgres-errors.js';
import { LIBRARY_PATH } from './sqlite-errors.js';

export interface PostgresEngineOptions {
  /** Connections this process keeps at most; default 10. */
  maxConnections?: number;
  /** How long to wait for a connection (a free one, or the server's answer), ms; default 5000. */
  connectTimeoutMs?: number;
  /** How long a statement may wait on another writer's lock, ms; default 10000 (then 'timeout'). */
  lockTimeoutMs?: number;
}

/**
 * The shared engine: a PostgreSQL database (`postgres://user@host:port/db`),
 * for several service instances over one library. Nothing a request needs
 * is kept in the process: every read and write is a transaction in the
 * database, so any instance answers any request.
 *
 * Writes are READ COMMITTED transactions that lock the record row they
 * change (SELECT … FOR UPDATE), so concurrent refits of one record take turns
 * and revision numbers never collide; reads are REPEATABLE READ READ ONLY,
 * one snapshot per call. Durability is the server's (fsync and
 * synchronous_commit on, its defaults): COMMIT returns after the WAL is
 * flushed. A lost connection surfaces as 'storage-unavailable' (503) and the
 * pool connects afresh on the next call: the service recovers by itself.
 */
export async function openPostgresEngine(url: string, options: PostgresEngineOptions = {}): Promise<SqlEngine> {
  const { maxConnections = 10, connectTimeoutMs = 5000, lockTimeoutMs = 10_000 } = options;
  const pool = new pg.Pool({
    connectionString: url,
    max: maxConnections,
    connectionTimeoutMillis: connectTimeoutMs,
    idleTimeoutMillis: 30_000,
    application_name: 'fieldgap',
  });
  // An idle connection that the server drops emits 'error' on the pool; the next call reconnects.
  pool.on('error', () => undefined);
  // Each connection waits at most this long on a row lock before 55P03 ('timeout'). Set per
  // connection rather than as a startup option, which a URL's own ?options= would replace.
  pool.on('connect', (client) => {
    client.query(`SET lock_timeout = ${Math.round(lockTimeoutMs)}`).catch(() => undefined);
  });

  const connect = async (): Promise<pg.PoolClient> => {
    try {
      return await pool.connect();
    } catch (error) {
      throw translatePostgresError(error);
    }
  };

  try {
    const client = await connect();
    try {
      await migratePostgres(client);
    } finally {
      client.release();
    }
  } catch (error) {
    await pool.end().catch(() => undefined);
    throw translatePostgresError(error);
  }

  const transaction = async <T>(begin: string, fn: (tx: SqlTx) => Promise<T>): Promise<T> => {
    const client = await connect();
    let broken = false;
    const tx: SqlTx = {
      all: async <R>(sql: string, params: readonly unknown[] = []) => (await client.query(numbered(sql), [...params])).rows as R[],
      get: async <R>(sql: string, params: readonly unknown[] = []) => (await client.query(numbered(sql), [...params])).rows[0] as R | undefined,
      run: async (sql: string, params: readonly unknown[] = []) => {
        await client.query(numbered(sql), [...params]);
      },
    };
    try {
      await client.query(begin);
      const value = await fn(tx);
      await client.query('COMMIT');
      return value;
    } catch (error) {
      await client.query('ROLLBACK').catch(() => {
        broken = true;
      });
      throw translatePostgresError(error);
    } finally {
      // A connection that failed mid-transaction is dropped, not reused.
      client.release(broken);
    }
  };

  let closed = false;
  return {
    dialect: 'postgres',
    label: 'PostgreSQL library',
    readOnly: false,
    write: (fn) => transaction('BEGIN', fn),
    read: (fn) => transaction('BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY', fn),
    ping: async () => {
      if (closed) throw new FieldgapError('storage-unavailable', 'the library is closed', LIBRARY_PATH);
      const client = await connect();
      try {
        await client.query('SELECT 1');
      } catch (error) {
        client.release(true);
        throw translatePostgresError(error);
      }
      client.release();
    },
    close: async () => {
      if (closed) return;
      closed = true;
      await pool.end();
    },
  };
}

/** `?` placeholders, in order, as PostgreSQL's $1, $2, … (the library's SQL has no other `?`). */
export function numbered(sql: string): string {
  let n = 0;
  return sql.replace(/\?/g, () => `$${++n}`);
}
