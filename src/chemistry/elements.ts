/**
 * The periodic table as far as fieldgap needs it: every element symbol (so an
 * unknown symbol and a non-transition element get different messages) and, for
 * the d-block metals of groups 3 to 12, the group number, the transition row and
 * the English name. Group numbers follow the IUPAC 1–18 numbering (IUPAC
 * Periodic Table of the Elements); lanthanum is placed in group 3 with the
 * third transition row, as the brief of this project asks (La and Hf–Hg).
 */

export type TransitionRow = 1 | 2 | 3;

export interface TransitionElement {
  symbol: string;
  /** IUPAC group, 3 to 12. */
  group: number;
  /** 1: Sc–Zn (3d), 2: Y–Cd (4d), 3: La, Hf–Hg (5d). */
  row: TransitionRow;
  /** English name, IUPAC spelling ("aluminium", "caesium" style). */
  name: string;
}

// IUPAC Periodic Table of the Elements: group numbers 3–12, periods 4–6.
const ROWS: readonly (readonly [string, string][])[] = [
  [['Sc', 'scandium'], ['Ti', 'titanium'], ['V', 'vanadium'], ['Cr', 'chromium'], ['Mn', 'manganese'],
    ['Fe', 'iron'], ['Co', 'cobalt'], ['Ni', 'nickel'], ['Cu', 'copper'], ['Zn', 'zinc']],
  [['Y', 'yttrium'], ['Zr', 'zirconium'], ['Nb', 'niobium'], ['Mo', 'molybdenum'], ['Tc', 'technetium'],
    ['Ru', 'ruthenium'], ['Rh', 'rhodium'], ['Pd', 'palladium'], ['Ag', 'silver'], ['Cd', 'cadmium']],
  [['La', 'lanthanum'], ['Hf', 'hafnium'], ['Ta', 'tantalum'], ['W', 'tungsten'], ['Re', 'rhenium'],
    ['Os', 'osmium'], ['Ir', 'iridium'], ['Pt', 'platinum'], ['Au', 'gold'], ['Hg', 'mercury']],
];

/** The 30 transition metals fieldgap knows, keyed by symbol. */
export const TRANSITION_ELEMENTS: ReadonlyMap<string, TransitionElement> = new Map(
  ROWS.flatMap((row, r) =>
    row.map(([symbol, name], i): [string, TransitionElement] => [
      symbol,
      { symbol, name, group: 3 + i, row: (r + 1) as TransitionRow },
    ]),
  ),
);

/** All 118 element symbols in order of atomic number (IUPAC). */
export const ELEMENT_SYMBOLS: readonly string[] = (
  'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn ' +
  'Ga Ge As Se Br Kr Rb Sr Y Zr Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba ' +
  'La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au Hg Tl Pb Bi ' +
  'Po At Rn Fr Ra Ac Th Pa U Np Pu Am Cm Bk Cf Es Fm Md No Lr Rf Db Sg Bh Hs Mt Ds ' +
  'Rg Cn Nh Fl Mc Lv Ts Og'
).split(' ');

const SYMBOL_BY_LOWER = new Map(ELEMENT_SYMBOLS.map((s) => [s.toLowerCase(), s]));

/** The properly capitalised symbol for "cr", "CR" or "Cr", or undefined if no element has it. */
export function elementSymbolFromText(text: string): string | undefined {
  return SYMBOL_BY_LOWER.get(text.toLowerCase());
}
