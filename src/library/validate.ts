import { parseIon } from '../chemistry/ions.js';
import { invalidArgument } from '../errors.js';
import type { AnalysisDetails } from './types.js';

/** Longest text field kept (sample, formula, ion, solvent, each ligand). */
export const MAX_SHORT_TEXT = 200;
/** Longest note kept. */
export const MAX_NOTE = 10_000;

/**
 * Checks the details a user gives and returns them trimmed, with empty
 * optional texts dropped. Errors name the field ("sample", "ligands[1]").
 * Only the fields present in `details` are checked, so a patch can use it.
 * The ion is kept as its canonical label ("Cr(III)" is stored as "Cr3+").
 */
export function checkDetails(details: Partial<Record<keyof AnalysisDetails, unknown>>): Partial<AnalysisDetails> {
  const out: Partial<AnalysisDetails> = {};
  if (details.sample !== undefined) {
    const sample = shortText('sample', details.sample);
    if (sample === undefined) throw invalidArgument('sample', 'sample: a sample name is required');
    out.sample = sample;
  }
  for (const key of ['formula', 'solvent'] as const) {
    if (details[key] === undefined) continue;
    const value = shortText(key, details[key]);
    if (value !== undefined) out[key] = value;
  }
  if (details.ion !== undefined) {
    const ion = shortText('ion', details.ion);
    if (ion !== undefined) out.ion = parseIon(ion, { path: 'ion' }).label;
  }
  if (details.note !== undefined) {
    const note = textOf('note', details.note, MAX_NOTE);
    if (note !== undefined) out.note = note;
  }
  if (details.ligands !== undefined) out.ligands = ligandList(details.ligands);
  if (details.temperature !== undefined) {
    const t = details.temperature;
    if (typeof t !== 'number' || !Number.isFinite(t) || t <= 0 || t > 5000) {
      throw invalidArgument('temperature', `temperature: expected kelvin above 0 and up to 5000, got ${JSON.stringify(t)}`);
    }
    out.temperature = t;
  }
  if (details.measuredOn !== undefined) out.measuredOn = isoDate(details.measuredOn);
  return out;
}

/** A file name without folders (the library keeps where it came from, not where it was). */
export function baseFileName(name: unknown): string {
  if (typeof name !== 'string') throw invalidArgument('fileName', 'fileName: expected text');
  const base = name.split(/[\\/]/).pop()!.trim();
  if (base === '') throw invalidArgument('fileName', 'fileName: the original file needs a name');
  if (base.length > 255) throw invalidArgument('fileName', 'fileName: longer than 255 characters');
  return base;
}

function shortText(field: string, value: unknown): string | undefined {
  return textOf(field, value, MAX_SHORT_TEXT);
}

function textOf(field: string, value: unknown, max: number): string | undefined {
  if (typeof value !== 'string') throw invalidArgument(field, `${field}: expected text, got ${typeof value}`);
  const trimmed = value.trim();
  if (trimmed.length > max) throw invalidArgument(field, `${field}: longer than ${max} characters`);
  return trimmed === '' ? undefined : trimmed;
}

function ligandList(value: unknown): string[] {
  if (!Array.isArray(value)) throw invalidArgument('ligands', 'ligands: expected a list of ligand names');
  const out: string[] = [];
  value.forEach((item, i) => {
    const name = shortText(`ligands[${i}]`, item);
    if (name !== undefined && !out.includes(name)) out.push(name);
  });
  return out;
}

/** A calendar date YYYY-MM-DD that exists (no 2024-02-30). */
function isoDate(value: unknown): string {
  const match = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value.trim()) : null;
  if (match) {
    const [y, m, d] = [Number(match[1]), Number(match[2]), Number(match[3])];
    const date = new Date(Date.UTC(y, m - 1, d));
    if (date.getUTCFullYear() === y && date.getUTCMonth() === m - 1 && date.getUTCDate() === d) return match[0];
  }
  throw invalidArgument('measuredOn', `measuredOn: expected a date as YYYY-MM-DD, got ${JSON.stringify(value)}`);
}

/**
 * The canonical label of an ion ("Cr(III)", "cr 3+" → "Cr3+"), as
 * src/chemistry reads it; FieldgapError naming `path` when it is no ion.
 */
export function canonicalIon(text: string, path = 'ion'): string {
  return parseIon(text, { path }).label;
}

/** The canonical label, or null for text that is not an ion (from a result or options we only store). */
export function canonicalIonOrNull(text: unknown): string | null {
  if (typeof text !== 'string' || text.trim() === '') return null;
  try {
    return canonicalIon(text);
  } catch {
    return null;
  }
}
