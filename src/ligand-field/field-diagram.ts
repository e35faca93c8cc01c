import { invalidArgument } from '../errors.js';
import {
  computeFieldLevels, doubleGroupRawLevels, tetragonalEnergies, validateTetragonalParameters, type FieldLevel,
  type ResolvedParameters,
} from './field-levels.js';
import { CHANNEL_D4_IRREPS } from './tetragonal-blocks.js';
import type { Geometry } from './types.js';
import { validateD, validateFinite, validateGeometry } from './validate.js';

/**
 * Level diagrams beyond the cubic field, E/B against one parameter with the
 * others fixed (B = the given Racah B, cm-1; energies from the ground level
 * at each point, so lines kink where the ground level changes):
 *   axis 'dq': Dq from 0 to maxDqOverB·B at fixed Ds, Dt, ζ;
 *   axis 'distortion': (Ds, Dt) = t·(ds, dt), t from 0 to 1, at fixed Dq, ζ
 *     (x = t·Ds/B, Ds on the axis);
 *   axis 'zeta': ζ from 0 to the given ζ at fixed Dq, Ds, Dt.
 * A line is one level followed by its identity, which does not change along
 * the path: spin-free (2S+1, D4 irrep, rank in its block) or, with
 * spin–orbit anywhere on the path, (D4' irrep, rank); its label is the
 * level's label at the last point (a cubic Γ8 with spin–orbit is two
 * coinciding lines, its Γ6 and Γ7 halves in D4'). The cubic Tanabe–Sugano
 * diagram without Ds, Dt or ζ stays in diagram.ts.
 */
export type FieldDiagramAxis = 'dq' | 'distortion' | 'zeta';

export const FIELD_DIAGRAM_AXES: readonly FieldDiagramAxis[] = ['dq', 'distortion', 'zeta'];

export interface FieldDiagramOptions {
  axis: FieldDiagramAxis;
  /** Racah B, cm-1 (> 0): the energy unit of the diagram. */
  b: number;
  /** C/B. */
  cOverB: number;
  /** Fixed Dq (cm-1) on the distortion and zeta axes. */
  dq: number;
  /** Ds, Dt (cm-1): fixed, or the end of the distortion axis. */
  ds: number;
  dt: number;
  /** ζ (cm-1): fixed, or the end of the zeta axis. */
  zeta: number;
  /** End of the dq axis, Dq/B. */
  maxDqOverB: number;
  /** Intervals: steps + 1 points, 1..2000. */
  steps: number;
}

export interface FieldDiagramLine {
  label: string;
  term: string;
  parent: string;
  degeneracy: number;
  /** E/B above the ground level at each point. */
  energies: number[];
}

export interface FieldDiagram {
  d: number;
  geometry: Geometry;
  axis: FieldDiagramAxis;
  b: number;
  cOverB: number;
  /** The parameters at each point, cm-1. */
  dq: number[];
  ds: number[];
  dt: number[];
  zeta: number[];
  /** The axis value over B at each point (Dq/B, Ds/B or ζ/B). */
  x: number[];
  groundTerms: string[];
  lines: FieldDiagramLine[];
}

const MAX_STEPS = 2000;

function pointParameters(options: FieldDiagramOptions, t: number): ResolvedParameters {
  const { axis, b, cOverB, dq, ds, dt, zeta, maxDqOverB } = options;
  const c = cOverB * b;
  if (axis === 'dq') return { dq: t * maxDqOverB * b, b, c, ds, dt, zeta };
  if (axis === 'distortion') return { dq, b, c, ds: t * ds, dt: t * dt, zeta };
  return { dq, b, c, ds, dt, zeta: t * zeta };
}

/** Identity → energy (cm-1 above the ground level) at one point, and the ground identity. */
function identifiedEnergies(d: number, geometry: Geometry, p: ResolvedParameters, doubleGroup: boolean): Map<string, [number, number]> {
  const out = new Map<string, [number, number]>();
  if (doubleGroup) {
    const raw = doubleGroupRawLevels(d, geometry, p);
    const ground = raw[0]!.energy;
    for (const r of raw) out.set(`${r.irrep}#${r.rank}`, [r.energy - ground, r.degeneracy]);
  } else {
    const { count, energy, keys, twoS, channel, ground } = tetragonalEnergies(d, p);
    const zero = energy[ground]!;
    for (let i = 0; i < count; i++) {
      const irrep = CHANNEL_D4_IRREPS[channel[i]!]!;
      out.set(keys[i]!, [energy[i]! - zero, (twoS[i]! + 1) * (irrep === 'E' ? 2 : 1)]);
    }
  }
  return out;
}

