/**
 * Chemistry data and functions: elements, ions and d-counts, free-ion Racah
 * parameters, ligands, counter-ions, complex formulas, Jørgensen's factors.
 * Pure data and functions; energies in cm-1.
 */
export { TRANSITION_ELEMENTS, ELEMENT_SYMBOLS, elementSymbolFromText, type TransitionElement, type TransitionRow } from './elements.js';
export {
  parseIon, ionFromOxidationState, ionLabel, romanOxidationState, chargeFromText,
  ION_FORMS, MIN_OXIDATION_STATE, MAX_OXIDATION_STATE, type Ion, type ParseIonOptions,
} from './ions.js';
export { freeIonRacah, FREE_ION_RACAH, type FreeIonRacah } from './free-ion-racah.js';
export { LIGANDS, findLigand, ligandByKey, bareLigandAt, type Ligand } from './ligands.js';
export { counterIonAt, counterIonByFormula, type CounterIon } from './counter-ions.js';
export { parseFormula, type ParsedComplex, type LigandCount, type CounterIonCount } from './formula.js';
export {
  JORGENSEN_F, JORGENSEN_G, JORGENSEN_H, JORGENSEN_K, JORGENSEN_SOURCE,
  jorgensenF, jorgensenG, jorgensenH, jorgensenK,
} from './jorgensen.js';
