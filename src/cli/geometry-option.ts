/**
 * --geometry for analyze and fit: the two words, and the point-group symbols
 * chemists write (Oh, Td; the page's own choice reads "cubic (Oh, Td)") and the
 * solid's names, in any case. AUDIT3 finding 14: `--geometry td` was refused.
 */
import { GEOMETRIES, type Geometry } from '../ligand-field/types.js';
import { choiceOption } from './options.js';

const ALIASES: Readonly<Record<string, Geometry>> = { oh: 'octahedral', octahedron: 'octahedral', td: 'tetrahedral', tetrahedron: 'tetrahedral' };

/** The geometry an option value names; an unknown word gets choiceOption's error listing the two. */
export function geometryOption(raw: string | undefined): Geometry {
  const alias = raw === undefined ? undefined : ALIASES[raw.trim().toLowerCase()];
  return alias ?? choiceOption('geometry', raw, GEOMETRIES, 'octahedral');
}
