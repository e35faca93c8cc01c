/**
 * A spectrum's bytes to its analysis, or the error that stopped it as plain
 * data (a FieldgapError cannot cross a thread boundary as a class).
 */
import { analyzeSpectrum, type AnalyzeOptions, type AnalyzeResult } from '../analysis.js';
import { FieldgapError, isFieldgapError, type ErrorCode } from '../errors.js';

export interface AnalyzeContentTask {
  content: Uint8Array;
  options: AnalyzeOptions;
}

export type ContentOutcome = { result: AnalyzeResult } | { error: { code: ErrorCode; message: string; path: string } };

/** Never throws: an error becomes the outcome's `error`. */
export function analyzeContent({ content, options }: AnalyzeContentTask): ContentOutcome {
  try {
    return { result: analyzeSpectrum(content, options) };
  } catch (error) {
    const e = isFieldgapError(error) ? error : new FieldgapError('internal', error instanceof Error ? error.message : String(error));
    return { error: { code: e.code, message: e.message, path: e.path } };
  }
}

/** The outcome's result, or its error thrown again as a FieldgapError. */
export function resultOf(outcome: ContentOutcome): AnalyzeResult {
  if ('result' in outcome) return outcome.result;
  throw new FieldgapError(outcome.error.code, outcome.error.message, outcome.error.path);
}
