import type { Ion } from './ions.js';

/**
 * Jørgensen's factorisations of octahedral ligand-field parameters:
 *
 *   10Dq ≈ f(ligand) · g(metal)        g in cm-1, f dimensionless, f(H2O) = 1
 *   1 − β ≈ h(ligand) · k(metal)       h and k dimensionless, h(H2O) = 1
 *
 * Source: C. K. Jørgensen, Oxidation Numbers and Oxidation States (1969), as
 * reproduced in Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984) and
 * many textbooks. Written without access to any of them: every value here is
 * "from memory" of those reproduced tables; check the last digit before relying
 * on it. Ligands and metals absent from the table (OH-, I- for f, NO2-, Cu2+,
 * Fe2+, ...) were either not in the recalled tables or not recalled reliably.
 *
 * Ligand keys are those of ligands.ts ("NH3", "ox", "NCS"); metal keys are ion
 * labels ("Cr3+").
 */
export const JORGENSEN_SOURCE =
  'Jørgensen, Oxidation Numbers and Oxidation States (1969), as reproduced in Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984); values from memory';

/** f(ligand), dimensionless, f(H2O) = 1. From memory (Jørgensen 1969 via Lever 1984). */
export const JORGENSEN_F: ReadonlyMap<string, number> = new Map([
  ['Br', 0.72],
  ['SCN', 0.73],
  ['Cl', 0.78],
  ['N3', 0.83],
  ['F', 0.9],
  ['dmso', 0.91],
  ['urea', 0.91],
  ['dmf', 0.98],
  ['ox', 0.99],
  ['H2O', 1.0],
  ['NCS', 1.02],
  ['gly', 1.18],
  ['py', 1.23],
  ['NH3', 1.25],
  ['en', 1.28],
  ['bpy', 1.33],
  ['phen', 1.34],
  ['CN', 1.7],
]);

/** g(metal) in cm-1 (the 10Dq of the octahedral aqua ion when f = 1). From memory (Jørgensen 1969 via Lever 1984). */
export const JORGENSEN_G: ReadonlyMap<string, number> = new Map([
  ['Mn2+', 8000],
  ['Ni2+', 8700],
  ['Co2+', 9000],
  ['V2+', 12000],
  ['Fe3+', 14000],
  ['Cr3+', 17400],
  ['Co3+', 18200],
  ['Ru2+', 20000],
  ['Mn4+', 23000],
  ['Mo3+', 24000],
  ['Rh3+', 27000],
  ['Tc4+', 30000],
  ['Ir3+', 32000],
  ['Pt4+', 36000],
]);

/** h(ligand), dimensionless, h(H2O) = 1 by this table's scale. From memory (Jørgensen 1969 via Lever 1984). */
export const JORGENSEN_H: ReadonlyMap<string, number> = new Map([
  ['F', 0.8],
  ['H2O', 1.0],
  ['dmf', 1.2],
  ['urea', 1.2],
  ['NH3', 1.4],
  ['en', 1.5],
  ['ox', 1.5],
  ['Cl', 2.0],
  ['CN', 2.1],
  ['Br', 2.3],
  ['N3', 2.4],
  ['I', 2.7],
]);

/** k(metal), dimensionless. From memory (Jørgensen 1969 via Lever 1984). */
export const JORGENSEN_K: ReadonlyMap<string, number> = new Map([
  ['Mn2+', 0.07],
  ['V2+', 0.1],
  ['Ni2+', 0.12],
  ['Mo3+', 0.15],
  ['Cr3+', 0.2],
  ['Fe3+', 0.24],
  ['Rh3+', 0.28],
  ['Ir3+', 0.28],
  ['Tc4+', 0.3],
  ['Co3+', 0.33],
  ['Mn4+', 0.5],
  ['Pt4+', 0.6],
  ['Pd4+', 0.7],
  ['Ni4+', 0.8],
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
