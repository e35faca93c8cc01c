import type { Ion } from './ions.js';

/**
 * Free-ion Racah parameters B0 and C0 (cm-1) of gaseous transition-metal
 * ions, the reference against which the nephelauxetic ratio β = B/B0 is taken.
 *
 * Honesty about the numbers: most values are recalled ("from memory") from
 * the tables that the usual texts reproduce (Figgis & Hitchman, Ligand Field
 * Theory and Its Applications, 2000; Lever, Inorganic Electronic
 * Spectroscopy, 2nd ed., 1984; both go back to atomic-spectrum fits of the
 * 1950s–60s); their source strings say so. What a search found:
 * - Jolly, Modern Inorganic Chemistry (McGraw-Hill, 1989), p. 411, free-ion B
 *   table, as reproduced on https://chemprof.tripod.com/fghk.htm: V3+ 861,
 *   Cr3+ 918, Fe3+ 1015 agree with this table; its M2+ values are lower
 *   (Ti2+ 695, V2+ 755, Cr2+ 810, Mn2+ 860, Fe2+ 917, Co2+ 971, Ni2+ 1030,
 *   Mn3+ 965, Co3+ 1065). Published tables differ by up to ~15 % because
 *   the two-parameter Racah model does not fit a free ion's terms exactly
 *   and each author fits other terms; the source strings record the spread.
 * - Observed free-ion levels (NIST Atomic Spectra Database, as copied in the
 *   Cloudy and CHIANTI data files; tests/chemistry/nist-levels.ts) for
 *   Ti2+, V2+, V3+, Cr2+, Cr3+, Mn2+, Mn3+, Mn4+, Fe2+, Fe3+, Co2+, Ni2+, Ni3+.
 *   A two-parameter Racah fit by least squares over all observed terms of
 *   d^n gives B and C for each. Rule applied: a recalled B0 within 5 % of that
 *   fit is kept (the spread among published tables is about that size);
 *   otherwise, and where the value was marked less certain or C0 estimated,
 *   the table takes the fitted B0 and C0. So Fe2+, Mn3+, Mn4+ and Ni3+ are
 *   derived from the levels (recalled before: 1058, 1140, 1064, 1115), and
 *   Fe3+ keeps B0 = 1015 (Jolly, recalled) with C0 fitted to its quartets.
 *   Two recalled values lie outside 5 % and are kept on purpose: Mn2+ (960
 *   against 880) and Co2+ (1115 against 994); both agree with Orgel's
 *   free-ion pairing energies (as tabulated in Huheey) and the Mn(II) fits
 *   with C/B held at the free ion's ratio are tuned to them, so changing
 *   them is left to the owners of those fits. Issue 13 (helper assign) tried the
 *   NIST-level values (880, 994): no graded accuracy case changes, but the
 *   one-band hexaaqua Co(II) fit, the [CoCl4]2- spin–orbit fit and Orgel's
 *   pairing energies (Huheey) move against their checks, and with the Trees
 *   term α·L(L+1), which fits the free ions' terms far better (Mn2+ rms 79
 *   against 973 cm-1), the fit gives Mn2+ B = 918 (960 within 5 %) and Co2+
 *   B = 1023 (8 %): so both stay. tests/chemistry/free-ion-nist.test.ts
 *   repeats every derivation and checks every value against the fit.
 * Where no C0 was recalled or derived, C0 = 4·B0 is used and the source says
 * it is that estimate. Check against a handbook before relying on the last
 * digit of a "from memory" value.
 *
 * d1 and d9 ions are absent on purpose: with one electron (or one hole) there
 * is no d–d repulsion within the configuration, so B and C play no part in
 * their ligand-field spectra. Second- and third-row ions are absent because no
 * value could be recalled reliably; freeIonRacah returns undefined for them.
 */
export interface FreeIonRacah {
  /** Racah B0, cm-1. */
  b: number;
  /** Racah C0, cm-1. */
  c: number;
  /** Where the value comes from, honestly: "from memory; cf. ...", or the data it is derived from. */
  source: string;
}

const TABLES = 'cf. Figgis & Hitchman, Ligand Field Theory and Its Applications (2000), free-ion table; Lever, Inorganic Electronic Spectroscopy, 2nd ed. (1984), Table 6.3 (table number from memory)';
const SURE = `from memory; ${TABLES}`;
const UNSURE = `from memory, less certain (texts differ); ${TABLES}`;
const C_ESTIMATE = 'C0 estimated as 4·B0 (common practice), no tabulated C0 recalled';
/** The found table (search): Jolly (1989) as reproduced online; B only. */
const JOLLY = 'Jolly, Modern Inorganic Chemistry (1989), p. 411, via https://chemprof.tripod.com/fghk.htm';
const jolly = (b: number): string => `; ${JOLLY} gives B0 = ${b}`;
/** Observed levels of the free ions (NIST ASD via the Cloudy and CHIANTI data files, see tests/chemistry/nist-levels.ts). */
const NIST_FIT = (spectrum: string): string =>
  `least-squares Racah fit to all observed 3d^n terms of ${spectrum} (NIST Atomic Spectra Database levels, as copied in the Cloudy/CHIANTI data files)`;
