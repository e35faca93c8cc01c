/**
 * Observed bands: the text form of a band list and its checked, cm-1 form.
 *
 * Text form (the CLI's --bands), items separated by commas or semicolons:
 *
 *   POSITION[UNIT][±UNCERTAINTY[UNIT]][:FLAG][:FLAG]...
 *
 * - POSITION is a band maximum; UNIT is cm-1 (the default), nm, um/µm or eV:
 *   "17400", "625nm", "2.16eV".
 * - "±200" (or "+-200", "+/-200") is the standard uncertainty of the
 *   position, in the position's unit unless it has its own: "625nm±5".
 * - Flags: `sh` (shoulder), `sf` (spin-forbidden), `ct` (charge-transfer,
 *   left out of the fit), `e=NUMBER` (molar absorption coefficient ε,
 *   L mol-1 cm-1), `w=NUMBER[UNIT]` (full width at half maximum, cm-1 unless
 *   a unit is given). Long forms are accepted: `shoulder`, `spin-forbidden`,
 *   `charge-transfer`, `eps=`, `width=`.
 *
 * Example: "8100±300, 16000:sh, 19400, 36000:ct".
 *
 * Positions are checked to lie between 2000 and 100 000 cm-1: a bare number
 * below 2000 is almost always a wavelength written without "nm".
 */
import { FieldgapError, invalidArgument } from '../errors.js';
import { valueToWavenumber, xUnitFromName } from '../spectrum/units.js';
import type { XUnit } from '../spectrum/types.js';

export type BandFlag = 'shoulder' | 'spin-forbidden' | 'charge-transfer';

export const BAND_FLAGS: readonly BandFlag[] = ['shoulder', 'spin-forbidden', 'charge-transfer'];

/** One band as a program gives it. Energies in cm-1. */
export interface BandInput {
  /** Band maximum, cm-1. */
  position: number;
  /** Standard uncertainty of the position, cm-1. */
  uncertainty?: number;
  /** Molar absorption coefficient at the maximum, L mol-1 cm-1. */
  epsilon?: number;
  /** Full width at half maximum, cm-1. */
  width?: number;
  /**
   * Integrated intensity (area under the band), in any unit shared by the
   * bands of one list (ε·cm-1 or absorbance·cm-1): only its ratio to other
   * bands' areas is used, to weight the components of a split band.
   */
  area?: number;
  flags?: readonly (BandFlag | string)[];
}

/** A checked band: cm-1, flags normalised, `index` its place in the input. */
export interface ObservedBand {
  index: number;
  position: number;
  uncertainty?: number;
  epsilon?: number;
  width?: number;
  area?: number;
  flags: BandFlag[];
}

/** Lowest and highest accepted band positions, cm-1. */
export const BAND_RANGE_CM1 = { min: 2000, max: 100_000 } as const;

const FLAG_ALIASES: Readonly<Record<string, BandFlag>> = {
  sh: 'shoulder',
  shoulder: 'shoulder',
  sf: 'spin-forbidden',
  'spin-forbidden': 'spin-forbidden',
  ct: 'charge-transfer',
  'charge-transfer': 'charge-transfer',
};

const NUMBER_WITH_UNIT = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)([a-zµμ^\-1/⁻¹]*)$/i;

/** Reads "625nm" as [625, 'nm']; the unit defaults to `fallback`. */
function readNumberWithUnit(text: string, fallback: XUnit, what: string, fail: (m: string) => FieldgapError) {
  const match = NUMBER_WITH_UNIT.exec(text);
  if (!match) throw fail(`${what} "${text}" is not a number (with an optional unit nm, cm-1, um or eV)`);
  const value = Number(match[1]);
  const unitText = match[2] ?? '';
  const unit = unitText === '' ? fallback : xUnitFromName(unitText);
  if (unit === null) throw fail(`${what} "${text}" has an unknown unit "${unitText}" (use nm, cm-1, um or eV)`);
  return { value, unit };
}

/** An interval of `size` (in `unit`) around `at` (in `unit`), as cm-1. */
function intervalToWavenumber(size: number, at: number, unit: XUnit): number {
  if (unit === 'cm-1') return size;
  return Math.abs(valueToWavenumber(at + size / 2, unit) - valueToWavenumber(at - size / 2, unit));
}

/** Why a position in cm-1 is not a plausible band maximum, or undefined. */
function positionProblem(cm1: number, bareNumber = true): string | undefined {
  if (cm1 < BAND_RANGE_CM1.min) {
    const hint = bareNumber && cm1 >= 150 ? ` (${cm1} looks like a wavelength: write ${cm1}nm)` : '';
    return `${Math.round(cm1)} cm-1 is below ${BAND_RANGE_CM1.min} cm-1${hint}`;
  }
  if (cm1 > BAND_RANGE_CM1.max) return `${Math.round(cm1)} cm-1 is above ${BAND_RANGE_CM1.max} cm-1`;
  return undefined;
}

