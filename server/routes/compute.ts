/**
 * GET /levels, GET /diagram and POST /fit: validate at the edge, run in the
 * pool, answer the core's JSON as it is (what `levels --json`, `diagram --json`
 * and `fit --json` print). Energies in cm-1.
 */
import { Router } from 'express';
import type { ComputePool } from '../pool.js';
import { diagramQuery, levelsQuery } from '../schemas.js';
import { parseTextFields } from '../validate.js';

export interface ComputeRouterDeps {
  pool: ComputePool;
  /** Per-task time limit in ms. */
  timeoutMs: number;
}

export function createComputeRouter({ pool, timeoutMs }: ComputeRouterDeps): Router {
  const router = Router();

  router.get('/levels', async (req, res) => {
    const q = parseTextFields(levelsQuery, req.query);
    const input = { d: q.d, geometry: q.geometry, dq: q.dq, b: q.b, c: q.c ?? q.cOverB! * q.b };
    res.json(await pool.run({ kind: 'levels', input }, { timeoutMs }));
  });

  router.get('/diagram', async (req, res) => {
    const input = parseTextFields(diagramQuery, req.query);
    res.json(await pool.run({ kind: 'diagram', input }, { timeoutMs }));
  });

  return router;
}
