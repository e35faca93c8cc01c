/**
 * The JSON documents of levels and diagrams, as `fieldgap levels --json`,
 * `fieldgap diagram --json` and the service's GET /api/v1/levels and
 * /api/v1/diagram return them: the contract fields first, then extras. One
 * builder each, so the command line and the service cannot drift apart.
 */
import { computeDiagram, type DiagramOptions } from './diagram.js';
import { crossoverDqOverB } from './crossover.js';
import { freeIonTerms } from './public-free-ion.js';
import type { Geometry, LevelsResult } from './types.js';

export function levelsDocument(result: LevelsResult): object {
  const { d, geometry, dq, b, c, groundTerm, spinState, unpairedElectrons, levels, notes } = result;
  return {
    d, geometry, dq, b, c, groundTerm, spinState, unpairedElectrons,
    levels: levels.map(({ energy, term, multiplicity, irrep, degeneracy, parent, label, cubicIrrep, rank }) => ({
      energy, term, multiplicity, irrep, degeneracy, parent, label, cubicIrrep, rank,
    })),
    groundLabel: levels[0]?.label,
    cOverB: c / b,
    tenDq: 10 * dq,
    freeIonTerms: freeIonTerms(d, b, c),
    notes,
  };
}

/** E/B values are rounded to 1e-6: more digits than a diagram can show, far fewer bytes. */
const round = (value: number): number => Math.round(value * 1e6) / 1e6;

export function diagramDocument(d: number, geometry: Geometry, options: Required<DiagramOptions>): object {
  const diagram = computeDiagram(d, geometry, options);
  const crossover = d > 0 && d < 10 ? crossoverDqOverB(d, geometry, options.cOverB, { maxDqOverB: options.maxDqOverB }) : undefined;
  const { cOverB, dqOverB, groundTerms, lines } = diagram;
  return {
    d, geometry, cOverB, maxDqOverB: options.maxDqOverB, steps: options.steps,
    crossoverDqOverB: crossover ?? null,
    dqOverB: dqOverB.map(round), groundTerms,
    lines: lines.map((line) => ({ ...line, energies: line.energies.map(round) })),
  };
}
