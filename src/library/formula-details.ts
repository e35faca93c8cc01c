/**
 * What a complex's formula tells a stored analysis when the user did not say
 * it otherwise: the metal ion (when neither ion nor d-count is given), the
 * ligands of the record's details (when not given), and a geometry guess from
 * the coordination number (when no geometry is given). One rule for
 * `library add --formula` and POST /analyses.
 */
import { parseFormula } from '../chemistry/formula.js';
import { FieldgapError, isFieldgapError } from '../errors.js';
import type { Geometry } from '../ligand-field/types.js';

export interface FormulaGiven {
  ion?: string | undefined;
  d?: number | undefined;
  geometry?: Geometry | undefined;
  ligands?: readonly string[] | undefined;
}

export interface FormulaDetails {
  /** The metal's ion label ("Cr3+"), when the caller gave neither ion nor d. */
  ion?: string;
  /** Ligand keys ("H2O"), when the caller gave none. */
  ligands?: string[];
  /** The geometry guessed from the coordination number, when the caller gave none. */
  geometry?: Geometry;
  /** Notes for the user (a geometry guess; a formula kept as written because it does not read). */
  notes: string[];
}

/**
 * Reads `formula` for what `given` lacks. A formula that does not read is
 * kept as written (a note says so), unless the ion must come from it: then
 * the parse error is thrown with `path` (the option or field naming the formula).
 */
export function detailsFromFormula(formula: string, given: FormulaGiven, path: string, ionHint: string): FormulaDetails {
  const needsIon = given.ion === undefined && given.d === undefined;
  let parsed;
  try {
    parsed = parseFormula(formula);
  } catch (error) {
    if (needsIon && isFieldgapError(error)) throw new FieldgapError(error.code, `${error.message} (or give ${ionHint})`, path);
    if (!isFieldgapError(error)) throw error;
    return { notes: [`${path} "${formula}" is kept as written; fieldgap could not read it (${error.message})`] };
  }
  const out: FormulaDetails = { notes: [] };
  if (needsIon) out.ion = parsed.metal.label;
  if (given.ligands === undefined) out.ligands = parsed.ligands.map((l) => l.key);
  if (given.geometry === undefined && parsed.geometry !== undefined) {
    out.geometry = parsed.geometry;
    out.notes.push(`geometry ${parsed.geometry} guessed from the formula (coordination number ${parsed.coordinationNumber})`);
  }
  return out;
}
