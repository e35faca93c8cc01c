/**
 * Reads delimited text (comma, semicolon, tab or whitespace separated; a
 * header row or none; a metadata preamble; decimal commas with ';', tab or
 * whitespace) into one Spectrum per y column. The first field is x.
 */
import { FieldgapError, invalidArgument } from '../../errors.js';
import type { Spectrum, XUnit, YUnit } from '../types.js';
import { isXUnitKey, isYUnitKey, xUnitFromLabel, yUnitFromLabel } from '../unit-labels.js';
import { readDataBlock, type DataBlock } from './delimited-block.js';
import { findNumericBlock } from './find-numeric-block.js';
import { inferXUnit } from './infer-x-unit.js';
import { readPreamble } from './preamble.js';
import { linesToCells, textToLines } from './split-lines.js';

export interface DelimitedOptions {
  /** Name used in error paths and messages. */
  fileName: string;
  /** x unit; wins over what the file says. */
  xUnit?: XUnit;
  /** y unit; wins over what the file says. */
  yUnit?: YUnit;
  /** Keep only this y column: 1-based index among the y columns, or a header name. */
  column?: number | string;
  /** Fewest points a spectrum may have. @default 10 */
  minPoints?: number;
}

export interface DelimitedResult {
  spectra: Spectrum[];
  warnings: string[];
}

export function parseDelimited(text: string, options: DelimitedOptions): DelimitedResult {
  const { fileName, minPoints = 10 } = options;
  const lines = textToLines(text);
  const run = findNumericBlock(lines);
  if (run === null) {
    throw new FieldgapError(
      'parse-error',
      'no block of numeric data found: expected lines of at least two numbers (x, then y) separated by commas, semicolons, tabs or spaces',
      fileName,
    );
  }
  const cells = linesToCells(lines, run.separator, run.cells);
  const block = readDataBlock(cells, lines, run, fileName);
  const preamble = readPreamble(cells, lines, block.first, block.fields);
  const warnings: string[] = [];
  const trailing = lines.slice(block.last + 1).filter((l) => l.trim() !== '').length;
  if (trailing > 0) warnings.push(`${fileName}: ignored ${trailing} line(s) after the data block (from line ${block.last + 2})`);
  if (block.skippedComments > 0) warnings.push(`${fileName}: skipped ${block.skippedComments} comment line(s) inside the data block`);

  const names = columnNames(preamble.header, block.fields);
  const selected = selectColumns(options.column, names, fileName);
  const xUnit = resolveXUnit(options.xUnit, preamble, block, fileName, warnings);
  const spectra: Spectrum[] = [];
  for (const column of selected) {
    const yUnit = resolveYUnit(options.yUnit, preamble, column, block, fileName, warnings);
    const name = names[column] as string;
    const { x, y, skipped } = columnToXY(block, column);
    if (skipped > 0) warnings.push(`${fileName}: column "${name}": skipped ${skipped} row(s) with a missing value`);
    const where = `${fileName}:${block.lineNumbers[0] ?? block.first + 1}`;
    if (x.length < minPoints) {
      throw new FieldgapError('parse-error', `column "${name}" has ${x.length} data points; at least ${minPoints} are needed`, where);
    }
    checkMonotonic(x, block, column, fileName);
    spectra.push({ x, y, xUnit, yUnit, name, column, metadata: { ...preamble.metadata } });
  }
  return { spectra, warnings };
}

/** Names of the y columns, index 1..fields-1 (index 0 is x): header cells, or "y1", "y2"… */
function columnNames(header: string[] | null, fields: number): string[] {
  const names: string[] = [];
  for (let f = 0; f < fields; f++) {
    const h = header?.[f]?.trim() ?? '';
    names.push(h !== '' ? h : f === 0 ? 'x' : `y${f}`);
  }
  return names;
}

function selectColumns(column: number | string | undefined, names: string[], fileName: string): number[] {
  const all = names.map((_, f) => f).slice(1);
  if (column === undefined) return all;
  const listing = all.map((f) => `${f} "${names[f]}"`).join(', ');
  if (typeof column === 'number') {
    if (Number.isInteger(column) && column >= 1 && column < names.length) return [column];
    throw invalidArgument('column', `column ${column} does not exist in ${fileName}; its y columns are ${listing}`);
  }
  const wanted = column.trim().toLowerCase();
  const byName = all.find((f) => (names[f] as string).toLowerCase() === wanted);
  if (byName !== undefined) return [byName];
  if (/^\d+$/.test(wanted)) return selectColumns(Number(wanted), names, fileName);
  throw invalidArgument('column', `no column named "${column}" in ${fileName}; its y columns are ${listing}`);
}

