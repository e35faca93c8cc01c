/**
 * GET /levels, GET /diagram and POST /fit: validate at the edge, run in the
 * pool, answer the core's JSON as it is (what `levels --json`, `diagram --json`
 * and `fit --json` print). Energies in cm-1.
 */
import { Router, type Request, type Response } from 'express';
import { FieldgapError } from '../../src/errors.js';
import { clientGoneSignal } from '../abort.js';
import type { ComputePool } from '../pool.js';
import { toFitInput, toTetragonalFitInput } from '../fit-input.js';
import { diagramQuery, fitBody, levelsQuery } from '../schemas.js';
import { parseJsonBody, parseTextFields } from '../validate.js';

export interface ComputeRouterDeps {
  pool: ComputePool;
  /** Per-task time limit in ms. */
  timeoutMs: number;
}

/** 415 unless the body is JSON (express.json leaves other bodies unread). */
function requireJson(req: Request): void {
  if (!req.is('application/json')) {
    const given = req.headers['content-type'] ?? '(none)';
    throw new FieldgapError('unsupported-format', `Content-Type: expected application/json, got ${given}`, 'Content-Type');
  }
}

/**
 * Sends a task's answer asked for as JSON text (RunOptions.asJson) with the
 * headers and bytes res.json would give; a pool that answers with the
 * result itself (one passed in by a caller) goes through res.json.
 */
function sendJsonAnswer(res: Response, answer: unknown): void {
  if (typeof answer === 'string') res.set('Content-Type', 'application/json').send(answer);
  else res.json(answer);
}

export function createComputeRouter({ pool, timeoutMs }: ComputeRouterDeps): Router {
  const router = Router();

  router.get('/levels', async (req, res) => {
    const q = parseTextFields(levelsQuery, req.query);
    const input = { d: q.d, geometry: q.geometry, dq: q.dq, b: q.b, c: q.c ?? q.cOverB! * q.b, ds: q.ds, dt: q.dt, zeta: q.zeta };
    sendJsonAnswer(res, await pool.run({ kind: 'levels', input }, { timeoutMs, signal: clientGoneSignal(res), asJson: true }));
  });

  router.get('/diagram', async (req, res) => {
    const input = parseTextFields(diagramQuery, req.query);
    sendJsonAnswer(res, await pool.run({ kind: 'diagram', input }, { timeoutMs, signal: clientGoneSignal(res), asJson: true }));
  });

  router.post('/fit', async (req, res) => {
    requireJson(req);
    const body = parseJsonBody(fitBody, req.body);
    // symmetry "tetragonal", zeta or freeZeta: the fit beyond the cubic field, as `fit --symmetry tetragonal --json`.
    const tetragonal = toTetragonalFitInput(body);
    const task = tetragonal === null ? { kind: 'fit' as const, input: toFitInput(body) } : { kind: 'fit-tetragonal' as const, input: tetragonal };
    sendJsonAnswer(res, await pool.run(task, { timeoutMs, signal: clientGoneSignal(res), asJson: true }));
  });

  return router;
}
