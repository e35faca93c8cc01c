/**
 * Common ligands: the formula as written inside a complex's brackets, the
 * usual abbreviations and names, charge, denticity and donor atoms. These are
 * facts of the trade (common practice; names follow IUPAC's ligand names,
 * Nomenclature of Inorganic Chemistry, 2005, where there is one).
 *
 * Linkage isomers are separate ligands, told apart the usual way by the atom
 * written first: "NCS" is N-bound isothiocyanato, "SCN" S-bound thiocyanato;
 * "NO2" is N-bound nitro, "ONO" O-bound nitrito.
 */
export interface Ligand {
  /** The canonical key, the formula or abbreviation fieldgap prints: "NH3", "en". */
  key: string;
  /** Formula as written in a complex: "NH3", "C2O4". */
  formula: string;
  /** Other spellings accepted in brackets, case-insensitive: "ox", "bipy". */
  abbreviations: readonly string[];
  /** Ligand names, first the IUPAC ligand name: "ammine". */
  names: readonly string[];
  /** Charge of the free ligand: -1 for Cl-, 0 for NH3, -4 for edta. */
  charge: number;
  /** Number of donor atoms bound to one metal. */
  denticity: number;
  /** Donor atoms, one per bond: ["N", "N"] for en. */
  donors: readonly string[];
  /** Written without brackets in formulas ([CoCl4]2-, [Co(NH3)5Cl]2+). */
  bare: boolean;
}

type Row = [key: string, formula: string, abbreviations: string[], names: string[], charge: number, donors: string, bare?: boolean];

// common practice
const ROWS: Row[] = [
  ['F', 'F', [], ['fluorido', 'fluoro', 'fluoride'], -1, 'F', true],
  ['Cl', 'Cl', [], ['chlorido', 'chloro', 'chloride'], -1, 'Cl', true],
  ['Br', 'Br', [], ['bromido', 'bromo', 'bromide'], -1, 'Br', true],
  ['I', 'I', [], ['iodido', 'iodo', 'iodide'], -1, 'I', true],
  ['OH', 'OH', [], ['hydroxido', 'hydroxo', 'hydroxide'], -1, 'O', true],
  ['O', 'O', [], ['oxido', 'oxo', 'oxide'], -2, 'O', true],
  ['H2O', 'H2O', ['OH2', 'aq'], ['aqua', 'water'], 0, 'O', true],
  ['NH3', 'NH3', [], ['ammine', 'ammonia'], 0, 'N', true],
  ['CN', 'CN', [], ['cyanido', 'cyano', 'cyanide'], -1, 'C', true],
  ['CO', 'CO', [], ['carbonyl'], 0, 'C', true],
  ['NCS', 'NCS', [], ['isothiocyanato', 'thiocyanato-N'], -1, 'N', true],
  ['SCN', 'SCN', [], ['thiocyanato', 'thiocyanato-S'], -1, 'S', true],
  ['NO2', 'NO2', [], ['nitro', 'nitrito-N'], -1, 'N', true],
  ['ONO', 'ONO', [], ['nitrito', 'nitrito-O'], -1, 'O', true],
  ['N3', 'N3', [], ['azido', 'azide'], -1, 'N', true],
  ['NCO', 'NCO', [], ['cyanato-N', 'isocyanato'], -1, 'N', true],
  ['en', 'C2H8N2', ['NH2CH2CH2NH2', 'H2NCH2CH2NH2'], ['ethylenediamine', 'ethane-1,2-diamine'], 0, 'N N'],
  ['ox', 'C2O4', [], ['oxalato', 'oxalate'], -2, 'O O'],
  ['py', 'C5H5N', [], ['pyridine'], 0, 'N'],
  ['bpy', 'C10H8N2', ['bipy'], ['2,2′-bipyridine', "2,2'-bipyridine", 'bipyridine'], 0, 'N N'],
  ['phen', 'C12H8N2', [], ['1,10-phenanthroline', 'phenanthroline'], 0, 'N N'],
  ['acac', 'C5H7O2', [], ['acetylacetonato', 'pentane-2,4-dionato'], -1, 'O O'],
  ['edta', 'C10H12N2O8', [], ['ethylenediaminetetraacetato'], -4, 'N N O O O O'],
  ['dien', 'C4H13N3', [], ['diethylenetriamine'], 0, 'N N N'],
  ['tpy', 'C15H11N3', ['terpy'], ['2,2′:6′,2″-terpyridine', 'terpyridine'], 0, 'N N N'],
  ['gly', 'C2H4NO2', ['glyO'], ['glycinato'], -1, 'N O'],
  ['urea', 'CO(NH2)2', ['OC(NH2)2'], ['urea'], 0, 'O'],
  ['dmso', 'C2H6OS', ['Me2SO', '(CH3)2SO'], ['dimethyl sulfoxide'], 0, 'O'],
  ['dmf', 'C3H7NO', ['Me2NCHO'], ['N,N-dimethylformamide'], 0, 'O'],
  ['MeCN', 'CH3CN', ['NCMe', 'NCCH3', 'acn'], ['acetonitrile'], 0, 'N'],
  ['PPh3', 'PPh3', ['P(C6H5)3'], ['triphenylphosphane', 'triphenylphosphine'], 0, 'P'],
  ['PMe3', 'PMe3', ['P(CH3)3'], ['trimethylphosphane', 'trimethylphosphine'], 0, 'P'],
  ['PEt3', 'PEt3', ['P(C2H5)3'], ['triethylphosphane', 'triethylphosphine'], 0, 'P'],
  ['PR3', 'PR3', ['phosphine', 'phosphane'], ['trialkylphosphane (generic)'], 0, 'P'],
  ['H', 'H', [], ['hydrido', 'hydride'], -1, 'H', true],
  ['tu', 'SC(NH2)2', ['thiourea'], ['thiourea'], 0, 'S'],
  ['dtc', 'S2CNEt2', ['Et2dtc', 'S2CN(C2H5)2'], ['diethyldithiocarbamato', 'N,N-diethyldithiocarbamato'], -1, 'S S'],
];

