/**
 * The JSON documents of levels and diagrams beyond the cubic field, as
 * `fieldgap levels --json` and `fieldgap diagram --json` print them when
 * --ds, --dt or --zeta is given, and as GET /api/v1/levels and
 * /api/v1/diagram return them with those fields. Every level keeps the
 * contract fields of the cubic document (energy, degeneracy, irrep, parent,
 * term, multiplicity, label) and adds parentWeight.
 */
import type { FieldDiagram } from './field-diagram.js';
import type { FieldLevelsResult } from './field-levels.js';

export function fieldLevelsDocument(result: FieldLevelsResult): object {
  const { d, geometry, dq, b, c, ds, dt, zeta, symmetry, spinOrbit, group, groundTerm, levels, notes } = result;
  return {
    d, geometry, dq, b, c, ds, dt, zeta, symmetry, spinOrbit, group, groundTerm,
    levels: levels.map(({ energy, degeneracy, irrep, parent, parentWeight, term, multiplicity, label }) => ({
      energy, degeneracy, irrep, parent, parentWeight, term, multiplicity, label,
    })),
    groundLabel: levels[0]?.label,
    cOverB: c / b,
    tenDq: 10 * dq,
    notes,
  };
}

/** E/B values are rounded to 1e-6, as in the cubic diagram document. */
const round = (value: number): number => Math.round(value * 1e6) / 1e6;

export function fieldDiagramDocument(diagram: FieldDiagram): object {
  const { d, geometry, axis, b, cOverB, dq, ds, dt, zeta, x, groundTerms, lines } = diagram;
  return {
    d, geometry, axis, b, cOverB, steps: x.length - 1,
    x: x.map(round), dq: dq.map(round), ds: ds.map(round), dt: dt.map(round), zeta: zeta.map(round), groundTerms,
    lines: lines.map((line) => ({ ...line, energies: line.energies.map(round) })),
  };
}
