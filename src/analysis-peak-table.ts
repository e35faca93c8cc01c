/**
 * A JCAMP-DX PEAK TABLE holds band maxima, not a spectrum: nothing for the
 * band finder, but exactly what `fieldgap fit` takes. The error says so and
 * prints the ready command with the positions in cm-1 (AUDIT2 finding 24).
 */
import { FieldgapError } from './errors.js';
import type { Geometry } from './ligand-field/types.js';
import { xToWavenumber } from './spectrum/x-to-wavenumber.js';
import type { Spectrum } from './spectrum/types.js';

export interface PeakTableFitOptions {
  ion?: string;
  d?: number;
  formula?: string;
  geometry?: Geometry;
}

/** The peak positions in cm-1, ascending, rounded to 1 cm-1 (the table's own precision is rarely better). */
export function peakTablePositions(spectrum: Pick<Spectrum, 'x' | 'xUnit'>): number[] {
  return Array.from(xToWavenumber(spectrum.x, spectrum.xUnit), Math.round).sort((a, b) => a - b);
}

/** "fieldgap fit --ion Cr3+ --bands 17400,24600": the command that fits the table's positions. */
export function peakTableFitCommand(positions: readonly number[], options: PeakTableFitOptions): string {
  const who = options.ion !== undefined ? `--ion ${shellWord(options.ion)}`
    : options.d !== undefined ? `--d ${options.d}`
    : options.formula !== undefined ? `--formula ${shellWord(options.formula)}`
    : '--ion ION';
  const geometry = options.geometry !== undefined && options.geometry !== 'octahedral' ? ` --geometry ${options.geometry}` : '';
  return `fieldgap fit ${who}${geometry} --bands ${positions.join(',')}`;
}

/** The error for a peak table given to the analysis, with the fit command; `file` names it in the path. */
export function peakTableError(spectrum: Pick<Spectrum, 'x' | 'xUnit'>, options: PeakTableFitOptions, file: string): FieldgapError {
  return new FieldgapError(
    'unsupported-format',
    `a JCAMP-DX PEAK TABLE lists peak positions, not a spectrum: there are no band shapes or baseline to fit; fit the positions directly: ${peakTableFitCommand(peakTablePositions(spectrum), options)}`,
    `${file}:##PEAK TABLE`,
  );
}

/** A word the shell keeps as it is: quoted when it holds anything beyond letters, digits and + - ( ) . , */
function shellWord(text: string): string {
  return /^[A-Za-z0-9+\-.,]+$/.test(text) ? text : `'${text.replace(/'/g, `'\\''`)}'`;
}
