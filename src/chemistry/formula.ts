import { FieldgapError, isFieldgapError } from '../errors.js';
import type { Geometry } from '../ligand-field/types.js';
import { elementSymbolFromText, TRANSITION_ELEMENTS } from './elements.js';
import { chargeAt, FormulaScanner } from './formula-scan.js';
import { readCounterIon, readHydrate } from './formula-salt.js';
import { guessGeometry } from './geometry-guess.js';
import { ionFromOxidationState, ionLabel, type Ion } from './ions.js';
import { bareLigandAt, findLigand, type Ligand } from './ligands.js';

/** One kind of ligand in a complex, with how many there are. */
export interface LigandCount {
  /** Canonical key: "NH3", "en", "Cl". */
  key: string;
  /** IUPAC ligand name: "ammine". */
  name: string;
  count: number;
  /** Charge of one ligand. */
  charge: number;
  denticity: number;
  donors: readonly string[];
}

export interface CounterIonCount {
  formula: string;
  count: number;
  /** Charge of one counter-ion. */
  charge: number;
}

/** What a formula says about its complex ion. */
export interface ParsedComplex {
  /** The text as given. */
  formula: string;
  /** The complex ion, rewritten: "[Co(NH3)6]3+". */
  complexIon: string;
  /** The metal in its oxidation state (charge = oxidation state, d = d-count). */
  metal: Ion;
  oxidationState: number;
  d: number;
  /** Charge of one complex ion. */
  complexCharge: number;
  /** Where the complex's charge came from; 'assumed-neutral' comes with a warning. */
  chargeSource: 'stated' | 'counter-ions' | 'assumed-neutral';
  /** How many complex ions one formula unit has ([Cr(H2O)6]2(SO4)3: 2). */
  complexCount: number;
  /** In the order written; one entry per kind. */
  ligands: LigandCount[];
  counterIons: CounterIonCount[];
  /** Water of crystallisation outside the complex ("·6H2O"); 0 when none. */
  hydrateWater: number;
  /** Σ count × denticity. */
  coordinationNumber: number;
  /** Guessed from the coordination number only (6 octahedral, 4 tetrahedral); undefined for others. */
  geometry: Geometry | undefined;
  /** Always true: the geometry is never read from the formula, only guessed. */
  geometryIsGuess: true;
  warnings: string[];
}

/**
 * Reads a complex's formula. Accepted forms:
 *   [Ni(NH3)6]Cl2, K3[Fe(C2O4)3], [Co(en)2Cl2]+, [Co(NH3)6]3+, [CoCl4]2-,
 *   [Co(NH3)6]^3+, (NEt4)2[NiCl4], [Cr(H2O)6]2(SO4)3, [Cr(H2O)6]Cl3·6H2O,
 *   and a complex ion without brackets when its charge follows a space or ^:
 *   "CoCl4 2-", "Co(NH3)6^3+", "Cr(CO)6". Without brackets everything is the
 *   complex (no counter-ions can be told apart).
 * The metal comes first inside the brackets; ligands are in parentheses
 * ((NH3), (en), (C2O4)) or bare when their formula starts with a capital
 * (Cl, CN, NH3, H2O, OH). The complex's charge is the stated one, else the
 * one that balances the counter-ions, else 0 with a warning.
 * Throws FieldgapError('parse-error', "... at character N of ...", 'formula').
 */
