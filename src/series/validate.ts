import { FieldgapError, invalidArgument } from '../errors.js';
import { findLigand } from '../chemistry/ligands.js';
import { parseIon, type Ion } from '../chemistry/ions.js';
import type { LigandShare, SeriesAnalysis } from './types.js';

/**
 * Checks a list of analyses before any arithmetic, naming the field at fault
 * ("analyses[2].tenDq"), and returns the one metal ion they share (undefined
 * when none names it). `path` prefixes every field name.
 */
export function validateSeriesAnalyses(analyses: readonly SeriesAnalysis[], path = 'analyses'): Ion | undefined {
  if (!Array.isArray(analyses) || analyses.length === 0) throw invalidArgument(path, `${path}: expected at least one analysis`);
  let ion: Ion | undefined;
  let ionAt = -1;
  // A series of thousands of analyses names a handful of ion spellings: each is read once.
  const ions = new Map<string, Ion>();
  analyses.forEach((a, i) => {
    const at = `${path}[${i}]`;
    if (typeof a.sample !== 'string' || a.sample.trim() === '') throw invalidArgument(`${at}.sample`, `${at}.sample: expected a sample name`);
    positive(a.tenDq, `${at}.tenDq`);
    nonNegative(a.tenDqUncertainty, `${at}.tenDqUncertainty`);
    if (a.beta !== undefined && !(Number.isFinite(a.beta) && a.beta > 0 && a.beta <= 1.2)) {
      throw invalidArgument(`${at}.beta`, `${at}.beta: expected a number in (0, 1.2], got ${a.beta}`);
    }
    nonNegative(a.betaUncertainty, `${at}.betaUncertainty`);
    ligandShares(a, at);
    if (a.ion !== undefined) {
      let here = ions.get(a.ion);
      if (here === undefined) {
        here = parseIon(a.ion, { path: `${at}.ion` });
        ions.set(a.ion, here);
      }
      if (ion && here.label !== ion.label) {
        throw invalidArgument(`${at}.ion`, `${at}.ion: ${here.label} differs from ${ion.label} in ${path}[${ionAt}]: a series compares complexes of one metal ion`);
      }
      ion ??= here;
      if (ionAt < 0) ionAt = i;
    }
  });
  return ion;
}

/** The ligand shares of an analysis with canonical keys where fieldgap knows the ligand. */
export function ligandShares(a: SeriesAnalysis, at: string): LigandShare[] {
  if (a.ligand !== undefined && a.ligands !== undefined) throw invalidArgument(`${at}.ligands`, `${at}: give ligand or ligands, not both`);
  const shares = a.ligand !== undefined ? [{ ligand: a.ligand, count: 1 }] : a.ligands;
  if (!shares || shares.length === 0) throw invalidArgument(`${at}.ligand`, `${at}.ligand: expected the ligand (or a ligands list)`);
  return shares.map((s, j) => {
    if (typeof s.ligand !== 'string' || s.ligand.trim() === '') throw invalidArgument(`${at}.ligands[${j}].ligand`, `${at}.ligands[${j}].ligand: expected a ligand name`);
    if (!Number.isInteger(s.count) || s.count < 1) throw invalidArgument(`${at}.ligands[${j}].count`, `${at}.ligands[${j}].count: expected a whole number ≥ 1, got ${s.count}`);
    return { ligand: canonicalLigand(s.ligand), count: s.count };
  });
}

/** "ammine" → "NH3"; a ligand fieldgap does not know keeps the user's spelling. */
export function canonicalLigand(text: string): string {
  let key = canonicalLigands.get(text);
  if (key === undefined) {
    key = findLigand(text)?.key ?? text.trim();
    // A series repeats a few spellings thousands of times; findLigand reads a fixed table, so the answer never changes.
    if (canonicalLigands.size >= 4096) canonicalLigands.clear();
    canonicalLigands.set(text, key);
  }
  return key;
}

const canonicalLigands = new Map<string, string>();

/** "NH3", or "NH3×5 Cl" for a mixed complex. */
export function ligandLabel(shares: readonly LigandShare[]): string {
  if (shares.length === 1) return (shares[0] as LigandShare).ligand;
  return shares.map((s) => (s.count === 1 ? s.ligand : `${s.ligand}×${s.count}`)).join(' ');
}

function positive(value: number, at: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new FieldgapError('invalid-argument', `${at}: expected a positive number of cm-1, got ${String(value)}`, at);
  }
}

function nonNegative(value: number | undefined, at: string): void {
  if (value === undefined) return;
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new FieldgapError('invalid-argument', `${at}: expected a number ≥ 0, got ${String(value)}`, at);
  }
}
