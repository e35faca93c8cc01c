/**
 * The analysis options' names, once: the pipeline's name (AnalyzeOptions), the
 * command line's (--conc) and the REST field's (conc), with the old names kept
 * as aliases. The CLI parser, the REST fields and the page read their names
 * from here; the rule between them (one way to fix C) lives here too.
 */
import { invalidArgument } from './errors.js';

export interface OptionNames {
  /** Command-line option, without the dashes. */
  cli: string;
  /** REST query or form field (the page sends the same). */
  rest: string;
  /** Other spellings accepted for the same option. */
  aliases: readonly string[];
}

export const ANALYSIS_OPTION_NAMES = {
  ion: { cli: 'ion', rest: 'ion', aliases: [] },
  d: { cli: 'd', rest: 'd', aliases: [] },
  geometry: { cli: 'geometry', rest: 'geometry', aliases: [] },
  // The pipeline's name is concentration; the CLI and REST say conc (REST refuses `concentration`, a tested contract).
  concentration: { cli: 'conc', rest: 'conc', aliases: [] },
  pathLength: { cli: 'path', rest: 'path', aliases: [] },
  xUnit: { cli: 'x-unit', rest: 'xUnit', aliases: [] },
  column: { cli: 'column', rest: 'column', aliases: [] },
  cOverB: { cli: 'c-over-b', rest: 'cOverB', aliases: [] },
  c: { cli: 'c', rest: 'c', aliases: [] },
  freeC: { cli: 'free-c', rest: 'freeC', aliases: [] },
} as const satisfies Record<string, OptionNames>;

export type AnalysisOptionKey = keyof typeof ANALYSIS_OPTION_NAMES;

/**
 * C is fixed one way at most: a C/B ratio, a value of C, or fitted (freeC).
 * `where` says how the caller spells the names ("cli": --c-over-b, "rest": cOverB).
 */
export function checkOneCMode(options: { cOverB?: number | undefined; c?: number | undefined; freeC?: boolean | undefined }, where: 'cli' | 'rest'): void {
  const given = (['cOverB', 'c', 'freeC'] as const).filter((k) => (k === 'freeC' ? options.freeC === true : options[k] !== undefined));
  if (given.length <= 1) return;
  const name = (k: 'cOverB' | 'c' | 'freeC') => (where === 'cli' ? `--${ANALYSIS_OPTION_NAMES[k].cli}` : ANALYSIS_OPTION_NAMES[k].rest);
  throw invalidArgument(name('cOverB'), `give at most one of ${name('cOverB')}, ${name('c')} and ${name('freeC')}`);
}