export function parseFormula(text: string): ParsedComplex {
  const scan = new FormulaScanner(text);
  if (scan.text.trim() === '') throw new FieldgapError('parse-error', 'the formula is empty', 'formula');
  scan.checkBrackets();
  scan.skipSpaces();
  const bracketAt = scan.text.indexOf('[');
  if (bracketAt < 0) return parseBareComplex(scan, text);

  const warnings: string[] = [];
  const counterIons: CounterIonCount[] = [];
  while (scan.index < bracketAt) {
    counterIons.push(readCounterIon(scan, 'cation'));
    scan.skipSpaces();
  }
  const close = scan.closing(bracketAt);
  scan.index = bracketAt + 1;
  const { metalSymbol, metalAt, ligands } = readInside(scan, close);
  scan.index = close + 1;
  let stated: number | undefined;
  const charge = chargeAt(scan.text, scan.index);
  if (charge) {
    stated = charge.charge;
    scan.index += charge.length;
  }
  const complexCount = stated === undefined ? scan.count(1) : 1;
  const hydrate = { water: 0 };
  scan.skipSpaces();
  while (!scan.done) {
    if (readHydrate(scan, hydrate)) break;
    if (scan.peek() === '[') throw scan.error('a second complex ion is not supported');
    counterIons.push(readCounterIon(scan, 'anion'));
    scan.skipSpaces();
  }
  if (stated !== undefined && counterIons.length > 0) {
    throw scan.error('give either the charge of the complex or its counter-ions, not both', close + 1);
  }
  const counterCharge = counterIons.reduce((sum, c) => sum + c.count * c.charge, 0);
  let complexCharge: number;
  let chargeSource: ParsedComplex['chargeSource'];
  if (stated !== undefined) {
    complexCharge = stated;
    chargeSource = 'stated';
  } else if (counterIons.length > 0) {
    if (counterCharge % complexCount !== 0) {
      throw scan.error(`charges do not balance: counter-ions of total charge ${signed(counterCharge)} cannot be shared by ${complexCount} complex ions`, close + 1);
    }
    complexCharge = -counterCharge / complexCount;
    chargeSource = 'counter-ions';
  } else {
    complexCharge = 0;
    chargeSource = 'assumed-neutral';
    warnings.push('no charge and no counter-ions given: the complex is taken as neutral');
  }
  return assemble({ text, scan, metalSymbol, metalAt, ligands, complexCharge, chargeSource, complexCount, counterIons, hydrateWater: hydrate.water, warnings });
}

function parseBareComplex(scan: FormulaScanner, text: string): ParsedComplex {
  const warnings: string[] = [];
  const m = /^(.*?)(?:\s+|\s*\^\s*)([+-]?\d*[+-]?)\s*$/.exec(scan.text);
  let end = scan.text.trimEnd().length;
  let complexCharge = 0;
  let chargeSource: ParsedComplex['chargeSource'] = 'assumed-neutral';
  if (m && m[2] !== '' && /[+-]/.test(m[2] as string)) {
    const charge = chargeAt(m[2] as string, 0);
    if (!charge || charge.length !== (m[2] as string).length) throw scan.error(`cannot read the charge "${m[2]}"`, (m[1] as string).length);
    end = (m[1] as string).length;
    complexCharge = charge.charge;
    chargeSource = 'stated';
  } else if (/[+-]$/.test(scan.text.trim())) {
    throw scan.error('without brackets, write the charge after a space or ^ ("CoCl4 2-") or use brackets ("[CoCl4]2-")', scan.text.trimEnd().length - 1);
  } else {
    warnings.push('no charge given: the complex is taken as neutral');
  }
  scan.skipSpaces();
  const { metalSymbol, metalAt, ligands } = readInside(scan, end);
  const parsed = assemble({ text, scan, metalSymbol, metalAt, ligands, complexCharge, chargeSource, complexCount: 1, counterIons: [], hydrateWater: 0, warnings });
  if (parsed.geometry === undefined) {
    parsed.warnings.push('without brackets every group counts as a ligand: if some are counter-ions, write the complex in brackets ("[Co(NH3)6]Cl3")');
  }
  return parsed;
}

interface LigandAt {
  ligand: Ligand;
  count: number;
  at: number;
}

/** Reads the metal and ligands from scan.index up to (not including) `end`. */
function readInside(scan: FormulaScanner, end: number): { metalSymbol: string; metalAt: number; ligands: LigandAt[] } {
  const metalAt = scan.index;
  const metalSymbol = readMetal(scan);
  const ligandsStart = scan.index;
  const ligands: LigandAt[] = [];
  while (scan.index < end) {
    const at = scan.index;
    if (/\s/.test(scan.peek())) {
      scan.index += 1;
      continue;
    }
    let ligand: Ligand | undefined;
    if (scan.peek() === '(' || scan.peek() === '{') {
      const close = scan.closing(at);
      const inner = scan.text.slice(at + 1, close);
      ligand = findLigand(inner);
      if (!ligand) throw scan.error(`unknown ligand "${inner}"`, at + 1);
      scan.index = close + 1;
    } else {
      const bare = bareLigandAt(scan.text, at);
      // "[Cr2O7]2-", "[Fe2(CO)9]": a count right after the metal is a second metal atom, not a ligand.
      const metalCount = at === ligandsStart ? /^\d+/.exec(scan.text.slice(at))?.[0] : undefined;
      if (!bare && metalCount && Number(metalCount) > 1) {
        throw scan.error(`${metalCount} ${metalSymbol} atoms: a formula with more than one metal centre cannot be read: write one centre with its own ligands (a spectrum of the compound can still be analysed with --ion)`, at);
      }
      if (!bare) throw scan.error(`cannot read a ligand in "${scan.text.slice(at, end)}" (write unknown or abbreviated ligands in parentheses, e.g. (en))`, at);
      ligand = bare.ligand;
      scan.index += bare.spelling.length;
    }
    const count = scan.count(1);
    if (count === 0) throw scan.error(`a ligand count of 0`, at);
    ligands.push({ ligand, count, at });
  }
  if (ligands.length === 0) throw scan.error('no ligands after the metal', scan.index);
  return { metalSymbol, metalAt, ligands };
}

