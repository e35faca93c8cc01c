import { levelKey } from './labels.js';
import { computeLevels } from './levels.js';
import type { Diagram, DiagramLine, Geometry } from './types.js';
import { validateD, validateFinite, validateGeometry } from './validate.js';
import { invalidArgument } from '../errors.js';

/** Options of computeDiagram. */
export interface DiagramOptions {
  /** C/B, the one shape parameter of a Tanabe–Sugano diagram. Default 4.5. */
  cOverB?: number;
  /** Right end of the Dq/B axis. Default 4. */
  maxDqOverB?: number;
  /** Number of intervals: the diagram has steps + 1 points. Default 200, at most 20000. */
  steps?: number;
}

export const DIAGRAM_DEFAULTS = { cOverB: 4.5, maxDqOverB: 4, steps: 200 } as const;

const MAX_STEPS = 20000;

/**
 * A Tanabe–Sugano-type diagram: E/B of every (2S+1, Γ) level against Dq/B
 * from 0 to maxDqOverB at fixed C/B. Energies are measured from the ground
 * level at each step, so lines kink where the ground level changes (a spin
 * crossover), as in the published diagrams. B = 1 internally: energies are
 * homogeneous of degree 1 in (Dq, B, C). A line is one (multiplicity, irrep,
 * rank) identity; its label and parent do not change along Dq.
 */
export function computeDiagram(d: number, geometry: Geometry, options: DiagramOptions = {}): Diagram {
  const { cOverB = DIAGRAM_DEFAULTS.cOverB, maxDqOverB = DIAGRAM_DEFAULTS.maxDqOverB, steps = DIAGRAM_DEFAULTS.steps } = options;
  validateD(d);
  validateGeometry(geometry);
  validateFinite(cOverB, 'cOverB', { min: 0, unit: '' });
  validateFinite(maxDqOverB, 'maxDqOverB', { min: 0, exclusiveMin: true, unit: '' });
  if (!Number.isInteger(steps) || steps < 1 || steps > MAX_STEPS) {
    throw invalidArgument('steps', `steps must be a whole number from 1 to ${MAX_STEPS}, got ${String(steps)}`);
  }
  const dqOverB: number[] = [];
  const groundTerms: string[] = [];
  // Line identity (multiplicity, irrep, rank) packed in one small integer.
  const lines = new Map<number, DiagramLine>();
  for (let i = 0; i <= steps; i++) {
    const x = (maxDqOverB * i) / steps;
    const result = computeLevels(d, geometry, { dq: x, b: 1, c: cOverB });
    dqOverB.push(x);
    groundTerms.push(result.groundTerm);
    for (const level of result.levels) {
      const key = 64 * levelKey(level.multiplicity, level.cubicIrrep) + level.rank;
      let line = lines.get(key);
      if (!line) {
        line = {
          label: level.label, term: level.term, parent: level.parent, multiplicity: level.multiplicity,
          irrep: level.irrep, rank: level.rank, energies: [],
        };
        lines.set(key, line);
      }
      line.energies.push(level.energy);
    }
  }
  return { d, geometry, cOverB, dqOverB, groundTerms, lines: [...lines.values()] };
}
