import { JORGENSEN_F, JORGENSEN_G, JORGENSEN_H, JORGENSEN_K, JORGENSEN_SOURCE } from '../chemistry/jorgensen.js';
import type { Ion } from '../chemistry/ions.js';

/**
 * Every factor the formula-only prediction uses, with a one-standard-deviation
 * uncertainty and its source. Published values come from Jørgensen's table
 * (src/chemistry/jorgensen.ts, looked up); the rest are estimates, marked
 * `kind: 'estimate'`, placed by the ligand's position in the spectrochemical
 * (f) or nephelauxetic (h) series, with a wide uncertainty.
 *
 * Uncertainties: a published f or g is quoted to two figures, so σ is taken
 * as 3% (f) and 5% (g) of the value; an estimate gets 15–30%. h and k are
 * rougher (Jørgensen gives them to one or two figures): σ(h) = 0.2 and
 * σ(k) = 0.03 for published values. These σ are fieldgap's own judgement.
 */
export type FactorKind = 'published' | 'estimate' | 'user';

export interface FactorValue {
  value: number;
  /** One standard deviation, same unit as value. */
  sigma: number;
  kind: FactorKind;
  source: string;
  /** Set on a g that is the 10Dq of the ion's hexaaqua complex (an observed value), not a trend estimate. */
  aquaIon?: true;
}

export const SPECTROCHEMICAL_ESTIMATE = 'estimate from the spectrochemical series, wide uncertainty';
export const NEPHELAUXETIC_ESTIMATE = 'estimate from the nephelauxetic series, wide uncertainty';

const published = (value: number, sigma: number): FactorValue => ({ value, sigma, kind: 'published', source: JORGENSEN_SOURCE });
const estimate = (value: number, sigma: number, why: string): FactorValue => ({ value, sigma, kind: 'estimate', source: why });
/** g read off the hexaaqua ion: f(H2O) = 1, so g is its 10Dq. */
const aquaIon = (value: number, sigma: number, complex: string, why: string): FactorValue => ({ ...estimate(value, sigma, `g = 10Dq of ${complex}, ${why}`), aquaIon: true });

/**
 * f estimates for ligands Jørgensen's table lacks. Each is placed where the
 * spectrochemical series (I- < Br- < SCN- < Cl- < N3- < F- < OH- < ox ≈ H2O
 * < NCS- < py ≈ NH3 < en < bpy ≈ phen < NO2- < PR3 < CN- ≈ H- < CO: common
 * practice) puts it between tabulated neighbours.
 */