/** The transition-metal symbol at scan.index (two letters before one: "Co" not "C"). */
function readMetal(scan: FormulaScanner): string {
  const at = scan.index;
  const two = /^[A-Z][a-z]/.test(scan.text.slice(at, at + 2)) ? scan.text.slice(at, at + 2) : '';
  const one = /^[A-Z]/.test(scan.peek()) ? scan.peek() : '';
  for (const candidate of [two, one]) {
    if (candidate && TRANSITION_ELEMENTS.has(candidate)) {
      scan.index += candidate.length;
      return candidate;
    }
  }
  const element = (two && elementSymbolFromText(two) === two ? two : undefined) ?? (one && elementSymbolFromText(one) ? one : undefined);
  if (element) throw scan.error(`${element} is not a transition metal (the metal must come first in the complex)`, at);
  const letters = /^[A-Za-z][a-z]?/.exec(scan.text.slice(at))?.[0];
  if (!letters) throw scan.error('expected the metal symbol first in the complex', at);
  throw scan.error(`unknown element "${letters}" where the metal should be`, at);
}

function signed(n: number): string {
  return n > 0 ? `+${n}` : String(n);
}

interface Parts {
  text: string;
  scan: FormulaScanner;
  metalSymbol: string;
  metalAt: number;
  ligands: LigandAt[];
  complexCharge: number;
  chargeSource: ParsedComplex['chargeSource'];
  complexCount: number;
  counterIons: CounterIonCount[];
  hydrateWater: number;
  warnings: string[];
}

function assemble(p: Parts): ParsedComplex {
  const merged = mergeLigands(p.ligands);
  const ligandCharge = merged.reduce((sum, l) => sum + l.count * l.charge, 0);
  const oxidationState = p.complexCharge - ligandCharge;
  let metal: Ion;
  try {
    metal = ionFromOxidationState(p.metalSymbol, oxidationState, 'formula');
  } catch (error) {
    if (!isFieldgapError(error)) throw error;
    throw p.scan.error(`charges do not balance (complex ${signed(p.complexCharge)}, ligands ${signed(ligandCharge)}): ${error.message}`, p.metalAt);
  }
  const coordinationNumber = merged.reduce((sum, l) => sum + l.count * l.denticity, 0);
  const warnings = [...p.warnings];
  if (metal.note) warnings.push(metal.note);
  const geometry = guessGeometry(metal, coordinationNumber, warnings);
  if (merged.length > 1) warnings.push('mixed ligands: the true symmetry is lower than cubic; cubic-field values are averages');
  return {
    formula: p.text,
    complexIon: writeComplexIon(p.metalSymbol, merged, p.complexCharge),
    metal,
    oxidationState,
    d: metal.d,
    complexCharge: p.complexCharge,
    chargeSource: p.chargeSource,
    complexCount: p.complexCount,
    ligands: merged,
    counterIons: p.counterIons,
    hydrateWater: p.hydrateWater,
    coordinationNumber,
    geometry,
    geometryIsGuess: true,
    warnings,
  };
}

function mergeLigands(list: LigandAt[]): LigandCount[] {
  const merged: LigandCount[] = [];
  for (const { ligand, count } of list) {
    const seen = merged.find((m) => m.key === ligand.key);
    if (seen) seen.count += count;
    else merged.push({ key: ligand.key, name: ligand.names[0] ?? ligand.key, count, charge: ligand.charge, denticity: ligand.denticity, donors: ligand.donors });
  }
  return merged;
}

/** "[Co(NH3)5Cl]2+": simple ligands bare, others in parentheses, counts after. */
function writeComplexIon(symbol: string, ligands: LigandCount[], charge: number): string {
  const body = ligands
    .map((l) => {
      const bareOne = /^[A-Z][a-z]?$/.test(l.key) && l.key !== 'CO';
      const written = bareOne ? l.key : `(${l.key})`;
      return l.count === 1 ? written : `${written}${l.count}`;
    })
    .join('');
  const label = ionLabel('', charge);
  return `[${symbol}${body}]${charge === 0 ? '' : label}`;
}
