/**
 * Extending the numeric run to the whole data block, and reading it cell by
 * cell, with every irregularity either reported (skipped cells and lines)
 * or refused with the line and field where it is.
 */
import { FieldgapError } from '../../errors.js';
import { cellToNumber, type DecimalMark, hasDecimalComma, isMissingCell, isNumberCell } from './cells.js';
import { isSkippableLine, numericFieldCount, type NumericRun } from './find-numeric-block.js';

/** The data block: line range, its rows of numbers (NaN for missing) and their line numbers. */
export interface DataBlock {
  first: number;
  last: number;
  fields: number;
  decimalMark: DecimalMark;
  /** columns[f][r]: the number in field f of data row r, NaN when missing. */
  columns: Float64Array[];
  /** 1-based file line of each row (its length is the number of rows). */
  lineNumbers: number[];
  /** Comment lines (#, //) inside the block, skipped. */
  skippedComments: number;
}

/** Minimum length of a second numeric run that marks a bad line as inside the block. */
const MIN_RUN_BEYOND = 3;

/** A line that belongs to the block even if some cells are bad: first field a number, no more fields. */
function isDataLike(cells: string[], fields: number, allowComma: boolean): boolean {
  return cells.length >= 2 && cells.length <= fields && isNumberCell(cells[0] as string, allowComma);
}

/** True when lines [from, to) (stepping `step`) hold a run of ≥ MIN_RUN_BEYOND numeric lines with `fields` fields. */
function hasRunBeyond(cells: string[][], lines: string[], start: number, step: 1 | -1, fields: number, allowComma: boolean): boolean {
  let run = 0;
  for (let i = start; i >= 0 && i < cells.length; i += step) {
    if (isSkippableLine(lines[i] as string)) continue;
    if (numericFieldCount(cells[i] as string[], allowComma) === fields) {
      if (++run >= MIN_RUN_BEYOND) return true;
    } else run = 0;
  }
  return false;
}

/**
 * Grows `run` over neighbouring data-like lines, then refuses a stray line
 * that has more numeric data beyond it (it is inside the block, not a
 * preamble or footer) with a parse-error at "file:line:field".
 */
export function readDataBlock(cells: string[][], lines: string[], run: NumericRun, fileName: string): DataBlock {
  const allowComma = run.separator !== ',';
  const { fields } = run;
  let first = run.first;
  let last = run.last;
  for (let i = first - 1; i >= 0; i--) {
    if (isSkippableLine(lines[i] as string)) continue;
    if (!isDataLike(cells[i] as string[], fields, allowComma)) {
      if (hasRunBeyond(cells, lines, i - 1, -1, fields, allowComma)) throw strayLine(cells, i, fields, fileName, allowComma);
      break;
    }
    first = i;
  }
  for (let i = last + 1; i < cells.length; i++) {
    if (isSkippableLine(lines[i] as string)) continue;
    if (!isDataLike(cells[i] as string[], fields, allowComma)) {
      if (hasRunBeyond(cells, lines, i + 1, 1, fields, allowComma)) throw strayLine(cells, i, fields, fileName, allowComma);
      break;
    }
    last = i;
  }
  const decimalMark = blockDecimalMark(cells, first, last, allowComma);
  const lineNumbers: number[] = [];
  let skippedComments = 0;
  for (let i = first; i <= last; i++) {
    const line = lines[i] as string;
    if (!isSkippableLine(line)) lineNumbers.push(i + 1);
    else if (line.trim() !== '') skippedComments++;
  }
  const rowCount = lineNumbers.length;
  const columns = Array.from({ length: fields }, () => new Float64Array(rowCount).fill(Number.NaN));
  for (let r = 0; r < rowCount; r++) {
    const i = (lineNumbers[r] as number) - 1;
    const rowCells = cells[i] as string[];
    for (let f = 0; f < rowCells.length; f++) {
      const cell = rowCells[f] as string;
      // Numbers first: nearly every cell is one, and a cell that is none must be a missing value.
      const value = cellToNumber(cell, decimalMark);
      if (!Number.isNaN(value)) (columns[f] as Float64Array)[r] = value;
      else if (!isMissingCell(cell)) throw badCell(cell, i, f, decimalMark, fileName);
    }
  }
  return { first, last, fields, decimalMark, columns, lineNumbers, skippedComments };
}

/** ',' when the block's cells use a decimal comma (possible only when ',' is not the separator). */
function blockDecimalMark(cells: string[][], first: number, last: number, allowComma: boolean): DecimalMark {
  if (!allowComma) return '.';
  for (let i = first; i <= last; i++) {
    for (const cell of cells[i] as string[]) if (hasDecimalComma(cell)) return ',';
  }
  return '.';
}

function badCell(cell: string, lineIndex: number, field: number, mark: DecimalMark, fileName: string): FieldgapError {
  const hint = mark === ',' && cell.includes('.') ? ' (this file uses a decimal comma, this cell a dot)' : '';
  return new FieldgapError(
    'parse-error',
    `non-numeric cell "${cell}" inside the data block${hint}`,
    `${fileName}:${lineIndex + 1}:${field + 1}`,
  );
}

function strayLine(cells: string[][], lineIndex: number, fields: number, fileName: string, allowComma: boolean): FieldgapError {
  const row = cells[lineIndex] as string[];
  if (row.length > fields) {
    return new FieldgapError(
      'parse-error',
      `line has ${row.length} fields inside a data block of ${fields} fields`,
      `${fileName}:${lineIndex + 1}:${fields + 1}`,
    );
  }
  const f = row.findIndex((c) => !isNumberCell(c, allowComma) && !isMissingCell(c));
  const field = f < 0 ? 0 : f;
  const cell = row[field] ?? '';
  return field === 0 && row.length < 2
    ? new FieldgapError('parse-error', `line "${cell}" interrupts the data block`, `${fileName}:${lineIndex + 1}:1`)
    : new FieldgapError('parse-error', `non-numeric cell "${cell}" inside the data block`, `${fileName}:${lineIndex + 1}:${field + 1}`);
}
