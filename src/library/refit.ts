import { invalidArgument } from '../errors.js';
import type { Library } from './library.js';
import type { AnalysisPatch, AnalysisRecord, StoredOptions, StoredResult } from './types.js';

/** The pipeline as the library's callers run it (in a worker pool for the service, inline for the CLI). */
export type AnalyzeStored = (content: Buffer, options: StoredOptions) => Promise<StoredResult>;

/**
 * Reruns the analysis of a stored record on its stored original with changed
 * options, and saves the outcome as a new revision (the history is kept; the
 * original bytes are never touched).
 *
 * `changes` are merged over the options of the current revision: a key
 * given replaces the old value, a key given as null is dropped (back to the
 * pipeline's default), keys not given are kept. `fileName` is always the
 * stored original's, so error positions name the file the user knows.
 * When the ion changes, the record's ion follows it.
 */
export async function refitAnalysis(
  library: Library,
  id: number,
  changes: Record<string, unknown>,
  analyze: AnalyzeStored,
): Promise<AnalysisRecord> {
  if (typeof changes !== 'object' || changes === null || Array.isArray(changes)) {
    throw invalidArgument('options', 'options: expected an object of analysis options to change');
  }
  const record = library.get(id);
  const original = library.getOriginal(id);
  const options: Record<string, unknown> = { ...(record.options as Record<string, unknown>) };
  for (const [key, value] of Object.entries(changes)) {
    if (value === null) delete options[key];
    else if (value !== undefined) options[key] = value;
  }
  // The ion and the d-count name the same thing: a new one of either replaces both.
  if (changes['ion'] != null && changes['d'] === undefined) delete options['d'];
  if (changes['d'] != null && changes['ion'] === undefined) delete options['ion'];
  options['fileName'] = original.fileName;
  const result = await analyze(original.bytes, options);
  const patch: AnalysisPatch = { options, result };
  if (typeof changes['ion'] === 'string') patch.ion = changes['ion'];
  return library.update(id, patch);
}
