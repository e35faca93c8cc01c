import type { Geometry } from '../ligand-field/types.js';
import type { Ion } from './ions.js';

/**
 * A geometry guessed from the coordination number alone, never read from the
 * formula: 6 → octahedral, 4 → tetrahedral (with a warning for d8, which is
 * often square planar), anything else → undefined. Every guess adds a warning.
 */
export function guessGeometry(metal: Ion, coordinationNumber: number, warnings: string[]): Geometry | undefined {
  if (coordinationNumber === 6) {
    warnings.push('geometry guessed from the coordination number 6: octahedral');
    return 'octahedral';
  }
  if (coordinationNumber === 4) {
    warnings.push('geometry guessed from the coordination number 4: tetrahedral');
    if (metal.d === 8) {
      const how = metal.row === 1 ? 'often' : 'almost always';
      warnings.push(`${metal.label} is d8: four-coordinate d8 complexes are ${how} square planar, which fieldgap does not model; treat the tetrahedral results with care`);
    }
    return 'tetrahedral';
  }
  warnings.push(`coordination number ${coordinationNumber}: no geometry guessed (fieldgap models octahedral, 6, and tetrahedral, 4)`);
  return undefined;
}