/** Every ligand fieldgap knows, in table order. */
export const LIGANDS: readonly Ligand[] = ROWS.map(([key, formula, abbreviations, names, charge, donors, bare]) => {
  const donorList = donors.split(' ');
  return { key, formula, abbreviations, names, charge, denticity: donorList.length, donors: donorList, bare: bare ?? false };
});

const BY_KEY = new Map(LIGANDS.map((l) => [l.key, l]));
const EXACT = new Map<string, Ligand>();
const FOLDED = new Map<string, Ligand>();
for (const ligand of LIGANDS) {
  for (const spelling of [ligand.key, ligand.formula, ...ligand.abbreviations]) EXACT.set(spelling, ligand);
  for (const spelling of [ligand.key, ...ligand.abbreviations, ...ligand.names]) FOLDED.set(spelling.toLowerCase(), ligand);
}

/** The ligand with this canonical key ("NH3", "en"), or undefined. */
export function ligandByKey(key: string): Ligand | undefined {
  return BY_KEY.get(key);
}

/**
 * The ligand written as `text` ("NH3", "C2O4", "ox", "EDTA", "ammine"), or
 * undefined. Formulas match exactly (so "CO" is carbonyl); abbreviations and
 * names also match case-insensitively. A trailing charge ("CN-", "C2O4 2-",
 * "NCS−") is ignored when it agrees with the ligand's own charge.
 */
export function findLigand(text: string): Ligand | undefined {
  const trimmed = text.trim();
  const direct = EXACT.get(trimmed) ?? FOLDED.get(trimmed.toLowerCase());
  if (direct) return direct;
  const charged = /^(.*?)\s*\^?(\d*)([+\-−])$/.exec(trimmed);
  if (!charged) return undefined;
  const base = EXACT.get(charged[1] as string) ?? FOLDED.get((charged[1] as string).toLowerCase());
  const size = charged[2] === '' ? 1 : Number(charged[2]);
  const charge = charged[3] === '+' ? size : -size;
  return base && base.charge === charge ? base : undefined;
}

// Spellings that may stand without brackets, longest first so "NCS" wins over "N...".
const BARE: readonly { spelling: string; ligand: Ligand }[] = LIGANDS.filter((l) => l.bare)
  .flatMap((ligand) => [ligand.formula, ...ligand.abbreviations.filter((a) => /^[A-Z]/.test(a))].map((spelling) => ({ spelling, ligand })))
  .sort((a, b) => b.spelling.length - a.spelling.length);

/**
 * The ligand written without brackets at `index` of `text` ("Cl" in
 * "[Co(NH3)5Cl]", "Cl" in "[CoCl4]"), longest spelling first and case-sensitive,
 * or undefined.
 */
export function bareLigandAt(text: string, index: number): { spelling: string; ligand: Ligand } | undefined {
  return BARE.find(({ spelling }) => text.startsWith(spelling, index));
}
