/**
 * What the fit could not fix, in a chemist's words: the core's
 * `undetermined` entries name parameters by their JSON fields (tenDq, b)
 * and say "(null)" where a value is left out; the page writes 10Dq, B and
 * "not determined", and keeps the long reason for a folded detail.
 */
import { UNIT } from './format.js';

export interface UndeterminedEntry {
  parameter: string;
  reason: string;
  action: string;
}

/** Display names of the fit's JSON fields. */
const PARAMETER_NAMES: Readonly<Record<string, string>> = {
  tenDq: '10Dq', dq: 'Dq', b: 'B', c: 'C', cOverB: 'C/B', beta: 'β', ds: 'Ds', dt: 'Dt', zeta: 'ζ',
};

/** "tenDq" → "10Dq"; an unknown field stays as it is. */
export function parameterName(field: string): string {
  return PARAMETER_NAMES[field] ?? field;
}

/** The core's sentence with JSON words replaced: "(null)" → "not determined", cm-1 → cm⁻¹. */
export function chemistWording(text: string): string {
  return text
    .replace(/\bnot reported \(null\)/g, 'not determined')
    .replace(/\s*\(null\)/g, ' (not determined)')
    .replace(/\bnull\b/g, 'not determined')
    .replace(/cm-1\b/g, UNIT.wavenumber);
}

/** One short line: "not fixed by the bands: 10Dq, B" (each parameter once, in the order given). */
export function undeterminedHeadline(entries: readonly UndeterminedEntry[]): string {
  const names = [...new Set(entries.map((u) => parameterName(u.parameter)))];
  return names.length === 0 ? '' : `not fixed by the bands: ${names.join(', ')}`;
}

/** One detail line per entry: "B: one band cannot fix both 10Dq and B; B fixed at its prior …". */
export function undeterminedDetail(entry: UndeterminedEntry): string {
  return `${parameterName(entry.parameter)}: ${chemistWording(entry.reason)}; ${chemistWording(entry.action)}`;
}