const F_ESTIMATES: ReadonlyMap<string, FactorValue> = new Map([
  ['I', estimate(0.65, 0.1, `${SPECTROCHEMICAL_ESTIMATE}: below Br- (0.72)`)],
  ['OH', estimate(0.94, 0.12, `${SPECTROCHEMICAL_ESTIMATE}: between F- (0.90) and H2O (1.00)`)],
  ['O', estimate(1.0, 0.3, `${SPECTROCHEMICAL_ESTIMATE}: oxido, strong π-donor, poorly placed`)],
  ['ONO', estimate(0.95, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: O-bound nitrito, near H2O and well below N-bound nitro (1.4)`)],
  ['NCO', estimate(1.0, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: N-bound cyanate, like NCS- (1.02)`)],
  ['urea', estimate(0.91, 0.1, `${SPECTROCHEMICAL_ESTIMATE}: O-bound, like Me2SO (0.91)`)],
  ['acac', estimate(1.0, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: O,O-chelate, like oxalate (0.99)`)],
  ['edta', estimate(1.1, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: N2O4, average environment of 2 amine N (1.28) and 4 carboxylate O (0.99)`)],
  ['dien', estimate(1.28, 0.1, `${SPECTROCHEMICAL_ESTIMATE}: amine N3, like en (1.28)`)],
  ['phen', estimate(1.34, 0.1, `${SPECTROCHEMICAL_ESTIMATE}: diimine, like bpy (1.33)`)],
  ['tpy', estimate(1.33, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: tridentate diimine, like bpy (1.33)`)],
  ['dtc', estimate(0.9, 0.15, `${SPECTROCHEMICAL_ESTIMATE}: S,S-chelate, near F- and thiourea`)],
  ['PPh3', estimate(1.5, 0.3, `${SPECTROCHEMICAL_ESTIMATE}: phosphane, between NO2- (1.4) and CN- (1.7)`)],
  ['PMe3', estimate(1.5, 0.3, `${SPECTROCHEMICAL_ESTIMATE}: phosphane, between NO2- (1.4) and CN- (1.7)`)],
  ['PEt3', estimate(1.5, 0.3, `${SPECTROCHEMICAL_ESTIMATE}: phosphane, between NO2- (1.4) and CN- (1.7)`)],
  ['PR3', estimate(1.5, 0.3, `${SPECTROCHEMICAL_ESTIMATE}: phosphane, between NO2- (1.4) and CN- (1.7)`)],
  ['H', estimate(1.7, 0.35, `${SPECTROCHEMICAL_ESTIMATE}: hydrido, beside CN- (1.7)`)],
  ['CO', estimate(1.9, 0.4, `${SPECTROCHEMICAL_ESTIMATE}: above CN- (1.7), the strongest common ligand`)],
]);

/** h estimates for ligands the table lacks (nephelauxetic series F < H2O < NH3 < en ≈ ox < Cl < CN < Br < I: common practice). */
const H_ESTIMATES: ReadonlyMap<string, FactorValue> = new Map([
  ['I', estimate(2.7, 0.4, `${NEPHELAUXETIC_ESTIMATE}: beyond Br- (2.3); 2.7 from memory (Jørgensen); the h table as found (chemprof.tripod.com/fghk.htm) has no I- entry`)],
  ['N3', estimate(2.4, 0.5, `${NEPHELAUXETIC_ESTIMATE}: near Br-; from memory (Jørgensen); the h table as found (chemprof.tripod.com/fghk.htm) gives f(N3-) = 0.83 but no h`)],
  ['dmf', estimate(1.2, 0.3, `${NEPHELAUXETIC_ESTIMATE}: O-donor like acetone (1.2)`)],
  ['urea', estimate(1.2, 0.3, `${NEPHELAUXETIC_ESTIMATE}: O-donor like acetone (1.2)`)],
  ['dmso', estimate(1.2, 0.3, `${NEPHELAUXETIC_ESTIMATE}: O-donor like acetone (1.2)`)],
  ['OH', estimate(1.2, 0.4, `${NEPHELAUXETIC_ESTIMATE}: O-donor, between H2O and NH3`)],
  ['acac', estimate(1.5, 0.4, `${NEPHELAUXETIC_ESTIMATE}: O,O-chelate like oxalate (1.5)`)],
  ['edta', estimate(1.5, 0.4, `${NEPHELAUXETIC_ESTIMATE}: like en and oxalate (1.5)`)],
  ['dien', estimate(1.5, 0.3, `${NEPHELAUXETIC_ESTIMATE}: like en (1.5)`)],
  ['SCN', estimate(2.3, 0.5, `${NEPHELAUXETIC_ESTIMATE}: S-donor, near Br-`)],
  ['dtc', estimate(2.5, 0.5, `${NEPHELAUXETIC_ESTIMATE}: S-donor, near Br-`)],
  ['CO', estimate(2.0, 0.6, `${NEPHELAUXETIC_ESTIMATE}: like CN- (2.0)`)],
  ['H', estimate(2.0, 0.6, `${NEPHELAUXETIC_ESTIMATE}: like CN- (2.0)`)],
]);
const H_DEFAULT_ESTIMATE = estimate(1.6, 0.6, `${NEPHELAUXETIC_ESTIMATE}: N- or O-donor, between NH3 (1.4) and Cl- (2.0)`);

/**
 * g estimates for ions the table lacks. The first five are the 10Dq of the
 * hexaaqua ion (g is that by definition, f(H2O) = 1); the rest follow the
 * trend common practice knows: g rises by about half from M2+ to M3+, and by
 * 30–50% from 3d to 4d and from 4d to 5d.
 */
const G_ESTIMATES: ReadonlyMap<string, FactorValue> = new Map([
  ['Ti3+', aquaIon(20300, 1500, '[Ti(H2O)6]3+', 'its band maximum at 20 300 cm-1 (University of Sheffield teaching page, looked up); Jahn–Teller broadened')],
  ['V3+', aquaIon(18600, 1500, '[V(H2O)6]3+', 'from memory')],
  ['Cr2+', aquaIon(14000, 2000, '[Cr(H2O)6]2+', 'from memory; Jahn–Teller distorted')],
  ['Mn3+', aquaIon(21000, 3000, '[Mn(H2O)6]3+', 'its d–d maximum at 21 000 cm-1 ("A spectrophotometric investigation of the aquomanganese(III) ion in perchlorate media", J. Chem. Soc. A (1967) 1858, looked up); Jahn–Teller distorted')],
  ['Cu2+', aquaIon(12600, 2000, '[Cu(H2O)6]2+', 'from memory; Jahn–Teller distorted')],
  ['Ru3+', estimate(28000, 5000, 'estimate: like Rh3+ (27 000), wide uncertainty')],
  ['Os2+', estimate(27000, 7000, 'estimate: Ru2+ (20 000) × 1.35 for 5d, wide uncertainty')],
  ['Os3+', estimate(35000, 8000, 'estimate: like Ir3+ (32 000), wide uncertainty')],
  ['Pd2+', estimate(20000, 6000, 'estimate: 4d M2+ like Ru2+ (20 000), wide uncertainty')],
  ['Pt2+', estimate(26000, 8000, 'estimate: Pd2+ × 1.3 for 5d, wide uncertainty')],
  ['Au3+', estimate(30000, 9000, 'estimate: 5d M3+ between Ir3+ (32 000) and Ag3+ (20 400) × 1.3, wide uncertainty')],
]);

/** Typical first-row g by oxidation state for any ion not listed (common practice, very rough). */
const G_BY_CHARGE: Record<number, number> = { 0: 8000, 1: 8000, 2: 9000, 3: 17000, 4: 23000 };
const ROW_FACTOR: Record<number, number> = { 1: 1, 2: 1.45, 3: 1.9 };

/** k estimates by oxidation state (Jørgensen's k rise with the charge: 0.07–0.12 for M2+, 0.15–0.35 for M3+, 0.5 for M4+). */
function kByCharge(charge: number): FactorValue {
  if (charge <= 2) return estimate(0.1, 0.05, 'estimate: typical k of M2+ (0.07–0.12 in Jørgensen\'s table), wide uncertainty');
  if (charge === 3) return estimate(0.25, 0.1, 'estimate: typical k of M3+ (0.15–0.35 in Jørgensen\'s table), wide uncertainty');
  return estimate(0.5, 0.2, 'estimate: typical k of M4+ (0.5 in Jørgensen\'s table), wide uncertainty');
}

/** f of a ligand key: published, else an estimate; undefined only for a ligand fieldgap cannot place. */
export function ligandF(key: string): FactorValue | undefined {
  const value = JORGENSEN_F.get(key);
  if (value !== undefined) return published(value, 0.03 * value);
  const guess = F_ESTIMATES.get(key);
  return guess ? { ...guess } : undefined;
}

/** h of a ligand key: published, else an estimate (a generic one when nothing better is known). */
export function ligandH(key: string): FactorValue {
  const value = JORGENSEN_H.get(key);
  if (value !== undefined) return published(value, 0.2);
  return { ...(H_ESTIMATES.get(key) ?? H_DEFAULT_ESTIMATE) };
}

/** g of an ion in cm-1: published, else an aqua-ion or trend estimate (always some value, σ ≥ 5%). */
export function metalG(ion: Pick<Ion, 'label' | 'charge' | 'row'>): FactorValue {
  const value = JORGENSEN_G.get(ion.label);
  if (value !== undefined) return published(value, 0.05 * value);
  const guess = G_ESTIMATES.get(ion.label);
  if (guess) return { ...guess };
  const base = G_BY_CHARGE[Math.max(0, Math.min(4, ion.charge))] as number;
  const g = Math.round((base * (ROW_FACTOR[ion.row] ?? 1)) / 100) * 100;
  return estimate(g, 0.35 * g, `estimate from the oxidation state (+${ion.charge}) and the row (${ion.row === 1 ? '3d' : ion.row === 2 ? '4d' : '5d'}): typical g, very wide uncertainty`);
}

/** k of an ion: published, else an estimate from its oxidation state. */
export function metalK(ion: Pick<Ion, 'label' | 'charge'>): FactorValue {
  const value = JORGENSEN_K.get(ion.label);
  if (value !== undefined) return published(value, 0.03);
  return kByCharge(ion.charge);
}

/** Every ligand key with an f (published or estimated), for messages. */
export function ligandsWithF(): string[] {
  return [...JORGENSEN_F.keys(), ...F_ESTIMATES.keys()];
}
