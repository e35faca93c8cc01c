import { FieldgapError } from '../errors.js';
import { elementSymbolFromText, TRANSITION_ELEMENTS, type TransitionRow } from './elements.js';

/**
 * A transition-metal ion in a given (formal) oxidation state.
 *
 * `charge` is the oxidation state, so for a metal inside a complex it is the
 * formal charge left on the metal, not the charge of the complex. The d-count
 * is the usual formal one: d = group − oxidation state (groups 3–12), which is
 * what ligand-field theory uses ([Fe(CN)6]4- is Fe(II), d6).
 */
export interface Ion {
  /** "Cr". */
  symbol: string;
  /** Oxidation state: 3 for Cr3+ and Cr(III); may be 0 or negative (Cr(0) in Cr(CO)6). */
  charge: number;
  /** d-electron count, 0 to 10. */
  d: number;
  /** Canonical label: "Cr3+", "Cu+", "Cr0", "Fe2-". */
  label: string;
  /** Transition row: 1 (3d), 2 (4d), 3 (5d). */
  row: TransitionRow;
  /** IUPAC group, 3–12. */
  group: number;
  /** English name: "chromium". */
  name?: string;
  /** Set for d0 and d10: such an ion is valid but has no d–d transitions. */
  note?: string;
}

export interface ParseIonOptions {
  /** Where the text came from, for the error's path. Default "ion". */
  path?: string;
}

/** The accepted spellings, quoted in every parse error. */
export const ION_FORMS = 'Cr3+, Cr(III), Cr 3+, Cr+3, Cr^3+, Cu+, Fe(0), Fe(-II)';

/** Oxidation states of d-block metals in compounds lie in −4…+8 (common practice). */
export const MIN_OXIDATION_STATE = -4;
export const MAX_OXIDATION_STATE = 8;

const ROMAN = ['0', 'I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII'];
const SUPERSCRIPTS: Record<string, string> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
  '⁺': '+', '⁻': '-', '−': '-', '–': '-',
};

/** Canonical label of an oxidation state: "Cr3+", "Cu+", "Cr0", "Fe2-". */
export function ionLabel(symbol: string, charge: number): string {
  if (charge === 0) return `${symbol}0`;
  const size = Math.abs(charge) === 1 ? '' : String(Math.abs(charge));
  return `${symbol}${size}${charge > 0 ? '+' : '-'}`;
}

/** Roman numeral for an oxidation state, with a sign when negative: "III", "-II", "0". */
export function romanOxidationState(charge: number): string {
  const roman = ROMAN[Math.abs(charge)];
  if (roman === undefined) return charge > 0 ? `+${charge}` : String(charge);
  return charge < 0 ? `-${roman}` : roman;
}

/**
 * The ion of a known element symbol ("Cr", already capitalised) in an
 * oxidation state. Throws FieldgapError('invalid-argument') for an element
 * that is not a transition metal and for an oxidation state that would leave
 * fewer than 0 or more than 10 d electrons.
 */
export function ionFromOxidationState(symbol: string, charge: number, path = 'ion'): Ion {
  const element = TRANSITION_ELEMENTS.get(symbol);
  if (!element) {
    throw new FieldgapError(
      'invalid-argument',
      `${symbol} is not a transition metal: fieldgap knows the d-block metals of groups 3 to 12 (Sc–Zn, Y–Cd, La and Hf–Hg)`,
      path,
    );
  }
  const label = ionLabel(symbol, charge);
  const d = element.group - charge;
  if (Number.isInteger(charge) && (charge > MAX_OXIDATION_STATE || charge < MIN_OXIDATION_STATE)) {
    throw new FieldgapError(
      'invalid-argument',
      `${symbol}(${romanOxidationState(charge)}) is an impossible oxidation state: fieldgap reads oxidation states from ${MIN_OXIDATION_STATE} to +${MAX_OXIDATION_STATE}`,
      path,
    );
  }
  if (!Number.isInteger(charge) || d < 0 || d > 10) {
    throw new FieldgapError(
      'invalid-argument',
      `${symbol}(${romanOxidationState(charge)}) is an impossible oxidation state: ${symbol} is in group ${element.group}, so it would have ${d} d electrons (possible: 0 to 10)`,
      path,
    );
  }
  const ion: Ion = { symbol, charge, d, label, row: element.row, group: element.group, name: element.name };
  if (d === 0 || d === 10) {
    ion.note = `${label} is d${d}: it has no d–d transitions, so no ligand-field bands to analyse`;
  }
  return ion;
}

