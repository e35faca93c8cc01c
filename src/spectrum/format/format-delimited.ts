/**
 * Writes spectra as delimited text, in the forms instruments export: for
 * demo data and test fixtures (text out; writing files is the caller's job).
 */
import { invalidArgument } from '../../errors.js';

export interface FormatDelimitedOptions {
  /** x column values. */
  x: Float64Array;
  /** One or more y columns, each as long as x. */
  ys: Float64Array[];
  /** Field separator. @default ',' */
  separator?: ',' | ';' | '\t' | ' ';
  /** Write numbers with a decimal comma (not allowed with ','). @default false */
  decimalComma?: boolean;
  /** Header row (x name first), or null for none. @default null */
  header?: string[] | null;
  /** Lines written before the header (instrument metadata). @default [] */
  preamble?: string[];
  /** Significant digits of y. @default 6 */
  digits?: number;
  /** Line ending. @default '\n' */
  newline?: '\n' | '\r\n';
}

export function formatDelimited(options: FormatDelimitedOptions): string {
  const { x, ys, separator = ',', decimalComma = false, header = null, preamble = [], digits = 6, newline = '\n' } = options;
  if (decimalComma && separator === ',') throw invalidArgument('decimalComma', 'decimalComma: a decimal comma cannot be used with a comma separator');
  for (const [i, y] of ys.entries()) {
    if (y.length !== x.length) throw invalidArgument(`ys[${i}]`, `ys[${i}]: length ${y.length} differs from x length ${x.length}`);
  }
  const number = (v: number, d: number): string => {
    const s = Number.isFinite(v) ? String(Number(v.toPrecision(d))) : 'NaN';
    return decimalComma ? s.replace('.', ',') : s;
  };
  const out: string[] = [...preamble];
  if (header !== null) out.push(header.join(separator));
  for (let i = 0; i < x.length; i++) {
    const cells = [number(x[i] as number, 10)];
    for (const y of ys) cells.push(number(y[i] as number, digits));
    out.push(cells.join(separator));
  }
  return out.join(newline) + newline;
}
