/**
 * The one text-table renderer of the CLI's readable outputs: columns padded
 * to their widest cell (widths in code points, so "β" and "ζ" count as one),
 * separated by two spaces, each line's trailing spaces cut.
 */

export type ColumnAlign = 'left' | 'right';

export interface TextTableOptions {
  /** Per column; a column not listed is left-aligned. Default: all left. */
  align?: readonly ColumnAlign[];
  /** Put before every line. Default "". */
  indent?: string;
}

/** The width of a cell as a terminal shows it: its code points. */
export function cellWidth(cell: string): number {
  return [...cell].length;
}

/** Each column's width: its widest cell over all rows. */
export function columnWidths(rows: readonly (readonly string[])[]): number[] {
  const columns = Math.max(0, ...rows.map((r) => r.length));
  return Array.from({ length: columns }, (_, c) => Math.max(0, ...rows.map((r) => cellWidth(r[c] ?? ''))));
}

function pad(cell: string, width: number, align: ColumnAlign): string {
  const fill = ' '.repeat(Math.max(0, width - cellWidth(cell)));
  return align === 'right' ? fill + cell : cell + fill;
}

/** One line of cells at the given widths (a wider cell widens its own line only). */
export function textTableLine(cells: readonly string[], widths: readonly number[], options: TextTableOptions = {}): string {
  const { align = [], indent = '' } = options;
  return `${indent}${cells.map((cell, c) => pad(cell, widths[c] ?? 0, align[c] ?? 'left')).join('  ')}`.trimEnd();
}

/** The lines of a table whose columns are as wide as their widest cell. */
export function textTableLines(rows: readonly (readonly string[])[], options: TextTableOptions = {}): string[] {
  const widths = columnWidths(rows);
  return rows.map((r) => textTableLine(r, widths, options));
}
