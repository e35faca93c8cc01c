/**
 * What a cell of a delimited file holds: a number (with a dot or a comma as
 * decimal mark), a missing value, or text.
 */

const DOT_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;
/** Spellings of a missing value: empty, NaN, NA, N/A, -, --, null, none, ±inf. */
const MISSING = /^(?:|nan|na|n\/a|-|--|null|none|[+-]?inf|[+-]?infinity)$/i;

/** Decimal mark of a file: '.' always, ',' only where ',' is not the separator. */
export type DecimalMark = '.' | ',';

export function isMissingCell(cell: string): boolean {
  return MISSING.test(cell);
}

/** True when `cell` is a number written with a dot, or (when allowed) a comma. */
export function isNumberCell(cell: string, allowComma: boolean): boolean {
  return DOT_NUMBER.test(cell) || (allowComma && COMMA_NUMBER.test(cell));
}

/** True when the cell is written with a decimal comma (and no dot). */
export function hasDecimalComma(cell: string): boolean {
  return cell.includes(',') && COMMA_NUMBER.test(cell);
}

/** The number a cell holds with the given decimal mark, or NaN when it holds none. */
export function cellToNumber(cell: string, mark: DecimalMark): number {
  if (mark === ',') return COMMA_NUMBER.test(cell) ? Number(cell.replace(',', '.')) : Number.NaN;
  return DOT_NUMBER.test(cell) ? Number(cell) : Number.NaN;
}
