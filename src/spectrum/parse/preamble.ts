/**
 * The lines before a data block: a header row (the column names) and
 * instrument metadata ("Instrument: …", "Slit width;2 nm", "X Units=nm").
 */
import { isNumberCell } from './cells.js';
import { isSkippableLine } from './find-numeric-block.js';

export interface Preamble {
  /** Column names from the header row, or null when there is none. */
  header: string[] | null;
  /** 1-based line of the header row, 0 when none. */
  headerLine: number;
  metadata: Record<string, string>;
}

/**
 * Reads the lines before `blockFirst` (0-based). The header is the nearest
 * non-blank line above the block whose cells are not all numbers and whose
 * field count is the block's (a header with more names than columns keeps
 * the first `fields` ones). Other lines become metadata: "key: value",
 * "key = value", or the first cell as key and the rest as value.
 */
export function readPreamble(cells: string[][], lines: string[], blockFirst: number, fields: number): Preamble {
  let header: string[] | null = null;
  let headerLine = 0;
  let i = blockFirst - 1;
  while (i >= 0 && (lines[i] as string).trim() === '') i--;
  if (i >= 0 && !isSkippableLine(lines[i] as string)) {
    const row = cells[i] as string[];
    const isText = row.some((c) => c !== '' && !isNumberCell(c, true));
    if (isText && row.length >= fields) {
      header = row.slice(0, fields);
      headerLine = i + 1;
    }
  }
  const metadata: Record<string, string> = {};
  for (let j = 0; j < blockFirst; j++) {
    if (j + 1 === headerLine) continue;
    const entry = lineToEntry(lines[j] as string, cells[j] as string[]);
    if (entry !== null && !(entry[0] in metadata)) metadata[entry[0]] = entry[1];
  }
  return { header, headerLine, metadata };
}

function lineToEntry(line: string, row: string[]): [string, string] | null {
  const t = line.trim().replace(/^(#|\/\/)\s*/, '');
  if (t === '') return null;
  const m = /^([^:=]{1,60}?)\s*[:=]\s*(.*)$/.exec(t);
  if (m !== null) return [m[1] as string, (m[2] as string).trim()];
  if (row.length >= 2) return [row[0] as string, row.slice(1).join(' ').trim()];
  return null;
}
