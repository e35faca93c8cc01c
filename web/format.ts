/**
 * Number and unit formatting for display. Values arrive in cm-1; nm only
 * appears here, at the edge. Pure functions, unit-tested in tests/e2e/.
 */
import { levelLabel as engineLevelLabel } from '../src/ligand-field/labels.js';
import { formatPlusMinus } from '../src/report/plus-minus.js';
import { wavenumberToValue } from '../src/spectrum/units.js';

export const UNIT = {
  wavenumber: 'cm⁻¹',
  wavelength: 'nm',
  epsilon: 'L mol⁻¹ cm⁻¹',
  moment: 'μB',
} as const;

/** cm-1 → nm, the core's conversion (src/spectrum/units.ts: λ = 10^7 / ν̃). */
export function nmFromWavenumber(wavenumber: number): number {
  return wavenumberToValue(wavenumber, 'nm');
}

export { decimalsForUncertainty } from '../src/report/plus-minus.js';

/**
 * "17 400 ± 120": the value rounded to the place of the uncertainty's second
 * significant figure; a missing uncertainty shows as the value alone with
 * `fallbackDecimals` digits.
 */
export function formatWithUncertainty(
  value: number | null | undefined,
  uncertainty: number | null | undefined,
  fallbackDecimals = 0,
): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const known = uncertainty !== null && uncertainty !== undefined && Number.isFinite(uncertainty) && uncertainty > 0;
  return formatPlusMinus(value, uncertainty, { digits: known ? 'two-significant' : fallbackDecimals, number: formatNumber });
}

/** Fixed decimals, with a thin space grouping thousands (SI style) and a real minus sign. */
export function formatNumber(value: number | null | undefined, decimals = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const fixed = Math.abs(value).toFixed(decimals);
  const [whole = '0', fraction] = fixed.split('.');
  const grouped = whole.length > 4 ? whole.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009') : whole;
  const sign = value < 0 && Number(fixed) !== 0 ? '−' : '';
  return fraction === undefined ? `${sign}${grouped}` : `${sign}${grouped}.${fraction}`;
}

/** Plain machine-readable number for CSV and JSON cells (no grouping). */
export function plainNumber(value: number | null | undefined, decimals?: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '';
  return decimals === undefined ? String(value) : value.toFixed(decimals);
}

/**
 * A level's display name: the service's label when it sent one, else the
 * engine's label of term and parent (src/ligand-field/labels.ts):
 * ("4T1g", "4P") → "4T1g(P)", ("2T2g", "2D2") → "2T2g(D2)"; the term alone without a parent.
 */
export function levelLabel(term: string, parent: string | undefined, label?: string): string {
  if (label !== undefined && label !== '') return label;
  if (parent === undefined || parent === '') return term;
  return engineLevelLabel(term, parent);
}

/** "high-spin" → "high spin"; unknown words pass through (src/report's one wording). */
export { spinStateWords as spinStateText } from '../src/report/spin-state-wording.js';

/** "d7" with a superscript count, for headings. */
export function dCountText(d: number): string {
  const sup = ['⁰', '¹', '²', '³', '⁴', '⁵', '⁶', '⁷', '⁸', '⁹'];
  return `d${String(d).split('').map((ch) => sup[Number(ch)] ?? ch).join('')}`;
}

/** A file name safe for downloads: letters, digits, dot, dash, underscore. */
export function safeFileStem(name: string): string {
  const stem = name.replace(/\.[^.]*$/, '').replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^_+|_+$/g, '');
  return stem === '' ? 'analysis' : stem;
}
