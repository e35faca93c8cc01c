/**
 * Counter-ions that stand outside a complex's brackets in a salt's formula,
 * with their charges (common practice). Cations come before the complex
 * (K3[Fe(C2O4)3], (NEt4)2[NiCl4]); anions after it ([Ni(NH3)6]Cl2,
 * [Cu(H2O)6](NO3)2). Alternative spellings of one ion share an entry.
 */
export interface CounterIon {
  /** Canonical formula: "NO3", "NEt4". */
  formula: string;
  charge: number;
  /** Other spellings: "Et4N". */
  spellings: readonly string[];
}

// common practice
const CATIONS: CounterIon[] = [
  { formula: 'H', charge: 1, spellings: [] },
  { formula: 'Li', charge: 1, spellings: [] },
  { formula: 'Na', charge: 1, spellings: [] },
  { formula: 'K', charge: 1, spellings: [] },
  { formula: 'Rb', charge: 1, spellings: [] },
  { formula: 'Cs', charge: 1, spellings: [] },
  { formula: 'Mg', charge: 2, spellings: [] },
  { formula: 'Ca', charge: 2, spellings: [] },
  { formula: 'Sr', charge: 2, spellings: [] },
  { formula: 'Ba', charge: 2, spellings: [] },
  { formula: 'NH4', charge: 1, spellings: [] },
  { formula: 'NMe4', charge: 1, spellings: ['Me4N', 'N(CH3)4'] },
  { formula: 'NEt4', charge: 1, spellings: ['Et4N', 'N(C2H5)4'] },
  { formula: 'NBu4', charge: 1, spellings: ['Bu4N', 'nBu4N', 'NnBu4'] },
  { formula: 'PPh4', charge: 1, spellings: ['Ph4P'] },
  { formula: 'AsPh4', charge: 1, spellings: ['Ph4As'] },
];

// common practice
const ANIONS: CounterIon[] = [
  { formula: 'F', charge: -1, spellings: [] },
  { formula: 'Cl', charge: -1, spellings: [] },
  { formula: 'Br', charge: -1, spellings: [] },
  { formula: 'I', charge: -1, spellings: [] },
  { formula: 'OH', charge: -1, spellings: [] },
  { formula: 'CN', charge: -1, spellings: [] },
  { formula: 'NCS', charge: -1, spellings: ['SCN'] },
  { formula: 'NO3', charge: -1, spellings: [] },
  { formula: 'NO2', charge: -1, spellings: [] },
  { formula: 'ClO4', charge: -1, spellings: [] },
  { formula: 'BF4', charge: -1, spellings: [] },
  { formula: 'PF6', charge: -1, spellings: [] },
  { formula: 'BPh4', charge: -1, spellings: ['B(C6H5)4'] },
  { formula: 'CF3SO3', charge: -1, spellings: ['OTf', 'SO3CF3'] },
  { formula: 'SO4', charge: -2, spellings: [] },
  { formula: 'CO3', charge: -2, spellings: [] },
  { formula: 'C2O4', charge: -2, spellings: [] },
  { formula: 'PO4', charge: -3, spellings: [] },
];

function byLongestSpelling(list: CounterIon[]): { spelling: string; ion: CounterIon }[] {
  return list
    .flatMap((ion) => [ion.formula, ...ion.spellings].map((spelling) => ({ spelling, ion })))
    .sort((a, b) => b.spelling.length - a.spelling.length);
}

const CATION_SPELLINGS = byLongestSpelling(CATIONS);
const ANION_SPELLINGS = byLongestSpelling(ANIONS);

/** The cation or anion spelled exactly `text` ("NEt4", "Et4N", "ClO4"), or undefined. */
export function counterIonByFormula(text: string, kind: 'cation' | 'anion'): CounterIon | undefined {
  return (kind === 'cation' ? CATION_SPELLINGS : ANION_SPELLINGS).find((e) => e.spelling === text)?.ion;
}

/** The counter-ion spelled at `index` of `text`, longest spelling first, case-sensitive; or undefined. */
export function counterIonAt(
  text: string,
  index: number,
  kind: 'cation' | 'anion',
): { spelling: string; ion: CounterIon } | undefined {
  return (kind === 'cation' ? CATION_SPELLINGS : ANION_SPELLINGS).find(({ spelling }) => text.startsWith(spelling, index));
}
