/**
 * An analysis that found and classified the bands but has nothing for a
 * ligand-field fit: a d0 or d10 ion (no d–d transitions), or a spectrum whose
 * bands are all charge transfer, or none at all. It is a FieldgapError
 * ('unexplained', so the service and a batch row report it as before), and
 * carries what was found so the CLI can print the band table with the note
 * and exit with its own code (3, "analysis done, no fit").
 */
import { FieldgapError } from './errors.js';
import type { Band } from './spectrum/types.js';

/** What the analysis found before it stopped: as AnalyzeResult's parts. */
export interface AnalysisWithoutFit<S> {
  spectrum: S;
  bands: Band[];
  warnings: string[];
}

export class NoLigandFieldFit<S = unknown> extends FieldgapError {
  readonly found: AnalysisWithoutFit<S>;

  constructor(message: string, path: string, found: AnalysisWithoutFit<S>) {
    super('unexplained', message, path);
    this.found = found;
  }
}

export function isNoLigandFieldFit(value: unknown): value is NoLigandFieldFit {
  return value instanceof NoLigandFieldFit;
}
