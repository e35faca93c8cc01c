/**
 * What the formula and ligand fields of a real library hold, for the seeded
 * series tests (series-identical, series-columns): formulas fieldgap reads
 * (mixed, chelating), one it does not, and none; ligand names in several
 * spellings, one ligand nobody tabulates, and none.
 */
export const SERIES_FORMULAS = ['[Cr(H2O)6]Cl3', '[Cr(NH3)6]Cl3', '[Cr(en)3]Cl3', '[Cr(NH3)5Cl]Cl2', 'K3[Cr(ox)3]', 'K3[Cr(CN)6]', 'my own complex', undefined];
export const SERIES_LIGAND_LISTS = [['H2O'], ['ammine'], ['NH3', 'Cl'], ['urea'], ['L1'], [], ['F']];