/**
 * Reads an ion from text. Accepted forms (documented, case-insensitive symbol):
 *   "Cr3+", "cr3+", "Cr 3+", "Cr^3+", "Cr³⁺"   charge number then sign
 *   "Co+2"                                     sign then number (accepted: unambiguous)
 *   "Cu+", "Fe+++", "Cl-"                     repeated signs
 *   "Cr(III)", "Cr III", "Cr(iii)", "Fe(-II)"  Roman oxidation state, (0) for zero
 *   "Cr(3+)", "Cr0", "Cr(0)"                  charge in brackets; zero
 * Rejected: a bare number with no sign ("Cr3" is ambiguous), no charge at all.
 */
export function parseIon(text: string, options: ParseIonOptions = {}): Ion {
  const { path = 'ion' } = options;
  const raw = text;
  const clean = [...text.trim()].map((ch) => SUPERSCRIPTS[ch] ?? ch).join('').replace(/\^/g, '');
  const fail = (why: string): never => {
    throw new FieldgapError('invalid-argument', `cannot read "${raw}" as an ion: ${why} (write it like ${ION_FORMS})`, path);
  };
  if (clean === '') fail('it is empty');
  const match = /^([A-Za-z]+)\s*(.*)$/.exec(clean);
  if (!match) return fail('it does not start with an element symbol');
  const letters = match[1] as string;
  const rest = (match[2] as string).trim();
  const symbol = elementSymbolFromText(letters);
  if (!symbol) {
    const hint = gluedRomanHint(letters);
    throw new FieldgapError('invalid-argument', `unknown element "${letters}" in "${raw}"${hint}`, path);
  }
  const charge = chargeFromText(rest);
  if (charge === undefined) {
    // A bare number ("Cr3") is most often "Cr3+" sent in a URL query unencoded, where "+" arrives as a space.
    const unsigned = /^\d+$/.test(rest) ? `: a charge needs its sign, ${symbol}${rest}+ or ${symbol}${rest}- (in a URL query "+" arrives as a space: write it %2B, ion=${symbol}${rest}%2B)` : '';
    return fail(rest === '' ? `no charge or oxidation state after ${symbol}` : `cannot read the charge "${rest}"${unsigned}`);
  }
  return ionFromOxidationState(symbol, charge, path);
}

/** " (for an oxidation state write Cr(III))" when letters look like "CrIII", else "". */
function gluedRomanHint(letters: string): string {
  for (const size of [2, 1]) {
    const symbol = elementSymbolFromText(letters.slice(0, size));
    const roman = letters.slice(size).toUpperCase();
    if (symbol && TRANSITION_ELEMENTS.has(symbol) && ROMAN.indexOf(roman) > 0) {
      return ` (for an oxidation state write ${symbol}(${roman}))`;
    }
  }
  return '';
}

/** The charge in "3+", "+3", "+++", "(III)", "III", "(-II)", "(3+)", "0"; undefined if unreadable. */
export function chargeFromText(text: string): number | undefined {
  let t = text.trim();
  const bracketed = /^\((.*)\)$/.exec(t);
  if (bracketed) t = (bracketed[1] as string).trim();
  if (t === '0') return 0;
  let m = /^(\d+)\s*([+-])$/.exec(t) ?? /^([+-])\s*(\d+)$/.exec(t);
  if (m) {
    const digits = /\d/.test(m[1] as string) ? (m[1] as string) : (m[2] as string);
    const sign = /\d/.test(m[1] as string) ? (m[2] as string) : (m[1] as string);
    const size = Number(digits);
    if (size === 0) return 0;
    return sign === '+' ? size : -size;
  }
  m = /^(\++|-+)$/.exec(t);
  if (m) return (m[1] as string).startsWith('+') ? (m[1] as string).length : -(m[1] as string).length;
  m = /^([+-]?)\s*([IVX]+)$/i.exec(t);
  if (m) {
    const value = ROMAN.indexOf((m[2] as string).toUpperCase());
    if (value <= 0) return undefined;
    return m[1] === '-' ? -value : value;
  }
  return undefined;
}
