import Papa from 'papaparse';

/** Field separators fieldgap recognises; 'whitespace' means runs of spaces and tabs. */
export type Separator = '\t' | ';' | ',' | 'whitespace';

/** Splits text into lines on \n, \r\n or \r (line i is line i + 1 of the file). */
export function textToLines(text: string): string[] {
  return text.split(/\r\n|\n|\r/);
}

/**
 * A quick split of one line without quote handling, used to choose the
 * separator and, for text with no quote character, as the final split;
 * trailing empty fields (a separator at the end of the line) are dropped and
 * cells are trimmed.
 */
export function splitLineQuick(line: string, separator: Separator): string[] {
  const cells = separator === 'whitespace' ? line.trim().split(/\s+/) : line.split(separator).map((c) => c.trim());
  while (cells.length > 0 && cells[cells.length - 1] === '') cells.pop();
  return cells;
}

/** splitLineQuick of every line. */
export function linesToQuickCells(lines: string[], separator: Separator): string[][] {
  return lines.map((l) => splitLineQuick(l, separator));
}

/**
 * Splits every line into trimmed cells with papaparse (quotes handled, so a
 * header "Wavelength, nm" in quotes stays one cell). Whitespace-separated
 * text is split on runs of blanks, which papaparse has no separator for.
 * The result has one entry per line, trailing empty cells dropped.
 *
 * Without a quote character anywhere, papaparse splits exactly at each
 * separator, so the quick split (`quick`, when the caller already made it)
 * is the answer and papaparse is skipped.
 */
export function linesToCells(lines: string[], separator: Separator, quick?: string[][]): string[][] {
  if (separator === 'whitespace' || !lines.some((l) => l.includes('"'))) return quick ?? linesToQuickCells(lines, separator);
  const parsed = Papa.parse<string[]>(lines.join('\n'), { delimiter: separator, newline: '\n', skipEmptyLines: false });
  // A quoted newline would shift rows against lines: parse line by line then.
  const rows =
    parsed.data.length === lines.length
      ? parsed.data
      : lines.map((l) => Papa.parse<string[]>(l, { delimiter: separator, newline: '\n' }).data[0] ?? []);
  return rows.map((row) => {
    const cells = row.map((c) => c.trim());
    while (cells.length > 0 && cells[cells.length - 1] === '') cells.pop();
    return cells;
  });
}