/** The level at the last point whose energy is closest to e (labels the line). */
function nearestLevel(levels: readonly FieldLevel[], energy: number): FieldLevel {
  let best = levels[0]!;
  for (const level of levels) if (Math.abs(level.energy - energy) < Math.abs(best.energy - energy)) best = level;
  return best;
}

export function computeFieldDiagram(d: number, geometry: Geometry, options: FieldDiagramOptions): FieldDiagram {
  validateD(d);
  validateGeometry(geometry);
  if (d === 0 || d === 10) throw invalidArgument('d', `d${d} is a closed configuration: it has no levels to plot`);
  const { axis, b, cOverB, steps } = options;
  if (!FIELD_DIAGRAM_AXES.includes(axis)) throw invalidArgument('axis', `axis must be one of ${FIELD_DIAGRAM_AXES.join(', ')}, got ${String(axis)}`);
  validateFinite(b, 'b', { min: 0, exclusiveMin: true });
  validateFinite(cOverB, 'cOverB', { min: 0, unit: '' });
  validateFinite(options.maxDqOverB, 'maxDqOverB', { min: 0, exclusiveMin: true, unit: '' });
  validateTetragonalParameters(geometry, { dq: options.dq, b, c: cOverB * b, ds: options.ds, dt: options.dt, zeta: options.zeta });
  if (!Number.isInteger(steps) || steps < 1 || steps > MAX_STEPS) {
    throw invalidArgument('steps', `steps must be a whole number from 1 to ${MAX_STEPS}, got ${String(steps)}`);
  }
  if (axis === 'distortion' && options.ds === 0 && options.dt === 0) throw invalidArgument('ds', 'the distortion axis needs a nonzero Ds or Dt (its end point)');
  if (axis === 'zeta' && options.zeta === 0) throw invalidArgument('zeta', 'the zeta axis needs ζ > 0 (its end point)');
  const doubleGroup = options.zeta > 0;
  const diagram: FieldDiagram = {
    d, geometry, axis, b, cOverB, dq: [], ds: [], dt: [], zeta: [], x: [], groundTerms: [], lines: [],
  };
  const lines = new Map<string, { energies: number[]; degeneracy: number }>();
  let last: ResolvedParameters | undefined;
  for (let i = 0; i <= steps; i++) {
    const t = i / steps;
    const p = pointParameters(options, t);
    last = p;
    diagram.dq.push(p.dq);
    diagram.ds.push(p.ds);
    diagram.dt.push(p.dt);
    diagram.zeta.push(p.zeta);
    diagram.x.push((axis === 'dq' ? p.dq : axis === 'distortion' ? p.ds : p.zeta) / b);
    const energies = identifiedEnergies(d, geometry, p, doubleGroup);
    let groundKey = '';
    for (const [key, [energy, degeneracy]] of energies) {
      if (energy === 0 && groundKey === '') groundKey = key;
      let line = lines.get(key);
      if (!line) lines.set(key, (line = { energies: [], degeneracy }));
      line.energies.push(energy / b);
    }
    diagram.groundTerms.push(groundKey);
  }
  // Labels from the last point.
  const levels = computeFieldLevels(d, geometry, last!).levels;
  const lastIndex = steps;
  diagram.groundTerms = diagram.groundTerms.map((key) => {
    const line = lines.get(key)!;
    return nearestLevel(levels, line.energies[lastIndex]! * b).term;
  });
  for (const [, line] of lines) {
    const level = nearestLevel(levels, line.energies[lastIndex]! * b);
    diagram.lines.push({ label: level.label, term: level.term, parent: level.parent, degeneracy: line.degeneracy, energies: line.energies });
  }
  diagram.lines.sort((x, y) => x.energies[lastIndex]! - y.energies[lastIndex]!);
  return diagram;
}
