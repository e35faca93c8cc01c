import type { Ion } from './ions.js';

/**
 * Jørgensen's factorisations of octahedral ligand-field parameters:
 *
 *   10Dq ≈ f(ligand) · g(metal)        g in cm-1, f dimensionless, f(H2O) = 1
 *   1 − β ≈ h(ligand) · k(metal)       h and k dimensionless, h(H2O) = 1
 *
 * Source (looked up, not recalled): C. K. Jørgensen, Modern Aspects of Ligand
 * Field Theory (1971), pp. 347–348, and Absorption Spectra and Chemical
 * Bonding in Complexes (1962), p. 113, as tabulated in "Values of f and g for
 * estimating 10Dq and of h and k for estimating β" (chemprof.tripod.com,
 * tables2.htm). Only values in that table are here; estimates for ligands and
 * metals it lacks live in src/predict/factor-table.ts, marked as estimates.
 * A second copy of the table on the same site (chemprof.tripod.com/fghk.htm,
 * found again for issue 13) agrees on every value here except that it prints
 * g(Ir3+) as 8 000 (an evident slip for 32 000) and gives no h for thiourea;
 * tables2.htm also lists h(glycinate) = 2.0, which is not taken here.
 *
 * Ligand keys are those of ligands.ts ("NH3", "ox", "NCS"; "SCN" is the
 * S-bound thiocyanate, "py" the table's C5H5N); metal keys are ion labels ("Cr3+").
 */
export const JORGENSEN_SOURCE =
  'Jørgensen, Modern Aspects of Ligand Field Theory (1971), pp. 347–348, and Absorption Spectra and Chemical Bonding in Complexes (1962), p. 113 (table of f, g, h, k looked up)';

/** f(ligand), dimensionless, f(H2O) = 1 (Jørgensen 1962, 1971). */
export const JORGENSEN_F: ReadonlyMap<string, number> = new Map([
  ['Br', 0.72],
  ['SCN', 0.75],
  ['Cl', 0.78],
  ['N3', 0.83],
  ['F', 0.9],
  ['dmso', 0.91],
  ['dmf', 0.98],
  ['ox', 0.99],
  ['H2O', 1.0],
  ['tu', 1.01],
  ['NCS', 1.02],
  ['gly', 1.18],
  ['MeCN', 1.22],
  ['py', 1.23],
  ['NH3', 1.25],
  ['en', 1.28],
  ['bpy', 1.33],
  ['NO2', 1.4],
  ['CN', 1.7],
]);

/** g(metal) in cm-1 (the 10Dq of the octahedral aqua ion when f = 1) (Jørgensen 1962, 1971). */
export const JORGENSEN_G: ReadonlyMap<string, number> = new Map([
  ['Mn2+', 8000],
  ['Fe2+', 8500],
  ['Ni2+', 8700],
  ['Co2+', 9000],
  ['V2+', 12000],
  ['Fe3+', 14000],
  ['Cu3+', 15700],
  ['Cr3+', 17400],
  ['Co3+', 18200],
  ['Ru2+', 20000],
  ['Ag3+', 20400],
  ['Ni4+', 22000],
  ['Mn4+', 24000],
  ['Mo3+', 24600],
  ['Rh3+', 27000],
  ['Pd4+', 29000],
  ['Tc4+', 31000],
  ['Ir3+', 32000],
  ['Pt4+', 36000],
]);

/** h(ligand), dimensionless, h(H2O) = 1 (Jørgensen 1962, 1971). */
export const JORGENSEN_H: ReadonlyMap<string, number> = new Map([
  ['F', 0.8],
  ['H2O', 1.0],
  ['NH3', 1.4],
  ['en', 1.5],
  ['ox', 1.5],
  ['Cl', 2.0],
  ['CN', 2.0],
  ['tu', 2.0],
  ['Br', 2.3],
]);

/** k(metal), dimensionless (Jørgensen 1962, 1971). */
export const JORGENSEN_K: ReadonlyMap<string, number> = new Map([
  ['Mn2+', 0.07],
  ['V2+', 0.08],
  ['Fe2+', 0.08],
  ['Co2+', 0.09],
  ['Ni2+', 0.12],
  ['Mo3+', 0.15],
  ['Cr3+', 0.21],
  ['Fe3+', 0.24],
  ['Rh3+', 0.3],
  ['Ir3+', 0.3],
  ['Co3+', 0.35],
  ['Mn4+', 0.5],
  ['Pt4+', 0.5],
]);

/** f for a ligand key ("NH3"), or undefined when the table has none. */
export function jorgensenF(ligandKey: string): number | undefined {
  return JORGENSEN_F.get(ligandKey);
}

/** g in cm-1 for an ion, or undefined when the table has none. */
export function jorgensenG(ion: Pick<Ion, 'label'>): number | undefined {
  return JORGENSEN_G.get(ion.label);
}

/** h for a ligand key, or undefined when the table has none. */
export function jorgensenH(ligandKey: string): number | undefined {
  return JORGENSEN_H.get(ligandKey);
}

/** k for an ion, or undefined when the table has none. */
export function jorgensenK(ion: Pick<Ion, 'label'>): number | undefined {
  return JORGENSEN_K.get(ion.label);
}
