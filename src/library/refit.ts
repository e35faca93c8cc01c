import { invalidArgument } from '../errors.js';
import type { FitResult } from '../fit/types.js';
import type { Library } from './library.js';
import type { AnalysisPatch, AnalysisRecord, StoredOptions, StoredResult } from './types.js';

/** The pipeline as the library's callers run it (in a worker pool for the service, inline for the CLI). */
export type AnalyzeStored = (content: Buffer, options: StoredOptions) => Promise<StoredResult>;

/** One thing a refit changed in the assignment. Energies in cm-1. */
export interface AssignmentChange {
  /** "band": a band's assigned transition; "spinState", "groundTerm", "cMode": the fit's. */
  what: 'band' | 'spinState' | 'groundTerm' | 'cMode';
  /** The observed band maximum, for "band". */
  observed?: number;
  /** Before and after ("4T2g(F)", "high-spin", ...); null where there was none (a band not assigned). */
  before: string | null;
  after: string | null;
}

/** A refitted record and what changed in its assignment (empty when nothing did). */
export type RefitOutcome = AnalysisRecord & { changes: AssignmentChange[] };

/**
 * How C is set: at most one of these holds, so a new one replaces the
 * others (a refit with --free-c, then one with --c-over-b 4.5, is back to a
 * fixed ratio). Given together in one refit they are kept as given, for
 * the pipeline to accept or refuse.
 */
const C_CHOICE = ['cOverB', 'c', 'freeC'] as const;

/**
 * Reruns the analysis of a stored record on its stored original with changed
 * options, and saves the outcome as a new revision (the history is kept; the
 * original bytes are never touched).
 *
 * `changes` are merged over the options of the current revision: a key
 * given replaces the old value, a key given as null is dropped (back to the
 * pipeline's default), keys not given are kept. Options that name one thing
 * replace each other: the ion and d; cOverB, c and freeC (C_CHOICE).
 * `fileName` is always the stored original's, so error positions name the
 * file the user knows. When the ion changes, the record's ion follows it.
 */
export async function refitAnalysis(
  library: Library,
  id: number,
  changes: Record<string, unknown>,
  analyze: AnalyzeStored,
): Promise<RefitOutcome> {
  if (typeof changes !== 'object' || changes === null || Array.isArray(changes)) {
    throw invalidArgument('options', 'options: expected an object of analysis options to change');
  }
  const record = await library.get(id);
  const original = await library.getOriginal(id);
  const options: Record<string, unknown> = { ...(record.options as Record<string, unknown>) };
  for (const [key, value] of Object.entries(changes)) {
    if (value === null) delete options[key];
    else if (value !== undefined) options[key] = value;
  }
  // The ion and the d-count name the same thing: a new one of either replaces both.
  if (changes['ion'] != null && changes['d'] === undefined) delete options['d'];
  if (changes['d'] != null && changes['ion'] === undefined) delete options['ion'];
  if (C_CHOICE.some((key) => changes[key] != null)) {
    for (const key of C_CHOICE) if (changes[key] === undefined) delete options[key];
  }
  options['fileName'] = original.fileName;
  const result = await analyze(original.bytes, options);
  const patch: AnalysisPatch = { options, result };
  if (typeof changes['ion'] === 'string') patch.ion = changes['ion'];
  const updated = await library.update(id, patch);
  return { ...updated, changes: assignmentChanges(record.result, updated.result) };
}

/**
 * What differs between two results' assignments: each observed band whose
 * assigned transition changed (matched by position within 1 cm-1, so a band
 * present in one fit only shows as gained or lost), then the spin state,
 * the ground term and how C was set. Tolerant of results without a fit.
 */
export function assignmentChanges(before: StoredResult, after: StoredResult): AssignmentChange[] {
  const a = fitOf(before);
  const b = fitOf(after);
  const out: AssignmentChange[] = [];
  const bandsBefore = assigned(a);
  const bandsAfter = assigned(b);
  const positions = [...bandsBefore.map((x) => x.observed), ...bandsAfter.map((x) => x.observed)].sort((x, y) => x - y);
  const seen: number[] = [];
  for (const observed of positions) {
    if (seen.some((p) => Math.abs(p - observed) <= 1)) continue;
    seen.push(observed);
    const was = bandsBefore.find((x) => Math.abs(x.observed - observed) <= 1)?.label ?? null;
    const now = bandsAfter.find((x) => Math.abs(x.observed - observed) <= 1)?.label ?? null;
    if (was !== now) out.push({ what: 'band', observed, before: was, after: now });
  }
  for (const what of ['spinState', 'groundTerm', 'cMode'] as const) {
    const was = text(a?.[what]);
    const now = text(b?.[what]);
    if (was !== now) out.push({ what, before: was, after: now });
  }
  return out;
}

/** The stored fit; a record saved by an older fieldgap may have none. */
function fitOf(result: StoredResult): Partial<FitResult> | null {
  return result.fit ?? null;
}

/** The assigned bands of a fit that have a position and a label (a label may be an older record's `term`). */
function assigned(fit: Partial<FitResult> | null): { observed: number; label: string }[] {
  return (fit?.assignments ?? []).flatMap((x) => {
    const label = text(x.label) ?? text(x.term);
    return typeof x.observed === 'number' && Number.isFinite(x.observed) && label !== null ? [{ observed: x.observed, label }] : [];
  });
}

function text(value: string | null | undefined): string | null {
  return typeof value === 'string' && value !== '' ? value : null;
}
