/**
 * Finding the data block of a delimited file: instrument exports put lines
 * of metadata (and sometimes a footer) around the numbers, which papaparse
 * does not tell apart.
 *
 * The block is the longest run of lines holding at least two numeric fields
 * with one field count (blank and comment lines inside do not break it),
 * tried with each separator; ties go to tab, then ';', then ',', then
 * whitespace.
 */
import { isMissingCell, isNumberCell } from './cells.js';
import { linesToQuickCells, type Separator, splitLineQuick } from './split-lines.js';

const SEPARATORS: readonly Separator[] = ['\t', ';', ',', 'whitespace'];

export interface NumericRun {
  separator: Separator;
  /** Field count of the block's lines (x plus the y columns). */
  fields: number;
  /** Index (0-based) of the first and last numeric line of the run. */
  first: number;
  last: number;
  /** Number of numeric lines in the run. */
  count: number;
  /** Every line of the text split with this separator (splitLineQuick), reused by linesToCells. */
  cells: string[][];
}

/** Lines skipped anywhere: blank, or starting with '#' or '//'. */
export function isSkippableLine(line: string): boolean {
  // A scan instead of trim(): this runs on every line, and trim() allocates.
  for (let i = 0; i < line.length; i++) {
    const c = line.charCodeAt(i);
    if (c === 32 || (c >= 9 && c <= 13)) continue;
    if (c > 127) {
      const t = line.trim();
      return t === '' || t.startsWith('#') || t.startsWith('//');
    }
    if (c === 35) return true;
    return c === 47 && line.charCodeAt(i + 1) === 47;
  }
  return true;
}

/** Field count of a line that holds only numbers (first one present) or missing values, else 0. */
export function numericFieldCount(cells: string[], allowComma: boolean): number {
  if (cells.length < 2 || !isNumberCell(cells[0] as string, allowComma)) return 0;
  for (let i = 1; i < cells.length; i++) {
    const c = cells[i] as string;
    if (!isNumberCell(c, allowComma) && !isMissingCell(c)) return 0;
  }
  return cells.length;
}

/** The longest numeric run with one separator, or null when there is none. */
export function findRunWithSeparator(lines: string[], separator: Separator): NumericRun | null {
  const allowComma = separator !== ',';
  const cells = linesToQuickCells(lines, separator);
  let best: NumericRun | null = null;
  let current: NumericRun | null = null;
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i] as string;
    if (isSkippableLine(line)) continue;
    const fields = numericFieldCount(cells[i] as string[], allowComma);
    if (fields >= 2 && current !== null && current.fields === fields) {
      current.last = i;
      current.count++;
    } else if (fields >= 2) {
      current = { separator, fields, first: i, last: i, count: 1, cells };
    } else {
      current = null;
    }
    if (current !== null && (best === null || current.count > best.count)) best = { ...current };
  }
  return best;
}

/**
 * Separators worth a full scan: those that read at least one of a few
 * probe lines (at 1/4, 1/2, 3/4 of the file and the last non-blank line,
 * where data usually are) as numeric. All of them when no probe does.
 */
function plausibleSeparators(lines: string[]): readonly Separator[] {
  const probes = [0.25, 0.5, 0.75].map((f) => lines[Math.floor(f * lines.length)] ?? '');
  const last = [...lines].reverse().find((l) => !isSkippableLine(l));
  if (last !== undefined) probes.push(last);
  const found = SEPARATORS.filter((s) => probes.some((l) => numericFieldCount(splitLineQuick(l, s), s !== ',') >= 2));
  return found.length > 0 ? found : SEPARATORS;
}

/** The longest numeric run over all separators, or null when the text has no numeric block. */
export function findNumericBlock(lines: string[]): NumericRun | null {
  let best: NumericRun | null = null;
  for (const separator of plausibleSeparators(lines)) {
    const run = findRunWithSeparator(lines, separator);
    if (run !== null && (best === null || run.count > best.count)) best = run;
  }
  return best;
}
