import type { Ion } from './ions.js';

/**
 * The highest oxidation state each d-block metal is known in, so that an ion
 * above it ("Fe7+", "Zn3+": a typing slip more often than a compound) is
 * analysed as asked but with a warning (never a refusal: the d-count of the
 * formal charge is still well defined).
 *
 * Source: the list of known oxidation states in Wikipedia's "List of
 * oxidation states of the elements", which is "based on Greenwood's"
 * (N. N. Greenwood, A. Earnshaw, Chemistry of the Elements, 2nd ed.,
 * Butterworth–Heinemann 1997) "with all additions noted"; the highest
 * positive state of each row is taken. Where that list's maximum rests on a
 * species made only in the gas phase or by matrix isolation (the list's
 * notes), `isolable` is the highest state of compounds that can be put in a
 * cuvette, and `beyond` says what lies above it:
 * - iron: +7 and +8 listed with notes; Greenwood & Earnshaw's own iron
 *   goes to +6 (ferrate(VI)), as do other element tables (e.g. University of
 *   Turku, imc.utu.fi/elements/iron.php: "Oxidation states: 6, 5, 4, 3, 2, 1");
 * - iridium: the list gives +6; IrO4 (+8) was made in an argon matrix at 6 K
 *   (Gong, Zhou, Kaupp, Riedel, Angew. Chem. Int. Ed. 2009) and [IrO4]+
 *   (+9) in the gas phase (Wang et al., Nature 514, 475–477, 2014);
 * - mercury: +4 is listed with a note; HgF4 was seen by matrix isolation
 *   only (Wang, Andrews, Riedel, Kaupp, Angew. Chem. Int. Ed. 2007: from memory).
 */
export interface KnownOxidationStates {
  /** Highest oxidation state of compounds that can be isolated. */
  isolable: number;
  /** Higher states reported only in the gas phase or in matrix isolation, with the highest of them. */
  beyond?: { highest: number; how: string };
}

export const OXIDATION_STATES_SOURCE = 'Greenwood & Earnshaw, Chemistry of the Elements, 2nd ed. 1997, as listed in Wikipedia\'s "List of oxidation states of the elements"';

const GAS_OR_MATRIX = 'only in the gas phase or in matrix isolation';

/** Keyed by element symbol; every transition metal of src/chemistry/elements.ts. */
export const HIGHEST_OXIDATION_STATES: ReadonlyMap<string, KnownOxidationStates> = new Map<string, KnownOxidationStates>([
  ['Sc', { isolable: 3 }], ['Ti', { isolable: 4 }], ['V', { isolable: 5 }], ['Cr', { isolable: 6 }], ['Mn', { isolable: 7 }],
  ['Fe', { isolable: 6, beyond: { highest: 8, how: GAS_OR_MATRIX } }], ['Co', { isolable: 5 }], ['Ni', { isolable: 4 }], ['Cu', { isolable: 4 }], ['Zn', { isolable: 2 }],
  ['Y', { isolable: 3 }], ['Zr', { isolable: 4 }], ['Nb', { isolable: 5 }], ['Mo', { isolable: 6 }], ['Tc', { isolable: 7 }],
  ['Ru', { isolable: 8 }], ['Rh', { isolable: 6 }], ['Pd', { isolable: 4 }], ['Ag', { isolable: 3 }], ['Cd', { isolable: 2 }],
  ['La', { isolable: 3 }], ['Hf', { isolable: 4 }], ['Ta', { isolable: 5 }], ['W', { isolable: 6 }], ['Re', { isolable: 7 }],
  ['Os', { isolable: 8 }], ['Ir', { isolable: 6, beyond: { highest: 9, how: GAS_OR_MATRIX } }], ['Pt', { isolable: 6 }], ['Au', { isolable: 5 }],
  ['Hg', { isolable: 2, beyond: { highest: 4, how: GAS_OR_MATRIX } }],
]);

/**
 * A warning for an ion above the highest oxidation state its element is
 * known in, naming the source and the d-count the result assumes; null for a
 * known one (and for 0 or negative states, which carbonyls and the like
 * reach and which have their own notes).
 *
 * "Fe7+: iron is not known above +6 in compounds that can be isolated
 * (+7 and +8 only in the gas phase or in matrix isolation; Greenwood &
 * Earnshaw …); the result assumes d1"
 */
export function oxidationStateWarning(ion: Pick<Ion, 'symbol' | 'charge' | 'd' | 'label' | 'name'>): string | null {
  const known = HIGHEST_OXIDATION_STATES.get(ion.symbol);
  const note = oxidationStateNote(ion);
  if (known === undefined || note === null) return null;
  const beyond = known.beyond;
  const reported = beyond === undefined
    ? ''
    : `${rangeText(known.isolable + 1, beyond.highest)} ${beyond.how}${ion.charge > beyond.highest ? `, nothing above +${beyond.highest}` : ''}; `;
  return `${ion.label}: ${note} (${reported}${OXIDATION_STATES_SOURCE}); the result assumes d${ion.d}, as the charge given says`;
}

/** The short form, for a message that names the ion already: "iron is not known above +6 in compounds that can be isolated"; null for a known state. */
export function oxidationStateNote(ion: Pick<Ion, 'symbol' | 'charge' | 'name'>): string | null {
  const known = HIGHEST_OXIDATION_STATES.get(ion.symbol);
  if (known === undefined || ion.charge <= known.isolable) return null;
  return `${ion.name ?? ion.symbol} is not known above +${known.isolable}${known.beyond === undefined ? '' : ' in compounds that can be isolated'}`;
}

/** "+7", "+7 and +8", "+7 to +9". */
function rangeText(low: number, high: number): string {
  if (low === high) return `+${low}`;
  return high === low + 1 ? `+${low} and +${high}` : `+${low} to +${high}`;
}
