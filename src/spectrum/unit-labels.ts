/**
 * Reading units out of the words files use: column headers ("Wavelength
 * (nm)", "%T", "ε / L mol-1 cm-1"), preamble lines ("X Units: nm") and the
 * JCAMP-DX ##XUNITS / ##YUNITS records ("NANOMETERS", "1/CM", "ABSORBANCE").
 */
import type { XUnit, YUnit } from './types.js';
import { xUnitFromName } from './units.js';

/** The pieces of a label that may be a unit: the whole, "(…)", "[…]", and what follows "/" or ",". */
function unitCandidates(label: string): string[] {
  const out = [label];
  for (const m of label.matchAll(/[([]([^)\]]*)[)\]]/g)) out.push(m[1] as string);
  const slash = label.indexOf(' / ') >= 0 ? label.split(' / ') : label.split('/');
  if (slash.length === 2 && !/^\s*1\s*$/.test(slash[0] as string)) out.push(slash[1] as string);
  const comma = label.split(',');
  if (comma.length === 2) out.push(comma[1] as string);
  return out;
}

/** The x unit a header or record names, or null when it names none. */
export function xUnitFromLabel(label: string): XUnit | null {
  for (const candidate of unitCandidates(label)) {
    const unit = xUnitFromName(candidate);
    if (unit !== null) return unit;
  }
  const s = label.toLowerCase();
  if (/wavenumber|cm-1|cm\^-1|cm⁻¹|1\/cm/.test(s)) return 'cm-1';
  if (/\bnanomet/.test(s)) return 'nm';
  if (/\bmicromet|\bmicrons?\b/.test(s)) return 'um';
  if (/\belectron ?volt/.test(s)) return 'eV';
  return null;
}

/**
 * The y unit a header or record names, or null. `%`, "percent" and "T%"
 * mean transmittance in percent; a bare "T" or "transmittance" means the
 * fraction; "A", "abs", "absorbance", "optical density" mean absorbance;
 * "ε", "epsilon", "molar absorptivity", "M-1 cm-1", "L mol-1 cm-1" mean ε.
 */
export function yUnitFromLabel(label: string): YUnit | null {
  const s = label.trim().toLowerCase();
  if (/ε|epsilon|absorptivit|extinction|m-1\s*cm-1|m\^-1|mol-1|mol\^-1|l\/\(?mol|\/m\/cm/.test(s)) return 'epsilon';
  if (/transmit|^%?\s*t\s*%?$|^t\s*[([/]|^%$/.test(s)) {
    return /%|percent/.test(s) ? 'transmittance-percent' : 'transmittance';
  }
  if (/absorb|^a$|^abs\b|^a\s*[([/]|optical density|^od$|\babs\b/.test(s)) return 'absorbance';
  return null;
}

/** True for metadata keys that state the x unit ("X Units", "xunit", "abscissa"). */
export function isXUnitKey(key: string): boolean {
  const k = key.toLowerCase().replace(/[^a-z]/g, '');
  return k === 'xunits' || k === 'xunit' || k === 'xaxis' || k === 'abscissa' || k === 'abscissaunit' || k === 'wavelengthunit' || k === 'wavelengthunits';
}

/** True for metadata keys that state the y unit ("Y Units", "Ordinate", "Data mode", "Measurement"). */
export function isYUnitKey(key: string): boolean {
  const k = key.toLowerCase().replace(/[^a-z]/g, '');
  return (
    k === 'yunits' || k === 'yunit' || k === 'yaxis' || k === 'ordinate' || k === 'ordinateunit' ||
    k === 'datamode' || k === 'mode' || k === 'measurement' || k === 'photometricmode' || k === 'datatype'
  );
}
