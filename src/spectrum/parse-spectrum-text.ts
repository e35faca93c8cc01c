/**
 * The one entry point for reading a spectrum file's content (text or bytes;
 * src/ never touches the file system). Picks the reader: JCAMP-DX when the
 * text starts with a "##LABEL=" record, delimited text otherwise.
 */
import { FieldgapError, invalidArgument } from '../errors.js';
import { decodeText } from './parse/decode-text.js';
import { parseDelimited } from './parse/parse-delimited.js';
import { looksLikeJcamp, parseJcamp } from './parse/parse-jcamp.js';
import type { ParsedFile, XUnit, YUnit } from './types.js';

export interface ParseSpectrumOptions {
  /** Name used in error paths ("sample.csv:14:2") and warnings. @default "<input>" */
  fileName?: string;
  /** x unit; wins over the file's header or ##XUNITS. @default what the file says, else inferred (with a warning) */
  xUnit?: XUnit;
  /** y unit; wins over the file. @default what the file says, else absorbance (with a warning) */
  yUnit?: YUnit;
  /**
   * Keep one y column: its 1-based index among the y columns (1 = the column
   * after x) or its header name. JCAMP-DX blocks count as columns 1, 2…
   * @default all columns
   */
  column?: number | string;
  /** Fewest points a spectrum may have. @default 10 */
  minPoints?: number;
}

/**
 * Reads a spectrum file's content into spectra in their own units.
 * Throws FieldgapError: 'parse-error' (with "file:line:field" or
 * "file:##RECORD" paths), 'unsupported-format' (binary files, JCAMP forms
 * not read), 'invalid-argument' (a column that does not exist).
 */
export function parseSpectrumText(content: string | Uint8Array, options: ParseSpectrumOptions = {}): ParsedFile {
  const { fileName = '<input>', minPoints = 10 } = options;
  if (!Number.isInteger(minPoints) || minPoints < 2) {
    throw invalidArgument('minPoints', `minPoints: expected an integer ≥ 2, got ${minPoints}`);
  }
  const text = decodeText(content, fileName);
  if (text.trim() === '') throw new FieldgapError('parse-error', 'the file is empty', fileName);
  const common = {
    fileName,
    minPoints,
    ...(options.xUnit !== undefined ? { xUnit: options.xUnit } : {}),
    ...(options.yUnit !== undefined ? { yUnit: options.yUnit } : {}),
  };
  if (looksLikeJcamp(text)) {
    const { spectra, warnings } = parseJcamp(text, common);
    return { format: 'jcamp', spectra: selectJcampColumn(spectra, options.column, fileName), warnings };
  }
  const { spectra, warnings } = parseDelimited(text, {
    ...common,
    ...(options.column !== undefined ? { column: options.column } : {}),
  });
  return { format: 'delimited', spectra, warnings };
}

function selectJcampColumn<T extends { name: string; column: number }>(spectra: T[], column: number | string | undefined, fileName: string): T[] {
  if (column === undefined) return spectra;
  const found = spectra.find((s) => (typeof column === 'number' ? s.column === column : s.name.toLowerCase() === column.trim().toLowerCase() || String(s.column) === column.trim()));
  if (found !== undefined) return [found];
  const listing = spectra.map((s) => `${s.column} "${s.name}"`).join(', ');
  throw invalidArgument('column', `column ${typeof column === 'number' ? column : `"${column}"`} does not exist in ${fileName}; its spectra are ${listing}`);
}
