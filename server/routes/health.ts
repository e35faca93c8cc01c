/**
 * GET /api/v1/health. On loopback (no tokens) and for a request with a good
 * token: the full answer (version, uptime, pool, library). Beyond loopback
 * without a token (a reverse proxy's or load balancer's health check), or
 * with a token that cannot be verified now (the database away): only
 * `{ status, library: { reachable } }`, which holds no record, no version
 * and no server detail; so a health check needs no user's token, and health
 * still answers while the users table cannot be read.
 *
 * Mounted before the token check (app.ts), so it decides who sees what here.
 */
import type { Request, Response } from 'express';
import { isFieldgapError } from '../../src/errors.js';
import type { Library } from '../../src/library/library.js';
import type { ComputePool } from '../pool.js';
import { presentedToken, type IdentityResolver } from '../security/auth.js';

export interface HealthOptions {
  version: string;
  startedAt: number;
  pool: ComputePool;
  library: Library;
  /** The service's token check; undefined on loopback (everyone gets the full answer). */
  resolve: IdentityResolver | undefined;
}

export function healthHandler({ version, startedAt, pool, library, resolve }: HealthOptions) {
  return async (req: Request, res: Response): Promise<void> => {
    const reachable = await library.ping().then(
      () => ({ reachable: true }),
      (error: unknown) => ({ reachable: false, message: isFieldgapError(error) ? error.message : 'the library could not be opened' }),
    );
    if (!(await mayReadAll(req, resolve))) {
      res.json({ status: 'ok', library: { reachable: reachable.reachable } });
      return;
    }
    res.json({
      status: 'ok', version, uptime: (Date.now() - startedAt) / 1000, pool: { mode: pool.mode, workersStopped: pool.workersStopped() },
      library: { engine: library.engine, readOnly: library.readOnly, ...reachable },
    });
  };
}

async function mayReadAll(req: Request, resolve: IdentityResolver | undefined): Promise<boolean> {
  if (resolve === undefined) return true;
  const token = presentedToken(req);
  if (token === undefined) return false;
  // A token that cannot be checked now (database away, not remembered) gets the short answer, not a 503: health must answer.
  return (await Promise.resolve(resolve(token)).catch(() => undefined)) !== undefined;
}
