/**
 * Conversions between the x units fieldgap reads and wavenumbers (cm-1),
 * the one energy unit used inside.
 *
 * ν̃[cm-1] = 10^7 / λ[nm] = 10^4 / λ[µm] = E[eV] × 8065.543937.
 * The eV factor is the CODATA 2018 eV–inverse-metre relationship
 * (806 554.3937 m-1, exact in the 2019 SI) expressed in cm-1.
 */
import { invalidArgument } from '../errors.js';
import { X_UNITS, type XUnit } from './types.js';

/** Wavenumber of one electronvolt, cm-1 (CODATA 2018). */
export const CM1_PER_EV = 8065.543937;

/** The x units fieldgap reads, in the order they are listed in messages (defined once, in types.ts). */
export { X_UNITS };

/** Converts one x value in `unit` to cm-1. Wavelengths must be > 0. */
export function valueToWavenumber(value: number, unit: XUnit): number {
  switch (unit) {
    case 'nm':
      return 1e7 / value;
    case 'um':
      return 1e4 / value;
    case 'eV':
      return value * CM1_PER_EV;
    case 'cm-1':
      return value;
  }
}

/** Converts one wavenumber (cm-1) to `unit`. The inverse of valueToWavenumber. */
export function wavenumberToValue(wavenumber: number, unit: XUnit): number {
  switch (unit) {
    case 'nm':
      return 1e7 / wavenumber;
    case 'um':
      return 1e4 / wavenumber;
    case 'eV':
      return wavenumber / CM1_PER_EV;
    case 'cm-1':
      return wavenumber;
  }
}

/**
 * Reads a unit name as a user or a file writes it: "nm", "cm-1", "cm^-1",
 * "1/cm", "eV", "um", "µm", "micrometers", "nanometers"... Returns null when
 * the text names none of the four units.
 */
export function xUnitFromName(name: string): XUnit | null {
  const s = name.trim().toLowerCase().replace(/\s+/g, '').replace(/μ/g, 'µ');
  if (/^(nm|nanomet(er|re)s?)$/.test(s)) return 'nm';
  if (/^(cm-1|cm\^-1|cm⁻¹|1\/cm|wavenumbers?|cm\*\*-1|\/cm)$/.test(s)) return 'cm-1';
  if (/^(ev|electronvolts?)$/.test(s)) return 'eV';
  if (/^(um|µm|microns?|micromet(er|re)s?)$/.test(s)) return 'um';
  return null;
}

/** Like xUnitFromName, for an option: throws invalid-argument naming the choices. */
export function parseXUnitOption(name: string, path = 'xUnit'): XUnit {
  const unit = xUnitFromName(name);
  if (unit === null) {
    throw invalidArgument(path, `${path}: unknown x unit "${name}"; expected one of ${X_UNITS.join(', ')}`);
  }
  return unit;
}