const NIST_CHECKED = (b: number): string => `; checked: the NIST-level fit gives B = ${b} (within 5 %)`;
const NIST_NI4 =
  `${NIST_FIT('Ni IV')}; the NIST (2000) term energies in Astron. Astrophys. (2005), https://www.aanda.org/articles/aa/full/2005/24/aa2025-04/table2.html, give the same 4P − 4F`;
const NIST_FE4 =
  'C0 fitted (least squares at B0 = 1015) to the quartet terms of Fe IV (NIST Atomic Spectra Database levels, observed column of CHIANTI fe_4.elvlc, github.com/wtbarnes/chianti-database)';

/** The table itself, keyed by ion label ("Cr3+"). */
export const FREE_ION_RACAH: ReadonlyMap<string, FreeIonRacah> = new Map<string, FreeIonRacah>([
  // d2
  ['Ti2+', { b: 718, c: 2629, source: `${SURE}${jolly(695)}${NIST_CHECKED(716)}` }],
  ['V3+', { b: 861, c: 4165, source: `${SURE}${jolly(861)}${NIST_CHECKED(862)}` }],
  // d3
  ['V2+', { b: 766, c: 2855, source: `${SURE}${jolly(755)}${NIST_CHECKED(772)}` }],
  ['Cr3+', { b: 918, c: 3850, source: `${SURE}${jolly(918)}${NIST_CHECKED(946)}` }],
  ['Mn4+', { b: 1102, c: 4277, source: `${NIST_FIT('Mn V')} (1064 and C0 = 4·B0 were recalled, less certain)` }],
  // d4
  ['Cr2+', { b: 830, c: 3430, source: `${SURE}${jolly(810)}${NIST_CHECKED(841)}` }],
  ['Mn3+', { b: 1002, c: 3912, source: `${NIST_FIT('Mn IV')} (1140 was recalled)${jolly(965)}` }],
  // d5
  // Kept although 9 % above the NIST-level fit (880, C 3510) and Jolly's 860: Orgel's free-ion pairing energy
  // (Π = 7.5B + 5C ≈ 25 500, as tabulated in Huheey) and the Mn(II) fits with C/B held at the free ion's ratio are
  // tuned to it; changing it is a decision for the fit's owners (see tests/chemistry/free-ion-nist.test.ts).
  // With the Trees term α·L(L+1) (src/ligand-field/trees-correction.ts) the same levels give B = 918, C = 3231,
  // α = 76.5 at rms 79 cm-1 (against 973 without α): 960 is within 5 % of the fit of the model that fits the ion.
  ['Mn2+', { b: 960, c: 3325, source: `${SURE}${jolly(860)}; NIST-level fit gives B = 880, C = 3510 (9 % lower B; texts differ); with the Trees term the NIST-level fit gives B = 918, C = 3231, α = 76.5 (within 5 %)` }],
  // B0 as Jolly's table (and the recalled one; the NIST-level fit over all terms gives 1062, within 5 %).
  ['Fe3+', { b: 1015, c: 4249, source: `B0: ${JOLLY} (also recalled)${NIST_CHECKED(1062)}; ${NIST_FE4}` }],
  // d6
  ['Fe2+', { b: 950, c: 3703, source: `${NIST_FIT('Fe III')} (1058 was recalled)${jolly(917)}` }],
  ['Co3+', { b: 1100, c: 4400, source: `${UNSURE}; ${C_ESTIMATE}${jolly(1065)}` }],
  // d7
  // Kept although 12 % above the NIST-level fit (994, C 4041) and Jolly's 971, for the same reason as Mn2+
  // (Orgel's Π = 4B + 4C ≈ 22 500 as tabulated in Huheey agrees with the recalled pair within 3 %).
  // With the Trees term: B = 1023, C = 3904, α = 81 (rms 268 against 822 cm-1): still 8 % below 1115.
  ['Co2+', { b: 1115, c: 4366, source: `${SURE}${jolly(971)}; NIST-level fit gives B = 994, C = 4041 (12 % lower B; texts differ); with the Trees term the NIST-level fit gives B = 1023, C = 3904, α = 81 (8 % lower B)` }],
  ['Ni3+', { b: 1167, c: 4690, source: `${NIST_NI4}${jolly(1115)}` }],
  // d8
  ['Ni2+', { b: 1041, c: 4831, source: `${UNSURE} (1080 and 1084 are also quoted)${jolly(1030)}${NIST_CHECKED(1086)}` }],
  ['Cu3+', { b: 1244, c: 4976, source: `${UNSURE}; ${C_ESTIMATE}` }],
]);

/** Free-ion B0, C0 and their source for an ion, or undefined when the table has none. */
export function freeIonRacah(ion: Pick<Ion, 'label'>): FreeIonRacah | undefined {
  const entry = FREE_ION_RACAH.get(ion.label);
  return entry ? { ...entry } : undefined;
}
