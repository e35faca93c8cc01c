/**
 * The d1–d9 ligand-field engine: energy levels of d^n ions in octahedral and
 * tetrahedral fields from Dq and the Racah parameters B and C, their labels,
 * Tanabe–Sugano-type diagrams, free-ion terms and spin-state helpers.
 * Energies in cm-1, measured from the ground level.
 */
export { computeLevels } from './levels.js';
export { computeDiagram, DIAGRAM_DEFAULTS, type DiagramOptions } from './diagram.js';
export { crossoverDqOverB, type CrossoverOptions } from './crossover.js';
export { freeIonTerms } from './public-free-ion.js';
export { diagramDocument, levelsDocument } from './documents.js';
export { spinStateChoice } from './spin-state.js';
export * from './types.js';
export {
  computeFieldLevels, spinOrbitEnergies, type FieldLevel, type FieldLevelsResult, type TetragonalParameters, type SiteGroup,
} from './field-levels.js';
export { computeFieldDiagram, FIELD_DIAGRAM_AXES, type FieldDiagram, type FieldDiagramAxis, type FieldDiagramOptions } from './field-diagram.js';
export { fieldDiagramDocument, fieldLevelsDocument } from './field-documents.js';
export { tetragonalOrbitalEnergies } from './tetragonal-field.js';
export { freeIonZeta, FREE_ION_ZETA, type FreeIonZeta } from './free-ion-zeta.js';
export { cubicOrbitalField, tetragonalOrbitalField, REAL_D_ORBITALS, type OrbitalField } from './orbital-field.js';
export { angularOverlapField, type AngularOverlapLigand } from './angular-overlap.js';
export { generalFieldLevels, type GeneralFieldLevel } from './general-field-levels.js';
