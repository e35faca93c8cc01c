import { invalidArgument } from '../errors.js';
import type { FieldLevel, FieldLevelsResult, ResolvedParameters, SiteGroup, TetragonalParameters } from './field-level-types.js';
import { spinOrbitLevels } from './spin-orbit-levels.js';
import { spinFreeFieldLevels } from './tetragonal-spin-free.js';
import type { Geometry } from './types.js';
import { validateD, validateFieldParameters, validateFinite, validateGeometry } from './validate.js';

/**
 * The levels of d^n beyond the cubic field (conventions and result shape in
 * field-level-types.ts): validation and the choice of regime. The spin-free
 * tetragonal levels live in tetragonal-spin-free.ts, those with spin–orbit
 * in spin-orbit-levels.ts; both are re-exported here for the callers.
 */
export {
  PARENT_WEIGHT_FLOOR, type FieldLevel, type FieldLevelsResult, type ResolvedParameters, type SiteGroup, type TetragonalParameters,
} from './field-level-types.js';
export {
  spinFreeFieldLevels, spinFreeTetragonalLevelsViaCubic, tetragonalEnergies, tetragonalRawLevels, type RawTetragonalLevel,
} from './tetragonal-spin-free.js';
export { doubleGroupRawLevels, spinOrbitEnergies, type RawDoubleGroupLevel } from './spin-orbit-levels.js';

/** Checks the parameters; every failure names its field. */
export function validateTetragonalParameters(geometry: Geometry, params: TetragonalParameters): ResolvedParameters {
  validateFieldParameters(params);
  const { ds = 0, dt = 0, zeta = 0 } = params;
  validateFinite(ds, 'ds');
  validateFinite(dt, 'dt');
  validateFinite(zeta, 'zeta', { min: 0 });
  if (geometry === 'tetrahedral' && (ds !== 0 || dt !== 0)) {
    throw invalidArgument(ds !== 0 ? 'ds' : 'dt', 'Ds and Dt describe a tetragonally distorted octahedron: use the octahedral geometry (a distorted tetrahedron, D2d, is not supported)');
  }
  return { dq: params.dq, b: params.b, c: params.c, ds, dt, zeta };
}

/** The levels of d^n (0..10) in a cubic or tetragonal field, with or without spin–orbit coupling (see above). */
export function computeFieldLevels(d: number, geometry: Geometry, params: TetragonalParameters): FieldLevelsResult {
  validateD(d);
  validateGeometry(geometry);
  const p = validateTetragonalParameters(geometry, params);
  const symmetry = p.ds === 0 && p.dt === 0 ? 'cubic' : 'tetragonal';
  const spinOrbit = p.zeta > 0;
  const cubicGroup: SiteGroup = geometry === 'octahedral' ? 'Oh' : 'Td';
  const group: SiteGroup =
    symmetry === 'tetragonal' ? (spinOrbit ? "D4'" : 'D4h') : spinOrbit ? (geometry === 'octahedral' ? "O'" : "Td'") : cubicGroup;
  const notes: string[] = [];
  let levels: FieldLevel[];
  if (d === 0 || d === 10) {
    const irrep = spinOrbit ? 'Γ1' : symmetry === 'tetragonal' ? 'A1g' : geometry === 'octahedral' ? 'A1g' : 'A1';
    const term = spinOrbit ? irrep : `1${irrep}`;
    levels = [{ energy: 0, degeneracy: 1, irrep, parent: '1S', parentWeight: 1, term, multiplicity: 1, label: `${term}[1S]` }];
    notes.push(`d${d} is a closed configuration: it has no ligand-field transitions`);
  } else {
    levels = spinOrbit ? spinOrbitLevels(d, geometry, p) : spinFreeFieldLevels(d, geometry, p);
  }
  if (symmetry === 'tetragonal') {
    notes.push('tetragonal field: a1g(z²) = 6Dq − 2Ds − 6Dt, b1g(x²−y²) = 6Dq + 2Ds − Dt, b2g(xy) = −4Dq + 2Ds − Dt, eg(xz, yz) = −4Dq − Ds + 4Dt');
  }
  if (spinOrbit) notes.push('spin–orbit coupling on: levels are labelled by the double group, with their dominant spin-free parent and its weight');
  return { d, geometry, ...p, symmetry, spinOrbit, group, groundTerm: levels[0]!.term, levels, notes };
}
