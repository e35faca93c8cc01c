/**
 * What a formula says before any spectrum: the factor table with
 * uncertainties and sources, the named rules of the trade, the mean pairing
 * energy, the spin decision with its probability, and the one-electron
 * orbital occupation. predictComplex (src/series/predict.ts) joins them.
 * Pure data and functions; energies in cm-1.
 */
export { ligandF, ligandH, metalG, metalK, ligandsWithF, SPECTROCHEMICAL_ESTIMATE, NEPHELAUXETIC_ESTIMATE, type FactorKind, type FactorValue } from './factor-table.js';
export { RULES, fourCoordinateRule, spinRule, STRONG_FIELD, PI_ACCEPTORS, SQUARE_PLANAR_LIGANDS, HALIDES, type PredictGeometry, type Rule, type LigandSet } from './rules.js';
export { meanPairingEnergy, pairingEnergyExpression, PAIRING_ENERGY_SOURCE } from './pairing-energy.js';
export { spinNumbers, BORDERLINE_PROBABILITY, type SpinNumbers, type SpinNumbersInput } from './spin-decision.js';
export { decideSpin, orbitalContribution, type SpinDecision } from './decide-spin.js';
export { orbitalOccupation, boxArrows, type Occupation, type OrbitalSet } from './occupation.js';
export { normalCdf, erfc } from './normal.js';