function columnToXY(block: DataBlock, column: number): { x: Float64Array; y: Float64Array; skipped: number } {
  const xs: number[] = [];
  const ys: number[] = [];
  let skipped = 0;
  const xs0 = block.columns[0] as Float64Array;
  const ys0 = block.columns[column] as Float64Array;
  for (let r = 0; r < xs0.length; r++) {
    const x = xs0[r] as number;
    const y = ys0[r] as number;
    if (Number.isNaN(x) || Number.isNaN(y)) skipped++;
    else {
      xs.push(x);
      ys.push(y);
    }
  }
  return { x: Float64Array.from(xs), y: Float64Array.from(ys), skipped };
}

/** x must be strictly ascending or strictly descending; the error names the first offending line. */
function checkMonotonic(x: Float64Array, block: DataBlock, column: number, fileName: string): void {
  const direction = Math.sign((x[1] as number) - (x[0] as number));
  let k = 0;
  const xs0 = block.columns[0] as Float64Array;
  const ys0 = block.columns[column] as Float64Array;
  for (let r = 0; r < xs0.length; r++) {
    if (Number.isNaN(xs0[r] as number) || Number.isNaN(ys0[r] as number)) continue;
    if (k > 0 && (direction === 0 || Math.sign((x[k] as number) - (x[k - 1] as number)) !== direction)) {
      throw new FieldgapError(
        'parse-error',
        `x is not monotonic: ${x[k]} follows ${x[k - 1]} (x must be strictly ascending or strictly descending)`,
        `${fileName}:${block.lineNumbers[r]}:1`,
      );
    }
    k++;
  }
}

function resolveXUnit(
  explicit: XUnit | undefined,
  preamble: ReturnType<typeof readPreamble>,
  block: DataBlock,
  fileName: string,
  warnings: string[],
): XUnit {
  if (explicit !== undefined) return explicit;
  const fromHeader = preamble.header !== null ? xUnitFromLabel(preamble.header[0] ?? '') : null;
  if (fromHeader !== null) return fromHeader;
  for (const [key, value] of Object.entries(preamble.metadata)) {
    if (isXUnitKey(key)) {
      const unit = xUnitFromLabel(value);
      if (unit !== null) return unit;
    }
  }
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const x of block.columns[0] as Float64Array) {
    if (x < min) min = x;
    if (x > max) max = x;
  }
  const guess = inferXUnit(min, max);
  if (guess === null) {
    throw new FieldgapError(
      'parse-error',
      `the file does not name its x unit and x values ${min}…${max} fit none of nm, cm-1, eV, µm: give the x unit`,
      fileName,
    );
  }
  warnings.push(`${fileName}: x unit not stated; ${guess} inferred from the x range ${min}…${max}`);
  return guess;
}

function resolveYUnit(
  explicit: YUnit | undefined,
  preamble: ReturnType<typeof readPreamble>,
  column: number,
  block: DataBlock,
  fileName: string,
  warnings: string[],
): YUnit {
  if (explicit !== undefined) return explicit;
  const fromHeader = preamble.header !== null ? yUnitFromLabel(preamble.header[column] ?? '') : null;
  if (fromHeader !== null) return refineTransmittance(fromHeader, block, column);
  for (const [key, value] of Object.entries(preamble.metadata)) {
    if (isYUnitKey(key)) {
      const unit = yUnitFromLabel(value);
      if (unit !== null) return refineTransmittance(unit, block, column);
    }
  }
  let max = 0;
  for (const v of block.columns[column] as Float64Array) if (v > max) max = v;
  const hint = max > 10 ? ` (values reach ${max}: if this is %T or ε, give the y unit)` : '';
  warnings.push(`${fileName}: y unit of column ${column} not stated; absorbance assumed${hint}`);
  return 'absorbance';
}

/** A column headed "T" whose values exceed 1.5 is in percent. */
function refineTransmittance(unit: YUnit, block: DataBlock, column: number): YUnit {
  if (unit !== 'transmittance') return unit;
  for (const v of block.columns[column] as Float64Array) if (v > 1.5) return 'transmittance-percent';
  return unit;
}