function parseBandItem(item: string, number: number, path: string): BandInput {
  const fail = (message: string) => invalidArgument(path, `band ${number} ("${item}"): ${message}`);
  const [head = '', ...flagTexts] = item.replace(/\s+/g, '').split(':');
  const [positionText = '', uncertaintyText, ...extra] = head.replace(/\+\/-|\+-/g, '±').split('±');
  if (extra.length > 0) throw fail('more than one "±"');
  if (positionText === '') throw fail('no position before the flags');
  const position = readNumberWithUnit(positionText, 'cm-1', 'position', fail);
  if (!(position.value > 0)) throw fail('the position must be positive');
  const band: BandInput = { position: valueToWavenumber(position.value, position.unit) };
  const problem = positionProblem(band.position, position.unit === 'cm-1' && !/[a-z]/i.test(positionText));
  if (problem) throw fail(problem);
  if (uncertaintyText !== undefined) {
    const u = readNumberWithUnit(uncertaintyText, position.unit, 'uncertainty', fail);
    if (!(u.value > 0)) throw fail('the uncertainty must be positive');
    band.uncertainty = intervalToWavenumber(u.value, position.value, u.unit);
  }
  const flags: BandFlag[] = [];
  for (const flagText of flagTexts) {
    const [key = '', value] = flagText.toLowerCase().split('=');
    if (value !== undefined && (key === 'e' || key === 'eps' || key === 'epsilon')) {
      const epsilon = Number(value);
      if (value === '' || !Number.isFinite(epsilon) || epsilon < 0) throw fail(`ε "${value}" must be a number ≥ 0`);
      band.epsilon = epsilon;
    } else if (value !== undefined && (key === 'w' || key === 'width')) {
      const w = readNumberWithUnit(value, position.unit === 'cm-1' ? 'cm-1' : position.unit, 'width', fail);
      if (!(w.value > 0)) throw fail('the width must be positive');
      band.width = intervalToWavenumber(w.value, position.value, w.unit);
    } else if (value === undefined && FLAG_ALIASES[key]) {
      flags.push(FLAG_ALIASES[key]);
    } else {
      throw fail(`unknown flag ":${flagText}" (known: sh, sf, ct, e=ε, w=width)`);
    }
  }
  if (flags.length > 0) band.flags = flags;
  return band;
}

export interface ParseBandListOptions {
  /** Where the text came from, for errors. Default "--bands". */
  path?: string;
}

/** Parses a band list such as "8100±300, 16000:sh, 19400, 36000:ct" (see the module docstring). */
export function parseBandList(text: string, { path = '--bands' }: ParseBandListOptions = {}): BandInput[] {
  const items = text.split(/[,;]/).map((s) => s.trim());
  if (items.every((s) => s === '')) throw invalidArgument(path, 'no bands given (e.g. 17400,24600 in cm-1, or 575nm,407nm)');
  const bands: BandInput[] = [];
  items.forEach((item, i) => {
    if (item === '') throw invalidArgument(path, `band ${i + 1} is empty (two separators in a row?)`);
    bands.push(parseBandItem(item, i + 1, path));
  });
  return bands;
}

function checkOptionalPositive(value: unknown, path: string, what: string, allowZero = false): number | undefined {
  if (value === undefined) return undefined;
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
    throw invalidArgument(path, `${path}: ${what} must be a ${allowZero ? 'number ≥ 0' : 'positive number'}, got ${JSON.stringify(value)}`);
  }
  return value;
}

function checkPosition(value: unknown, path: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw invalidArgument(path, `${path}: a band position must be a number in cm-1, got ${JSON.stringify(value)}`);
  }
  const problem = positionProblem(value);
  if (problem) throw invalidArgument(path, `${path}: ${problem}`);
  return value;
}

/**
 * Checks bands given as numbers (cm-1), objects, or band-list text, and
 * returns them in cm-1 with normalised flags, in input order. `path` is the
 * field's name in errors: "bands[2].position".
 */
export function normalizeBands(bands: unknown, path = 'bands'): ObservedBand[] {
  const list = typeof bands === 'string' ? parseBandList(bands, { path }) : bands;
  if (!Array.isArray(list) || list.length === 0) {
    throw invalidArgument(path, `${path}: give at least one band maximum (cm-1)`);
  }
  return list.map((raw: unknown, index): ObservedBand => {
    const at = `${path}[${index}]`;
    if (typeof raw === 'number') return { index, position: checkPosition(raw, at), flags: [] };
    if (typeof raw !== 'object' || raw === null) {
      throw invalidArgument(at, `${at}: expected a number (cm-1) or an object with a position, got ${JSON.stringify(raw)}`);
    }
    const input = raw as Record<string, unknown>;
    const band: ObservedBand = { index, position: checkPosition(input['position'], `${at}.position`), flags: [] };
    const uncertainty = checkOptionalPositive(input['uncertainty'], `${at}.uncertainty`, 'an uncertainty');
    if (uncertainty !== undefined) band.uncertainty = uncertainty;
    const epsilon = checkOptionalPositive(input['epsilon'], `${at}.epsilon`, 'ε', true);
    if (epsilon !== undefined) band.epsilon = epsilon;
    const width = checkOptionalPositive(input['width'], `${at}.width`, 'a width');
    if (width !== undefined) band.width = width;
    const area = checkOptionalPositive(input['area'], `${at}.area`, 'an area', true);
    if (area !== undefined) band.area = area;
    const flags = input['flags'];
    if (flags !== undefined) {
      if (!Array.isArray(flags)) throw invalidArgument(`${at}.flags`, `${at}.flags: expected a list of flags`);
      flags.forEach((flag: unknown, k) => {
        const normal = typeof flag === 'string' ? FLAG_ALIASES[flag.trim().toLowerCase()] : undefined;
        if (!normal) {
          throw invalidArgument(`${at}.flags[${k}]`, `${at}.flags[${k}]: unknown flag ${JSON.stringify(flag)} (known: ${BAND_FLAGS.join(', ')})`);
        }
        if (!band.flags.includes(normal)) band.flags.push(normal);
      });
    }
    if (band.flags.includes('spin-forbidden') && band.flags.includes('charge-transfer')) {
      throw invalidArgument(`${at}.flags`, `${at}.flags: a band cannot be both spin-forbidden and charge-transfer`);
    }
    return band;
  });
}
