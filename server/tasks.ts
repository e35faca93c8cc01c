/**
 * The computations the service runs, as plain data in and plain JSON out, so
 * the same dispatch serves a worker thread (worker.ts) and the in-process
 * mode used by tests. A FieldgapError cannot cross a thread boundary as a
 * class, so the outcome carries it as `{ code, message, path }` and
 * `rebuildError` makes it a FieldgapError again on the main side.
 */
import { analyzeSpectrum, listSpectra, type AnalyzeOptions } from '../src/analysis.js';
import { FieldgapError, isFieldgapError, type ErrorCode } from '../src/errors.js';
import { fitLigandField, type FitInput } from '../src/fit/index.js';
import { fitTetragonal, type TetragonalFitInput } from '../src/fit-tetragonal/index.js';
import {
  computeFieldDiagram, computeFieldLevels, computeLevels, diagramDocument, fieldDiagramDocument, fieldLevelsDocument, levelsDocument,
  type FieldDiagramAxis,
} from '../src/ligand-field/index.js';
import type { Geometry } from '../src/ligand-field/types.js';
import { TaskBugError } from './errors.js';

export interface LevelsTaskInput {
  d: number;
  geometry: Geometry;
  dq: number;
  b: number;
  c: number;
  /** Beyond the cubic field, cm-1: any of them present gives the field levels document. */
  ds?: number | undefined;
  dt?: number | undefined;
  zeta?: number | undefined;
}

export interface DiagramTaskInput {
  d: number;
  geometry: Geometry;
  cOverB: number;
  maxDqOverB: number;
  steps: number;
  /** Beyond the cubic field: any of these present gives the field diagram document. */
  axis?: FieldDiagramAxis | undefined;
  b?: number | undefined;
  dq?: number | undefined;
  ds?: number | undefined;
  dt?: number | undefined;
  zeta?: number | undefined;
}

export interface AnalyzeTaskInput {
  /** The uploaded file's bytes (a Buffer arrives in a worker as a Uint8Array). */
  content: Uint8Array | string;
  options: AnalyzeOptions;
}

export type Task =
  | { kind: 'levels'; input: LevelsTaskInput }
  | { kind: 'diagram'; input: DiagramTaskInput }
  | { kind: 'fit'; input: FitInput }
  | { kind: 'fit-tetragonal'; input: TetragonalFitInput }
  | { kind: 'analyze'; input: AnalyzeTaskInput }
  /** The spectra a file holds (column and name each): which records one upload becomes in the library. */
  | { kind: 'spectra'; input: { content: Uint8Array | string; options: Pick<AnalyzeOptions, 'fileName' | 'xUnit' | 'yUnit'> } };

export type TaskKind = Task['kind'];

/**
 * What piscina hands a worker: the task, and flags shared with this thread
 * (Int32Array over a SharedArrayBuffer). Element ABANDONED is 1 once nobody
 * waits for the answer, so a task whose client left while it was queued is
 * dropped by the worker at no cost instead of by stopping the thread.
 * Element STARTED (when present) is set to 1 and notified by the worker as
 * it starts the task, so the pool's time limit counts running time only,
 * not time spent in the queue.
 */
export interface WorkerRequest {
  task: Task;
  abandoned: Int32Array;
  /** Answer the result as its JSON text (see RunOptions.asJson in pool.ts). */
  json?: boolean;
}

/** Indices into WorkerRequest.abandoned. */
export const TASK_FLAG = { ABANDONED: 0, STARTED: 1 } as const;

/** The worker's side of the STARTED flag: set it and wake the pool, which arms the time limit then. */
export function markStarted(flags: Int32Array): void {
  if (flags.length <= TASK_FLAG.STARTED) return;
  Atomics.store(flags, TASK_FLAG.STARTED, 1);
  Atomics.notify(flags, TASK_FLAG.STARTED);
}

export interface SerializedError {
  code: ErrorCode;
  message: string;
  path: string;
}

/** What a task gives back: its JSON result, or the error it raised. */
export type Outcome =
  | { ok: true; value: unknown }
  | { ok: false; error: SerializedError; /** Stack of a bug, for the log only. */ detail?: string };

function runTask(task: Task): unknown {
  switch (task.kind) {
    case 'levels': {
      const { d, geometry, dq, b, c, ds, dt, zeta } = task.input;
      if (ds !== undefined || dt !== undefined || zeta !== undefined) {
        return fieldLevelsDocument(computeFieldLevels(d, geometry, { dq, b, c, ds, dt, zeta }));
      }
      // The document `fieldgap levels --json` prints: one shape for the CLI and the service.
      return levelsDocument(computeLevels(d, geometry, { dq, b, c }));
    }
    case 'diagram': {
      const { d, geometry, cOverB, maxDqOverB, steps, axis, b, dq, ds, dt, zeta } = task.input;
      if ([axis, b, dq, ds, dt, zeta].some((v) => v !== undefined)) {
        return fieldDiagramDocument(computeFieldDiagram(d, geometry, {
          axis: axis ?? 'dq', b: b ?? 1000, cOverB, dq: dq ?? 0, ds: ds ?? 0, dt: dt ?? 0, zeta: zeta ?? 0, maxDqOverB, steps,
        }));
      }
      return diagramDocument(d, geometry, { cOverB, maxDqOverB, steps });
    }
    case 'fit':
      return fitLigandField(task.input);
    case 'fit-tetragonal':
      return fitTetragonal(task.input);
    case 'analyze':
      return analyzeSpectrum(task.input.content, task.input.options);
    case 'spectra':
      return listSpectra(task.input.content, task.input.options);
    default: {
      const kind = (task as { kind?: unknown }).kind;
      throw new FieldgapError('internal', `unknown task kind ${JSON.stringify(kind)}`);
    }
  }
}

/**
 * Runs one task and never throws: errors become the outcome's `error`. With
 * `json`, the value is the result's JSON text (JSON.stringify, what
 * express's res.json would send).
 */
export function dispatchTask(task: Task, json = false): Outcome {
  try {
    const value = runTask(task);
    return { ok: true, value: json ? JSON.stringify(value) : value };
  } catch (error) {
    if (isFieldgapError(error)) return { ok: false, error: error.toJSON() };
    const message = error instanceof Error ? error.message : String(error);
    const detail = error instanceof Error && error.stack ? error.stack : message;
    return { ok: false, error: { code: 'internal', message, path: '' }, detail };
  }
}

/** The outcome's error as a FieldgapError on this side of the thread boundary. */
export function rebuildError(outcome: Outcome & { ok: false }): FieldgapError {
  const { code, message, path } = outcome.error;
  if (code === 'internal') return new TaskBugError(message, outcome.detail ?? message);
  return new FieldgapError(code, message, path);
}
